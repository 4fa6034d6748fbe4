// One key factory for the training feature: a squad's sheet and its recorded sessions.
export const trainingKeys = {
  sheet: (clubId: string, squadId: string) => ['training', clubId, 'sheet', squadId] as const,
  sessions: (clubId: string, squadId: string) => ['training', clubId, 'sessions', squadId] as const,
};

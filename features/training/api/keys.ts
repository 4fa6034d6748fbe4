// One key factory for the training feature: a squad's sheet and its recorded sessions, as React Query
// keys and as the keys of the copies those who screen keep on the device.
export const trainingKeys = {
  sheet: (clubId: string, squadId: string) => ['training', clubId, 'sheet', squadId] as const,
  sessions: (clubId: string, squadId: string) => ['training', clubId, 'sessions', squadId] as const,
};

/** Where the copies are kept on the device (features/offline's cache; removed at sign-out). */
export const trainingKeptKeys = {
  sheet: (squadId: string) => `training.sheet.${squadId}`,
  sessions: (squadId: string) => `training.sessions.${squadId}`,
};

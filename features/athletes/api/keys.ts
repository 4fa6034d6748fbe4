export const athleteKeys = {
  root: ['athletes'] as const,
  squads: (clubId: string) => [...athleteKeys.root, clubId, 'squads'] as const,
  list: (clubId: string) => [...athleteKeys.root, clubId, 'list'] as const,
  squad: (clubId: string, squadId: string) => [...athleteKeys.root, clubId, 'squad', squadId] as const,
  detail: (clubId: string, id: string) => [...athleteKeys.root, clubId, 'detail', id] as const,
};
export const ROSTER_STALE_MS = 60 * 1000;

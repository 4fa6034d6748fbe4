// One key factory for the roster. Every mutation invalidates `athleteKeys.club(clubId)`, which covers
// squads, lists, athlete pages and consent histories of that club.
export const athleteKeys = {
  root: ['athletes'] as const,
  club: (clubId: string) => [...athleteKeys.root, clubId] as const,
  squads: (clubId: string) => [...athleteKeys.club(clubId), 'squads'] as const,
  list: (clubId: string, options: { includeArchived?: boolean } = {}) =>
    [...athleteKeys.club(clubId), 'list', options.includeArchived ? 'with-archived' : 'active'] as const,
  squad: (clubId: string, squadId: string) => [...athleteKeys.club(clubId), 'squad', squadId] as const,
  detail: (clubId: string, id: string) => [...athleteKeys.club(clubId), 'detail', id] as const,
  consents: (clubId: string, id: string) => [...athleteKeys.detail(clubId, id), 'consents'] as const,
};
export const ROSTER_STALE_MS = 60 * 1000;

// One key factory for progress and trends. Nothing here is written by this feature: new screens arrive
// through screening, whose mutations may invalidate `progressKeys.club(clubId)`.
export const progressKeys = {
  root: ['progress'] as const,
  club: (clubId: string) => [...progressKeys.root, clubId] as const,
  athlete: (clubId: string, athleteId: string) => [...progressKeys.club(clubId), 'athlete', athleteId] as const,
  trends: (clubId: string, squadId: string) => [...progressKeys.club(clubId), 'trends', squadId] as const,
  watch: (clubId: string) => [...progressKeys.club(clubId), 'watch'] as const,
};
/** Screens arrive a few times a season: a minute is fresh enough. */
export const PROGRESS_STALE_MS = 60 * 1000;

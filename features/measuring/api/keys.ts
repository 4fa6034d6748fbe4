// One key factory for the "to measure" list, keyed by club like every other feature.
export const measuringKeys = {
  root: ['measuring'] as const,
  club: (clubId: string) => [...measuringKeys.root, clubId] as const,
  queue: (clubId: string, filter: { roundId?: string }) => [...measuringKeys.club(clubId), 'queue', filter.roundId ?? 'all'] as const,
};

/** Testers add photos courtside while a coach measures: kept short. */
export const QUEUE_STALE_MS = 15 * 1000;

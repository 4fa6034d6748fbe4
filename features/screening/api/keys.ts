// One key factory for screening. Keys start with the club so switching clubs never shows another club's data.
export const screeningKeys = {
  root: ['screening'] as const,
  club: (clubId: string) => [...screeningKeys.root, clubId] as const,
  rounds: (clubId: string) => [...screeningKeys.club(clubId), 'rounds'] as const,
  round: (clubId: string, roundId: string) => [...screeningKeys.rounds(clubId), 'detail', roundId] as const,
  assessment: (clubId: string, id: string) => [...screeningKeys.club(clubId), 'assessment', id] as const,
  athleteAssessments: (clubId: string, athleteId: string) => [...screeningKeys.club(clubId), 'athlete', athleteId] as const,
};

/** Round lists change as testers work through a squad: short. */
export const ROUNDS_STALE_MS = 15 * 1000;
/** An assessment's draft lives in the draft store once loaded; the query only seeds it. */
export const ASSESSMENT_STALE_MS = 30 * 1000;
export const ATHLETE_ASSESSMENTS_STALE_MS = 60 * 1000;

/** Keys of the answers kept on the device for offline use (features/offline/device-cache). */
export const ROUND_KEPT_PREFIX = 'screening.round.';
export const roundKeptKey = (roundId: string) => `${ROUND_KEPT_PREFIX}${roundId}`;
export const assessmentKeptKey = (assessmentId: string) => `screening.assessment.${assessmentId}`;

// Moving through a round from one athlete to the next. Pure.
import type { RoundAthlete } from './contract';

/**
 * The next athlete of the round still to be screened, after this one in the round's order (wrapping
 * round to the start), or null when everyone else is done.
 */
export function nextUnscreened(athletes: readonly RoundAthlete[], currentAssessmentId: string): RoundAthlete | null {
  const i = athletes.findIndex((a) => a.assessmentId === currentAssessmentId);
  const ordered = i < 0 ? [...athletes] : [...athletes.slice(i + 1), ...athletes.slice(0, i)];
  // An athlete without the family's agreement to screening is never "next" (our rule).
  return ordered.find((a) => a.status !== 'submitted' && a.screeningConsent) ?? null;
}

import type { RoundAthlete } from './contract';

/**
 * Submitted: the result. Otherwise the capture screens, for those who screen; others see the result page.
 * Its own module: the athlete page links to screens too, and importing it from
 * the round screen put that whole screen in the chunk every page loads.
 */
export function assessmentHref(a: Pick<RoundAthlete, 'assessmentId' | 'status'>, screens = true): string {
  return a.status === 'submitted' || !screens ? `/screening/assessments/${a.assessmentId}/result` : `/screening/assessments/${a.assessmentId}`;
}

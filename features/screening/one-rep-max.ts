/**
 * A check of the split-squat 1RM typed at the screen against the athlete's body mass: a junior's 1RM well
 * above their own mass is more often a typing slip (or another lift's 1RM) than a real figure, and every
 * loaded exercise of the plan is a share of it. A warning to check, never a refusal. Pure.
 */

/** Above this many times the body mass, the 1RM is questioned (our choice). */
export const ONE_REP_MAX_CHECK_RATIO = 1.5;

export function oneRepMaxWarning(oneRepMaxKg: number | null | undefined, massKg: number | null | undefined): string | null {
  if (oneRepMaxKg == null || massKg == null || massKg <= 0) return null;
  if (oneRepMaxKg <= ONE_REP_MAX_CHECK_RATIO * massKg) return null;
  return `A ${oneRepMaxKg} kg 1RM is more than ${ONE_REP_MAX_CHECK_RATIO} times the body mass (${massKg} kg). Check that it is this athlete's split-squat 1RM, in kg, before any load is lifted: every loaded exercise is a share of it.`;
}

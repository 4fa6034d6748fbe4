/**
 * A check of the split-squat 1RM typed at the screen against the athlete's body mass: a junior's 1RM well
 * above their own mass is more often a typing slip (or another lift's 1RM) than a real figure, and every
 * loaded exercise of the plan is a share of it. A warning to check, never a refusal. Pure.
 */

/** Above this many times the body mass, the 1RM is questioned (our choice). */
export const ONE_REP_MAX_CHECK_RATIO = 1.5;

/**
 * Without a body mass to check against, a 1RM above this is questioned (our choice: 1.5 times 67 kg, a
 * heavy 17-year-old; a slip of 300 for 30 would otherwise pass unseen).
 */
export const ONE_REP_MAX_CHECK_WITHOUT_MASS_KG = 100;

/**
 * The 1RM that loads are worked from: the one typed, unless the check questions it and the tester has not
 * confirmed that very value (our choice: a slip of 90 for 30 had set every load of a 40 kg child's plan
 * after a warning alone). Without it the plan uses bodyweight, as with no 1RM.
 */
export function usableOneRepMax(draft: { oneRepMaxKg?: number | null; oneRepMaxCheckedKg?: number | null; body?: { massKg?: number | null } }): number | null {
  const kg = draft.oneRepMaxKg;
  if (kg == null || !Number.isFinite(kg)) return null;
  if (oneRepMaxWarning(kg, draft.body?.massKg) && draft.oneRepMaxCheckedKg !== kg) return null;
  return kg;
}

export function oneRepMaxWarning(oneRepMaxKg: number | null | undefined, massKg: number | null | undefined): string | null {
  if (oneRepMaxKg == null) return null;
  if (massKg == null || massKg <= 0) {
    return oneRepMaxKg > ONE_REP_MAX_CHECK_WITHOUT_MASS_KG
      ? `A ${oneRepMaxKg} kg 1RM is more than most juniors lift, and no body mass is on record to check it against. Check that it is this athlete's split-squat 1RM, in kg, and enter the body mass, before any load is lifted: every loaded exercise is a share of it.`
      : null;
  }
  if (oneRepMaxKg <= ONE_REP_MAX_CHECK_RATIO * massKg) return null;
  return `A ${oneRepMaxKg} kg 1RM is more than ${ONE_REP_MAX_CHECK_RATIO} times the body mass (${massKg} kg). Check that it is this athlete's split-squat 1RM, in kg, before any load is lifted: every loaded exercise is a share of it.`;
}

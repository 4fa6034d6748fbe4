/**
 * Loading arithmetic: 1RM estimates from a submaximal set and the working
 * range of the strength-endurance phase.
 */
import { EngineInputError, requireFinite } from './errors';

export type OneRepMaxFormula = 'epley' | 'brzycki';

/**
 * Repetitions the estimates accept. Brzycki is meaningful up to about 10-12
 * reps (from memory) and breaks down completely at 37; we hold Epley to the
 * same ceiling so both answer the same question.
 */
export const ONE_REP_MAX_REPS = { min: 1, max: 12 } as const;

const MAX_LOAD_KG = 1000;

/**
 * Estimated 1RM in kg from `reps` clean repetitions with `loadKg`.
 * - epley: w x (1 + r / 30), with r = 1 returning w itself.
 * - brzycki: w x 36 / (37 - r).
 */
export function estimateOneRepMax(loadKg: number, reps: number, formula: OneRepMaxFormula): number {
  const w = requireFinite('loadKg', loadKg);
  if (w <= 0 || w > MAX_LOAD_KG) {
    throw new EngineInputError('loadKg', `must be more than 0 and at most ${MAX_LOAD_KG} kg, got ${w}`);
  }
  const r = requireFinite('reps', reps);
  if (!Number.isInteger(r) || r < ONE_REP_MAX_REPS.min || r > ONE_REP_MAX_REPS.max) {
    throw new EngineInputError(
      'reps',
      `must be a whole number from ${ONE_REP_MAX_REPS.min} to ${ONE_REP_MAX_REPS.max}: beyond about 12 reps the ${String(formula)} estimate is no longer meaningful; got ${r}`,
    );
  }
  switch (formula) {
    case 'epley':
      return r === 1 ? w : w * (1 + r / 30);
    case 'brzycki':
      return (w * 36) / (37 - r);
    default:
      throw new EngineInputError('formula', `must be 'epley' or 'brzycki', got ${String(formula)}`);
  }
}

/** Strength-endurance phase: 50-65% of 1RM, 3-4 sets close to fatigue (common practice, no source). */
export const STRENGTH_ENDURANCE = {
  minPercent: 50,
  maxPercent: 65,
  sets: { min: 3, max: 4 },
  reps: 'close to fatigue: stop when one or two more clean repetitions would still be possible',
  /** The same sets where the athlete's stage allows no sets to fatigue (limits.ts; our choice). */
  repsShortOfFatigue: 'short of fatigue: stop while two or three more clean repetitions would still be possible',
  tempo: 'slow and controlled: 3 s down, 1 s pause, 2 s up',
  rangeOfMotion: 'full range of motion',
} as const;

export interface StrengthEnduranceLoad {
  oneRepMaxKg: number;
  incrementKg: number;
  minPercent: number;
  maxPercent: number;
  /**
   * Lightest and heaviest working load: the lightest rounded up, the heaviest rounded down to the
   * increment, so both lie inside minPercent-maxPercent of 1RM. Null when no multiple of the increment
   * fits inside the range (a small 1RM, a coarse step): prescribe bodyweight or a band instead.
   */
  minKg: number | null;
  maxKg: number | null;
  sets: { min: number; max: number };
  reps: string;
  tempo: string;
  rangeOfMotion: string;
}

/** Round to the nearest multiple of `incrementKg`, without binary noise (0.1 x 3 = 0.3, not 0.30000000000000004). */
export function roundToIncrement(kg: number, incrementKg: number): number {
  return stepsToKg(Math.round(kg / incrementKg), incrementKg);
}

function stepsToKg(steps: number, incrementKg: number): number {
  return Math.round(steps * incrementKg * 1e6) / 1e6;
}

/** Whether `kg` lies inside minPercent-maxPercent of `oneRepMaxKg`, compared as the percentage itself. */
export function withinPercentOfOneRepMax(kg: number, oneRepMaxKg: number, minPercent: number, maxPercent: number): boolean {
  const share = kg / oneRepMaxKg;
  return share >= minPercent / 100 && share <= maxPercent / 100;
}

function checkLoadInputs(oneRepMaxKg: number, incrementKg: number): { orm: number; inc: number } {
  const orm = requireFinite('oneRepMaxKg', oneRepMaxKg);
  if (orm <= 0 || orm > MAX_LOAD_KG) {
    throw new EngineInputError('oneRepMaxKg', `must be more than 0 and at most ${MAX_LOAD_KG} kg, got ${orm}`);
  }
  const inc = requireFinite('incrementKg', incrementKg);
  if (inc <= 0) throw new EngineInputError('incrementKg', `must be more than 0, got ${inc}`);
  return { orm, inc };
}

/**
 * Working range for given percentages, shared by every prescription and by the plan editor. The top
 * of the range is rounded DOWN and the bottom UP to the increment, and each end is then checked as a
 * share of 1RM (binary fractions can put a product a hair over), so a rounded load never exceeds the
 * stated share of 1RM nor falls under it. Null when no multiple of the increment lies inside the range.
 */
export function loadRangeKg(oneRepMaxKg: number, incrementKg: number, minPercent: number, maxPercent: number): { minKg: number; maxKg: number } | null {
  const { orm, inc } = checkLoadInputs(oneRepMaxKg, incrementKg);
  if (!(minPercent > 0 && minPercent <= maxPercent && maxPercent <= 100)) {
    throw new EngineInputError('percent', `must satisfy 0 < min <= max <= 100, got ${minPercent}-${maxPercent}`);
  }
  // The small tolerances let an exact multiple through; the share checks then decide.
  let low = Math.max(1, Math.ceil((orm * minPercent) / 100 / inc - 1e-9));
  while (stepsToKg(low, inc) / orm < minPercent / 100) low += 1;
  let high = Math.floor((orm * maxPercent) / 100 / inc + 1e-9);
  while (high >= 1 && stepsToKg(high, inc) / orm > maxPercent / 100) high -= 1;
  if (high < low) return null;
  const minKg = stepsToKg(low, inc);
  const maxKg = stepsToKg(high, inc);
  return { minKg, maxKg };
}

/**
 * Strength-endurance working range: 50% to 65% of 1RM, rounded inwards to the loadable increment
 * (1.25 kg plates, 2 kg dumbbell steps...), with 3-4 sets taken close to fatigue, a slow controlled
 * tempo and full range. For adolescents after peak height velocity only: the plan applies the youth
 * limits of `limits.ts` at every other stage.
 */
export function strengthEnduranceLoad(oneRepMaxKg: number, incrementKg: number): StrengthEnduranceLoad {
  const range = loadRangeKg(oneRepMaxKg, incrementKg, STRENGTH_ENDURANCE.minPercent, STRENGTH_ENDURANCE.maxPercent);
  return {
    oneRepMaxKg,
    incrementKg,
    minPercent: STRENGTH_ENDURANCE.minPercent,
    maxPercent: STRENGTH_ENDURANCE.maxPercent,
    minKg: range?.minKg ?? null,
    maxKg: range?.maxKg ?? null,
    sets: { ...STRENGTH_ENDURANCE.sets },
    reps: STRENGTH_ENDURANCE.reps,
    tempo: STRENGTH_ENDURANCE.tempo,
    rangeOfMotion: STRENGTH_ENDURANCE.rangeOfMotion,
  };
}

/**
 * Load steps once technique holds: about 5-10% at a time (Faigenbaum 2009; content from memory).
 * Returns the largest multiple of the increment that is at most 10% of the working load, or null when
 * even one increment is more than 10% (then stay at the load and add repetitions first: our choice).
 */
export const LOAD_PROGRESSION = { minStepPercent: 5, maxStepPercent: 10 } as const;

export function progressionStepKg(workingKg: number, incrementKg: number): number | null {
  const { orm: kg, inc } = checkLoadInputs(workingKg, incrementKg);
  const steps = Math.floor((kg * LOAD_PROGRESSION.maxStepPercent) / 100 / inc + 1e-9);
  for (let n = steps; n >= 1; n -= 1) {
    const step = stepsToKg(n, inc);
    if (step / kg <= LOAD_PROGRESSION.maxStepPercent / 100) return step;
  }
  return null;
}

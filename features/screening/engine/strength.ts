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
  tempo: 'slow and controlled: 3 s down, 1 s pause, 2 s up',
  rangeOfMotion: 'full range of motion',
} as const;

export interface StrengthEnduranceLoad {
  oneRepMaxKg: number;
  incrementKg: number;
  minPercent: number;
  maxPercent: number;
  /** Lightest and heaviest working load, each rounded to the nearest increment. */
  minKg: number;
  maxKg: number;
  sets: { min: number; max: number };
  reps: string;
  tempo: string;
  rangeOfMotion: string;
}

/** Round to the nearest multiple of `incrementKg`, without binary noise (0.1 x 3 = 0.3, not 0.30000000000000004). */
export function roundToIncrement(kg: number, incrementKg: number): number {
  const steps = Math.round(kg / incrementKg);
  return Math.round(steps * incrementKg * 1e6) / 1e6;
}

/** Working range for given percentages; shared by the standard and the growth-spurt prescriptions. */
export function loadRangeKg(
  oneRepMaxKg: number,
  incrementKg: number,
  minPercent: number,
  maxPercent: number,
): { minKg: number; maxKg: number } {
  const orm = requireFinite('oneRepMaxKg', oneRepMaxKg);
  if (orm <= 0 || orm > MAX_LOAD_KG) {
    throw new EngineInputError('oneRepMaxKg', `must be more than 0 and at most ${MAX_LOAD_KG} kg, got ${orm}`);
  }
  const inc = requireFinite('incrementKg', incrementKg);
  if (inc <= 0) throw new EngineInputError('incrementKg', `must be more than 0, got ${inc}`);
  if (inc > orm) {
    throw new EngineInputError('incrementKg', `a ${inc} kg step is coarser than the 1RM itself (${orm} kg)`);
  }
  return {
    minKg: roundToIncrement((orm * minPercent) / 100, inc),
    maxKg: roundToIncrement((orm * maxPercent) / 100, inc),
  };
}

/**
 * Strength-endurance working range: 50% to 65% of 1RM, each end rounded to
 * the nearest loadable increment (1.25 kg plates, 2 kg dumbbell steps...),
 * with 3-4 sets taken close to fatigue, a slow controlled tempo and full range.
 */
export function strengthEnduranceLoad(oneRepMaxKg: number, incrementKg: number): StrengthEnduranceLoad {
  const { minKg, maxKg } = loadRangeKg(
    oneRepMaxKg,
    incrementKg,
    STRENGTH_ENDURANCE.minPercent,
    STRENGTH_ENDURANCE.maxPercent,
  );
  return {
    oneRepMaxKg,
    incrementKg,
    minPercent: STRENGTH_ENDURANCE.minPercent,
    maxPercent: STRENGTH_ENDURANCE.maxPercent,
    minKg,
    maxKg,
    sets: { ...STRENGTH_ENDURANCE.sets },
    reps: STRENGTH_ENDURANCE.reps,
    tempo: STRENGTH_ENDURANCE.tempo,
    rangeOfMotion: STRENGTH_ENDURANCE.rangeOfMotion,
  };
}

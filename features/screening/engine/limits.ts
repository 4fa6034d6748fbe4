/**
 * Loading limits for juniors: the ONE place that says how many sets and repetitions, how heavy and how
 * often, at each growth stage, and what is held back while pain is not cleared. The engine's plan
 * (`plan.ts`), the plan editor on the phone and the plan adjustment route on the server all call the
 * functions below, so an exercise added from the library, one set more or a heavier load meet exactly
 * the limits the engine applied to its own proposal.
 *
 * Youth volume follows the position statements the plan cites (Faigenbaum et al. 2009; Lloyd et al.
 * 2014). The per-stage loads are our choice and say so; the one deviation (strength-endurance volume
 * after peak height velocity) is labelled on the plan.
 */
import { EXERCISES } from './exercises';
import { FAIGENBAUM_2009, LLOYD_2014, OUR_CHOICE, COMMON_PRACTICE } from './sources';
import { LOAD_PROGRESSION, loadRangeKg, progressionStepKg, STRENGTH_ENDURANCE, withinPercentOfOneRepMax } from './strength';
import type {
  AssessmentResult,
  Certainty,
  ExerciseSpec,
  LoadingContext,
  LoadRule,
  MaturityResult,
  MaturityStage,
  PlannedExercise,
  Prescription,
  SourceKind,
} from './types';

export interface LimitBasis {
  source: string;
  sourceKind: SourceKind;
  certainty: Certainty;
  note: string;
}

/**
 * Youth resistance-training volume: 1-3 sets of 6-15 repetitions, 2-3 non-consecutive days a week,
 * load steps of about 5-10% once technique holds (Faigenbaum et al. 2009; title checked, content from
 * memory). About a minute of rest for most children (Lloyd et al. 2014; content secondary).
 */
export const YOUTH_VOLUME = {
  maxSets: 3,
  minReps: 6,
  maxReps: 15,
  maxStrengthDaysPerWeek: 3,
  /** Mobility work may be done daily: it is not resistance training. */
  maxMobilityDaysPerWeek: 7,
  basis: {
    source: FAIGENBAUM_2009,
    sourceKind: 'published',
    certainty: 'from memory',
    note: "1-3 sets of 6-15 repetitions on 2-3 non-consecutive days a week (the statement's title is checked; its figures are from memory).",
  } satisfies LimitBasis,
} as const;

export interface StageLimits {
  /** Heaviest share of 1RM for any percent-of-1RM load. */
  maxPercentOneRepMax: number;
  /** Whether sets may be taken close to fatigue. */
  toNearFatigue: boolean;
  /** Landing and jump repetitions are multiplied by this (then rounded up). */
  jumpVolumeFactor: number;
  maxSetsJump: number;
  /**
   * Strength-endurance volume for the percent-of-1RM exercise (3-4 sets of 12-20 repetitions close to
   * fatigue): beyond youth guidance, so only after peak height velocity and labelled on the plan.
   */
  strengthEnduranceVolume: boolean;
  /** Plain words for the stage, as the plan says it. */
  words: string;
  basis: LimitBasis;
}

const STAGE_BASIS: LimitBasis = {
  source: OUR_CHOICE,
  sourceKind: 'our-choice',
  certainty: 'no source',
  note: 'Lower loads and no sets to fatigue before and around peak height velocity; landing volume halved in the growth-spurt window. Maturity bands -1/+1 year from peak height velocity are common practice, no source.',
};

export const STAGE_LIMITS: Readonly<Record<MaturityStage, StageLimits>> = {
  pre: {
    maxPercentOneRepMax: 55,
    toNearFatigue: false,
    jumpVolumeFactor: 1,
    maxSetsJump: 3,
    strengthEnduranceVolume: false,
    words: 'before the growth spurt, more than a year before peak height velocity',
    basis: STAGE_BASIS,
  },
  circa: {
    maxPercentOneRepMax: 55,
    toNearFatigue: false,
    jumpVolumeFactor: 0.5,
    maxSetsJump: 2,
    strengthEnduranceVolume: false,
    words: 'in the growth-spurt window, within a year of peak height velocity',
    basis: STAGE_BASIS,
  },
  post: {
    maxPercentOneRepMax: 65,
    toNearFatigue: true,
    jumpVolumeFactor: 1,
    maxSetsJump: 3,
    strengthEnduranceVolume: true,
    words: 'after the growth spurt, more than a year after peak height velocity',
    basis: STAGE_BASIS,
  },
  // Banded before or after, but within one standard error of the estimate of the window: its limits.
  near: {
    maxPercentOneRepMax: 55,
    toNearFatigue: false,
    jumpVolumeFactor: 0.5,
    maxSetsJump: 2,
    strengthEnduranceVolume: false,
    words: "near the growth-spurt window: the estimate's error reaches into it, so the window's limits apply",
    basis: STAGE_BASIS,
  },
  // No estimate: the most cautious limits, those of the growth-spurt window.
  unknown: {
    maxPercentOneRepMax: 55,
    toNearFatigue: false,
    jumpVolumeFactor: 0.5,
    maxSetsJump: 2,
    strengthEnduranceVolume: false,
    words: 'growth stage unknown, so the cautious limits of the growth-spurt window apply',
    basis: STAGE_BASIS,
  },
};

/**
 * The stage the loading limits follow: the band, except that a pre or post estimate within one standard
 * error of the window's edges (-1 and +1 year from peak height velocity) is 'near' and takes the window's
 * limits. Our choice: the SEE is the authors' (Mirwald et al. 2002: 0.49-0.50 y; Moore et al. 2015:
 * 0.51-0.52 y), and an athlete at +1.3 y may well be at +0.8 y, in the window.
 */
export function loadingStage(maturity: Pick<MaturityResult, 'band' | 'offsetYears' | 'standardErrorYears'> | null | undefined): MaturityStage {
  if (!maturity) return 'unknown';
  if (maturity.band !== 'circa' && Math.abs(maturity.offsetYears) <= 1 + maturity.standardErrorYears) return 'near';
  return maturity.band;
}

/** The labelled deviation: strength-endurance volume after peak height velocity. */
export const STRENGTH_ENDURANCE_DEVIATION = {
  maxSets: 4,
  maxReps: 20,
  basis: {
    source: COMMON_PRACTICE,
    sourceKind: 'common-practice',
    certainty: 'no source',
    note: 'Strength endurance (3-4 sets of 12-20 repetitions close to fatigue at 50-65% of 1RM) goes beyond the 1-3 sets of 6-15 repetitions of the youth position statement; Squadline prescribes it only after peak height velocity.',
  } satisfies LimitBasis,
} as const;

export type LimitId = 'sets' | 'reps' | 'near-fatigue' | 'load' | 'per-week' | 'withheld';

export interface ExerciseLimits {
  /** Why the exercise is held back, or null when it may be done. */
  withheld: string | null;
  maxSets: number;
  /** For repetition doses; null for timed holds. */
  maxReps: number | null;
  toNearFatigue: boolean;
  /** For a percent-of-1RM load. */
  maxPercentOneRepMax: number;
  maxPerWeek: number;
}

export interface LimitBreach {
  exerciseId: string;
  limit: LimitId;
  /** Path inside the exercise, for form errors: 'prescription.sets', 'prescription.load'... */
  field: string;
  message: string;
}

/** A head coach's or physiotherapist's decision to go past one limit of one exercise, with the reason. */
export interface LimitOverride {
  exerciseId: string;
  limit: LimitId;
  reason: string;
}

/** Loaded strength work: any percent-of-1RM load, and every exercise of the strength phase. */
export function isLoadedStrengthWork(spec: Pick<ExerciseSpec, 'phase'>, load?: LoadRule): boolean {
  return spec.phase === 'strength' || load?.kind === 'percent-1rm';
}

const BY_ID = new Map(EXERCISES.map((e) => [e.id, e]));

export function librarySpec(id: string): ExerciseSpec | undefined {
  return BY_ID.get(id);
}

export function exerciseLimits(spec: ExerciseSpec, ctx: LoadingContext, load: LoadRule = spec.prescription.load): ExerciseLimits {
  const stage = STAGE_LIMITS[ctx.stage];
  const percentWork = load.kind === 'percent-1rm';
  const deviation = percentWork && stage.strengthEnduranceVolume;
  let withheld: string | null = null;
  if (ctx.painUncleared && (isLoadedStrengthWork(spec, load) || spec.isJump)) {
    withheld = spec.isJump
      ? 'Held back: pain was reported and no physiotherapist has cleared the athlete yet (no landing work until then: our choice).'
      : 'Held back: pain was reported and no physiotherapist has cleared the athlete yet (no loaded strength work until then).';
  }
  const library = spec.prescription.dose;
  let maxReps: number | null = null;
  if (library.kind === 'reps') {
    maxReps = deviation ? STRENGTH_ENDURANCE_DEVIATION.maxReps : YOUTH_VOLUME.maxReps;
    if (spec.isJump && stage.jumpVolumeFactor < 1) maxReps = Math.min(maxReps, Math.max(1, Math.ceil(library.max * stage.jumpVolumeFactor)));
  }
  let maxSets: number = deviation ? STRENGTH_ENDURANCE_DEVIATION.maxSets : YOUTH_VOLUME.maxSets;
  if (spec.isJump) maxSets = Math.min(maxSets, stage.maxSetsJump);
  return {
    withheld,
    maxSets,
    maxReps,
    toNearFatigue: percentWork && stage.toNearFatigue,
    maxPercentOneRepMax: stage.maxPercentOneRepMax,
    maxPerWeek: spec.phase === 'mobility' ? YOUTH_VOLUME.maxMobilityDaysPerWeek : YOUTH_VOLUME.maxStrengthDaysPerWeek,
  };
}

const range = (min: number, max: number) => (min === max ? String(min) : `${min}-${max}`);

function stageWords(ctx: LoadingContext): string {
  return STAGE_LIMITS[ctx.stage].words;
}

/**
 * The engine's prescription of a library exercise under the limits: sets, repetitions, fatigue and
 * load brought within them, and kg loads rounded inwards from the athlete's 1RM. Each change is said
 * in plain words in `adjustments`.
 */
export function applyLimits(spec: ExerciseSpec, ctx: LoadingContext): { prescription: Prescription; adjustments: string[] } {
  const base = spec.prescription;
  const stage = STAGE_LIMITS[ctx.stage];
  const adjustments: string[] = [];

  // The load first: when no step fits, the exercise becomes bodyweight and takes bodyweight volume.
  let load: LoadRule = base.load;
  if (load.kind === 'percent-1rm') {
    const maxPercent = Math.min(load.maxPercent, stage.maxPercentOneRepMax);
    const minPercent = Math.min(load.minPercent, maxPercent);
    if (maxPercent !== load.maxPercent) {
      adjustments.push(`Load capped at ${maxPercent}% of 1RM: ${stageWords(ctx)} (our choice).`);
    }
    if (ctx.oneRepMaxKg === null) {
      load = {
        ...load,
        minPercent,
        maxPercent,
        kg: null,
        note: `${load.note} No 1RM recorded: use bodyweight until a 1RM has been estimated from a submaximal set under qualified supervision.`,
      };
    } else {
      const kg = loadRangeKg(ctx.oneRepMaxKg, ctx.loadIncrementKg, minPercent, maxPercent);
      if (kg) {
        load = { ...load, minPercent, maxPercent, kg: { min: kg.minKg, max: kg.maxKg, incrementKg: ctx.loadIncrementKg } };
      } else {
        load = {
          kind: 'bodyweight',
          note: `No ${ctx.loadIncrementKg} kg step fits within ${minPercent}-${maxPercent}% of a ${ctx.oneRepMaxKg} kg 1RM: bodyweight, or a light band, instead of a load outside the range.`,
        };
        adjustments.push(`No loadable step fits within ${minPercent}-${maxPercent}% of 1RM: bodyweight or band instead.`);
      }
    }
  }

  const limits = exerciseLimits(spec, ctx, load);
  const sets = { min: Math.min(base.sets.min, limits.maxSets), max: Math.min(base.sets.max, limits.maxSets) };
  let dose = { ...base.dose };
  if (dose.kind === 'reps' && limits.maxReps !== null) {
    const max = Math.min(dose.max, limits.maxReps);
    const min = spec.isJump && stage.jumpVolumeFactor < 1 ? Math.max(1, Math.ceil(dose.min * stage.jumpVolumeFactor)) : dose.min;
    dose = { ...dose, min: Math.min(min, max), max, toNearFatigue: dose.toNearFatigue && limits.toNearFatigue };
  }
  if (spec.isJump && stage.jumpVolumeFactor < 1) {
    adjustments.push(
      `Landing volume halved and at most ${stage.maxSetsJump} sets: ${
        ctx.stage === 'unknown'
          ? 'growth stage unknown, so the cautious limits apply'
          : ctx.stage === 'near'
            ? 'near the growth-spurt window, within the estimate’s error'
            : 'growth-spurt window'
      } (our choice).`,
    );
  } else if (sets.max !== base.sets.max || (dose.kind === 'reps' && base.dose.kind === 'reps' && dose.max !== base.dose.max)) {
    adjustments.push(
      `Youth volume: at most ${limits.maxSets} sets of up to ${limits.maxReps ?? YOUTH_VOLUME.maxReps} repetitions (1-3 sets of 6-15 repetitions; Faigenbaum et al. 2009).`,
    );
  }
  if (base.dose.kind === 'reps' && base.dose.toNearFatigue && dose.kind === 'reps' && !dose.toNearFatigue) {
    adjustments.push(`Sets stop two or three clean repetitions short of fatigue: ${stageWords(ctx)} (our choice).`);
    // The load's own words said "close to fatigue": they say what is prescribed now, never both.
    if (load.kind === 'percent-1rm' && load.note.includes(STRENGTH_ENDURANCE.reps)) {
      load = { ...load, note: load.note.replace(STRENGTH_ENDURANCE.reps, STRENGTH_ENDURANCE.repsShortOfFatigue) };
    }
  }
  if (load.kind === 'percent-1rm' && stage.strengthEnduranceVolume) {
    adjustments.push(
      'Strength-endurance volume (3-4 sets of 12-20 repetitions close to fatigue) goes beyond the youth position statement (1-3 sets of 6-15; Faigenbaum et al. 2009): prescribed only after peak height velocity (common practice, no source).',
    );
  }
  const perWeek = Math.min(base.perWeek, limits.maxPerWeek);
  return { prescription: { ...base, sets, dose, load, perWeek }, adjustments };
}

/** How to move between variations and how the load changes, in plain words for one exercise. */
export function loadRuleText(spec: ExerciseSpec, prescription: Prescription): string {
  const load = prescription.load;
  const steps = `${LOAD_PROGRESSION.minStepPercent}-${LOAD_PROGRESSION.maxStepPercent}%`;
  if (load.kind === 'percent-1rm' && load.kg) {
    const step = progressionStepKg(load.kg.min, load.kg.incrementKg);
    const stepText =
      step === null
        ? `one ${load.kg.incrementKg} kg step is more than 10% of ${load.kg.min} kg: add repetitions first, not load`
        : `about ${step} kg at a time`;
    return `Add load only when every repetition of every set is clean, in steps of about ${steps} (${stepText}), never above ${load.kg.max} kg (${load.maxPercent}% of 1RM). Harder variation (${spec.progression.toLowerCase().replace(/\.$/, '')}): start again without added load and build back in the same steps, no heavier than ${load.kg.min} kg, since these loads are shares of the easier variation's 1RM (our choice). Form breaks down: back to the easier variation. Steps of ${steps}: Faigenbaum et al. 2009 (from memory).`;
  }
  return `Move to the harder variation only when every repetition of every set is clean, starting with the fewest sets and repetitions of the range; any added load starts light and grows in steps of about ${steps} (Faigenbaum et al. 2009, from memory). Form breaks down: back to the easier variation.`;
}

/**
 * Everything that breaks a limit in one planned exercise. Percentages are checked as percentages
 * (kg / 1RM), never only "load <= 1RM". A kg load without a 1RM on record cannot be checked, so it counts
 * as a breach too.
 */
export function checkExercise(exercise: Pick<PlannedExercise, 'id' | 'prescription'>, ctx: LoadingContext): LimitBreach[] {
  const spec = librarySpec(exercise.id);
  if (!spec) return [];
  const p = exercise.prescription;
  const limits = exerciseLimits(spec, ctx, p.load);
  const out: LimitBreach[] = [];
  const add = (limit: LimitId, field: string, message: string) => out.push({ exerciseId: spec.id, limit, field, message });
  if (limits.withheld) add('withheld', 'id', `${spec.name}: ${limits.withheld}`);
  if (p.sets.max > limits.maxSets) {
    add('sets', 'prescription.sets', `${spec.name}: ${range(p.sets.min, p.sets.max)} sets is more than the ${limits.maxSets} allowed (${stageWords(ctx)}).`);
  }
  if (p.dose.kind === 'reps' && limits.maxReps !== null) {
    if (p.dose.max > limits.maxReps) {
      add(
        'reps',
        'prescription.dose',
        `${spec.name}: ${range(p.dose.min, p.dose.max)} repetitions is more than the ${limits.maxReps} allowed (${stageWords(ctx)}).`,
      );
    }
    if (p.dose.toNearFatigue && !limits.toNearFatigue) {
      add(
        'near-fatigue',
        'prescription.dose',
        `${spec.name}: sets close to fatigue are not allowed ${ctx.stage === 'unknown' ? 'while the growth stage is unknown' : stageWords(ctx)}.`,
      );
    }
  }
  if (p.perWeek > limits.maxPerWeek) {
    add(
      'per-week',
      'prescription.perWeek',
      `${spec.name}: ${p.perWeek} sessions a week is more than the ${limits.maxPerWeek} allowed for strength work (2-3 non-consecutive days).`,
    );
  }
  const load = p.load;
  if (load.kind === 'percent-1rm') {
    const cap = limits.maxPercentOneRepMax;
    if (load.maxPercent > cap) {
      add('load', 'prescription.load', `${spec.name}: up to ${load.maxPercent}% of 1RM is more than the ${cap}% allowed (${stageWords(ctx)}).`);
    } else if (load.kg) {
      if (ctx.oneRepMaxKg === null) {
        add('load', 'prescription.load', `${spec.name}: a load in kg cannot be checked without a 1RM on record.`);
      } else if (!withinPercentOfOneRepMax(load.kg.max, ctx.oneRepMaxKg, 0, Math.min(load.maxPercent, cap))) {
        const pct = Math.round((load.kg.max / ctx.oneRepMaxKg) * 1000) / 10;
        add(
          'load',
          'prescription.load',
          `${spec.name}: ${load.kg.max} kg is ${pct}% of the ${ctx.oneRepMaxKg} kg 1RM, more than the ${Math.min(load.maxPercent, cap)}% allowed (${stageWords(ctx)}).`,
        );
      }
    }
  }
  return out;
}

/** Breaches of a whole plan, and which of them the overrides do not cover. */
export function checkPlan(
  exercises: readonly Pick<PlannedExercise, 'id' | 'prescription'>[],
  ctx: LoadingContext,
  overrides: readonly LimitOverride[] = [],
): { breaches: LimitBreach[]; uncovered: LimitBreach[] } {
  const breaches = exercises.flatMap((e) => checkExercise(e, ctx));
  const covered = (b: LimitBreach) => overrides.some((o) => o.exerciseId === b.exerciseId && o.limit === b.limit && o.reason.trim().length > 0);
  return { breaches, uncovered: breaches.filter((b) => !covered(b)) };
}

/** A library exercise as the engine would plan it for this athlete: the same limits, the same words. */
export function plannedFromLibrary(spec: ExerciseSpec, ctx: LoadingContext, order: number): PlannedExercise {
  const { prescription, adjustments } = applyLimits(spec, ctx);
  return {
    id: spec.id,
    name: spec.name,
    purpose: spec.purpose,
    howTo: spec.howTo,
    cue: spec.cue,
    commonFault: spec.commonFault,
    progression: spec.progression,
    regression: spec.regression,
    phase: spec.phase,
    isJump: spec.isJump,
    order,
    prescription,
    flagIds: [],
    patterns: [...spec.addresses],
    adjustments,
    loadRule: loadRuleText(spec, prescription),
  };
}

/**
 * The limits' inputs for a stored result. Results from engine 1.1.0 on carry them in the plan; for
 * older ones they are rebuilt: stage from the maturity band (unknown without one), pain from the plan
 * status, and the 1RM the caller knows (the draft's).
 */
export function loadingContextOf(result: Pick<AssessmentResult, 'plan' | 'maturity'>, oneRepMaxKg?: number | null, loadIncrementKg = 2.5): LoadingContext {
  if (result.plan.loading) return result.plan.loading;
  return {
    stage: loadingStage(result.maturity),
    unknownReason: result.maturity ? null : 'not-estimated',
    painUncleared: result.plan.status === 'clearance-needed',
    oneRepMaxKg: oneRepMaxKg ?? null,
    loadIncrementKg,
  };
}

export const LIMIT_SOURCES = { youth: `${FAIGENBAUM_2009}; ${LLOYD_2014}` } as const;

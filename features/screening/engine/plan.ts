/**
 * Corrective plan: picks exercises for the flags, adapts their prescriptions
 * (1RM loads, growth-spurt window), orders them for a session and adds the
 * cautions every junior plan carries. Selection, ordering and the growth-spurt
 * changes are our design.
 */
import { EXERCISES, PHASE_ORDER } from './exercises';
import { applyLimits, exerciseLimits, loadingStage, loadRuleText, STAGE_LIMITS, YOUTH_VOLUME } from './limits';
import {
  COMMON_PRACTICE,
  FAIGENBAUM_2009,
  OUR_CHOICE,
  HERRINGTON_MUNRO_2010,
  LLOYD_2014,
  MIRWALD_2002,
  MOORE_2015,
  MUNRO_HERRINGTON_CAROLAN_2012,
} from './sources';
import type {
  Caution,
  ExerciseSpec,
  Flag,
  GrowthUnknownReason,
  LoadingContext,
  MaturityResult,
  PatternId,
  Plan,
  PlannedExercise,
  Severity,
  WithheldExercise,
} from './types';
import { formatIsoDay } from './validate';

/** Longest session we prescribe: enough to address every pattern, short enough for a junior's attention. */
export const MAX_EXERCISES = 6;

/** Growth-spurt window changes (our choice), as applied by `limits.ts`: lower loading, less jumping. */
export const GROWTH_SPURT_ADJUSTMENT = {
  maxPercentOneRepMax: STAGE_LIMITS.circa.maxPercentOneRepMax,
  maxSetsLoaded: YOUTH_VOLUME.maxSets,
  jumpVolumeFactor: STAGE_LIMITS.circa.jumpVolumeFactor,
  maxSetsJump: STAGE_LIMITS.circa.maxSetsJump,
} as const;

const SEVERITY_WEIGHT: Record<Severity, number> = { watch: 1, concern: 2 };

export interface PlanContext {
  oneRepMaxKg: number | undefined;
  loadIncrementKg: number;
  painTaskTitles: readonly string[];
  /** A physiotherapist has cleared the athlete after the reported pain. */
  painCleared?: boolean;
  rescreenWeeks: number;
  todayDay: number | null;
  maturity: MaturityResult | null;
  /** Why there is no maturity estimate (null when there is one). */
  unknownReason?: GrowthUnknownReason | null;
}

interface Candidate {
  spec: ExerciseSpec;
  index: number;
  flags: Flag[];
  score: number;
}

/**
 * Greedy choice: first cover every flag (each pick covers the most
 * still-uncovered severity weight), then fill up to the cap with the
 * highest-scoring exercises left.
 */
export function selectExercises(flags: readonly Flag[], cap = MAX_EXERCISES, excluded: ReadonlySet<string> = new Set()): Candidate[] {
  const candidates: Candidate[] = [];
  EXERCISES.forEach((spec, index) => {
    if (excluded.has(spec.id)) return;
    const hit = flags.filter((f) => spec.addresses.includes(f.pattern));
    if (hit.length === 0) return;
    candidates.push({ spec, index, flags: hit, score: hit.reduce((s, f) => s + SEVERITY_WEIGHT[f.severity], 0) });
  });

  const chosen: Candidate[] = [];
  const uncovered = new Set(flags.map((f) => f.id));
  while (uncovered.size > 0 && chosen.length < cap) {
    let best: Candidate | undefined;
    let bestGain = 0;
    for (const c of candidates) {
      if (chosen.includes(c)) continue;
      const gain = c.flags.reduce((s, f) => s + (uncovered.has(f.id) ? SEVERITY_WEIGHT[f.severity] : 0), 0);
      if (gain > bestGain || (gain === bestGain && best !== undefined && gain > 0 && c.score > best.score)) {
        best = c;
        bestGain = gain;
      }
    }
    if (!best) break;
    chosen.push(best);
    for (const f of best.flags) uncovered.delete(f.id);
  }

  const rest = candidates.filter((c) => !chosen.includes(c)).sort((a, b) => b.score - a.score || a.index - b.index);
  for (const c of rest) {
    if (chosen.length >= cap) break;
    chosen.push(c);
  }

  return chosen.sort((a, b) => PHASE_ORDER.indexOf(a.spec.phase) - PHASE_ORDER.indexOf(b.spec.phase) || a.index - b.index);
}

const UNKNOWN_WORDS: Record<GrowthUnknownReason, string> = {
  'measures-missing': 'the body measures the estimate needs (standing and sitting height, or body mass) were not entered',
  'age-outside-range': "the athlete's age is outside the range the maturity equations were made for (about 8-16 years for girls, 9-18 for boys)",
  'not-estimated': 'no growth estimate was made for this screen',
};

function cautionsFor(flags: readonly Flag[], ctx: PlanContext, loading: LoadingContext, growthSpurt: boolean): Caution[] {
  const out: Caution[] = [
    {
      id: 'stop-on-pain',
      text: 'Stop on pain: if any exercise hurts, during the session or afterwards, stop it, tell the coach, and see a physiotherapist before doing it again.',
      source: COMMON_PRACTICE,
    },
    {
      id: 'not-a-diagnosis',
      text: 'These results describe how the athlete moved on the day of the screen. They are not a diagnosis and do not rule out injury.',
      source: null,
    },
    {
      id: 'youth-resistance-training',
      text: 'Technique before load: teach each exercise without load first, start light, and add load in small steps (about 5-10%) only while technique holds. A qualified coach supervises every session. Strength work 2-3 non-consecutive days a week, with about a minute of rest between sets for most children.',
      source: `${FAIGENBAUM_2009}; ${LLOYD_2014}`,
    },
  ];
  if (ctx.painTaskTitles.length > 0) {
    out.push({
      id: 'pain-reported',
      text: loading.painUncleared
        ? `Pain was reported during: ${ctx.painTaskTitles.join(', ')}. Refer the athlete to a physiotherapist or doctor. Until a physiotherapist clears the athlete, no loaded strength work and no landing work: only the exercises listed here, and only where they are pain-free. Follow their advice over this plan.`
        : `Pain was reported during: ${ctx.painTaskTitles.join(', ')}. A physiotherapist has since decided how the athlete trains (their decision is shown with the athlete's name); follow their advice over this plan.`,
      source: null,
    });
  }
  if (loading.stage === 'unknown') {
    out.push({
      id: 'growth-stage-unknown',
      text: `Growth stage unknown: ${UNKNOWN_WORDS[loading.unknownReason ?? 'not-estimated']}. The plan applies the cautious limits of the growth-spurt window (at most ${STAGE_LIMITS.unknown.maxPercentOneRepMax}% of 1RM, at most ${YOUTH_VOLUME.maxSets} sets, no sets to fatigue, landing volume halved) until a growth estimate is made (our choice). Watch the knees: pain at the front of the knee, below the kneecap or at the heel is a reason to stop and refer.`,
      source: OUR_CHOICE,
    });
  } else if (loading.stage === 'near' && ctx.maturity) {
    out.push({
      id: 'growth-spurt-near',
      text: `Near the growth-spurt window: the estimate (${ctx.maturity.offsetYears.toFixed(1)} years from peak height velocity) is within its standard error (about ${ctx.maturity.standardErrorYears} years) of the window, so the plan applies the window's limits (at most ${STAGE_LIMITS.near.maxPercentOneRepMax}% of 1RM, no sets to fatigue, landing volume halved) until a later screen places the athlete clearly outside it (our choice). Watch the knees: pain at the front of the knee, below the kneecap or at the heel is a reason to stop and refer.`,
      source: OUR_CHOICE,
    });
  } else if (loading.stage === 'pre') {
    out.push({
      id: 'youth-volume',
      text: `Before the growth spurt: youth volume only (at most ${YOUTH_VOLUME.maxSets} sets of ${YOUTH_VOLUME.minReps}-${YOUTH_VOLUME.maxReps} repetitions, no sets to fatigue, at most ${STAGE_LIMITS.pre.maxPercentOneRepMax}% of 1RM).`,
      source: FAIGENBAUM_2009,
    });
  }
  if (growthSpurt && ctx.maturity) {
    out.push({
      id: 'growth-spurt-window',
      text: `The athlete appears to be in the growth-spurt window (${ctx.maturity.offsetYears.toFixed(1)} years from peak height velocity). Loads are lowered and jump and landing volume is cut (our choice). Watch the knees: pain at the front of the knee, below the kneecap or at the heel is a reason to stop and refer.`,
      source: COMMON_PRACTICE,
    });
  }
  if (ctx.maturity) {
    out.push({
      id: 'maturity-estimate',
      text: `The maturity offset is an estimate from body measurements (standard error about ${ctx.maturity.standardErrorYears} years): treat the band as a guide, especially near -1 or +1 years.`,
      source: ctx.maturity.method === 'mirwald2002' ? MIRWALD_2002 : MOORE_2015,
    });
  }
  if (flags.some((f) => f.thresholdsMet.some((t) => t.rowId.startsWith('fppa-')))) {
    out.push({
      id: 'adult-knee-norms',
      text: 'Knee-angle thresholds come from adult norms and are applied to juniors for want of junior norms. A change between two screens of 8.93 degrees or less may be measurement error (the largest smallest detectable difference reported for these tasks, 7.54-8.93 degrees; the progress view uses the same figure).',
      source: `${HERRINGTON_MUNRO_2010}; ${MUNRO_HERRINGTON_CAROLAN_2012}`,
    });
  }
  return out;
}

export function loadingContextFor(ctx: PlanContext): LoadingContext {
  return {
    stage: loadingStage(ctx.maturity),
    unknownReason: ctx.maturity ? null : (ctx.unknownReason ?? 'not-estimated'),
    painUncleared: ctx.painTaskTitles.length > 0 && ctx.painCleared !== true,
    oneRepMaxKg: ctx.oneRepMaxKg ?? null,
    loadIncrementKg: ctx.loadIncrementKg,
  };
}

export function buildPlan(flags: readonly Flag[], ctx: PlanContext): Plan {
  const growthSpurt = flags.some((f) => f.pattern === 'growth-spurt-window');
  const loading = loadingContextFor(ctx);
  // What would have been planned, then without what the limits hold back (pain not cleared).
  const held = new Set(EXERCISES.filter((spec) => exerciseLimits(spec, loading).withheld !== null).map((spec) => spec.id));
  const withheld: WithheldExercise[] =
    held.size === 0
      ? []
      : selectExercises(flags)
          .filter((c) => held.has(c.spec.id))
          .map((c) => ({ id: c.spec.id, name: c.spec.name, reason: exerciseLimits(c.spec, loading).withheld ?? '' }));
  const exercises: PlannedExercise[] = selectExercises(flags, MAX_EXERCISES, held).map((c, i) => {
    const { prescription, adjustments } = applyLimits(c.spec, loading);
    const patterns = [...new Set<PatternId>(c.flags.map((f) => f.pattern))];
    const s = c.spec;
    // Fields copied one by one: object rest/spread of the spec was the benchmark's hottest line.
    return {
      id: s.id,
      name: s.name,
      purpose: s.purpose,
      howTo: s.howTo,
      cue: s.cue,
      commonFault: s.commonFault,
      progression: s.progression,
      regression: s.regression,
      phase: s.phase,
      isJump: s.isJump,
      order: i + 1,
      prescription,
      flagIds: c.flags.map((f) => f.id),
      patterns,
      adjustments,
      loadRule: loadRuleText(s, prescription),
    };
  });
  return {
    status: ctx.painTaskTitles.length > 0 && loading.painUncleared ? 'clearance-needed' : 'ready',
    exercises,
    maxExercises: MAX_EXERCISES,
    growthSpurtAdjusted: growthSpurt,
    rescreenWeeks: ctx.rescreenWeeks,
    rescreenDate: ctx.todayDay === null ? null : formatIsoDay(ctx.todayDay + ctx.rescreenWeeks * 7),
    cautions: cautionsFor(flags, ctx, loading, growthSpurt),
    loading,
    withheld,
  };
}

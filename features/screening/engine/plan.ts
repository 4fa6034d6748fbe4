/**
 * Corrective plan: picks exercises for the flags, adapts their prescriptions
 * (1RM loads, growth-spurt window), orders them for a session and adds the
 * cautions every junior plan carries. Selection, ordering and the growth-spurt
 * changes are our design.
 */
import { EXERCISES, PHASE_ORDER } from './exercises';
import { loadRangeKg, strengthEnduranceLoad } from './strength';
import {
  COMMON_PRACTICE,
  FAIGENBAUM_2009,
  HERRINGTON_MUNRO_2010,
  LLOYD_2014,
  MIRWALD_2002,
  MOORE_2015,
  MUNRO_HERRINGTON_CAROLAN_2012,
} from './sources';
import type { Caution, ExerciseSpec, Flag, MaturityResult, PatternId, Plan, PlannedExercise, Prescription, Severity } from './types';
import { formatIsoDay } from './validate';

/** Longest session we prescribe: enough to address every pattern, short enough for a junior's attention. */
export const MAX_EXERCISES = 6;

/** Growth-spurt window changes (our design): lower loading, less jumping. */
export const GROWTH_SPURT_ADJUSTMENT = {
  maxPercentOneRepMax: 55,
  maxSetsLoaded: 3,
  jumpVolumeFactor: 0.5,
  maxSetsJump: 2,
} as const;

const SEVERITY_WEIGHT: Record<Severity, number> = { watch: 1, concern: 2 };

export interface PlanContext {
  oneRepMaxKg: number | undefined;
  loadIncrementKg: number;
  painTaskTitles: readonly string[];
  rescreenWeeks: number;
  todayDay: number | null;
  maturity: MaturityResult | null;
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
export function selectExercises(flags: readonly Flag[], cap = MAX_EXERCISES): Candidate[] {
  const candidates: Candidate[] = [];
  EXERCISES.forEach((spec, index) => {
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

  const rest = candidates
    .filter((c) => !chosen.includes(c))
    .sort((a, b) => b.score - a.score || a.index - b.index);
  for (const c of rest) {
    if (chosen.length >= cap) break;
    chosen.push(c);
  }

  return chosen.sort(
    (a, b) => PHASE_ORDER.indexOf(a.spec.phase) - PHASE_ORDER.indexOf(b.spec.phase) || a.index - b.index,
  );
}

function resolvePrescription(
  spec: ExerciseSpec,
  ctx: PlanContext,
  growthSpurt: boolean,
): { prescription: Prescription; adjustments: string[] } {
  const base = spec.prescription;
  const adjustments: string[] = [];
  let sets = { ...base.sets };
  let dose = { ...base.dose };
  let load = base.load;

  if (load.kind === 'percent-1rm') {
    let maxPercent = load.maxPercent;
    if (growthSpurt) {
      maxPercent = Math.min(maxPercent, GROWTH_SPURT_ADJUSTMENT.maxPercentOneRepMax);
      sets = { min: Math.min(sets.min, GROWTH_SPURT_ADJUSTMENT.maxSetsLoaded), max: Math.min(sets.max, GROWTH_SPURT_ADJUSTMENT.maxSetsLoaded) };
      adjustments.push(
        `Growth-spurt window: load capped at ${maxPercent}% of 1RM and ${GROWTH_SPURT_ADJUSTMENT.maxSetsLoaded} sets (our design).`,
      );
    }
    if (ctx.oneRepMaxKg !== undefined) {
      const range =
        maxPercent === load.maxPercent
          ? strengthEnduranceLoad(ctx.oneRepMaxKg, ctx.loadIncrementKg)
          : loadRangeKg(ctx.oneRepMaxKg, ctx.loadIncrementKg, load.minPercent, maxPercent);
      load = { ...load, maxPercent, kg: { min: range.minKg, max: range.maxKg, incrementKg: ctx.loadIncrementKg } };
    } else {
      load = {
        ...load,
        maxPercent,
        kg: null,
        note: `${load.note} No 1RM recorded: use bodyweight until a 1RM has been estimated from a submaximal set under qualified supervision.`,
      };
    }
  }

  if (growthSpurt && spec.isJump) {
    const f = GROWTH_SPURT_ADJUSTMENT.jumpVolumeFactor;
    dose = { ...dose, min: Math.max(1, Math.ceil(dose.min * f)), max: Math.max(1, Math.ceil(dose.max * f)) };
    sets = { min: Math.min(sets.min, GROWTH_SPURT_ADJUSTMENT.maxSetsJump), max: Math.min(sets.max, GROWTH_SPURT_ADJUSTMENT.maxSetsJump) };
    adjustments.push('Growth-spurt window: landing volume halved and at most 2 sets (our design).');
  }

  return { prescription: { ...base, sets, dose, load }, adjustments };
}

function cautionsFor(flags: readonly Flag[], ctx: PlanContext, growthSpurt: boolean): Caution[] {
  const out: Caution[] = [
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
      text: `Pain was reported during: ${ctx.painTaskTitles.join(', ')}. Stop those tasks and refer the athlete to a physiotherapist or doctor; start this plan only once they have cleared it, and follow their advice over this plan.`,
      source: null,
    });
  }
  if (growthSpurt && ctx.maturity) {
    out.push({
      id: 'growth-spurt-window',
      text: `The athlete appears to be in the growth-spurt window (${ctx.maturity.offsetYears.toFixed(1)} years from peak height velocity). Loads are lowered and jump and landing volume is cut (our design). Watch the knees: pain at the front of the knee, below the kneecap or at the heel is a reason to stop and refer.`,
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
      text: 'Knee-angle thresholds come from adult norms and are applied to juniors for want of junior norms. A change between two screens smaller than about 8 degrees may be measurement error.',
      source: `${HERRINGTON_MUNRO_2010}; ${MUNRO_HERRINGTON_CAROLAN_2012}`,
    });
  }
  return out;
}

export function buildPlan(flags: readonly Flag[], ctx: PlanContext): Plan {
  const growthSpurt = flags.some((f) => f.pattern === 'growth-spurt-window');
  const exercises: PlannedExercise[] = selectExercises(flags).map((c, i) => {
    const { prescription, adjustments } = resolvePrescription(c.spec, ctx, growthSpurt);
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
    };
  });
  return {
    status: ctx.painTaskTitles.length > 0 ? 'clearance-needed' : 'ready',
    exercises,
    maxExercises: MAX_EXERCISES,
    growthSpurtAdjusted: growthSpurt,
    rescreenWeeks: ctx.rescreenWeeks,
    rescreenDate: ctx.todayDay === null ? null : formatIsoDay(ctx.todayDay + ctx.rescreenWeeks * 7),
    cautions: cautionsFor(flags, ctx, growthSpurt),
  };
}


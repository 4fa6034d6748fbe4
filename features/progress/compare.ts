/**
 * Comparing two screens of one athlete: measurement by measurement against the measurement's published
 * error, and flag by flag (cleared, new, persisting). Pure: no React, no server, no clock.
 *
 * The one rule that matters most: a change no larger than the measurement's error is not called better
 * or worse; it is "within error". Where no published error exists the verdict says so, and no direction
 * is given either.
 */
import { daysBetween } from '@/features/athletes/age';
import type { AssessmentResult, Flag, FlagSide, Measurement, MetricId, PatternId, TaskId } from '@/features/screening/engine';

export const MUNRO_HERRINGTON_CAROLAN_2012 =
  'Munro A, Herrington L, Carolan M. Reliability of 2-dimensional video assessment of frontal-plane dynamic knee valgus during common athletic screening tasks. J Sport Rehabil. 2012;21(1):7-11.';
export const POWDEN_HOCH_HOCH_2015 =
  'Powden CJ, Hoch JM, Hoch MC. Reliability and minimal detectable change of the weight-bearing lunge test: a systematic review. Man Ther. 2015;20(4):524-532.';

export type ErrorMargin = {
  /** A change must be larger than this to count as real (same unit as the measurement). */
  value: number;
  unit: 'deg' | 'cm';
  /** What the published figure is (smallest detectable difference, minimal detectable change). */
  kind: string;
  source: string;
  certainty: 'checked' | 'secondary' | 'from memory';
  /** How we use the figure, and which part is our own choice. */
  note: string;
};

/**
 * Published measurement errors by metric. A metric not listed here has no published figure we could check,
 * and its changes get the verdict "no-published-figure".
 */
export const ERROR_MARGINS: Partial<Record<MetricId, ErrorMargin>> = {
  fppa: {
    value: 8.93,
    unit: 'deg',
    kind: 'smallest detectable difference (between days)',
    source: MUNRO_HERRINGTON_CAROLAN_2012,
    certainty: 'checked',
    note: 'The study reports 7.54-8.93 deg across single-leg squat, single-leg landing and drop jump; we use the upper end for every task, so that no task is called changed inside its own figure (our choice). Adults; applied to juniors for want of junior figures.',
  },
  'knee-to-wall': {
    value: 1.9,
    unit: 'cm',
    kind: 'minimal detectable change',
    source: POWDEN_HOCH_HOCH_2015,
    certainty: 'checked',
    note: 'The review reports 1.6 cm between clinicians and 1.9 cm within one clinician; we use the larger, 1.9 cm, whoever tested (our choice).',
  },
};

export type Verdict = 'real-change' | 'within-error' | 'no-published-figure';

export type MeasurementChange = {
  measurementId: string;
  metric: MetricId;
  label: string;
  unit: Measurement['unit'];
  taskId: TaskId | null;
  side: FlagSide;
  earlier: number;
  later: number;
  /** later minus earlier, rounded to 0.01. */
  change: number;
  /** null where no published figure exists. */
  errorMargin: number | null;
  verdict: Verdict;
  /** Only for a real change: which way the number went. Never "better" or "worse". */
  direction: 'up' | 'down' | null;
  source: string | null;
};

export type FlagRef = {
  id: string;
  pattern: PatternId;
  title: string;
  taskId: TaskId | null;
  side: FlagSide;
  severity: Flag['severity'];
  /** A left-right comparison: the pair of tasks compared (absent otherwise). */
  comparesTasks?: readonly [TaskId, TaskId];
};
export type PersistingFlag = FlagRef & { earlierSeverity: Flag['severity'] };

export type FlagChanges = {
  cleared: FlagRef[];
  new: FlagRef[];
  persisting: PersistingFlag[];
  /** Flags of the earlier screen whose task was not done again: neither cleared nor persisting. */
  notRetested: FlagRef[];
};

/** The parts of a flag a comparison reads (a stored result's flags carry evidence and thresholds besides). */
export type ComparedFlag = Pick<Flag, 'id' | 'pattern' | 'title' | 'taskId' | 'side' | 'severity'> & { comparesTasks?: Flag['comparesTasks'] | null };

/**
 * What one screen brings to a comparison: the parts of its result compared, the tasks done, and its date.
 * Only those parts, so a caller reading many screens can fetch a slim result instead of the whole one.
 */
export type ScreenForComparison = {
  assessmentId: string;
  screenedOn: string;
  /** Task ids present in the screen's input (done, not skipped). */
  tasksDone: readonly TaskId[];
  result: Pick<AssessmentResult, 'measurements' | 'maturity'> & {
    flags: readonly ComparedFlag[];
    plan: Pick<AssessmentResult['plan'], 'status' | 'rescreenWeeks'>;
  };
};

export type PlanTime = {
  days: number;
  /** The plan's own re-screen interval (the engine's, 6 weeks unless changed). */
  neededWeeks: number;
  /** true when the later screen came at least the plan's re-screen interval after the earlier one. */
  longEnough: boolean;
  /** The earlier plan asked for a clinician first (pain reported): the plan may have started late. */
  waitedForClearance: boolean;
  /** The earlier screen raised no flag, so no corrective plan was needed. */
  noPlanNeeded: boolean;
};

export type ScreenComparison = {
  earlierAssessmentId: string;
  laterAssessmentId: string;
  earlierScreenedOn: string;
  laterScreenedOn: string;
  measurements: MeasurementChange[];
  flags: FlagChanges;
  planTime: PlanTime;
};

const round2 = (n: number) => Math.round(n * 100) / 100;

/** The verdict for one change against an error margin (null: no published figure). Must exceed, not equal. */
export function verdictFor(change: number, margin: number | null): Verdict {
  if (margin === null) return 'no-published-figure';
  return Math.abs(change) > margin ? 'real-change' : 'within-error';
}

export function compareMeasurement(earlier: Measurement, later: Measurement): MeasurementChange {
  const margin = ERROR_MARGINS[earlier.metric];
  // Units must agree for the figure to apply (a percent LSI never borrows a cm figure).
  const errorMargin = margin && margin.unit === earlier.unit ? margin.value : null;
  const change = round2(later.value - earlier.value);
  const verdict = verdictFor(change, errorMargin);
  return {
    measurementId: earlier.id,
    metric: earlier.metric,
    label: later.label,
    unit: earlier.unit,
    taskId: earlier.taskId,
    side: earlier.side,
    earlier: earlier.value,
    later: later.value,
    change,
    errorMargin,
    verdict,
    direction: verdict === 'real-change' ? (change > 0 ? 'up' : 'down') : null,
    source: errorMargin === null ? null : margin!.source,
  };
}

function flagRef(f: ComparedFlag): FlagRef {
  return {
    id: f.id,
    pattern: f.pattern,
    title: f.title,
    taskId: f.taskId,
    side: f.side,
    severity: f.severity,
    ...(f.comparesTasks ? { comparesTasks: f.comparesTasks } : {}),
  };
}

/** Whether a flag's task (or both tasks of a pair) was done in the later screen. */
function retested(flag: ComparedFlag, later: ScreenForComparison): boolean {
  if (flag.comparesTasks) return flag.comparesTasks.every((t) => later.tasksDone.includes(t));
  if (flag.taskId) return later.tasksDone.includes(flag.taskId);
  // Athlete-level flags (the growth-spurt window) need the maturity estimate.
  return flag.pattern === 'growth-spurt-window' ? later.result.maturity !== null : true;
}

export function compareFlags(earlier: ScreenForComparison, later: ScreenForComparison): FlagChanges {
  const laterById = new Map(later.result.flags.map((f) => [f.id, f]));
  const earlierIds = new Set(earlier.result.flags.map((f) => f.id));
  const out: FlagChanges = { cleared: [], new: [], persisting: [], notRetested: [] };
  for (const f of earlier.result.flags) {
    const now = laterById.get(f.id);
    if (now) out.persisting.push({ ...flagRef(now), earlierSeverity: f.severity });
    else if (retested(f, later)) out.cleared.push(flagRef(f));
    else out.notRetested.push(flagRef(f));
  }
  for (const f of later.result.flags) if (!earlierIds.has(f.id)) out.new.push(flagRef(f));
  return out;
}

// Whole days between two ISO dates: one function for the app, kept with the other date helpers.
export { daysBetween };

/**
 * Whether the earlier screen's plan had been in place long enough to expect a change: at least the plan's
 * own re-screen interval (6 weeks by default) between the screens. Six weeks or so for a corrective
 * programme to show is common practice, no source; the rule is our choice.
 */
export function planTimeBetween(earlier: ScreenForComparison, later: ScreenForComparison): PlanTime {
  const days = daysBetween(earlier.screenedOn, later.screenedOn);
  const neededWeeks = earlier.result.plan.rescreenWeeks;
  return {
    days,
    neededWeeks,
    longEnough: days >= neededWeeks * 7,
    waitedForClearance: earlier.result.plan.status === 'clearance-needed',
    noPlanNeeded: earlier.result.flags.length === 0,
  };
}

/**
 * Which measurements of two screens are the same one: the id, except for a left-right comparison (limb
 * symmetry, left-right differences), whose id ends with the shorter or weaker side, and that side can
 * change from one screen to the next: it is still the same comparison (our choice).
 */
export function measurementKey(m: Pick<Measurement, 'id' | 'comparesTasks'>): string {
  return m.comparesTasks ? m.id.slice(0, m.id.lastIndexOf('/')) : m.id;
}

/** Compares two screens of one athlete; `earlier` must be the older one. */
export function compareScreens(earlier: ScreenForComparison, later: ScreenForComparison): ScreenComparison {
  const laterByKey = new Map(later.result.measurements.map((m) => [measurementKey(m), m]));
  const measurements: MeasurementChange[] = [];
  for (const m of earlier.result.measurements) {
    const now = laterByKey.get(measurementKey(m));
    if (now) measurements.push(compareMeasurement(m, now));
  }
  return {
    earlierAssessmentId: earlier.assessmentId,
    laterAssessmentId: later.assessmentId,
    earlierScreenedOn: earlier.screenedOn,
    laterScreenedOn: later.screenedOn,
    measurements,
    flags: compareFlags(earlier, later),
    planTime: planTimeBetween(earlier, later),
  };
}

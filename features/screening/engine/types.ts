/**
 * Shared types of the screening engine. Everything a capture screen, the
 * server or a report needs to build an input or read a result lives here.
 */

/** The athlete's own side (never the side of the image). */
export type Side = 'left' | 'right';
/** A flag is about one side, both sides, or nothing sided (the trunk, maturity). */
export type FlagSide = Side | 'both' | null;
export type Sex = 'female' | 'male';
export type View = 'front' | 'side';
export type Severity = 'watch' | 'concern';

/**
 * A point in image pixel coordinates: x grows to the right, y grows downwards.
 * In a front view the camera faces the athlete, so the athlete's right leg
 * appears on the image's left.
 */
export interface Point {
  readonly x: number;
  readonly y: number;
}

export type TaskId =
  | 'two-leg-squat'
  | 'single-leg-squat-left'
  | 'single-leg-squat-right'
  | 'drop-landing'
  | 'single-leg-stance-left'
  | 'single-leg-stance-right'
  | 'knee-to-wall-left'
  | 'knee-to-wall-right'
  | 'racket-side-lunge';

/** A left/right pair of tasks, compared for asymmetry. */
export type PairId = 'single-leg-squat' | 'single-leg-stance' | 'knee-to-wall';

export type LandmarkId =
  // front view, sided
  | 'right-hip'
  | 'left-hip'
  | 'right-knee'
  | 'left-knee'
  | 'right-ankle'
  | 'left-ankle'
  | 'right-asis'
  | 'left-asis'
  // front view, trunk
  | 'mid-shoulder'
  | 'mid-hip'
  // front view, the front (racket-side) leg of a lunge
  | 'lead-hip'
  | 'lead-knee'
  | 'lead-ankle'
  // side view, the limb nearest the camera
  | 'near-shoulder'
  | 'near-hip'
  | 'near-knee'
  | 'near-ankle';

export type PatternId =
  | 'dynamic-knee-valgus'
  | 'contralateral-pelvic-drop'
  | 'limited-ankle-dorsiflexion'
  | 'left-right-asymmetry'
  | 'heels-lifting'
  | 'squat-depth-not-reached'
  | 'excessive-trunk-lean'
  | 'growth-spurt-window';

/** What a measurement (or a threshold row) is about. */
export type MetricId =
  | 'fppa'
  | 'fppa-difference'
  | 'pelvic-obliquity'
  | 'pelvic-tilt'
  | 'trunk-lean-lateral'
  | 'trunk-lean-forward'
  | 'trunk-tibia-difference'
  | 'knee-flexion'
  | 'tibial-inclination'
  | 'thigh-angle'
  | 'knee-to-wall'
  | 'knee-to-wall-difference'
  | 'knee-to-wall-lsi'
  | 'rating-gap'
  | 'maturity-offset'
  | 'age-at-phv'
  | 'observed-criteria';

export type Unit = 'deg' | 'cm' | 'percent' | 'years' | 'grades' | 'criteria';

export type MaturityMethod = 'mirwald2002' | 'moore2015';
export type MaturityBand = 'pre' | 'circa' | 'post';

export interface MaturityInput {
  sex: Sex;
  ageYears: number;
  statureCm?: number;
  sittingHeightCm?: number;
  massKg?: number;
}

export interface MaturityResult {
  method: MaturityMethod;
  /** Years from peak height velocity: negative before, positive after. */
  offsetYears: number;
  /** Chronological age minus offset. */
  ageAtPhvYears: number;
  band: MaturityBand;
  /** Standard error of the estimate reported by the equation's authors. */
  standardErrorYears: number;
}

// ---------------------------------------------------------------------------
// evaluateAssessment input
// ---------------------------------------------------------------------------

export interface AthleteInput {
  sex: Sex;
  ageYears: number;
  statureCm?: number;
  sittingHeightCm?: number;
  massKg?: number;
  /** Needed for the racket-side lunge: the lead leg is on the racket side. */
  racketHand?: Side;
}

export interface PhotoInput {
  /** Only the landmarks placed so far; a missing one just means no measurement. */
  landmarks: Partial<Record<LandmarkId, Point>>;
}

export interface TaskResultInput {
  /** Ids of the criteria the tester ticked (observed). Empty when nothing was seen. */
  criteria: readonly string[];
  photos?: { front?: PhotoInput; side?: PhotoInput };
  /** Knee-to-wall tasks only: big toe to wall, in cm. */
  distanceCm?: number;
  painReported?: boolean;
}

export interface AssessmentOptions {
  /** Weeks until the re-screen. Default 6. */
  rescreenWeeks?: number;
  /** ISO date (YYYY-MM-DD, or a full ISO timestamp) of the screen; without it there is no re-screen date. */
  today?: string;
  /**
   * Which maturity equation to use. Default 'moore2015'. Maturity is computed
   * whenever the athlete record holds what the method needs; 'none' turns it off
   * (use it for athletes outside the equations' age range, which otherwise throw).
   */
  maturityMethod?: MaturityMethod | 'none';
  /** Smallest load step for the percent-of-1RM exercise. Default 2.5 kg (a pair of 1.25 kg plates). */
  loadIncrementKg?: number;
  /**
   * A physiotherapist has cleared the athlete after the pain reported at this screen. Until then the
   * plan holds back loaded strength and landing work. Default false.
   */
  painCleared?: boolean;
  /**
   * Pain reported at an earlier screen (its day and tasks) that no physiotherapist has cleared since: the
   * plan holds back loaded strength and landing work as for pain reported at this screen, until
   * `painCleared` (our choice: a later screen with no pain reported is not a clearance).
   */
  earlierPain?: { day: string; taskIds: TaskId[] };
}

export interface AssessmentInput {
  athlete: AthleteInput;
  tasks: Partial<Record<TaskId, TaskResultInput>>;
  /** 1RM (kg, external load) in the split squat used for strength-endurance work. */
  oneRepMaxKg?: number;
  options?: AssessmentOptions;
}

// ---------------------------------------------------------------------------
// evaluateAssessment output
// ---------------------------------------------------------------------------

export interface Measurement {
  /** Stable within a result, e.g. 'two-leg-squat/fppa/left', 'knee-to-wall/knee-to-wall-difference/left'. */
  id: string;
  metric: MetricId;
  /** The task measured; null for pair comparisons and athlete-level values. */
  taskId: TaskId | null;
  /** For a left/right comparison: the two tasks compared. */
  comparesTasks?: readonly [TaskId, TaskId];
  side: FlagSide;
  value: number;
  unit: Exclude<Unit, 'criteria'>;
  label: string;
}

export type Comparison = 'greater-than' | 'less-than' | 'at-least' | 'at-most' | 'within';

/**
 * What kind of basis a number has:
 * - published: a value printed in a source, used for the population it was measured in;
 * - published-other-population: a published value applied to people unlike the source's (adult norms
 *   applied to juniors, basketball players' values applied to badminton players);
 * - common-practice: a rule of the trade without a source we could name;
 * - our-choice: a rule Squadline's authors designed;
 * - derived: computed by us from published parts (a mean plus a measurement-error margin), parts named.
 */
export type SourceKind = 'published' | 'published-other-population' | 'common-practice' | 'our-choice' | 'derived';

/** How sure we are of the value: read in the source, read where another text restates it, recalled, or no source at all. */
export type Certainty = 'checked' | 'secondary' | 'from memory' | 'no source';

export interface ThresholdRef {
  rowId: string;
  comparison: Comparison;
  value: number;
  /** Only for 'within'. */
  upperValue?: number;
  unit: Unit;
  severity: Severity;
  source: string;
  sourceKind: SourceKind;
  certainty: Certainty;
  /** For a derived value: how it was computed from its published parts, in words and numbers. */
  derivation?: string;
  /** When the source's people differ from ours: who they were, said beside the flag. */
  populationNote?: string;
}

export type Evidence =
  | {
      kind: 'measurement';
      measurementId: string;
      label: string;
      value: number;
      unit: Measurement['unit'];
    }
  | { kind: 'criterion'; criterionId: string; taskId: TaskId; label: string };

export interface Flag {
  /** Stable within a result: pattern/scope/side, e.g. 'dynamic-knee-valgus/single-leg-squat-left/left'. */
  id: string;
  pattern: PatternId;
  /** Plain-words name of the pattern. */
  title: string;
  taskId: TaskId | null;
  comparesTasks?: readonly [TaskId, TaskId];
  side: FlagSide;
  severity: Severity;
  evidence: Evidence[];
  /** The row that set the severity (a measured row wins a tie with an observed one). */
  threshold: ThresholdRef;
  /** Source of `threshold`, in full. */
  source: string;
  /** Every row met, deciding row first. */
  thresholdsMet: ThresholdRef[];
}

export type SingleLegSquatArea = 'overall' | 'trunk' | 'pelvis' | 'hip' | 'knee';
export type Rating = 'good' | 'fair' | 'poor';

export interface TaskRating {
  taskId: TaskId;
  side: Side;
  rating: Rating;
  /** Areas with at least one ticked criterion. */
  areasWithFaults: SingleLegSquatArea[];
  basis: string;
}

export type Phase = 'mobility' | 'activation' | 'control' | 'landing' | 'strength';

export type Dose =
  | { kind: 'reps'; min: number; max: number; perSide: boolean; toNearFatigue: boolean }
  | { kind: 'seconds'; min: number; max: number; perSide: boolean };

export type LoadRule =
  | { kind: 'bodyweight'; note?: string }
  | { kind: 'band'; resistance: 'light' | 'medium'; placement: string }
  | {
      kind: 'percent-1rm';
      minPercent: number;
      maxPercent: number;
      /** Rounded working loads, or null when no 1RM was given. */
      kg: { min: number; max: number; incrementKg: number } | null;
      note: string;
    };

export interface Prescription {
  sets: { min: number; max: number };
  dose: Dose;
  tempo: string;
  load: LoadRule;
  restSeconds: number;
  perWeek: number;
}

export interface ExerciseSpec {
  id: string;
  name: string;
  purpose: string;
  howTo: readonly string[];
  cue: string;
  commonFault: string;
  progression: string;
  regression: string;
  phase: Phase;
  /** Landing or jump work: its volume is cut in the growth-spurt window. */
  isJump: boolean;
  addresses: readonly PatternId[];
  prescription: Prescription;
}

export interface PlannedExercise extends Omit<ExerciseSpec, 'prescription' | 'addresses'> {
  order: number;
  prescription: Prescription;
  /** Ids of this result's flags the exercise addresses. */
  flagIds: string[];
  patterns: PatternId[];
  /** Changes made to the library prescription, in plain words. */
  adjustments: string[];
  /** How to move to the harder or easier variation and how the load changes (see `progressionRule`). */
  loadRule?: string;
}

export interface Caution {
  id: string;
  text: string;
  source: string | null;
}

/**
 * Where the athlete stands for loading purposes: the maturity band, 'near' when the band is pre or post
 * but the estimate's standard error reaches into the growth-spurt window (`loadingStage`), or 'unknown'
 * when there is no growth estimate (body measures missing, age outside the equations' range, estimate
 * turned off).
 */
export type MaturityStage = MaturityBand | 'near' | 'unknown';

export type GrowthUnknownReason = 'measures-missing' | 'age-outside-range' | 'not-estimated';

/** Everything the loading limits depend on; stored with the plan so the editor and the server apply the same limits. */
export interface LoadingContext {
  stage: MaturityStage;
  /** Why the stage is unknown; null when it is known. */
  unknownReason: GrowthUnknownReason | null;
  /** Pain was reported at the screen and no physiotherapist has cleared the athlete since. */
  painUncleared: boolean;
  oneRepMaxKg: number | null;
  loadIncrementKg: number;
}

/** An exercise the plan holds back, with the reason in plain words. */
export interface WithheldExercise {
  id: string;
  name: string;
  reason: string;
}

export interface Plan {
  /** 'clearance-needed' when pain was reported: start only after a clinician has seen the athlete. */
  status: 'ready' | 'clearance-needed';
  exercises: PlannedExercise[];
  maxExercises: number;
  growthSpurtAdjusted: boolean;
  rescreenWeeks: number;
  /** YYYY-MM-DD, or null when options.today was not given. */
  rescreenDate: string | null;
  cautions: Caution[];
  /** What the limits were computed from (absent in results stored before engine 1.1.0). */
  loading?: LoadingContext;
  /** Exercises held back (loaded strength and landing work while pain is not cleared). */
  withheld?: WithheldExercise[];
}

export interface AssessmentResult {
  engineVersion: string;
  measurements: Measurement[];
  flags: Flag[];
  ratings: TaskRating[];
  maturity: MaturityResult | null;
  plan: Plan;
}

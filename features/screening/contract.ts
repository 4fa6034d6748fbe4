// The contract between the capture screens and the server for screening: request schemas (yup, used by
// the forms and by the server's validation middleware) and response shapes. Pure: no React, no server.
import { array, boolean, mixed, number, object, string, type InferType } from 'yup';
import type { AssessmentResult, Flag, LandmarkId, LimitId, PlannedExercise, Point, TaskId } from './engine';

// ---------------------------------------------------------------------------------------------------
// The tester's draft, saved to the server as they go (PUT /api/assessments/:id)
// ---------------------------------------------------------------------------------------------------

/**
 * Where a point came from: placed by a tap, suggested by the pose model and confirmed as it was, or
 * suggested and then moved before being confirmed. A point without `source` was placed by hand (points
 * saved before suggestions existed). A suggestion nobody confirmed is never stored.
 */
export const POINT_SOURCES = ['placed', 'suggested', 'moved'] as const;
export type PointSource = (typeof POINT_SOURCES)[number];
export type LandmarkPoint = Point & { readonly source?: PointSource };

/** Landmark points are in pixels of the stored (re-encoded) photo, x right, y down. */
export type LandmarkSet = Partial<Record<LandmarkId, LandmarkPoint>>;

export type TaskDraft = {
  /** Ids of the ticked criteria of the task (from the battery). */
  criteria: string[];
  /** Knee-to-wall tasks: big toe to wall, cm. */
  distanceCm?: number | null;
  painReported?: boolean;
  notes?: string;
  landmarks?: { front?: LandmarkSet; side?: LandmarkSet };
  /** The task was not done (refused, pain, time): the reason is kept. */
  skipped?: boolean;
  skipReason?: string;
};

export type AssessmentDraft = {
  body: { statureCm?: number | null; sittingHeightCm?: number | null; massKg?: number | null };
  tasks: Partial<Record<TaskId, TaskDraft>>;
  /** Split-squat 1RM in kg, when known, for the strength-endurance loads. */
  oneRepMaxKg?: number | null;
  /**
   * The 1RM the tester confirmed after the check against body mass questioned it (`oneRepMaxWarning`);
   * a questioned 1RM is used for loads only while this equals it.
   */
  oneRepMaxCheckedKg?: number | null;
  /**
   * Asked before anything is measured: the athlete says something hurts today. The screen then stops
   * there (our choice: a child in pain is not screened; a physiotherapist or doctor sees them first), and
   * it cannot be submitted while this is ticked.
   */
  hurtsToday?: boolean | null;
  /** Where the tester was, to resume on another phone: 'body' or a task id. */
  step?: string;
};

/**
 * yup casts a list or a boolean to a number ([150] → 150, true → 1); a number field takes only a number
 * or the text of one, anything else is a type error.
 */
const numberOrText = (v: unknown, original: unknown) => (typeof original === 'number' || typeof original === 'string' ? v : NaN);

const optionalNumber = (min: number, max: number, what: string) =>
  number()
    .transform(numberOrText)
    .transform((v, original) => (original === '' || original === null ? null : v))
    .nullable()
    .typeError(`${what} must be a number.`)
    .min(min, `${what} must be at least ${min}.`)
    .max(max, `${what} must be at most ${max}.`);

/** Plausible ranges for juniors; they catch typing errors (a comma lost, cm typed as m). */
export const BODY_LIMITS = {
  statureCm: [100, 220],
  sittingHeightCm: [50, 120],
  massKg: [15, 150],
  distanceCm: [0, 30],
  oneRepMaxKg: [1, 300],
} as const;

export const bodySchema = object({
  statureCm: optionalNumber(...BODY_LIMITS.statureCm, 'Standing height (cm)'),
  sittingHeightCm: optionalNumber(...BODY_LIMITS.sittingHeightCm, 'Sitting height (cm)').test(
    'below-stature',
    'Sitting height must be less than standing height.',
    function check(value) {
      const stature = this.parent.statureCm as number | null | undefined;
      return value == null || stature == null || value < stature;
    },
  ),
  massKg: optionalNumber(...BODY_LIMITS.massKg, 'Body mass (kg)'),
});

/** Photos are scaled to 1600 px at most; a point far outside any photo is a broken client, not a landmark. */
export const MAX_POINT_PX = 10_000;
const coordinate = (axis: 'x' | 'y') =>
  number()
    .transform(numberOrText)
    .typeError(`${axis} must be a number.`)
    .required(`${axis} is required.`)
    .test('finite', `${axis} must be a finite number.`, (v) => v === undefined || Number.isFinite(v))
    .min(0, `${axis} must be at least 0.`)
    .max(MAX_POINT_PX, `${axis} must be at most ${MAX_POINT_PX}.`);
export const pointSchema = object({
  x: coordinate('x'),
  y: coordinate('y'),
  source: string().oneOf(POINT_SOURCES, 'A point comes from "placed", "suggested" or "moved".'),
});

export const taskDraftSchema = object({
  criteria: array(string().required()).default([]),
  distanceCm: optionalNumber(...BODY_LIMITS.distanceCm, 'Distance (cm)'),
  painReported: boolean(),
  notes: string().max(2000, 'Notes are limited to 2000 characters.'),
  landmarks: object({
    front: mixed<LandmarkSet>().test('points', 'A landmark is not a valid point.', (v) => validPoints(v)),
    side: mixed<LandmarkSet>().test('points', 'A landmark is not a valid point.', (v) => validPoints(v)),
  }).default(undefined),
  skipped: boolean(),
  skipReason: string().max(500),
});

function validPoints(value: unknown): boolean {
  if (value === undefined || value === null) return true;
  if (typeof value !== 'object') return false;
  return Object.values(value as Record<string, unknown>).every((p) => pointSchema.isValidSync(p));
}

/** The largest value of the database's integer column (2^31 - 1). */
export const MAX_DRAFT_VERSION = 2_147_483_647;

/** The point as stored: x, y and, when known, where it came from; anything else a client sent is dropped. */
export function storedPoint(p: LandmarkPoint): LandmarkPoint {
  return { x: Number(p.x), y: Number(p.y), ...(p.source ? { source: p.source } : {}) };
}

export const saveDraftSchema = object({
  draftVersion: number()
    .transform(numberOrText)
    .typeError('draftVersion must be a whole number.')
    .integer('draftVersion must be a whole number.')
    .min(0, 'draftVersion must be at least 0.')
    .max(MAX_DRAFT_VERSION, 'draftVersion is out of range: reload the assessment.')
    .required('draftVersion is required.'),
  draft: object({
    body: bodySchema.default({}),
    tasks: mixed<Record<string, unknown>>().default({}),
    oneRepMaxKg: optionalNumber(...BODY_LIMITS.oneRepMaxKg, '1RM (kg)'),
    oneRepMaxCheckedKg: optionalNumber(...BODY_LIMITS.oneRepMaxKg, 'Confirmed 1RM (kg)'),
    hurtsToday: boolean().strict().nullable().typeError('hurtsToday must be true or false.'),
    step: string().max(64),
  })
    // Without this, yup fills a missing draft with {} and the save would wipe the tester's work.
    .default(undefined)
    .required('draft is required.'),
});
export type SaveDraftInput = InferType<typeof saveDraftSchema>;

/**
 * Submitting may name the draft version the tester reviewed; a newer save from another phone: 409. A submit
 * sent from the device's outbox names none: it is queued behind the draft save of the same phone.
 */
export const submitSchema = object({
  draftVersion: number().integer().min(0).optional(),
});
export type SubmitInput = InferType<typeof submitSchema>;

export const createRoundSchema = object({
  squadId: string().uuid('Choose a squad.').required('Choose a squad.'),
  name: string().trim().min(2, 'Name the round, for example "Pre-season".').max(80).required('Name the round.'),
  screenedOn: string()
    .matches(/^\d{4}-\d{2}-\d{2}$/, 'Use a date like 2026-09-14.')
    .required('Choose the screening date.')
    .test('plausible', 'Choose a date from 2000 up to one year ahead.', (v) => {
      if (!v || !/^\d{4}-\d{2}-\d{2}$/.test(v)) return true;
      // Rounds may be planned ahead, but not for a year nobody is screening in (our choice).
      const yearAhead = new Date(Date.now() + 366 * 24 * 3600 * 1000).toISOString().slice(0, 10);
      return v >= '2000-01-01' && v <= yearAhead;
    }),
});
export type CreateRoundInput = InferType<typeof createRoundSchema>;

export const LIMIT_IDS: readonly LimitId[] = ['sets', 'reps', 'near-fatigue', 'load', 'per-week', 'withheld'];

/** Going past one limit of one exercise: only a head coach or a physiotherapist, always with a reason. */
export const limitOverrideSchema = object({
  exerciseId: string().required(),
  limit: mixed<LimitId>()
    .oneOf([...LIMIT_IDS], 'Unknown limit.')
    .required(),
  reason: string().trim().min(5, 'Say why the limit is passed (at least a few words).').max(500).required('Say why the limit is passed.'),
});

export const planAdjustmentSchema = object({
  /** The full adjusted list, in order; exercises may be dropped, added from the library, or re-dosed. */
  exercises: array(mixed<PlannedExercise>().required()).min(1, 'Keep at least one exercise.').max(12).required(),
  note: string().max(1000).default(''),
  /** One per limit passed; checked on the server against the same limits the engine applies. */
  overrides: array(limitOverrideSchema).max(60).default([]),
  /** The plan the user saw: its result version and when it was last adjusted (null: never). Stale: 409. */
  basedOn: object({
    resultVersion: number().integer().min(1).required('basedOn.resultVersion is required.'),
    adjustedAt: string().nullable().defined('basedOn.adjustedAt is required (null when never adjusted).'),
  }).required('basedOn is required.'),
});
export type PlanAdjustmentInput = InferType<typeof planAdjustmentSchema>;

// ---------------------------------------------------------------------------------------------------
// Responses
// ---------------------------------------------------------------------------------------------------

export type AssessmentStatus = 'not_started' | 'in_progress' | 'submitted';

/** PUT /api/assessments/:id */
export type SaveDraftResponse = { draftVersion: number; status: AssessmentStatus };
/** The `current` of a 409 `draft_conflict` (save or submit against a newer draft). */
export type DraftConflictCurrent = { draft: AssessmentDraft; draftVersion: number; status: AssessmentStatus };
/** The `current` of a 409 `plan_conflict` (plan edit against a newer result or adjustment). */
export type PlanConflictCurrent = ResultView;

export type RoundSummary = {
  id: string;
  squadId: string;
  squadName: string;
  name: string;
  screenedOn: string;
  counts: Record<AssessmentStatus, number>;
  /** Set while the round is closed: nothing can be screened in it until a head coach reopens it. */
  closedAt: string | null;
  closedByName: string | null;
};

export type RoundAthlete = {
  assessmentId: string;
  athleteId: string;
  firstName: string;
  lastName: string;
  status: AssessmentStatus;
  photoConsent: boolean;
  /** The family agreed to screening and corrective exercises (no decision on record: false). */
  screeningConsent: boolean;
  /** The family's decision in force is a no (false where none is recorded yet). */
  screeningRefused: boolean;
  flagCount: number | null;
  /** The current result's flags, most severe first (concern, then watch): what a coach scans the list for. */
  flags: RoundAthleteFlag[];
};

export type RoundAthleteFlag = { severity: Flag['severity']; title: string; side: Flag['side'] };

export type RoundDetail = {
  round: RoundSummary;
  athletes: RoundAthlete[];
  /**
   * An open round: athletes in its squad now who have no screen in it (they joined the squad after it
   * began), name order; empty for a closed round. Absent from rounds kept on a device before it existed.
   */
  newcomers?: { athleteId: string; firstName: string; lastName: string }[];
};

export type PhotoView = {
  id: string;
  taskId: TaskId;
  view: 'front' | 'side';
  width: number;
  height: number;
  /** Authorised URLs (session cookie): never a public folder. */
  url: string;
  thumbUrl: string;
  createdAt: string;
};

/** A limit passed on purpose, as kept in the plan's history. */
export type PlanOverrideView = {
  exerciseId: string;
  limit: LimitId;
  reason: string;
  /** The limit as the checker worded it at the time. */
  message: string;
  /** Role of the person who passed it (head_coach or physio). */
  role: string;
};

export type PlanAdjustmentView = {
  exercises: PlannedExercise[];
  note: string;
  overrides: PlanOverrideView[];
  createdAt: string;
  createdByName: string | null;
};

export type ResultView = {
  id: string;
  version: number;
  engineVersion: string;
  createdAt: string;
  createdByName: string | null;
  /** Why this version was made when it was not a tester's submission (e.g. worked out again after a clearance); null otherwise. */
  reason: string | null;
  result: AssessmentResult;
  adjustment: PlanAdjustmentView | null;
  /** Every adjustment of this result, newest first (the first is `adjustment`). */
  adjustmentHistory: PlanAdjustmentView[];
  /**
   * When this version has no adjustment of its own: the newest one made on an earlier version (a
   * clearance worked the result out again after a tester had adjusted its plan), so the screen can say
   * the plan starts again from the proposal. Null otherwise.
   */
  earlierAdjustment: { version: number; createdAt: string; createdByName: string | null } | null;
  /** Earlier versions of this assessment's result, newest first. */
  history: { id: string; version: number; engineVersion: string; createdAt: string; reason: string | null }[];
};

export type AssessmentDetail = {
  id: string;
  roundId: string;
  roundName: string;
  screenedOn: string;
  /** The round is closed: the assessment can be read, not changed. */
  roundClosedAt: string | null;
  status: AssessmentStatus;
  draft: AssessmentDraft;
  draftVersion: number;
  athlete: {
    id: string;
    firstName: string;
    lastName: string;
    sex: 'female' | 'male';
    dateOfBirth: string;
    racketHand: 'left' | 'right';
    takeOffLeg: 'left' | 'right';
    photoConsent: boolean;
    /** The family agreed to screening and corrective exercises: without it nothing is saved or submitted. */
    screeningConsent: boolean;
    /** The family's decision in force is a no (false where none is recorded yet). */
    screeningRefused: boolean;
  };
  photos: PhotoView[];
  result: ResultView | null;
};

export type AthleteAssessmentItem = {
  assessmentId: string;
  roundId: string;
  roundName: string;
  screenedOn: string;
  status: AssessmentStatus;
  submittedAt: string | null;
  result: { id: string; version: number; engineVersion: string; flags: Flag[] } | null;
};

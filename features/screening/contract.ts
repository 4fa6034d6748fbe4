// The contract between the capture screens and the server for screening: request schemas (yup, used by
// the forms and by the server's validation middleware) and response shapes. Pure: no React, no server.
import { array, boolean, mixed, number, object, string, type InferType } from 'yup';
import type { AssessmentResult, Flag, LandmarkId, PlannedExercise, Point, TaskId } from './engine';

// ---------------------------------------------------------------------------------------------------
// The tester's draft, saved to the server as they go (PUT /api/assessments/:id)
// ---------------------------------------------------------------------------------------------------

/** Landmark points are in pixels of the stored (re-encoded) photo, x right, y down. */
export type LandmarkSet = Partial<Record<LandmarkId, Point>>;

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
  /** Where the tester was, to resume on another phone: 'body' or a task id. */
  step?: string;
};

const optionalNumber = (min: number, max: number, what: string) =>
  number()
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

const pointSchema = object({ x: number().required().min(0), y: number().required().min(0) });

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

export const saveDraftSchema = object({
  draftVersion: number().integer().min(0).required('draftVersion is required.'),
  draft: object({
    body: bodySchema.default({}),
    tasks: mixed<Record<string, unknown>>().default({}),
    oneRepMaxKg: optionalNumber(...BODY_LIMITS.oneRepMaxKg, '1RM (kg)'),
    step: string().max(64),
  }).required(),
});
export type SaveDraftInput = InferType<typeof saveDraftSchema>;

/** Submitting names the draft version the tester reviewed; a newer save from another phone: 409. */
export const submitSchema = object({
  draftVersion: number().integer().min(0).required('draftVersion is required.'),
});
export type SubmitInput = InferType<typeof submitSchema>;

export const createRoundSchema = object({
  squadId: string().uuid('Choose a squad.').required('Choose a squad.'),
  name: string().trim().min(2, 'Name the round, for example "Pre-season".').max(80).required('Name the round.'),
  screenedOn: string()
    .matches(/^\d{4}-\d{2}-\d{2}$/, 'Use a date like 2026-09-14.')
    .required('Choose the screening date.'),
});
export type CreateRoundInput = InferType<typeof createRoundSchema>;

export const planAdjustmentSchema = object({
  /** The full adjusted list, in order; exercises may be dropped, added from the library, or re-dosed. */
  exercises: array(mixed<PlannedExercise>().required()).min(1, 'Keep at least one exercise.').max(12).required(),
  note: string().max(1000).default(''),
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
};

export type RoundAthlete = {
  assessmentId: string;
  athleteId: string;
  firstName: string;
  lastName: string;
  status: AssessmentStatus;
  photoConsent: boolean;
  flagCount: number | null;
};

export type RoundDetail = { round: RoundSummary; athletes: RoundAthlete[] };

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

export type PlanAdjustmentView = { exercises: PlannedExercise[]; note: string; createdAt: string; createdByName: string | null };

export type ResultView = {
  id: string;
  version: number;
  engineVersion: string;
  createdAt: string;
  createdByName: string | null;
  result: AssessmentResult;
  adjustment: PlanAdjustmentView | null;
  /** Earlier versions of this assessment's result, newest first. */
  history: { id: string; version: number; engineVersion: string; createdAt: string }[];
};

export type AssessmentDetail = {
  id: string;
  roundId: string;
  roundName: string;
  screenedOn: string;
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

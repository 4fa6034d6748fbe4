// Turns the tester's saved draft into the engine's input. Pure: the server calls it on submit, and a
// capture screen may call it to show live results from the same numbers.
import type { AssessmentDraft, LandmarkSet, TaskDraft } from '@/features/screening/contract';
import { MATURITY_AGE_RANGE } from '@/features/screening/engine/maturity';
import { usableOneRepMax } from './one-rep-max';
import type { AssessmentInput, AthleteInput, LandmarkId, PhotoInput, Point, Sex, Side, TaskId, TaskResultInput } from '@/features/screening/engine';

export type DraftToInputArgs = {
  athlete: { sex: Sex; ageYears: number; racketHand?: Side };
  draft: AssessmentDraft;
  /** YYYY-MM-DD: the round's date; the plan's re-screen date counts from it. */
  screenedOn: string;
};

/** Null, undefined and non-numbers are "not measured": the engine is told nothing rather than 0. */
function measured(value: number | null | undefined): value is number {
  return typeof value === 'number';
}

function photoOf(set: LandmarkSet | undefined): PhotoInput | undefined {
  if (!set) return undefined;
  const landmarks: Partial<Record<LandmarkId, Point>> = {};
  for (const [id, point] of Object.entries(set) as [LandmarkId, Point | undefined][]) {
    if (point) landmarks[id] = { x: point.x, y: point.y };
  }
  return Object.keys(landmarks).length > 0 ? { landmarks } : undefined;
}

function taskInput(task: TaskDraft): TaskResultInput {
  const out: TaskResultInput = { criteria: [...task.criteria] };
  const front = photoOf(task.landmarks?.front);
  const side = photoOf(task.landmarks?.side);
  if (front || side) out.photos = { ...(front ? { front } : {}), ...(side ? { side } : {}) };
  if (measured(task.distanceCm)) out.distanceCm = task.distanceCm;
  if (task.painReported !== undefined) out.painReported = task.painReported;
  return out;
}

/**
 * Every task present in the draft and not marked skipped is sent, even with no criterion ticked: an
 * empty list means "done, nothing seen". Notes, the skip reason and the tester's step stay in the draft.
 * A task with pain reported is sent even if marked skipped (a draft saved before the capture screen
 * took the skip back): pain must reach the plan, which then asks for clearance.
 */
export function draftToInput({ athlete, draft, screenedOn }: DraftToInputArgs): AssessmentInput {
  const a: AthleteInput = { sex: athlete.sex, ageYears: athlete.ageYears };
  if (athlete.racketHand) a.racketHand = athlete.racketHand;
  const body = draft.body ?? {};
  if (measured(body.statureCm)) a.statureCm = body.statureCm;
  if (measured(body.sittingHeightCm)) a.sittingHeightCm = body.sittingHeightCm;
  if (measured(body.massKg)) a.massKg = body.massKg;

  const tasks: Partial<Record<TaskId, TaskResultInput>> = {};
  for (const [id, task] of Object.entries(draft.tasks ?? {}) as [TaskId, TaskDraft | undefined][]) {
    if (!task || !isSent(task)) continue;
    tasks[id] = taskInput(task);
  }

  const range = MATURITY_AGE_RANGE[athlete.sex];
  const input: AssessmentInput = {
    athlete: a,
    tasks,
    // The maturity equations refuse ages they were not derived on; the engine asks callers to turn
    // maturity off for such athletes rather than fail the whole screen.
    options: {
      today: screenedOn,
      ...(athlete.ageYears < range.min || athlete.ageYears > range.max ? { maturityMethod: 'none' as const } : {}),
    },
  };
  const oneRepMax = usableOneRepMax(draft);
  if (measured(oneRepMax)) input.oneRepMaxKg = oneRepMax;
  return input;
}

/** Whether the draft holds at least one task that would be sent to the engine. */
export function hasTaskData(draft: AssessmentDraft): boolean {
  return Object.values(draft.tasks ?? {}).some((t) => t !== undefined && isSent(t));
}

const isSent = (task: TaskDraft) => !task.skipped || task.painReported === true;

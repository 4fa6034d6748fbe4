import { ValidationError } from 'yup';
import { storedPoint, taskDraftSchema, type AssessmentDraft, type SaveDraftInput, type TaskDraft } from '@/features/screening/contract';
import { getLandmark, getTask, LANDMARKS, TASK_IDS, type LandmarkId, type TaskId } from '@/features/screening/engine';
import { badRequest } from '@/server/http/errors';
import { fieldErrors } from '@/server/http/validate';

const LANDMARK_IDS = new Set<string>(LANDMARKS.map((l) => l.id));
const isTaskId = (id: string): id is TaskId => (TASK_IDS as readonly string[]).includes(id);

/**
 * The tasks of a draft, checked against the battery: known task ids, each task's own criteria, the
 * photo views the task has and landmarks that belong to that view. The body and the rest were checked
 * by saveDraftSchema already. Throws one 400 listing every field that needs attention.
 */
export function validateDraft(input: SaveDraftInput['draft']): AssessmentDraft {
  const fields: Record<string, string> = {};
  const tasks: Partial<Record<TaskId, TaskDraft>> = {};
  const raw = input.tasks ?? {};
  if (typeof raw !== 'object' || Array.isArray(raw)) {
    throw badRequest('Some fields need attention.', { 'draft.tasks': 'Tasks must be an object keyed by task id.' });
  }

  for (const [id, value] of Object.entries(raw)) {
    const path = `draft.tasks.${id}`;
    if (!isTaskId(id)) {
      fields[path] = `"${id}" is not a task of the screening battery.`;
      continue;
    }
    let task: TaskDraft;
    try {
      task = taskDraftSchema.validateSync(value ?? {}, { abortEarly: false, stripUnknown: true }) as TaskDraft;
    } catch (error) {
      if (!(error instanceof ValidationError)) throw error;
      for (const [field, message] of Object.entries(fieldErrors(error))) fields[`${path}.${field}`] = message;
      continue;
    }
    const spec = getTask(id);
    const known = new Set(spec.criteria.map((c) => c.id));
    const unknown = task.criteria.filter((c) => !known.has(c));
    if (unknown.length > 0) fields[`${path}.criteria`] = `Not a criterion of "${spec.title}": ${unknown.join(', ')}.`;
    if (task.distanceCm != null && !spec.distance) fields[`${path}.distanceCm`] = `"${spec.title}" takes no distance.`;

    const landmarks: NonNullable<TaskDraft['landmarks']> = {};
    for (const view of ['front', 'side'] as const) {
      const set = task.landmarks?.[view];
      if (set === undefined || set === null) continue;
      // Points are stored as {x, y} and where they came from; anything else a client sent along is dropped.
      landmarks[view] = Object.fromEntries(Object.entries(set).map(([landmarkId, p]) => [landmarkId, storedPoint(p!)]));
      if (!spec.views.some((v) => v.view === view)) {
        fields[`${path}.landmarks.${view}`] = `"${spec.title}" has no ${view} photo.`;
        continue;
      }
      for (const landmarkId of Object.keys(set)) {
        if (!LANDMARK_IDS.has(landmarkId)) {
          fields[`${path}.landmarks.${view}.${landmarkId}`] = `"${landmarkId}" is not a landmark.`;
        } else if (getLandmark(landmarkId as LandmarkId).view !== view) {
          fields[`${path}.landmarks.${view}.${landmarkId}`] = `"${landmarkId}" belongs on the ${getLandmark(landmarkId as LandmarkId).view} photo.`;
        }
      }
    }
    // Keep only what the contract knows: unknown keys were stripped above, dedupe the ticks.
    const { landmarks: _raw, ...rest } = task;
    tasks[id] = { ...rest, criteria: [...new Set(task.criteria)], ...(Object.keys(landmarks).length > 0 ? { landmarks } : {}) };
  }

  if (Object.keys(fields).length > 0) throw badRequest('Some fields need attention.', fields);

  const draft: AssessmentDraft = { body: input.body ?? {}, tasks };
  if (input.oneRepMaxKg !== undefined) draft.oneRepMaxKg = input.oneRepMaxKg;
  if (input.oneRepMaxCheckedKg !== undefined) draft.oneRepMaxCheckedKg = input.oneRepMaxCheckedKg;
  if (input.hurtsToday !== undefined) draft.hurtsToday = input.hurtsToday;
  if (input.step !== undefined) draft.step = input.step;
  return draft;
}

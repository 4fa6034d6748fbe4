import type { Db } from '@/db/client';
import type { MeasureItem, MeasureQueue, SavedLandmarks } from '@/features/measuring/contract';
import { storedPoint, type AssessmentDraft, type LandmarkPoint, type LandmarkSet, type TaskDraft } from '@/features/screening/contract';
import { getTask, TASK_IDS, type LandmarkId, type TaskId } from '@/features/screening/engine';
import type { ClubScope } from '@/server/access/scope';
import { AppError, badRequest, conflict, notFound } from '@/server/http/errors';
import { validateDraft } from '@/server/screening/draft-validation';
import { screeningRepo } from '@/server/screening/screening.repo';
import { notTakingPart, photoView, submitAssessment } from '@/server/screening/screening.service';
import { measuringRepo } from './measuring.repo';

const isTaskId = (id: string): id is TaskId => (TASK_IDS as readonly string[]).includes(id);

function neededFor(taskId: string, view: 'front' | 'side'): readonly LandmarkId[] {
  if (!isTaskId(taskId)) return [];
  return getTask(taskId).views.find((v) => v.view === view)?.landmarks ?? [];
}

function placedOn(draft: AssessmentDraft, taskId: string, view: 'front' | 'side', needed: readonly LandmarkId[]): LandmarkSet {
  const set = draft.tasks?.[taskId as TaskId]?.landmarks?.[view] ?? {};
  const out: LandmarkSet = {};
  for (const id of needed) {
    const p = set[id];
    if (p) out[id] = { x: p.x, y: p.y };
  }
  return out;
}

export function measuringService({ db }: { db: Db }) {
  return {
    /** Photos with points still to place, across the club (or one round or squad). Skipped tasks are left out. */
    async queue(scope: ClubScope, filter: { roundId?: string; squadId?: string }): Promise<MeasureQueue> {
      const rows = await measuringRepo(db, scope).currentPhotos(filter);
      const items: MeasureItem[] = [];
      for (const r of rows) {
        const taskId = r.photo.taskId;
        if (!isTaskId(taskId) || r.draft.tasks?.[taskId]?.skipped) continue;
        const needed = neededFor(taskId, r.photo.view);
        const landmarks = placedOn(r.draft, taskId, r.photo.view, needed);
        const placed = Object.keys(landmarks).length;
        if (needed.length === 0 || placed >= needed.length) continue;
        items.push({
          photo: photoView(r.photo),
          assessmentId: r.assessmentId,
          assessmentStatus: r.status,
          athlete: { id: r.athleteId, firstName: r.firstName, lastName: r.lastName, racketHand: r.racketHand },
          round: { id: r.roundId, name: r.roundName, screenedOn: r.screenedOn, squadName: r.squadName },
          taskId,
          view: r.photo.view,
          landmarks,
          placed,
          needed: needed.length,
        });
      }
      // Athletes in the repository's order; within an athlete, the battery's order (as taken in a session).
      const rank = new Map<string, number>();
      for (const i of items) if (!rank.has(i.assessmentId)) rank.set(i.assessmentId, rank.size);
      const key = (i: MeasureItem) => [rank.get(i.assessmentId)!, TASK_IDS.indexOf(i.taskId), i.view === 'front' ? 0 : 1];
      items.sort((a, b) => {
        const [ka, kb] = [key(a), key(b)];
        return ka[0]! - kb[0]! || ka[1]! - kb[1]! || ka[2]! - kb[2]!;
      });
      return { items };
    },

    /**
     * Stores the points of one photo in its assessment's draft, under the assessment's row lock. A
     * submitted assessment is worked out again in the same transaction (a new result version, the
     * earlier ones kept); an engine refusal rolls the whole save back.
     */
    async saveLandmarks(scope: ClubScope, photoId: string, landmarks: LandmarkSet): Promise<SavedLandmarks> {
      return db.transaction(async (tx) => {
        const repo = measuringRepo(tx, scope);
        const first = await repo.photoWithAssessment(photoId);
        if (!first) throw notFound('The photo');
        if (!(await screeningRepo(tx, scope).lockAssessment(first.assessmentId))) throw notFound('The assessment');
        // Read again under the lock: this is the draft that gets changed.
        const row = (await repo.photoWithAssessment(photoId))!;
        if (!row.photoConsent) {
          throw new AppError(403, 'no_photo_consent', 'The family has not agreed to photos, or has withdrawn it: this photo is hidden and cannot be measured.');
        }
        if (!row.screeningConsent) throw notTakingPart(row.athleteName);
        if (row.photo.replacedAt) throw conflict('A newer photo replaced this one: measure the newer photo instead.');
        const taskId = row.photo.taskId;
        const view = row.photo.view;
        const needed = new Set<string>(neededFor(taskId, view));
        const fields: Record<string, string> = {};
        const points: LandmarkSet = {};
        for (const [id, p] of Object.entries(landmarks) as [LandmarkId, LandmarkPoint | undefined][]) {
          if (!p) continue;
          if (!needed.has(id)) fields[`landmarks.${id}`] = `"${id}" is not a point of this photo.`;
          else if (p.x > row.photo.width || p.y > row.photo.height) fields[`landmarks.${id}`] = 'The point lies outside the photo.';
          else points[id] = storedPoint(p);
        }
        if (Object.keys(fields).length > 0) throw badRequest('Some points need attention.', fields);

        const tasks = row.draft.tasks ?? {};
        const task: TaskDraft = tasks[taskId as TaskId] ?? { criteria: [] };
        const nextDraft = validateDraft({
          ...row.draft,
          tasks: { ...tasks, [taskId]: { ...task, landmarks: { ...task.landmarks, [view]: points } } },
        } as Parameters<typeof validateDraft>[0]);
        const saved = await repo.writeDraft(row.assessmentId, nextDraft);
        if (row.status !== 'submitted') return { ...saved, resultVersion: null };
        const result = await submitAssessment(tx, scope, row.assessmentId, { rework: true });
        return { draftVersion: saved.draftVersion, status: 'submitted', resultVersion: result.version };
      });
    },
  };
}

import { randomUUID } from 'node:crypto';
import type { Db } from '@/db/client';
import type { Photo } from '@/db/schema';
import { decimalAge } from '@/features/athletes/age';
import type {
  AssessmentDetail,
  AssessmentStatus,
  AthleteAssessmentItem,
  DraftConflictCurrent,
  CreateRoundInput,
  PhotoView,
  PlanAdjustmentInput,
  ResultView,
  RoundAthleteFlag,
  RoundDetail,
  RoundSummary,
  SaveDraftInput,
} from '@/features/screening/contract';
import { draftToInput, hasTaskData } from '@/features/screening/draft-to-input';
import {
  ENGINE_VERSION,
  EngineInputError,
  evaluateAssessment,
  getTask,
  loadingContextOf,
  TASK_IDS,
  type AssessmentInput,
  type AssessmentResult,
  type TaskId,
  type View,
} from '@/features/screening/engine';
import type { ClubScope } from '@/server/access/scope';
import { AppError, badRequest, conflict, notFound, staleVersion } from '@/server/http/errors';
import type { PhotoStorage } from '@/server/storage/storage';
import { validateDraft } from './draft-validation';
import { processPhoto } from './photo-processing';
import { formatDateInWords } from '@/features/ui/format-date';
import { enforceLimits, normaliseAdjustment, withServerWords } from './plan-adjustment';
import { screeningRepo, type Executor, type RoundRow, type ScreeningRepo } from './screening.repo';
import { painWaiting } from '@/server/care/clearance.repo';

export type Evaluate = (input: AssessmentInput) => AssessmentResult;

export type ScreeningDeps = {
  db: Db;
  storage: PhotoStorage;
  /** The engine; injectable so a test can make a submission fail halfway. */
  evaluate?: Evaluate;
};

/** 409 on a stale draftVersion, carrying the server's draft so the client can merge and retry. */
export class DraftConflictError extends AppError {
  constructor(
    current: DraftConflictCurrent,
    message = 'This assessment was changed on another device since you opened it. Your changes were not saved: review the latest version and save again.',
  ) {
    super(409, 'draft_conflict', message, undefined, current);
  }
}

const iso = (d: Date) => d.toISOString();

function roundSummary(row: RoundRow): RoundSummary {
  return {
    id: row.id,
    squadId: row.squadId,
    squadName: row.squadName,
    name: row.name,
    screenedOn: row.screenedOn,
    counts: { not_started: row.notStarted, in_progress: row.inProgress, submitted: row.submitted },
    closedAt: row.closedAt ? iso(row.closedAt) : null,
    closedByName: row.closedAt ? row.closedByName : null,
  };
}

const SEVERITY_ORDER: Record<string, number> = { concern: 0, watch: 1 };

/** Most severe first; within a severity, the engine's order. */
function bySeverity(flags: RoundAthleteFlag[] | null): RoundAthleteFlag[] {
  return (flags ?? [])
    .map((f, i) => ({ f, i }))
    .sort((a, b) => (SEVERITY_ORDER[a.f.severity] ?? 9) - (SEVERITY_ORDER[b.f.severity] ?? 9) || a.i - b.i)
    .map(({ f }) => f);
}

/** 409 for a change to an assessment of a closed round: reading stays possible. */
function roundClosed(): AppError {
  return new AppError(409, 'round_closed', 'This round is closed, so its screens cannot be changed. A head coach can reopen it.');
}

export function photoView(p: Photo): PhotoView {
  return {
    id: p.id,
    taskId: p.taskId as TaskId,
    view: p.view,
    width: p.width,
    height: p.height,
    url: `/api/photos/${p.id}?size=full`,
    thumbUrl: `/api/photos/${p.id}?size=thumb`,
    createdAt: iso(p.createdAt),
  };
}

async function resultView(repo: ScreeningRepo, assessmentId: string): Promise<ResultView | null> {
  const current = await repo.currentResult(assessmentId);
  if (!current) return null;
  // One after another: the repository may be a transaction's, and one connection runs one query at a time.
  const earlier = await repo.earlierResults(assessmentId, current.id);
  const adjustments = await repo.adjustments(current.id);
  const before = adjustments.length === 0 && earlier.length > 0 ? await repo.earlierAdjustment(assessmentId, current.id) : null;
  const history = adjustments.map((a) => ({
    exercises: a.exercises,
    note: a.note,
    overrides: a.overrides,
    createdAt: iso(a.createdAt),
    createdByName: a.createdByName,
  }));
  return {
    id: current.id,
    version: current.version,
    engineVersion: current.engineVersion,
    createdAt: iso(current.createdAt),
    createdByName: current.createdByName,
    reason: current.reason,
    result: current.result,
    adjustment: history[0] ?? null,
    adjustmentHistory: history,
    earlierAdjustment: before ? { version: before.version, createdAt: iso(before.createdAt), createdByName: before.createdByName } : null,
    history: earlier.map((r) => ({ id: r.id, version: r.version, engineVersion: r.engineVersion, createdAt: iso(r.createdAt), reason: r.reason })),
  };
}

/** Points the engine's field (a path into its input) at the draft field the tester typed. */
export function draftFieldOf(engineField: string): string {
  const body = /^athlete\.(statureCm|sittingHeightCm|massKg)$/.exec(engineField);
  if (body) return `draft.body.${body[1]}`;
  const photo = /^tasks\.([^.]+)\.photos\.(front|side)(?:\.landmarks)?(.*)$/.exec(engineField);
  if (photo) return `draft.tasks.${photo[1]}.landmarks.${photo[2]}${photo[3]}`;
  if (engineField.startsWith('tasks.') || engineField === 'oneRepMaxKg') return `draft.${engineField}`;
  return engineField;
}

/**
 * Runs the engine on the saved draft and stores the result as the assessment's new current version,
 * all in one transaction holding the assessment's row lock: either everything is stored (new version,
 * earlier ones no longer current, status submitted) or nothing changes. Used by the API and by the
 * demo seed, so demo results are made exactly as real ones.
 */
export async function submitAssessment(
  db: Executor,
  scope: ClubScope,
  assessmentId: string,
  options: {
    evaluate?: Evaluate;
    at?: Date;
    draftVersion?: number;
    /** Points added at the desk: work a submitted screen out again. */
    rework?: boolean;
  } = {},
): Promise<ResultView> {
  const evaluate = options.evaluate ?? evaluateAssessment;
  const at = options.at ?? new Date();
  await db.transaction(async (tx) => {
    const repo = screeningRepo(tx, scope);
    if (!(await repo.lockAssessment(assessmentId))) throw notFound('The assessment');
    // Read after taking the lock: this is the draft that gets evaluated.
    const a = (await repo.assessment(assessmentId))!;
    // The tester reviewed `draftVersion`: a newer save from another phone must be seen before submitting.
    if (options.draftVersion !== undefined && a.draftVersion !== options.draftVersion) {
      throw new DraftConflictError(
        { draft: a.draft, draftVersion: a.draftVersion, status: a.status },
        'This screen was changed on another device after you last saw it, so it was not submitted: open it, check the latest version and submit again.',
      );
    }
    // Submitted, and no draft saved since (a save sets it back to in progress): this is the same submit
    // again, a retry after a lost answer or a double tap. It returns the result already made, with the
    // same engine, instead of adding a second version of the same draft.
    if (a.status === 'submitted' && !options.rework) {
      const current = await repo.currentResult(assessmentId);
      if (current && current.engineVersion === ENGINE_VERSION) return;
    }
    if (!hasTaskData(a.draft)) {
      throw badRequest('There is nothing to submit yet: record at least one task (skipped tasks do not count).', {
        'draft.tasks': 'Record at least one task.',
      });
    }
    if (a.draft.hurtsToday === true) {
      throw badRequest('“Something hurts today” is ticked: a child in pain is not screened today. Untick it only if it was ticked by mistake.', {
        'draft.hurtsToday': 'Something hurts today: no screen today.',
      });
    }
    let ageYears: number;
    try {
      ageYears = decimalAge(a.dateOfBirth, a.screenedOn);
    } catch {
      throw badRequest(`The round's date (${a.screenedOn}) is before the athlete's date of birth (${a.dateOfBirth}): check both.`);
    }
    const input = draftToInput({ athlete: { sex: a.sex, ageYears, racketHand: a.racketHand }, draft: a.draft, screenedOn: a.screenedOn });
    // Pain at the athlete's newest other screen that no physiotherapist has cleared since is carried: a
    // screen with no pain reported is not a clearance (our choice).
    const earlier = (await painWaiting(tx, scope.clubId, { athleteId: a.athleteId, exceptAssessmentId: assessmentId }))[a.athleteId];
    if (earlier && earlier.taskIds.length > 0) {
      input.options = { ...input.options, earlierPain: { day: earlier.screenedOn, taskIds: earlier.taskIds as TaskId[] } };
    }
    // A physiotherapist's clearance given since this screen's first submission still counts when it is
    // submitted again (its pain was reported before the clearance).
    if (await repo.painClearedSinceFirstResult(assessmentId, a.athleteId)) input.options = { ...input.options, painCleared: true };
    let result: AssessmentResult;
    try {
      result = evaluate(input);
    } catch (error) {
      if (error instanceof EngineInputError) throw badRequest(error.message, { [draftFieldOf(error.field)]: error.reason });
      throw error;
    }
    await repo.addResult({ assessmentId, athleteId: a.athleteId, engineVersion: result.engineVersion ?? ENGINE_VERSION, input, result }, at);
    await repo.markSubmitted(assessmentId, at);
  });
  return (await resultView(screeningRepo(db, scope), assessmentId))!;
}

/**
 * Works an assessment's current result out again from the very input it was made from, with the pain
 * reported at the screen cleared by a physiotherapist (the engine's `painCleared`), and stores it as a
 * new current version carrying `reason`. The earlier version stays as it was. Only a result that waits
 * for a clearance (`plan.status` 'clearance-needed') is worked out again; otherwise null. With
 * `painCleared: false` (the athlete referred on after a clearance) it goes the other way: a result worked
 * out with the pain cleared goes back to waiting for a clearance, where pain was reported. The caller
 * runs it inside its transaction; the assessment's row lock is taken here, as on submit.
 */
export async function reevaluateAfterClearance(
  tx: Executor,
  scope: ClubScope,
  assessmentId: string,
  options: { reason: string; at?: Date; evaluate?: Evaluate; painCleared?: boolean },
): Promise<{ fromResultId: string; resultId: string } | null> {
  const painCleared = options.painCleared ?? true;
  const repo = screeningRepo(tx, scope);
  const locked = await repo.lockAssessment(assessmentId);
  if (!locked) throw notFound('The assessment');
  const current = await repo.currentResult(assessmentId);
  if (!current) return null;
  // Clearing: only a result still waiting for one. Referring on again: only a result worked out with the
  // pain cleared, which goes back to waiting (the engine holds loaded and landing work back again).
  if (painCleared ? current.result.plan.status !== 'clearance-needed' : current.input.options?.painCleared !== true) return null;
  const input: AssessmentInput = { ...current.input, options: { ...current.input.options, painCleared } };
  const result = (options.evaluate ?? evaluateAssessment)(input);
  // No pain was reported at this screen: the referral changes nothing the engine works out.
  if (!painCleared && result.plan.status !== 'clearance-needed') return null;
  const resultId = await repo.addResult(
    { assessmentId, athleteId: locked.athleteId, engineVersion: result.engineVersion ?? ENGINE_VERSION, input, result, reason: options.reason },
    options.at ?? new Date(),
  );
  return { fromResultId: current.id, resultId };
}

/**
 * The family has not agreed to the athlete taking part (or no decision is on record): nothing of a screen
 * is saved, uploaded or submitted. What was saved before stays as it was.
 */
export function notTakingPart(name: string) {
  return new AppError(
    403,
    'no_screening_consent',
    `${name}'s family has not agreed to screening and corrective exercises, or no decision is on record: nothing of this screen can be saved. What was saved before is kept. Record the family's decision on the athlete's page first.`,
  );
}

export function screeningService(deps: ScreeningDeps) {
  const { db, storage } = deps;
  const repoFor = (scope: ClubScope, executor: Executor = db) => screeningRepo(executor, scope);

  async function roundDetail(scope: ClubScope, id: string): Promise<RoundDetail> {
    const repo = repoFor(scope);
    const round = await repo.round(id);
    if (!round) throw notFound('The round');
    const athletes = await repo.roundAthletes(id);
    // Who joined the squad since the round began, for an open round: they can be brought in.
    const newcomers = round.closedAt ? [] : await repo.roundNewcomers(id, round.squadId);
    return {
      round: roundSummary(round),
      athletes: athletes.map((a) => ({ ...a, flags: bySeverity(a.flags as RoundAthleteFlag[] | null) })),
      newcomers,
    };
  }

  return {
    async listRounds(scope: ClubScope, squadId?: string): Promise<{ rounds: RoundSummary[] }> {
      const rows = await repoFor(scope).listRounds({ squadId });
      return { rounds: rows.map(roundSummary) };
    },

    async createRound(scope: ClubScope, input: CreateRoundInput): Promise<RoundDetail> {
      if (
        Number.isNaN(Date.parse(`${input.screenedOn}T00:00:00Z`)) ||
        new Date(`${input.screenedOn}T00:00:00Z`).toISOString().slice(0, 10) !== input.screenedOn
      ) {
        throw badRequest('Some fields need attention.', { screenedOn: `${input.screenedOn} is not a calendar date.` });
      }
      const id = await db.transaction(async (tx) => {
        const repo = repoFor(scope, tx);
        const squad = await repo.squad(input.squadId);
        if (!squad) throw notFound('The squad');
        if (squad.archivedAt) throw badRequest('Some fields need attention.', { squadId: 'This squad is archived.' });
        return repo.createRound({ squadId: squad.id, name: input.name, screenedOn: input.screenedOn });
      });
      return roundDetail(scope, id);
    },

    roundDetail,

    async assessmentDetail(scope: ClubScope, id: string): Promise<AssessmentDetail> {
      const repo = repoFor(scope);
      const a = await repo.assessment(id);
      if (!a) throw notFound('The assessment');
      const [photos, result] = await Promise.all([repo.currentPhotos(id), resultView(repo, id)]);
      return {
        id: a.id,
        roundId: a.roundId,
        roundName: a.roundName,
        screenedOn: a.screenedOn,
        roundClosedAt: a.roundClosedAt ? iso(a.roundClosedAt) : null,
        status: a.status,
        draft: a.draft,
        draftVersion: a.draftVersion,
        athlete: {
          id: a.athleteId,
          firstName: a.firstName,
          lastName: a.lastName,
          sex: a.sex,
          dateOfBirth: a.dateOfBirth,
          racketHand: a.racketHand,
          takeOffLeg: a.takeOffLeg,
          photoConsent: a.photoConsent,
          screeningConsent: a.screeningConsent,
          screeningRefused: a.screeningRefused,
        },
        // Withdrawn consent hides the photos already taken; landmarks and results stay.
        photos: a.photoConsent ? photos.map(photoView) : [],
        result,
      };
    },

    async saveDraft(scope: ClubScope, id: string, input: SaveDraftInput): Promise<{ draftVersion: number; status: AssessmentStatus }> {
      const repo = repoFor(scope);
      const draft = validateDraft(input.draft);
      const round = await repo.roundOf(id);
      if (round?.closedAt) throw roundClosed();
      if (round && !round.screeningConsent) throw notTakingPart(round.athleteName);
      const saved = await repo.saveDraft(id, input.draftVersion, draft);
      if (saved) return saved;
      const current = await repo.currentDraft(id);
      if (!current) throw notFound('The assessment');
      throw new DraftConflictError(current);
    },

    async uploadPhoto(scope: ClubScope, assessmentId: string, upload: { buffer: Buffer | undefined; task: unknown; view: unknown }): Promise<PhotoView> {
      const repo = repoFor(scope);
      const a = await repo.assessment(assessmentId);
      if (!a) throw notFound('The assessment');
      if (a.roundClosedAt) throw roundClosed();
      if (!a.screeningConsent) throw notTakingPart(`${a.firstName} ${a.lastName}`);

      const fields: Record<string, string> = {};
      if (!upload.buffer || upload.buffer.length === 0) fields.photo = 'Choose a photo to upload (field "photo").';
      const task = typeof upload.task === 'string' && (TASK_IDS as readonly string[]).includes(upload.task) ? (upload.task as TaskId) : null;
      if (!task) fields.task = 'Name the task the photo belongs to.';
      const view = upload.view === 'front' || upload.view === 'side' ? (upload.view as View) : null;
      if (!view) fields.view = 'The view must be "front" or "side".';
      else if (task && !getTask(task).views.some((v) => v.view === view)) fields.view = `"${getTask(task).title}" has no ${view} photo.`;
      if (Object.keys(fields).length > 0) throw badRequest('Some fields need attention.', fields);

      if (!(await repo.photoConsent(a.athleteId))) {
        throw new AppError(
          403,
          'no_photo_consent',
          `${a.firstName} ${a.lastName}'s family has not agreed to photos, so no photo can be taken or stored. Screen without photos, or record the family's consent on the athlete's page first.`,
        );
      }

      const processed = await processPhoto(upload.buffer!);
      const id = randomUUID();
      const storageKey = `${scope.clubId}/${assessmentId}/${id}.jpg`;
      const thumbKey = `${scope.clubId}/${assessmentId}/${id}-thumb.jpg`;
      await storage.put(storageKey, processed.full, 'image/jpeg');
      await storage.put(thumbKey, processed.thumb, 'image/jpeg');
      try {
        const row = await db.transaction(async (tx) => {
          const r = repoFor(scope, tx);
          if (!(await r.lockAssessment(assessmentId))) throw notFound('The assessment');
          return r.addPhoto(
            { id, assessmentId, taskId: task!, view: view!, storageKey, thumbKey, width: processed.width, height: processed.height },
            new Date(),
          );
        });
        return photoView(row);
      } catch (error) {
        // No row points at the files: remove them rather than leave orphans.
        await Promise.allSettled([storage.delete(storageKey), storage.delete(thumbKey)]);
        throw error;
      }
    },

    async photoBytes(scope: ClubScope, id: string, size: 'full' | 'thumb'): Promise<Buffer> {
      const repo = repoFor(scope);
      const photo = await repo.photo(id);
      if (!photo) throw notFound('The photo');
      const owner = await repo.assessment(photo.assessmentId);
      if (!owner?.photoConsent) {
        throw new AppError(403, 'no_photo_consent', 'The family has not agreed to photos, or has withdrawn it: this photo is hidden.');
      }
      const stored = await storage.get(size === 'thumb' ? photo.thumbKey : photo.storageKey);
      if (!stored) throw notFound('The photo file');
      return stored.data;
    },

    async submit(scope: ClubScope, id: string, input: { draftVersion?: number } = {}): Promise<ResultView> {
      const round = await repoFor(scope).roundOf(id);
      if (round?.closedAt) throw roundClosed();
      if (round && !round.screeningConsent) throw notTakingPart(round.athleteName);
      // A screen takes its round's date: one submitted into a round planned for a later day would be
      // dated ahead (ages, growth and "days since the last screen" counted from a day not yet come).
      // One day of slack for time zones (our choice).
      const day = round?.screenedOn;
      const latest = new Date(Date.now() + 24 * 3600 * 1000).toISOString().slice(0, 10);
      if (day && day > latest) {
        throw new AppError(
          409,
          'round_not_yet',
          `This round is dated ${formatDateInWords(day)}: its screens can be submitted from that day. The draft is kept. To screen today, open a round for today.`,
        );
      }
      return submitAssessment(db, scope, id, { evaluate: deps.evaluate, draftVersion: input.draftVersion });
    },

    /** Closing ends the session's screening; reopening (head coach, checked by the router) allows it again. */
    /**
     * Brings the squad's newcomers into an open round: a not-started screen each (a closed round is a
     * 409: reopen it first). Nothing else of the round changes.
     */
    async addNewcomers(scope: ClubScope, id: string): Promise<RoundDetail> {
      await db.transaction(async (tx) => {
        const repo = repoFor(scope, tx);
        const round = await repo.round(id);
        if (!round) throw notFound('The round');
        if (round.closedAt) throw conflict('This round is closed: reopen it before adding athletes.');
        await repo.addToRound(
          id,
          (await repo.roundNewcomers(id, round.squadId)).map((a) => a.athleteId),
        );
      });
      return roundDetail(scope, id);
    },

    async setRoundClosed(scope: ClubScope, id: string, closed: boolean): Promise<RoundDetail> {
      if (!(await repoFor(scope).setRoundClosed(id, closed ? new Date() : null))) throw notFound('The round');
      return roundDetail(scope, id);
    },

    async adjustPlan(scope: ClubScope, id: string, input: PlanAdjustmentInput): Promise<ResultView> {
      const sent = normaliseAdjustment(input);
      await db.transaction(async (tx) => {
        const repo = repoFor(scope, tx);
        // Locked so a re-submission cannot slip in between: the adjustment is for the result shown.
        if (!(await repo.lockAssessment(id))) throw notFound('The assessment');
        const current = await repo.currentResult(id);
        if (!current) throw conflict('This assessment has no result yet: submit it before adjusting the plan.');
        const [latest] = await repo.adjustments(current.id);
        const seen = input.basedOn;
        if (current.version !== seen.resultVersion || (latest?.createdAt.toISOString() ?? null) !== seen.adjustedAt) {
          throw staleVersion(
            'plan_conflict',
            'This plan was changed (or the screen re-submitted) since you opened it. Your edit was not saved: look at the current plan and edit again.',
            await resultView(repo, id),
          );
        }
        // The limits the engine applied to this result, from what it stored (older results: rebuilt).
        const ctx = loadingContextOf(current.result, current.input.oneRepMaxKg, current.input.options?.loadIncrementKg);
        const exercises = withServerWords(sent, current.result.plan.exercises, ctx);
        const overrides = enforceLimits(exercises, input, ctx, scope.role);
        await repo.addPlanAdjustment(current.id, exercises, input.note ?? '', overrides);
      });
      return (await resultView(repoFor(scope), id))!;
    },

    async athleteAssessments(scope: ClubScope, athleteId: string): Promise<{ assessments: AthleteAssessmentItem[] }> {
      const rows = await repoFor(scope).athleteAssessments(athleteId);
      return {
        assessments: rows.map((r) => ({
          assessmentId: r.assessmentId,
          roundId: r.roundId,
          roundName: r.roundName,
          screenedOn: r.screenedOn,
          status: r.status,
          submittedAt: r.submittedAt ? iso(r.submittedAt) : null,
          result: r.resultId && r.result ? { id: r.resultId, version: r.resultVersion!, engineVersion: r.engineVersion!, flags: r.result.flags } : null,
        })),
      };
    },
  };
}

export type ScreeningService = ReturnType<typeof screeningService>;

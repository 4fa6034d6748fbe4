import type { Db } from '@/db/client';
import { assessments } from '@/db/schema';
import { can } from '@/features/access/permissions';
import { NOTE_EDIT_WINDOW_MINUTES, type NoteVisibility } from '@/features/care/choices';
import type { NoteEditInput, NoteInput } from '@/features/care/schemas';
import type { NoteView } from '@/features/care/types';
import type { ClubScope } from '@/server/access/scope';
import { AppError, badRequest, forbidden, notFound } from '@/server/http/errors';
import { and, eq } from 'drizzle-orm';
import { recordAudit } from './audit.repo';
import { notesRepo } from './notes.repo';
import { careSettingsOf } from './settings.repo';

type NoteRow = NonNullable<Awaited<ReturnType<ReturnType<typeof notesRepo>['get']>>>;

const WINDOW_MS = NOTE_EDIT_WINDOW_MINUTES * 60 * 1000;

export function noteView(row: NoteRow, scope: ClubScope, now = new Date()): NoteView {
  const editableUntil = new Date(row.createdAt.getTime() + WINDOW_MS);
  return {
    id: row.id,
    athleteId: row.athleteId,
    assessmentId: row.assessmentId,
    visibility: row.visibility,
    text: row.text,
    authorId: row.authorId,
    authorName: row.authorName,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    editableUntil: editableUntil.toISOString(),
    canEdit: row.authorId === scope.userId && now < editableUntil,
  };
}

/** Team-only notes: roles holding note.read-team; testers only where the club allows it. */
export async function readsTeamNotes(db: Db, scope: ClubScope): Promise<boolean> {
  if (!can(scope.role, 'note.read-team')) return false;
  if (scope.role !== 'tester') return true;
  return (await careSettingsOf(db, scope.clubId)).testersReadTeamNotes;
}

export function notesService(db: Db, scope: ClubScope) {
  const repo = notesRepo(db, scope);
  return {
    async list(athleteId: string, only?: NoteVisibility): Promise<NoteView[]> {
      const team = await readsTeamNotes(db, scope);
      if (only === 'team' && !team) throw forbidden('Team-only notes are not shown to your role in this club.');
      const visibilities: NoteVisibility[] = only ? [only] : team ? ['team', 'family'] : ['family'];
      const rows = await repo.list(athleteId, visibilities);
      await recordAudit(db, {
        clubId: scope.clubId,
        actorId: scope.userId,
        action: 'view',
        subjectKind: 'note',
        athleteId,
        detail: { count: rows.length, visibilities },
      });
      return rows.map((r) => noteView(r, scope));
    },

    async get(id: string): Promise<NoteView> {
      const row = await repo.get(id);
      if (!row) throw notFound('The note');
      if (row.visibility === 'team' && !(await readsTeamNotes(db, scope))) throw forbidden('This note is for the care team only.');
      await recordAudit(db, { clubId: scope.clubId, actorId: scope.userId, action: 'view', subjectKind: 'note', subjectId: id, athleteId: row.athleteId });
      return noteView(row, scope);
    },

    async create(athleteId: string, input: NoteInput): Promise<NoteView> {
      const id = await db.transaction(async (tx) => {
        if (input.assessmentId) {
          const [a] = await tx
            .select({ id: assessments.id })
            .from(assessments)
            .where(and(eq(assessments.id, input.assessmentId), eq(assessments.athleteId, athleteId), eq(assessments.clubId, scope.clubId)));
          if (!a) throw badRequest('Some fields need attention.', { assessmentId: 'This is not an assessment of this athlete.' });
        }
        const noteId = await notesRepo(tx, scope).create({
          athleteId,
          assessmentId: input.assessmentId ?? null,
          visibility: input.visibility as NoteVisibility,
          text: input.text,
        });
        await recordAudit(tx, {
          clubId: scope.clubId,
          actorId: scope.userId,
          action: 'create',
          subjectKind: 'note',
          subjectId: noteId,
          athleteId,
          detail: { visibility: input.visibility },
        });
        return noteId;
      });
      return noteView((await repo.get(id))!, scope);
    },

    /** Only the author, only within the edit window; afterwards a correction is a new note. */
    async edit(id: string, input: NoteEditInput, now = new Date()): Promise<NoteView> {
      await db.transaction(async (tx) => {
        const r = notesRepo(tx, scope);
        const note = await r.lock(id);
        if (!note) throw notFound('The note');
        if (note.authorId !== scope.userId) throw forbidden('Only the author can correct a note.');
        if (now.getTime() > note.createdAt.getTime() + WINDOW_MS) {
          throw new AppError(
            409,
            'note_locked',
            `Notes can be corrected for ${NOTE_EDIT_WINDOW_MINUTES} minutes after writing; this one is now kept as written. Add a new note with the correction.`,
          );
        }
        const visibility = input.visibility as NoteVisibility | undefined;
        await r.updateText(id, input.text, visibility);
        await recordAudit(tx, {
          clubId: scope.clubId,
          actorId: scope.userId,
          action: 'update',
          subjectKind: 'note',
          subjectId: id,
          athleteId: note.athleteId,
          detail: {
            previousText: note.text,
            ...(visibility && visibility !== note.visibility ? { previousVisibility: note.visibility, visibility } : {}),
          },
        });
      });
      return noteView((await repo.get(id))!, scope, now);
    },
  };
}

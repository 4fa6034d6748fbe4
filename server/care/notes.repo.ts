import { and, asc, eq, inArray } from 'drizzle-orm';
import { careNotes, users } from '@/db/schema';
import type { NoteVisibility } from '@/features/care/choices';
import type { ClubScope } from '@/server/access/scope';
import type { Executor } from '@/server/screening/screening.repo';

/** Notes of the scope's club; the athlete was checked against the scope by guard(). */
export function notesRepo(db: Executor, scope: ClubScope) {
  const columns = {
    id: careNotes.id,
    athleteId: careNotes.athleteId,
    assessmentId: careNotes.assessmentId,
    visibility: careNotes.visibility,
    text: careNotes.text,
    authorId: careNotes.authorId,
    authorName: users.displayName,
    createdAt: careNotes.createdAt,
    updatedAt: careNotes.updatedAt,
  };
  return {
    async list(athleteId: string, visibilities: readonly NoteVisibility[]) {
      if (visibilities.length === 0) return [];
      return db
        .select(columns)
        .from(careNotes)
        .leftJoin(users, eq(users.id, careNotes.authorId))
        .where(and(eq(careNotes.clubId, scope.clubId), eq(careNotes.athleteId, athleteId), inArray(careNotes.visibility, [...visibilities])))
        .orderBy(asc(careNotes.createdAt), asc(careNotes.id));
    },
    async get(id: string) {
      const [row] = await db
        .select(columns)
        .from(careNotes)
        .leftJoin(users, eq(users.id, careNotes.authorId))
        .where(and(eq(careNotes.clubId, scope.clubId), eq(careNotes.id, id)));
      return row ?? null;
    },
    /** Locks the note's row so two saves by the author cannot race the edit window. */
    async lock(id: string) {
      const [row] = await db
        .select({
          id: careNotes.id,
          authorId: careNotes.authorId,
          createdAt: careNotes.createdAt,
          athleteId: careNotes.athleteId,
          text: careNotes.text,
          visibility: careNotes.visibility,
        })
        .from(careNotes)
        .where(and(eq(careNotes.clubId, scope.clubId), eq(careNotes.id, id)))
        .for('update');
      return row ?? null;
    },
    async create(values: { athleteId: string; assessmentId: string | null; visibility: NoteVisibility; text: string }) {
      const [row] = await db
        .insert(careNotes)
        .values({ ...values, clubId: scope.clubId, authorId: scope.userId })
        .returning({ id: careNotes.id });
      return row!.id;
    },
    async updateText(id: string, text: string, visibility?: NoteVisibility) {
      await db
        .update(careNotes)
        .set({ text, ...(visibility ? { visibility } : {}) })
        .where(and(eq(careNotes.clubId, scope.clubId), eq(careNotes.id, id)));
    },
  };
}

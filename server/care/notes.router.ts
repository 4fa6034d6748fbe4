import { eq } from 'drizzle-orm';
import { Router } from 'express';
import type { Db } from '@/db/client';
import { careNotes } from '@/db/schema';
import { noteEditSchema, noteSchema } from '@/features/care/schemas';
import { accessGuards, on, registerRecord, scopeOf } from '@/server/access/guard';
import { badRequest } from '@/server/http/errors';
import { validateBody } from '@/server/http/validate';
import { notesService } from './notes.service';

registerRecord('note', 'The note', async (db, id) => {
  const [row] = await db.select({ clubId: careNotes.clubId, athleteId: careNotes.athleteId }).from(careNotes).where(eq(careNotes.id, id));
  return row ?? null;
});

/** Notes on an athlete: team-only or shared with family; the author corrects them for a short time. */
export function notesRouter(db: Db) {
  const router = Router();
  const { guard } = accessGuards(db);
  const id = (res: { locals: object }) => (res.locals as { id: string }).id;

  // Everyone who may read family notes reaches this; team-only notes are added for roles that may read them.
  router.get('/athletes/:id/notes', guard('note.read-family', on('athlete')), async (req, res) => {
    const only = req.query.visibility;
    if (only !== undefined && only !== 'team' && only !== 'family')
      throw badRequest('Some fields need attention.', { visibility: 'Visibility is "team" or "family".' });
    res.json({ notes: await notesService(db, scopeOf(res)).list(id(res), only) });
  });

  router.post('/athletes/:id/notes', guard('note.write', on('athlete')), validateBody(noteSchema), async (req, res) => {
    res.status(201).json({ note: await notesService(db, scopeOf(res)).create(id(res), req.body) });
  });

  router.get('/notes/:id', guard('note.read-family', on('note')), async (_req, res) => {
    res.json({ note: await notesService(db, scopeOf(res)).get(id(res)) });
  });

  router.patch('/notes/:id', guard('note.write', on('note')), validateBody(noteEditSchema), async (req, res) => {
    res.json({ note: await notesService(db, scopeOf(res)).edit(id(res), req.body) });
  });

  return router;
}

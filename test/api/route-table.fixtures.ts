// Sample records for the route-table test (route-table.test.ts): one per kind of record a route can
// guard with `guard(action, on(kind))`. A new kind of record needs one line here, nothing else.
import type { Db } from '@/db/client';
import { assessments, careNotes, photos, rounds } from '@/db/schema';
import type { PhotoStorage } from '@/server/storage/storage';

/** The club every route is called about, with one family's child and another family's child in it. */
export type RouteWorld = {
  db: Db;
  storage: PhotoStorage;
  clubId: string;
  squadId: string;
  /** The child of the `parent-own-child` caller. */
  ownChildId: string;
  /** The child of the `parent-of-another-family` caller. */
  otherChildId: string;
  staffUserId: string;
};

/**
 * Builds a record of the kind in `world.clubId` and returns its id. A record that belongs to an athlete
 * must belong to `ownChildId`: the test expects the own-child parent to reach it and the other family's
 * parent not to.
 */
export type RecordFixture = (world: RouteWorld) => Promise<string>;

const roundOf = async (w: RouteWorld) => {
  const [round] = await w.db.insert(rounds).values({ clubId: w.clubId, squadId: w.squadId, name: 'Route-table round', screenedOn: '2026-09-14' }).returning();
  return round!.id;
};

const assessmentOf = async (w: RouteWorld) => {
  const [a] = await w.db
    .insert(assessments)
    .values({ clubId: w.clubId, roundId: await roundOf(w), athleteId: w.ownChildId })
    .returning();
  return a!.id;
};

export const RECORD_FIXTURES: Record<string, RecordFixture> = {
  athlete: async (w) => w.ownChildId,
  squad: async (w) => w.squadId,
  round: roundOf,
  assessment: assessmentOf,
  photo: async (w) => {
    const assessmentId = await assessmentOf(w);
    const key = `${w.clubId}/${assessmentId}/route-table`;
    await w.storage.put(`${key}.jpg`, Buffer.from('not really a jpeg'), 'image/jpeg');
    await w.storage.put(`${key}-thumb.jpg`, Buffer.from('not really a jpeg'), 'image/jpeg');
    const [p] = await w.db
      .insert(photos)
      .values({
        clubId: w.clubId,
        assessmentId,
        taskId: 'two-leg-squat',
        view: 'front',
        storageKey: `${key}.jpg`,
        thumbKey: `${key}-thumb.jpg`,
        width: 900,
        height: 1600,
        uploadedBy: w.staffUserId,
      })
      .returning();
    return p!.id;
  },
  // A note shared with the family, about the caller's own child: every role holding a note action may reach it.
  note: async (w) => {
    const [n] = await w.db
      .insert(careNotes)
      .values({ clubId: w.clubId, athleteId: w.ownChildId, authorId: w.staffUserId, visibility: 'family', text: 'Route-table sample note.' })
      .returning({ id: careNotes.id });
    return n!.id;
  },
};

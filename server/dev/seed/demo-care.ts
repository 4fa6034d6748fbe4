import { and, asc, eq, inArray } from 'drizzle-orm';
import type { Db } from '@/db/client';
import { assessments, athletes, rounds, users } from '@/db/schema';
import type { ClubScope } from '@/server/access/scope';
import { recordAudit } from '@/server/care/audit.repo';
import { clearanceRepo } from '@/server/care/clearance.repo';
import { notesRepo } from '@/server/care/notes.repo';
import { reviewsRepo } from '@/server/care/reviews.repo';
import { releaseSummary } from '@/server/care/summary.service';
import { applyClearance } from '@/server/care/clearance.service';
import type { Executor } from '@/server/screening/screening.repo';
import type { Outbox } from '@/server/mail/outbox';
import type { DemoIds } from './demo';

// Seeded summaries are history: nothing is e-mailed for them (and no e-mail is rendered or recorded).
const silentOutbox: Outbox = { enqueue: async () => undefined, stop: async () => undefined };

/**
 * The care team's demo: the Okafor children's screens reviewed and released (a current summary and
 * earlier ones for the demo parent), everyone else's newest screen waiting for the physiotherapist,
 * a few clearances and notes.
 */
export async function seedDemoCare(db: Db, ids: Pick<DemoIds, 'clubId' | 'athleteIds'>, publicUrl = 'http://127.0.0.1:8080') {
  // One transaction: one commit instead of one per release keeps the demo quick to load.
  await db.transaction(async (tx) => seedIn(tx as unknown as Db, ids, publicUrl));
}

async function seedIn(db: Db, ids: Pick<DemoIds, 'clubId' | 'athleteIds'>, publicUrl: string) {
  const [physio] = await db.select({ id: users.id }).from(users).where(eq(users.email, 'physio@squadline.test'));
  const scope: ClubScope = { userId: physio!.id, clubId: ids.clubId, role: 'physio', athleteIds: null };
  const screens = await db
    .select({
      id: assessments.id,
      athleteId: assessments.athleteId,
      squadId: rounds.squadId,
      screenedOn: rounds.screenedOn,
      lastName: athletes.lastName,
      firstName: athletes.firstName,
    })
    .from(assessments)
    .innerJoin(rounds, eq(rounds.id, assessments.roundId))
    .innerJoin(athletes, eq(athletes.id, assessments.athleteId))
    .where(and(eq(assessments.clubId, ids.clubId), eq(assessments.status, 'submitted')))
    .orderBy(asc(rounds.screenedOn));
  // The Okafor children's screens, oldest first: the newest is their current summary, the others earlier
  // ones. Everyone else's newest screen waits in the physiotherapist's list (older ones are superseded).
  for (const s of screens.filter((x) => x.lastName === 'Okafor')) {
    await reviewsRepo(db, scope).markReviewed(s.id, (await reviewsRepo(db, scope).state(s.id))!.resultId);
    const at = new Date(`${s.screenedOn}T18:00:00Z`);
    at.setUTCDate(at.getUTCDate() + 3);
    await releaseSummary({ db, outbox: silentOutbox, publicUrl }, scope, s.id, { releasedBy: physio!.id, at, notify: false });
  }

  const okafor = await db
    .select({ id: athletes.id, firstName: athletes.firstName })
    .from(athletes)
    .where(and(eq(athletes.clubId, ids.clubId), eq(athletes.lastName, 'Okafor'), inArray(athletes.id, ids.athleteIds)));
  const maya = okafor.find((a) => a.firstName === 'Maya')!;
  const notes = notesRepo(db, scope);
  const shared = await notes.create({
    athleteId: maya.id,
    assessmentId: null,
    visibility: 'family',
    text: 'Maya is doing well and has nothing extra to do for now. Her usual warm-up before each session is enough.',
  });
  const team = await notes.create({
    athleteId: maya.id,
    assessmentId: null,
    visibility: 'team',
    text: 'Mild heel soreness after the tournament weekend; watch jump volume in the next block.',
  });
  const clearances = clearanceRepo(db, scope);
  const others = ids.athleteIds.filter((id) => !okafor.some((o) => o.id === id));
  const { id: modified } = await clearances.add(others[2]!, 'modified', 'No drop landings for three weeks; everything else as planned.', ['landing']);
  const { id: referred } = await clearances.add(others[7]!, 'referred', 'Sports physician at the district clinic, for knee pain after jumps.');
  const { id: cleared } = await clearances.add(maya.id, 'cleared', '');
  // As the route does: the plans and the family's page follow each decision (Maya's released summary is
  // shared again, without e-mail, saying who cleared her and when).
  await applyClearance(db as Executor, scope, others[2]!, modified, 'modified');
  await applyClearance(db as Executor, scope, others[7]!, referred, 'referred');
  await applyClearance(db as Executor, scope, maya.id, cleared, 'cleared');
  await recordAudit(
    db,
    { clubId: ids.clubId, actorId: physio!.id, action: 'create', subjectKind: 'note', subjectId: shared, athleteId: maya.id, detail: { visibility: 'family' } },
    { clubId: ids.clubId, actorId: physio!.id, action: 'create', subjectKind: 'note', subjectId: team, athleteId: maya.id, detail: { visibility: 'team' } },
    {
      clubId: ids.clubId,
      actorId: physio!.id,
      action: 'set',
      subjectKind: 'clearance',
      subjectId: modified,
      athleteId: others[2]!,
      detail: { status: 'modified', holds: ['landing'] },
    },
    {
      clubId: ids.clubId,
      actorId: physio!.id,
      action: 'set',
      subjectKind: 'clearance',
      subjectId: referred,
      athleteId: others[7]!,
      detail: { status: 'referred' },
    },
    { clubId: ids.clubId, actorId: physio!.id, action: 'set', subjectKind: 'clearance', subjectId: cleared, athleteId: maya.id, detail: { status: 'cleared' } },
  );
}

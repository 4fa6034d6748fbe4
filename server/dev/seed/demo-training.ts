import { and, eq, inArray, isNull } from 'drizzle-orm';
import type { Db } from '@/db/client';
import { athletes, memberships, users } from '@/db/schema';
import { sessionsRepo } from '@/server/training/training.repo';
import { DEMO_USERS } from './demo-accounts';
import type { DemoIds } from './demo';
import { seededRandom } from './random';

type Span = { from: string; to: string; breakFrom: string; breakTo: string };

/**
 * Corrective sessions of an invented season for the demo squads: twice a week (Tuesday and Thursday)
 * between the mid-season and autumn rounds, with a four-week summer break, and again after the autumn
 * round until late November, with a week's break; each athlete missing some. Recorded through the
 * training repository, as the training sheet does.
 */
export const DEMO_SESSION_SPAN: Span = { from: '2026-06-16', to: '2026-09-10', breakFrom: '2026-07-20', breakTo: '2026-08-16' };
export const DEMO_AUTUMN_SESSION_SPAN: Span = { from: '2026-09-22', to: '2026-11-26', breakFrom: '2026-10-26', breakTo: '2026-11-01' };

function sessionDays(span: Span): string[] {
  const out: string[] = [];
  for (let d = new Date(`${span.from}T12:00:00Z`); d.toISOString().slice(0, 10) <= span.to; d.setUTCDate(d.getUTCDate() + 1)) {
    const day = d.toISOString().slice(0, 10);
    const weekday = d.getUTCDay();
    if ((weekday === 2 || weekday === 4) && !(day >= span.breakFrom && day <= span.breakTo)) out.push(day);
  }
  return out;
}

export async function seedDemoTraining(db: Db, ids: Pick<DemoIds, 'clubId' | 'squadIds'>): Promise<void> {
  const rand = seededRandom(20260616);
  const coachEmail = DEMO_USERS.find((u) => u.role === 'head_coach')!.email;
  const [coach] = await db
    .select({ id: users.id })
    .from(users)
    .innerJoin(memberships, and(eq(memberships.userId, users.id), eq(memberships.clubId, ids.clubId)))
    .where(eq(users.email, coachEmail));
  const repo = sessionsRepo(db, { userId: coach!.id, clubId: ids.clubId, role: 'head_coach', athleteIds: null });
  const rows = await db
    .select({ id: athletes.id, squadId: athletes.squadId })
    .from(athletes)
    .where(and(eq(athletes.clubId, ids.clubId), inArray(athletes.squadId, ids.squadIds), isNull(athletes.archivedAt)))
    .orderBy(athletes.lastName, athletes.firstName);
  for (const squadId of ids.squadIds) {
    const squad = rows.filter((r) => r.squadId === squadId);
    // Each athlete's chance of being there: most come nearly always, a few far less (our invention).
    const turnout = new Map(squad.map((a, i) => [a.id, i % 5 === 3 ? 0.45 : 0.85 + rand() * 0.1]));
    for (const heldOn of [...sessionDays(DEMO_SESSION_SPAN), ...sessionDays(DEMO_AUTUMN_SESSION_SPAN)]) {
      const athleteIds = squad.filter((a) => rand() < turnout.get(a.id)!).map((a) => a.id);
      if (athleteIds.length) await repo.record(squadId, { heldOn, athleteIds, note: '' });
    }
  }
}

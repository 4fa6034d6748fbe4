import { and, desc, eq, inArray } from 'drizzle-orm';
import { clearances, users } from '@/db/schema';
import { CLEARANCE_HOLDS, type ClearanceHold, type ClearanceStatus } from '@/features/care/choices';
import type { ClearanceView } from '@/features/care/types';
import type { ClubScope } from '@/server/access/scope';
import type { Executor } from '@/server/screening/screening.repo';

/** The stored holds in the choices' order, unknown words dropped. */
const holdsOf = (stored: readonly string[]): ClearanceHold[] => CLEARANCE_HOLDS.filter((h) => stored.includes(h));

/** The clearance in force for each athlete (newest decision), keyed by athlete id. */
export async function latestClearances(db: Executor, athleteIds: readonly string[]): Promise<Map<string, NonNullable<ClearanceView>>> {
  if (athleteIds.length === 0) return new Map();
  const rows = await db
    .selectDistinctOn([clearances.athleteId], {
      athleteId: clearances.athleteId,
      status: clearances.status,
      detail: clearances.detail,
      holds: clearances.holds,
      setByName: users.displayName,
      createdAt: clearances.createdAt,
    })
    .from(clearances)
    .leftJoin(users, eq(users.id, clearances.setBy))
    .where(inArray(clearances.athleteId, [...athleteIds]))
    .orderBy(clearances.athleteId, desc(clearances.createdAt), desc(clearances.id));
  return new Map(
    rows.map((r) => [r.athleteId, { status: r.status, detail: r.detail, holds: holdsOf(r.holds), setByName: r.setByName, setAt: r.createdAt.toISOString() }]),
  );
}

export function clearanceRepo(db: Executor, scope: ClubScope) {
  return {
    async current(athleteId: string): Promise<ClearanceView> {
      return (await latestClearances(db, [athleteId])).get(athleteId) ?? null;
    },
    async history(athleteId: string) {
      const rows = await db
        .select({
          id: clearances.id,
          status: clearances.status,
          detail: clearances.detail,
          holds: clearances.holds,
          setByName: users.displayName,
          createdAt: clearances.createdAt,
        })
        .from(clearances)
        .leftJoin(users, eq(users.id, clearances.setBy))
        .where(and(eq(clearances.clubId, scope.clubId), eq(clearances.athleteId, athleteId)))
        .orderBy(desc(clearances.createdAt), desc(clearances.id));
      return rows.map((r) => ({
        id: r.id,
        status: r.status,
        detail: r.detail,
        holds: holdsOf(r.holds),
        setByName: r.setByName,
        setAt: r.createdAt.toISOString(),
      }));
    },
    /** Records a decision; holds only with "train with changes", known ones once each. Returns the row's id and the holds stored. */
    async add(athleteId: string, status: ClearanceStatus, detail: string, holds: readonly string[] = []) {
      const stored = status === 'modified' ? holdsOf(holds) : [];
      const [row] = await db
        .insert(clearances)
        .values({ clubId: scope.clubId, athleteId, status, detail, holds: stored, setBy: scope.userId })
        .returning({ id: clearances.id });
      return { id: row!.id, holds: stored };
    },
  };
}

import { and, desc, eq, inArray, isNull, ne, sql } from 'drizzle-orm';
import { assessmentResults, assessments, athletes, clearances, rounds, users } from '@/db/schema';
import { CLEARANCE_HOLDS, type ClearanceHold, type ClearanceStatus } from '@/features/care/choices';
import { strengthBlock } from '@/features/care/strength-block';
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

/**
 * Athletes of the club whose newest submitted screen reported pain, or carried pain from an earlier one
 * (`options.earlierPain`), and whose plan still waits for a physiotherapist (no clearance recorded since
 * that result, none referring them on): the day the pain was reported and the tasks in which it hurt. The
 * same rule as `strengthBlock`'s "clearance-needed". `only` narrows it to one athlete, leaving one
 * assessment out (the one being submitted).
 */
export async function painWaiting(
  db: Executor,
  clubId: string,
  only?: { athleteId: string; exceptAssessmentId: string },
): Promise<Record<string, { screenedOn: string; taskIds: string[] }>> {
  const newest = await db
    .selectDistinctOn([assessments.athleteId], {
      athleteId: assessments.athleteId,
      screenedOn: sql<string>`coalesce(${assessmentResults.input} #>> '{options,earlierPain,day}', ${rounds.screenedOn}::text)`,
      status: sql<string | null>`${assessmentResults.result} #>> '{plan,status}'`,
      createdAt: assessmentResults.createdAt,
      taskIds: sql<string[]>`jsonb_path_query_array(${assessmentResults.input}, '$.tasks.keyvalue() ? (@.value.painReported == true).key')
        || coalesce(${assessmentResults.input} #> '{options,earlierPain,taskIds}', '[]'::jsonb)`,
    })
    .from(assessments)
    .innerJoin(rounds, eq(rounds.id, assessments.roundId))
    .innerJoin(athletes, eq(athletes.id, assessments.athleteId))
    .innerJoin(assessmentResults, and(eq(assessmentResults.assessmentId, assessments.id), eq(assessmentResults.isCurrent, true)))
    .where(
      and(
        eq(assessments.clubId, clubId),
        eq(assessments.status, 'submitted'),
        isNull(athletes.archivedAt),
        only ? and(eq(assessments.athleteId, only.athleteId), ne(assessments.id, only.exceptAssessmentId)) : undefined,
      ),
    )
    .orderBy(assessments.athleteId, desc(rounds.screenedOn), desc(assessmentResults.createdAt));
  const waiting = newest.filter((r) => r.status === 'clearance-needed');
  const decided = await latestClearances(
    db,
    waiting.map((r) => r.athleteId),
  );
  return Object.fromEntries(
    waiting
      .filter((r) => {
        const block = strengthBlock({ status: 'clearance-needed' }, decided.get(r.athleteId) ?? null, r.createdAt.toISOString());
        return block.blocked && block.reason === 'clearance-needed';
      })
      .map((r) => [r.athleteId, { screenedOn: r.screenedOn, taskIds: [...new Set(r.taskIds)] }]),
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

import { and, desc, eq, inArray, isNull, sql } from 'drizzle-orm';
import { preparedRows, type Db } from '@/db/client';
import { athletes, trainingAttendance, trainingSessions, users } from '@/db/schema';
import type { RecordSessionInput, SessionView } from '@/features/training/schemas';
import type { SheetMember } from '@/features/training/sheet';
import type { ClubScope } from '@/server/access/scope';
import { screeningConsentSql, type Executor } from '@/server/screening/screening.repo';

type Head = { squad: { id: string; name: string } | null; members: SheetMember[] };
export type SheetHead = { squad: { id: string; name: string }; members: SheetMember[] };

/**
 * A squad's current members, each with the plan in force on their newest submitted screen (wherever it
 * was: `athlete_latest_screens`), that result's newest adjustment and the clearance in force: one
 * statement, filtered by the scope's club. Only the plan's status, exercises, growth-spurt mark and
 * re-screen date are read from the stored result, not its measurements and flags.
 */
export function trainingRepo(db: Executor, scope: ClubScope) {
  return {
    async sheetMembers(squadId: string): Promise<SheetHead | null> {
      const [head] = await preparedRows<Head>(
        db,
        'training_sheet_members',
        `select
          (select json_build_object('id', s.id, 'name', s.name) from squads s where s.id = $1 and s.club_id = $2) as squad,
          (select coalesce(json_agg(json_build_object(
              'id', m.id, 'firstName', m.first_name, 'lastName', m.last_name,
              'assessmentId', ar.assessment_id, 'screenedOn', case when ar.id is null then null else l.screened_on end,
              'resultCreatedAt', ar.created_at,
              'plan', case when ar.id is null then null else jsonb_build_object(
                'status', ar.result #> '{plan,status}', 'exercises', ar.result #> '{plan,exercises}',
                'growthSpurtAdjusted', ar.result #> '{plan,growthSpurtAdjusted}', 'rescreenDate', ar.result #> '{plan,rescreenDate}') end,
              'adjusted', case when pa.exercises is null then null else json_build_object('exercises', pa.exercises, 'at', pa.created_at, 'byName', u.display_name) end,
              'clearance', case when c.status is null then null else json_build_object('status', c.status, 'setAt', c.created_at, 'detail', c.detail, 'holds', c.holds) end,
              'takingPart', coalesce(sc.granted, false),
              'screeningRefused', coalesce(not sc.granted, false)
            ) order by m.last_name, m.first_name, m.id), '[]')
            from athletes m
            left join athlete_latest_screens l on l.athlete_id = m.id
            left join assessment_results ar on ar.assessment_id = l.assessment_id and ar.is_current and ar.club_id = $2
            left join lateral (
              select exercises, created_at, created_by from plan_adjustments
              where result_id = ar.id order by created_at desc, id desc limit 1
            ) pa on true
            left join users u on u.id = pa.created_by
            left join lateral (
              select granted from consents where athlete_id = m.id and kind = 'screening' order by created_at desc limit 1
            ) sc on true
            left join lateral (
              select status, created_at, detail, holds from clearances where athlete_id = m.id and club_id = $2 order by created_at desc limit 1
            ) c on true
            where m.squad_id = $1 and m.club_id = $2 and m.archived_at is null) as members`,
        [squadId, scope.clubId],
      );
      if (!head?.squad) return null;
      // Times as JavaScript writes them, so that the hold rule compares like with like.
      const iso = (t: string) => new Date(t).toISOString();
      const members = head.members.map((m) => ({
        ...m,
        resultCreatedAt: m.resultCreatedAt && iso(m.resultCreatedAt),
        adjusted: m.adjusted && { ...m.adjusted, at: iso(m.adjusted.at) },
        clearance: m.clearance && { ...m.clearance, setAt: iso(m.clearance.setAt) },
      }));
      return { squad: head.squad, members };
    },
  };
}

/** Recorded sessions of a squad, and recording one (a day recorded again replaces who took part). */
export function sessionsRepo(db: Db, scope: ClubScope) {
  const clubId = scope.clubId;
  return {
    /** The squad's current (not archived) members among `athleteIds`. */
    async currentMembers(squadId: string, athleteIds: readonly string[]): Promise<Set<string>> {
      if (athleteIds.length === 0) return new Set();
      const rows = await db
        .select({ id: athletes.id })
        .from(athletes)
        .where(and(eq(athletes.clubId, clubId), eq(athletes.squadId, squadId), isNull(athletes.archivedAt), inArray(athletes.id, [...athleteIds])));
      return new Set(rows.map((r) => r.id));
    },

    /** Those among `athleteIds` whose family has not agreed to screening and corrective exercises, by name. */
    async withoutConsent(athleteIds: readonly string[]): Promise<string[]> {
      if (athleteIds.length === 0) return [];
      const rows = await db
        .select({ name: sql<string>`${athletes.firstName} || ' ' || ${athletes.lastName}` })
        .from(athletes)
        .where(and(eq(athletes.clubId, clubId), inArray(athletes.id, [...athleteIds]), sql`not ${screeningConsentSql}`));
      return rows.map((r) => r.name);
    },

    /** Writes the day's session and its attendance in one transaction; `created` when the day was new. */
    async record(squadId: string, input: RecordSessionInput): Promise<{ id: string; created: boolean }> {
      return db.transaction(async (tx) => {
        const [before] = await tx
          .select({ id: trainingSessions.id })
          .from(trainingSessions)
          .where(and(eq(trainingSessions.clubId, clubId), eq(trainingSessions.squadId, squadId), eq(trainingSessions.heldOn, input.heldOn)));
        // One row per squad and day (unique index): a day recorded again, or twice at once, updates it.
        const [row] = await tx
          .insert(trainingSessions)
          .values({ clubId, squadId, heldOn: input.heldOn, note: input.note, recordedBy: scope.userId })
          .onConflictDoUpdate({ target: [trainingSessions.squadId, trainingSessions.heldOn], set: { note: input.note, recordedBy: scope.userId } })
          .returning({ id: trainingSessions.id });
        await tx.delete(trainingAttendance).where(eq(trainingAttendance.sessionId, row!.id));
        await tx.insert(trainingAttendance).values([...new Set(input.athleteIds)].map((athleteId) => ({ sessionId: row!.id, athleteId, clubId })));
        return { id: row!.id, created: !before };
      });
    },

    /** The squad's latest sessions, newest first, with who took part; or the one session `onlyId`. */
    async latest(squadId: string, options: { limit?: number; onlyId?: string } = {}): Promise<SessionView[]> {
      return db
        .select({
          id: trainingSessions.id,
          heldOn: trainingSessions.heldOn,
          note: trainingSessions.note,
          recordedByName: users.displayName,
          athleteIds: sql<
            string[]
          >`coalesce((select array_agg(a.athlete_id order by a.athlete_id) from ${trainingAttendance} a where a.session_id = ${trainingSessions.id}), '{}')`,
        })
        .from(trainingSessions)
        .leftJoin(users, eq(users.id, trainingSessions.recordedBy))
        .where(
          and(eq(trainingSessions.clubId, clubId), eq(trainingSessions.squadId, squadId), options.onlyId ? eq(trainingSessions.id, options.onlyId) : undefined),
        )
        .orderBy(desc(trainingSessions.heldOn))
        .limit(options.limit ?? 10);
    },
  };
}

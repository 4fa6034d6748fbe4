import { and, asc, desc, eq, inArray, isNull, sql } from 'drizzle-orm';
import type { Db } from '@/db/client';
import { athletes, consents, squads } from '@/db/schema';
import { athleteFilter, type ClubScope } from '@/server/access/scope';

export type ConsentView = { granted: boolean; decidedOn: string } | null;
export type AthleteView = {
  id: string;
  clubId: string;
  squadId: string | null;
  squadName: string | null;
  firstName: string;
  lastName: string;
  dateOfBirth: string;
  sex: 'female' | 'male';
  racketHand: 'left' | 'right';
  takeOffLeg: 'left' | 'right';
  archived: boolean;
  consents: { photos: ConsentView; emailSummaries: ConsentView };
};

/** Every query here filters by the scope's club and, for parents, by their athletes. */
export function athletesRepo(db: Db, scope: ClubScope) {
  const inScope = (...extra: (ReturnType<typeof eq> | undefined)[]) =>
    and(eq(athletes.clubId, scope.clubId), athleteFilter(scope, athletes.id), ...extra);

  async function withConsents(rows: Omit<AthleteView, 'consents'>[]): Promise<AthleteView[]> {
    if (rows.length === 0) return [];
    const latest = await db
      .selectDistinctOn([consents.athleteId, consents.kind], {
        athleteId: consents.athleteId,
        kind: consents.kind,
        granted: consents.granted,
        decidedOn: consents.decidedOn,
      })
      .from(consents)
      .where(inArray(consents.athleteId, rows.map((r) => r.id)))
      .orderBy(consents.athleteId, consents.kind, desc(consents.createdAt));
    return rows.map((row) => {
      const find = (kind: 'photos' | 'email_summaries'): ConsentView => {
        const c = latest.find((l) => l.athleteId === row.id && l.kind === kind);
        return c ? { granted: c.granted, decidedOn: c.decidedOn } : null;
      };
      return { ...row, consents: { photos: find('photos'), emailSummaries: find('email_summaries') } };
    });
  }

  const columns = {
    id: athletes.id,
    clubId: athletes.clubId,
    squadId: athletes.squadId,
    squadName: squads.name,
    firstName: athletes.firstName,
    lastName: athletes.lastName,
    dateOfBirth: athletes.dateOfBirth,
    sex: athletes.sex,
    racketHand: athletes.racketHand,
    takeOffLeg: athletes.takeOffLeg,
    archived: sql<boolean>`${athletes.archivedAt} is not null`,
  };

  return {
    async list(options: { squadId?: string; includeArchived?: boolean } = {}) {
      const rows = await db
        .select(columns)
        .from(athletes)
        .leftJoin(squads, eq(squads.id, athletes.squadId))
        .where(
          inScope(
            options.squadId ? eq(athletes.squadId, options.squadId) : undefined,
            options.includeArchived ? undefined : (isNull(athletes.archivedAt) as ReturnType<typeof eq>),
          ),
        )
        .orderBy(asc(athletes.lastName), asc(athletes.firstName));
      return withConsents(rows);
    },
    async get(id: string): Promise<AthleteView | null> {
      const rows = await db
        .select(columns)
        .from(athletes)
        .leftJoin(squads, eq(squads.id, athletes.squadId))
        .where(inScope(eq(athletes.id, id)));
      return (await withConsents(rows))[0] ?? null;
    },
    async squads() {
      return db
        .select({ id: squads.id, name: squads.name, athleteCount: sql<number>`count(${athletes.id})::int` })
        .from(squads)
        .leftJoin(athletes, and(eq(athletes.squadId, squads.id), isNull(athletes.archivedAt)))
        .where(and(eq(squads.clubId, scope.clubId), isNull(squads.archivedAt)))
        .groupBy(squads.id)
        .orderBy(asc(squads.name));
    },
    async squad(id: string) {
      const [row] = await db.select().from(squads).where(and(eq(squads.clubId, scope.clubId), eq(squads.id, id)));
      return row ?? null;
    },
  };
}

/** The club an athlete belongs to, looked up before the caller's scope is known. */
export async function clubOfAthlete(db: Db, athleteId: string): Promise<string | null> {
  const [row] = await db.select({ clubId: athletes.clubId }).from(athletes).where(eq(athletes.id, athleteId));
  return row?.clubId ?? null;
}

export async function clubOfSquad(db: Db, squadId: string): Promise<string | null> {
  const [row] = await db.select({ clubId: squads.clubId }).from(squads).where(eq(squads.id, squadId));
  return row?.clubId ?? null;
}

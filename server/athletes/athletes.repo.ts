import { randomUUID } from 'node:crypto';
import { and, asc, desc, eq, gt, inArray, isNull, ne, sql, type SQL } from 'drizzle-orm';
import type { NodePgQueryResultHKT } from 'drizzle-orm/node-postgres';
import type { PgDatabase } from 'drizzle-orm/pg-core';
import type { Db } from '@/db/client';
import type * as schema from '@/db/schema';
import { athletes, consents, guardianLinks, invitationAthletes, invitations, memberships, squads, users, type Role } from '@/db/schema';
import { athleteFilter, type ClubScope } from '@/server/access/scope';
import type { Athlete, ConsentView, SquadSummary } from '@/features/athletes/api/types';
import { latestClearances } from '@/server/care/clearance.repo';
import { can } from '@/features/access/permissions';
import type { ConsentKind } from '@/features/athletes/schemas';

/** The database or a transaction: repositories work inside either. */
export type Executor = PgDatabase<NodePgQueryResultHKT, typeof schema>;

// The response shape is shared with the client (features/athletes/api/types.ts); guardians are added by the service.
export type { ConsentView };
export type AthleteView = Omit<Athlete, 'guardians'>;
export type GuardianView = { userId: string; displayName: string; email: string };
export type ConsentRecordView = {
  id: string;
  kind: ConsentKind;
  granted: boolean;
  decidedOn: string;
  recordedBy: string | null;
  recordedAt: Date;
};
export type AthleteValues = Pick<typeof athletes.$inferInsert, 'firstName' | 'lastName' | 'dateOfBirth' | 'sex' | 'racketHand' | 'takeOffLeg' | 'squadId'>;

/** Same person: names compared without case or surrounding spaces, plus the date of birth. */
export const identityKey = (firstName: string, lastName: string, dateOfBirth: string) =>
  `${firstName.trim().toLowerCase()}|${lastName.trim().toLowerCase()}|${dateOfBirth}`;

/** Every query here filters by the scope's club and, for parents, by their athletes. */
export function athletesRepo(db: Executor | Db, scope: ClubScope) {
  const inScope = (...extra: (SQL | undefined)[]) => and(eq(athletes.clubId, scope.clubId), athleteFilter(scope, athletes.id), ...extra);

  async function withConsents(rows: Omit<AthleteView, 'consents' | 'clearance'>[]): Promise<AthleteView[]> {
    if (rows.length === 0) return [];
    const latest = await db
      .selectDistinctOn([consents.athleteId, consents.kind], {
        athleteId: consents.athleteId,
        kind: consents.kind,
        granted: consents.granted,
        decidedOn: consents.decidedOn,
      })
      .from(consents)
      .where(
        inArray(
          consents.athleteId,
          rows.map((r) => r.id),
        ),
      )
      .orderBy(consents.athleteId, consents.kind, desc(consents.createdAt));
    const clearance = await latestClearances(
      db,
      rows.map((r) => r.id),
    );
    return rows.map((row) => {
      const find = (kind: ConsentKind): ConsentView => {
        const c = latest.find((l) => l.athleteId === row.id && l.kind === kind);
        return c ? { granted: c.granted, decidedOn: c.decidedOn } : null;
      };
      const decided = clearance.get(row.id) ?? null;
      return {
        ...row,
        consents: { screening: find('screening'), photos: find('photos'), emailSummaries: find('email_summaries') },
        // The physiotherapist's words are for the team (they may name a clinic or a condition): a
        // parent reads the decision only, and the family summary's own wording of it.
        clearance: decided && !can(scope.role, 'roster.read') ? { ...decided, detail: '' } : decided,
      };
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

  const squadOfClub = (...extra: (SQL | undefined)[]) => and(eq(squads.clubId, scope.clubId), ...extra);

  return {
    async list(options: { squadId?: string; includeArchived?: boolean } = {}): Promise<AthleteView[]> {
      // Staff see how many parent accounts are linked to each child (a child with none has no family
      // reading the club's summaries); parents do not learn of the other adults linked.
      const staff = can(scope.role, 'guardians.read');
      const guardianCount = sql<number>`(select count(*)::int from ${guardianLinks} where ${guardianLinks.athleteId} = ${athletes.id})`;
      const rows = await db
        .select({ ...columns, ...(staff ? { guardianCount } : {}) })
        .from(athletes)
        .leftJoin(squads, eq(squads.id, athletes.squadId))
        .where(inScope(options.squadId ? eq(athletes.squadId, options.squadId) : undefined, options.includeArchived ? undefined : isNull(athletes.archivedAt)))
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
    async create(values: AthleteValues): Promise<string> {
      const [row] = await db
        .insert(athletes)
        .values({ ...values, clubId: scope.clubId })
        .returning({ id: athletes.id });
      return row!.id;
    },
    async createMany(values: AthleteValues[]): Promise<string[]> {
      if (values.length === 0) return [];
      // Ids chosen here, so that the caller can pair them with its rows without relying on RETURNING's order.
      const ids = values.map(() => randomUUID());
      await db.insert(athletes).values(values.map((v, i) => ({ ...v, id: ids[i]!, clubId: scope.clubId })));
      return ids;
    },
    async update(id: string, values: Partial<AthleteValues>) {
      await db
        .update(athletes)
        .set(values)
        .where(inScope(eq(athletes.id, id)));
    },
    async setArchived(id: string, archived: boolean) {
      await db
        .update(athletes)
        .set({ archivedAt: archived ? new Date() : null })
        .where(inScope(eq(athletes.id, id)));
    },
    /** Athletes of the club (archived too) with this name and date of birth, except `exceptId`. */
    async sameIdentity(firstName: string, lastName: string, dateOfBirth: string, exceptId?: string) {
      return db
        .select({ id: athletes.id, archived: columns.archived })
        .from(athletes)
        .where(
          inScope(
            sql`lower(trim(${athletes.firstName})) = ${firstName.trim().toLowerCase()}`,
            sql`lower(trim(${athletes.lastName})) = ${lastName.trim().toLowerCase()}`,
            eq(athletes.dateOfBirth, dateOfBirth),
            exceptId ? ne(athletes.id, exceptId) : undefined,
          ),
        );
    },
    /** Serialises roster writes of one club, so that two imports cannot both add the same child. */
    async lockRoster() {
      await db.execute(sql`select pg_advisory_xact_lock(hashtext(${`roster:${scope.clubId}`}))`);
    },

    // --- consents ---------------------------------------------------------------------------------
    async consentHistory(athleteId: string): Promise<ConsentRecordView[]> {
      return db
        .select({
          id: consents.id,
          kind: consents.kind,
          granted: consents.granted,
          decidedOn: consents.decidedOn,
          recordedBy: users.displayName,
          recordedAt: consents.createdAt,
        })
        .from(consents)
        .innerJoin(athletes, eq(athletes.id, consents.athleteId))
        .leftJoin(users, eq(users.id, consents.recordedBy))
        .where(inScope(eq(consents.athleteId, athleteId)))
        .orderBy(desc(consents.createdAt), desc(consents.id));
    },
    async recordConsents(rows: { athleteId: string; kind: ConsentKind; granted: boolean; decidedOn: string }[]) {
      if (rows.length === 0) return [];
      return db
        .insert(consents)
        .values(rows.map((r) => ({ ...r, recordedBy: scope.userId })))
        .returning({ id: consents.id });
    },

    // --- guardians --------------------------------------------------------------------------------
    async guardians(athleteId: string): Promise<GuardianView[]> {
      return db
        .select({ userId: users.id, displayName: users.displayName, email: users.email })
        .from(guardianLinks)
        .innerJoin(users, eq(users.id, guardianLinks.userId))
        .innerJoin(athletes, eq(athletes.id, guardianLinks.athleteId))
        .where(inScope(eq(guardianLinks.athleteId, athleteId)))
        .orderBy(asc(users.displayName));
    },
    /** Every parent link of the club's children, as `athleteId:userId`. */
    async guardianLinkKeys(): Promise<Set<string>> {
      const rows = await db
        .select({ athleteId: guardianLinks.athleteId, userId: guardianLinks.userId })
        .from(guardianLinks)
        .innerJoin(athletes, eq(athletes.id, guardianLinks.athleteId))
        .where(inScope());
      return new Set(rows.map((r) => `${r.athleteId}:${r.userId}`));
    },
    /** Members of this club by e-mail (lower-cased), with their role. */
    async membersByEmail(emails: string[]): Promise<Map<string, { userId: string; role: Role; displayName: string }>> {
      if (emails.length === 0) return new Map();
      const rows = await db
        .select({ email: users.email, userId: users.id, role: memberships.role, displayName: users.displayName })
        .from(memberships)
        .innerJoin(users, eq(users.id, memberships.userId))
        .where(and(eq(memberships.clubId, scope.clubId), inArray(users.email, emails)));
      return new Map(rows.map((r) => [r.email, { userId: r.userId, role: r.role, displayName: r.displayName }]));
    },
    /** The club's open invitations (not accepted, not expired) to these addresses, with the children they name. */
    async openInvitations(filter: { email?: string; athleteId?: string }): Promise<{ email: string; sentAt: string; athleteIds: string[] }[]> {
      const rows = await db
        .select({ id: invitations.id, email: invitations.email, createdAt: invitations.createdAt, athleteId: invitationAthletes.athleteId })
        .from(invitations)
        .leftJoin(invitationAthletes, eq(invitationAthletes.invitationId, invitations.id))
        .where(
          and(
            eq(invitations.clubId, scope.clubId),
            isNull(invitations.acceptedAt),
            gt(invitations.expiresAt, new Date()),
            filter.email ? eq(invitations.email, filter.email) : undefined,
            filter.athleteId
              ? sql`exists (select 1 from ${invitationAthletes} ia where ia.invitation_id = ${invitations.id} and ia.athlete_id = ${filter.athleteId})`
              : undefined,
          ),
        )
        .orderBy(asc(invitations.createdAt));
      const byId = new Map<string, { email: string; sentAt: string; athleteIds: string[] }>();
      for (const r of rows) {
        const entry = byId.get(r.id) ?? { email: r.email, sentAt: r.createdAt.toISOString(), athleteIds: [] };
        if (r.athleteId) entry.athleteIds.push(r.athleteId);
        byId.set(r.id, entry);
      }
      return [...byId.values()];
    },
    /** Links parents to children; returns the links that were new (one already there is left as it is). */
    async linkGuardians(links: { athleteId: string; userId: string }[]): Promise<{ athleteId: string; userId: string }[]> {
      if (links.length === 0) return [];
      return db.insert(guardianLinks).values(links).onConflictDoNothing().returning({ athleteId: guardianLinks.athleteId, userId: guardianLinks.userId });
    },
    async unlinkGuardian(athleteId: string, userId: string): Promise<boolean> {
      // The athlete id was checked to be in scope by the caller; the link table has no club column.
      const removed = await db
        .delete(guardianLinks)
        .where(and(eq(guardianLinks.athleteId, athleteId), eq(guardianLinks.userId, userId)))
        .returning({ userId: guardianLinks.userId });
      return removed.length > 0;
    },

    // --- squads -----------------------------------------------------------------------------------
    /** Active squads with their current members and their last corrective session (null if none is recorded). */
    async squads() {
      return db
        .select({
          id: squads.id,
          name: squads.name,
          athleteCount: sql<number>`count(${athletes.id})::int`,
          // The newest row of the squad-and-day index, and its attendance by primary key.
          lastSession: sql<SquadSummary['lastSession']>`(
            select json_build_object('heldOn', ts.held_on, 'attended', (select count(*)::int from training_attendance ta where ta.session_id = ts.id))
            from training_sessions ts where ts.squad_id = ${squads.id} order by ts.held_on desc limit 1)`,
        })
        .from(squads)
        .leftJoin(athletes, and(eq(athletes.squadId, squads.id), isNull(athletes.archivedAt)))
        .where(squadOfClub(isNull(squads.archivedAt)))
        .groupBy(squads.id)
        .orderBy(asc(squads.name));
    },
    async squad(id: string) {
      const [row] = await db
        .select()
        .from(squads)
        .where(squadOfClub(eq(squads.id, id)));
      return row ?? null;
    },
    /** Active squads whose name matches without case or surrounding spaces. */
    async activeSquadsNamed(name: string, exceptId?: string) {
      return db
        .select({ id: squads.id, name: squads.name })
        .from(squads)
        .where(
          squadOfClub(
            isNull(squads.archivedAt),
            sql`lower(trim(${squads.name})) = ${name.trim().toLowerCase()}`,
            exceptId ? ne(squads.id, exceptId) : undefined,
          ),
        );
    },
    async activeSquadsByName(): Promise<Map<string, string>> {
      const rows = await db
        .select({ id: squads.id, name: squads.name })
        .from(squads)
        .where(squadOfClub(isNull(squads.archivedAt)));
      return new Map(rows.map((r) => [r.name.trim().toLowerCase(), r.id]));
    },
    async createSquad(name: string) {
      const [row] = await db.insert(squads).values({ clubId: scope.clubId, name }).returning();
      return row!;
    },
    async renameSquad(id: string, name: string) {
      const [row] = await db
        .update(squads)
        .set({ name })
        .where(squadOfClub(eq(squads.id, id)))
        .returning();
      return row ?? null;
    },
    async archiveSquad(id: string) {
      const [row] = await db
        .update(squads)
        .set({ archivedAt: new Date() })
        .where(squadOfClub(eq(squads.id, id)))
        .returning();
      return row ?? null;
    },
    async activeAthleteCount(squadId: string): Promise<number> {
      const [row] = await db
        .select({ n: sql<number>`count(*)::int` })
        .from(athletes)
        .where(inScope(eq(athletes.squadId, squadId), isNull(athletes.archivedAt)));
      return row?.n ?? 0;
    },
  };
}

export type AthletesRepo = ReturnType<typeof athletesRepo>;

import { and, desc, eq, gte, lt, ne, sql, type SQL } from 'drizzle-orm';
import { athletes, auditEvents, users } from '@/db/schema';
import type { AuditSubject } from '@/features/care/choices';
import type { AuditRow } from '@/features/care/types';
import type { Executor } from '@/server/screening/screening.repo';

export type AuditEntry = {
  clubId: string;
  actorId: string | null;
  action: string;
  subjectKind: AuditSubject;
  subjectId?: string | null;
  athleteId?: string | null;
  detail?: Record<string, unknown>;
  at?: Date;
};

/** Adds rows to the audit trail; inside the caller's transaction when given one, so a change and its record go together. */
export async function recordAudit(db: Executor, ...entries: AuditEntry[]) {
  if (entries.length === 0) return;
  await db.insert(auditEvents).values(
    entries.map((e) => ({
      clubId: e.clubId,
      actorId: e.actorId,
      action: e.action,
      subjectKind: e.subjectKind,
      subjectId: e.subjectId ?? null,
      athleteId: e.athleteId ?? null,
      detail: e.detail ?? {},
      ...(e.at ? { createdAt: e.at } : {}),
    })),
  );
}

export type AuditFilters = { subject?: AuditSubject; actorId?: string; athleteId?: string; from?: string; to?: string; changes?: string };

export const AUDIT_PAGE_LIMIT = 500;

/** The club's audit trail, newest first, filtered. */
export async function listAudit(db: Executor, clubId: string, filters: AuditFilters, limit = AUDIT_PAGE_LIMIT): Promise<AuditRow[]> {
  const where: (SQL | undefined)[] = [eq(auditEvents.clubId, clubId)];
  if (filters.subject) where.push(eq(auditEvents.subjectKind, filters.subject));
  if (filters.actorId) where.push(eq(auditEvents.actorId, filters.actorId));
  if (filters.athleteId) where.push(eq(auditEvents.athleteId, filters.athleteId));
  if (filters.changes === 'true') where.push(ne(auditEvents.action, 'view'));
  if (filters.from) where.push(gte(auditEvents.createdAt, new Date(`${filters.from}T00:00:00Z`)));
  // "to" is inclusive of that whole day.
  if (filters.to) where.push(lt(auditEvents.createdAt, sql`(${filters.to}::date + 1)::timestamptz`));
  const rows = await db
    .select({
      id: auditEvents.id,
      at: auditEvents.createdAt,
      actorId: auditEvents.actorId,
      actorName: users.displayName,
      action: auditEvents.action,
      subjectKind: auditEvents.subjectKind,
      subjectId: auditEvents.subjectId,
      athleteId: auditEvents.athleteId,
      athleteName: sql<string | null>`${athletes.firstName} || ' ' || ${athletes.lastName}`,
      detail: auditEvents.detail,
    })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorId))
    .leftJoin(athletes, eq(athletes.id, auditEvents.athleteId))
    .where(and(...where))
    .orderBy(desc(auditEvents.createdAt), desc(auditEvents.id))
    .limit(limit);
  return rows.map((r) => ({ ...r, at: r.at.toISOString() }));
}

import { and, desc, eq, inArray, sql } from 'drizzle-orm';
import type { Db } from '@/db/client';
import { assessments, athletes, consents, photos } from '@/db/schema';
import type { RetentionCandidate } from '@/features/care/types';
import type { PhotoStorage } from '@/server/storage/storage';
import { recordAudit } from './audit.repo';
import { careSettingsOf } from './settings.repo';

const DAY_MS = 24 * 60 * 60 * 1000;

/** `months` calendar months before `now` (UTC), the end of a month clamped: 31 March minus 1 month is 28/29 February. */
export function monthsBefore(now: Date, months: number): Date {
  const d = new Date(now.getTime());
  const day = d.getUTCDate();
  d.setUTCDate(1);
  d.setUTCMonth(d.getUTCMonth() - months);
  const last = new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth() + 1, 0)).getUTCDate();
  d.setUTCDate(Math.min(day, last));
  return d;
}

type Candidate = RetentionCandidate & { storageKey: string; thumbKey: string; assessmentId: string };

/**
 * Photos of one club due for deletion at `now`: those of athletes whose photo consent has been
 * withdrawn for longer than the grace period, and those older than the retention period.
 */
export async function retentionCandidates(db: Db, clubId: string, now: Date): Promise<Candidate[]> {
  const settings = await careSettingsOf(db, clubId);
  const rows = await db
    .select({
      photoId: photos.id,
      storageKey: photos.storageKey,
      thumbKey: photos.thumbKey,
      createdAt: photos.createdAt,
      assessmentId: photos.assessmentId,
      athleteId: athletes.id,
      athleteName: sql<string>`${athletes.firstName} || ' ' || ${athletes.lastName}`,
    })
    .from(photos)
    .innerJoin(assessments, eq(assessments.id, photos.assessmentId))
    .innerJoin(athletes, eq(athletes.id, assessments.athleteId))
    .where(eq(photos.clubId, clubId));
  if (rows.length === 0) return [];
  const athleteIds = [...new Set(rows.map((r) => r.athleteId))];
  const latest = await db
    .selectDistinctOn([consents.athleteId], { athleteId: consents.athleteId, granted: consents.granted, recordedAt: consents.createdAt })
    .from(consents)
    .where(and(inArray(consents.athleteId, athleteIds), eq(consents.kind, 'photos')))
    .orderBy(consents.athleteId, desc(consents.createdAt), desc(consents.id));
  const withdrawnAt = new Map(latest.filter((c) => !c.granted).map((c) => [c.athleteId, c.recordedAt]));
  const expiredBefore = monthsBefore(now, settings.photoRetentionMonths);
  const out: Candidate[] = [];
  for (const r of rows) {
    const withdrawn = withdrawnAt.get(r.athleteId);
    const reason =
      withdrawn && withdrawn.getTime() + settings.photoGraceDays * DAY_MS <= now.getTime()
        ? 'consent-withdrawn'
        : r.createdAt < expiredBefore
          ? 'retention-expired'
          : null;
    if (!reason) continue;
    out.push({
      photoId: r.photoId,
      athleteId: r.athleteId,
      athleteName: r.athleteName,
      takenAt: r.createdAt.toISOString(),
      reason,
      storageKey: r.storageKey,
      thumbKey: r.thumbKey,
      assessmentId: r.assessmentId,
    });
  }
  return out;
}

export type RetentionReport = { dryRun: boolean; candidates: RetentionCandidate[]; deleted: number; failed: number };

/**
 * Deletes due photos of one club from storage, then their rows, recording each deletion in the audit
 * trail. A dry run only lists them. A file that cannot be deleted keeps its row, so the next run retries.
 */
export async function runRetention(db: Db, storage: PhotoStorage, clubId: string, options: { now?: Date; dryRun?: boolean } = {}): Promise<RetentionReport> {
  const now = options.now ?? new Date();
  const candidates = await retentionCandidates(db, clubId, now);
  const publicView = candidates.map(({ photoId, athleteId, athleteName, takenAt, reason }) => ({ photoId, athleteId, athleteName, takenAt, reason }));
  if (options.dryRun) return { dryRun: true, candidates: publicView, deleted: 0, failed: 0 };
  let deleted = 0;
  let failed = 0;
  for (const c of candidates) {
    try {
      await storage.delete(c.storageKey);
      await storage.delete(c.thumbKey);
    } catch {
      failed += 1;
      continue;
    }
    await db.transaction(async (tx) => {
      await tx.delete(photos).where(and(eq(photos.id, c.photoId), eq(photos.clubId, clubId)));
      await recordAudit(tx, {
        clubId,
        actorId: null,
        action: 'photo.deleted',
        subjectKind: 'photo',
        subjectId: c.photoId,
        athleteId: c.athleteId,
        detail: { reason: c.reason, takenAt: c.takenAt, assessmentId: c.assessmentId },
        at: now,
      });
    });
    deleted += 1;
  }
  return { dryRun: false, candidates: publicView, deleted, failed };
}

/** Clubs that hold any photo: the scheduled job checks each of them. */
export async function clubsWithPhotos(db: Db): Promise<string[]> {
  const rows = await db.selectDistinct({ clubId: photos.clubId }).from(photos);
  return rows.map((r) => r.clubId);
}

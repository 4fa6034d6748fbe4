import { and, eq, isNotNull, lte, sql } from 'drizzle-orm';
import PgBoss from 'pg-boss';
import type { Logger } from 'pino';
import type { Db } from '@/db/client';
import { assessmentResults, assessmentReviews, assessments, careSettings, summaryReleases } from '@/db/schema';
import type { ClubScope } from '@/server/access/scope';
import type { Outbox } from '@/server/mail/outbox';
import type { PhotoStorage } from '@/server/storage/storage';
import { clubsWithPhotos, runRetention } from './retention.service';
import { releaseSummary } from './summary.service';

export const RETENTION_JOB = 'care-photo-retention';
export const AUTO_RELEASE_JOB = 'care-auto-release';
/** Every night at 03:15 (server time) and every hour at :20 (our choice: quiet hours, off the hour). */
export const RETENTION_CRON = '15 3 * * *';
export const AUTO_RELEASE_CRON = '20 * * * *';

/** The scope a scheduled job acts in: the club, no person. */
const systemScope = (clubId: string): ClubScope => ({ userId: '00000000-0000-0000-0000-000000000000', clubId, role: 'admin', athleteIds: null });

/** Deletes due photos in every club; returns how many went. */
export async function retentionJob(db: Db, storage: PhotoStorage, logger: Logger, now = new Date()) {
  let deleted = 0;
  for (const clubId of await clubsWithPhotos(db)) {
    const report = await runRetention(db, storage, clubId, { now });
    deleted += report.deleted;
    if (report.deleted || report.failed) logger.info({ clubId, deleted: report.deleted, failed: report.failed }, 'photo retention');
  }
  return deleted;
}

/**
 * Releases reviewed screens whose club releases automatically and whose submission is older than the
 * club's number of days. Only reviewed screens go out by themselves (our choice: nothing a
 * physiotherapist has not looked at reaches a family unasked).
 */
export async function autoReleaseJob(deps: { db: Db; outbox: Outbox; publicUrl: string }, logger: Logger, now = new Date()) {
  const due = await deps.db
    .select({ assessmentId: assessments.id, clubId: assessments.clubId })
    .from(assessments)
    .innerJoin(careSettings, eq(careSettings.clubId, assessments.clubId))
    .innerJoin(assessmentResults, and(eq(assessmentResults.assessmentId, assessments.id), eq(assessmentResults.isCurrent, true)))
    .where(
      and(
        isNotNull(careSettings.autoReleaseDays),
        eq(assessments.status, 'submitted'),
        lte(assessments.submittedAt, sql`${now.toISOString()}::timestamptz - make_interval(days => ${careSettings.autoReleaseDays})`),
        sql`exists (select 1 from ${assessmentReviews} where ${assessmentReviews.resultId} = ${assessmentResults.id})`,
        sql`not exists (select 1 from ${summaryReleases} where ${summaryReleases.resultId} = ${assessmentResults.id})`,
      ),
    );
  let released = 0;
  for (const d of due) {
    try {
      await releaseSummary(deps, systemScope(d.clubId), d.assessmentId, { releasedBy: null });
      released += 1;
    } catch (err) {
      logger.warn({ err, assessmentId: d.assessmentId }, 'automatic release failed; next run retries');
    }
  }
  return released;
}

/** Schedules the care jobs on pg-boss's cron (one instance across servers: pg-boss holds the schedule in the database). */
export async function startCareJobs(options: { connectionString: string; db: Db; storage: PhotoStorage; outbox: Outbox; publicUrl: string; logger: Logger }) {
  const { db, storage, outbox, publicUrl, logger } = options;
  const boss = new PgBoss({ connectionString: options.connectionString, max: 2 });
  boss.on('error', (err) => logger.error({ err }, 'care jobs error'));
  await boss.start();
  for (const name of [RETENTION_JOB, AUTO_RELEASE_JOB]) await boss.createQueue(name, { name, retryLimit: 3, retryDelay: 300 });
  await boss.schedule(RETENTION_JOB, RETENTION_CRON);
  await boss.schedule(AUTO_RELEASE_JOB, AUTO_RELEASE_CRON);
  await boss.work(RETENTION_JOB, async () => {
    await retentionJob(db, storage, logger);
  });
  await boss.work(AUTO_RELEASE_JOB, async () => {
    await autoReleaseJob({ db, outbox, publicUrl }, logger);
  });
  return { stop: () => boss.stop({ graceful: true, wait: true, timeout: 5000 }) };
}

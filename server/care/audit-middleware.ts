import type { RequestHandler } from 'express';
import type { Db } from '@/db/client';
import type { AuditSubject } from '@/features/care/choices';
import type { Locals } from '@/server/access/guard';
import { eq } from 'drizzle-orm';
import { assessments, athletes } from '@/db/schema';
import { recordAudit } from './audit.repo';

async function assessmentHome(db: Db, id: string) {
  const [row] = await db.select({ clubId: assessments.clubId, athleteId: assessments.athleteId }).from(assessments).where(eq(assessments.id, id));
  return row ?? null;
}
async function athleteHome(db: Db, id: string) {
  const [row] = await db.select({ clubId: athletes.clubId, athleteId: athletes.id }).from(athletes).where(eq(athletes.id, id));
  return row ?? null;
}

type Rule = { method: string; pattern: RegExp; subject: AuditSubject; action: string };

const ID = '([0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12})';

/**
 * Routes of other capabilities whose views and changes belong in the audit trail. Matching here keeps
 * those routers untouched; the care routes record their own events where the change happens, as do the
 * roster's changes whose details matter (an athlete added, a consent with its answer, a parent linked or
 * unlinked: `server/athletes/`).
 */
const RULES: Rule[] = [
  { method: 'GET', pattern: new RegExp(`^/athletes/${ID}$`), subject: 'athlete', action: 'view' },
  { method: 'PATCH', pattern: new RegExp(`^/athletes/${ID}$`), subject: 'athlete', action: 'update' },
  { method: 'POST', pattern: new RegExp(`^/athletes/${ID}/archive$`), subject: 'athlete', action: 'archive' },
  { method: 'POST', pattern: new RegExp(`^/athletes/${ID}/restore$`), subject: 'athlete', action: 'restore' },
  { method: 'GET', pattern: new RegExp(`^/athletes/${ID}/consents$`), subject: 'consent', action: 'view' },
  { method: 'GET', pattern: new RegExp(`^/assessments/${ID}$`), subject: 'assessment', action: 'view' },
  { method: 'POST', pattern: new RegExp(`^/assessments/${ID}/submit$`), subject: 'assessment', action: 'submit' },
  { method: 'PUT', pattern: new RegExp(`^/assessments/${ID}/plan$`), subject: 'assessment', action: 'plan.change' },
];

/**
 * Records a view or change after a successful answer, with the caller's scope that guard() left.
 * A failed audit write is logged and does not undo the answer already sent.
 */
export function auditTrailMiddleware(db: Db): RequestHandler {
  return (req, res, next) => {
    const rule = RULES.find((r) => r.method === req.method && r.pattern.test(req.path));
    if (!rule) return next();
    const id = rule.pattern.exec(req.path)![1]!;
    res.on('finish', () => {
      if (res.statusCode >= 300 || !req.user) return;
      const actorId = req.user.id;
      const scope = (res.locals as Partial<Locals>).scope;
      void (async () => {
        // Routes not yet on guard() leave no scope: the record's own club is looked up instead.
        const home = rule.subject === 'assessment' ? await assessmentHome(db, id) : await athleteHome(db, id);
        if (!home) return;
        await recordAudit(db, {
          clubId: scope?.clubId ?? home.clubId,
          actorId,
          action: rule.action,
          subjectKind: rule.subject,
          subjectId: id,
          athleteId: home.athleteId,
          // An edit names the fields sent (their values are on the athlete's page).
          ...(rule.action === 'update' && req.body && typeof req.body === 'object' ? { detail: { fields: Object.keys(req.body as object) } } : {}),
        });
      })().catch((err: unknown) => req.log?.error({ err }, 'audit record failed'));
    });
    next();
  };
}

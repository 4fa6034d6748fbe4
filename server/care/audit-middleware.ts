import type { RequestHandler } from 'express';
import type { Db } from '@/db/client';
import type { AuditSubject } from '@/features/care/schemas';
import type { Locals } from '@/server/access/guard';
import { recordAudit } from './audit.repo';

type Rule = { method: string; pattern: RegExp; subject: AuditSubject; action: string };

const ID = '([0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12})';

/**
 * Routes of other capabilities whose views and changes belong in the audit trail. Matching here keeps
 * those routers untouched; the care routes record their own events where the change happens.
 */
const RULES: Rule[] = [
  { method: 'GET', pattern: new RegExp(`^/athletes/${ID}$`), subject: 'athlete', action: 'view' },
  { method: 'PATCH', pattern: new RegExp(`^/athletes/${ID}$`), subject: 'athlete', action: 'update' },
  { method: 'POST', pattern: new RegExp(`^/athletes/${ID}/(archive|restore)$`), subject: 'athlete', action: 'update' },
  { method: 'GET', pattern: new RegExp(`^/athletes/${ID}/consents$`), subject: 'consent', action: 'view' },
  { method: 'POST', pattern: new RegExp(`^/athletes/${ID}/consents$`), subject: 'consent', action: 'create' },
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
      const scope = (res.locals as Partial<Locals>).scope;
      const home = (res.locals as Partial<Locals>).home;
      if (res.statusCode >= 300 || !scope) return;
      const athleteId = rule.subject === 'assessment' ? (home?.athleteId ?? null) : id;
      recordAudit(db, {
        clubId: scope.clubId,
        actorId: scope.userId,
        action: rule.action,
        subjectKind: rule.subject,
        subjectId: id,
        athleteId,
      }).catch((err: unknown) => req.log?.error({ err }, 'audit record failed'));
    });
    next();
  };
}

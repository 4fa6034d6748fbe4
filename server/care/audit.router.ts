import { auditActionInWords, auditDetailsInWords, auditSubjectInWords } from '@/features/care/audit-details';
import { Router } from 'express';
import { safeCsv } from '@/server/http/csv';
import { ValidationError } from 'yup';
import type { Db } from '@/db/client';
import { auditQuerySchema, type AuditQuery } from './audit-query';
import { accessGuards, callerClub, scopeOf } from '@/server/access/guard';
import { badRequest } from '@/server/http/errors';
import { fieldErrors } from '@/server/http/validate';
import { listAudit } from './audit.repo';

/** The stored codes and details as recorded, then the same event in the trail's words on screen. */
export const AUDIT_CSV_COLUMNS = ['time (UTC)', 'person', 'action', 'record', 'record id', 'athlete', 'details', 'in words'] as const;

/** The audit trail for admins: filters in the query string, `?format=csv` for the export. */
export function auditRouter(db: Db) {
  const router = Router();
  const { guard } = accessGuards(db);

  router.get('/audit', guard('audit.read', callerClub), async (req, res) => {
    let query: AuditQuery;
    try {
      query = await auditQuerySchema.validate(req.query, { abortEarly: false, stripUnknown: true });
    } catch (error) {
      if (error instanceof ValidationError) throw badRequest('Some filters need attention.', fieldErrors(error));
      throw error;
    }
    const scope = scopeOf(res);
    const csv = query.format === 'csv';
    const rows = await listAudit(db, scope.clubId, query, csv ? 50_000 : undefined);
    if (!csv) {
      res.json({ events: rows });
      return;
    }
    const body = safeCsv(
      rows.map((r) => [
        r.at,
        r.actorName ?? 'system',
        r.action,
        r.subjectKind,
        r.subjectId ?? '',
        r.athleteName ?? '',
        JSON.stringify(r.detail),
        [`${auditActionInWords(r.action)} ${auditSubjectInWords(r.subjectKind)}`, auditDetailsInWords(r.detail)].filter(Boolean).join(': '),
      ]),
      { header: true, columns: [...AUDIT_CSV_COLUMNS] },
    );
    res.set({ 'Content-Type': 'text/csv; charset=utf-8', 'Content-Disposition': 'attachment; filename="squadline-audit.csv"' });
    res.send(body);
  });

  return router;
}

// The audit trail's filters, read from the query string. Server only (the screen builds the query
// string from its own controls, `features/care/api/get-audit.ts`).
import { mixed, object, string, type InferType } from 'yup';
import { isCalendarDate } from '@/features/athletes/schemas';
import { AUDIT_SUBJECTS, type AuditSubject } from '@/features/care/choices';

/** Filters of the audit trail (query string). */
/** A filter day: YYYY-MM-DD and a real day of the calendar (2026-13-01 is a clear 400, never a 500). */
const auditDay = () =>
  string()
    .matches(/^\d{4}-\d{2}-\d{2}$/, 'Write the date as YYYY-MM-DD.')
    .test('calendar', 'This day does not exist in the calendar.', (v) => !v || !/^\d{4}-\d{2}-\d{2}$/.test(v) || isCalendarDate(v))
    .optional();

export const auditQuerySchema = object({
  subject: mixed<AuditSubject>()
    .oneOf([...AUDIT_SUBJECTS, undefined], 'Unknown kind of record.')
    .optional(),
  actorId: string().uuid('Unknown person.').optional(),
  athleteId: string().uuid('Unknown athlete.').optional(),
  from: auditDay(),
  to: auditDay().test('after-from', 'The end is before the start.', function (to) {
    const from = (this.parent as { from?: string }).from;
    return !to || !from || !isCalendarDate(to) || !isCalendarDate(from) || to >= from;
  }),
  format: string().oneOf(['json', 'csv'], 'Format is json or csv.').optional(),
  // "true": changes only, the views left out (a visit to a child's page records three or four views).
  changes: string().oneOf(['true', 'false'], 'Write true or false.').optional(),
});
export type AuditQuery = InferType<typeof auditQuerySchema>;

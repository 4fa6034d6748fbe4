import { formatDate } from '@/features/ui/format-date';

/**
 * When the next check is, for a parent (our wording): the date in their locale, and once it has passed,
 * that it is due rather than a date in the past with nothing said. Pure: `today` is YYYY-MM-DD.
 */
export function recheckWords(recheckDate: string | null, today: string, locale?: string): string {
  if (!recheckDate) return 'The coaches will tell you.';
  const when = formatDate(recheckDate, { locale });
  return recheckDate < today ? `It was planned for around ${when} and is due now: the coaches will arrange it.` : `Around ${when}.`;
}

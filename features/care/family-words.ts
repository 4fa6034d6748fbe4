import { formatDate, formatDateInWords } from '@/features/ui/format-date';

/**
 * When the next check is, for a parent (our wording): the date in their locale, and once it has passed,
 * that it is due rather than a date in the past with nothing said. Pure: `today` is YYYY-MM-DD.
 */
export function recheckWords(recheckDate: string | null, today: string, locale?: string): string {
  if (!recheckDate) return 'The coaches will tell you.';
  const when = formatDate(recheckDate, { locale });
  return recheckDate < today ? `It was planned for around ${when} and is due now: the coaches will arrange it.` : `Around ${when}.`;
}

/** The same for the e-mail, with the date in words (the reader's locale is not known). */
export function recheckLine(recheckDate: string, today: string): string {
  const when = formatDateInWords(recheckDate);
  return recheckDate < today ? `Next check: due now (it was planned for around ${when}); the coaches will arrange it.` : `Next check: around ${when}.`;
}

/**
 * How much of the corrective work the child has done since the check a parent is reading (wording and
 * rule our choice):
 * nothing is said where the squad keeps no record of its sessions. `screenedOn` is YYYY-MM-DD.
 */
export function sessionsSinceWords(firstName: string, screenedOn: string, sessions: { attended: number; held: number } | null, locale?: string): string | null {
  if (!sessions || sessions.held === 0) return null;
  const since = formatDate(screenedOn, { locale });
  const { attended, held } = sessions;
  return held === 1
    ? `Since the check of ${since}, the squad held 1 exercise session; ${firstName} ${attended ? 'took part' : 'was not there'}.`
    : `Since the check of ${since}, ${firstName} took part in ${attended} of the ${held} exercise sessions the squad held.`;
}

/** Said beside each loaded strength or landing exercise (our choice: the usual rule of supervised youth strength work). */
export const CLUB_ONLY_WORDS = 'At club sessions only, with a coach watching: not at home.';

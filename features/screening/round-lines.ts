import { daysBetween } from '@/features/athletes/age';
import { formatDate } from '@/features/ui/format-date';

/**
 * The closed round's notice. Kept well under the round's head line (PAGE_HEADS.round.text in
 * features/shell/page-heads.ts): that line is painted from the page's HTML, and a phone takes the largest
 * text painted as the page's main content (round-lines.test.ts).
 */
export const closedLine = (closedAt: string, by: string | null) => `Closed on ${formatDate(closedAt)}${by ? ` by ${by}` : ''}. A head coach can reopen it.`;

/** After this many days, an open round's date is said before anyone screens in it (our choice). */
export const STALE_ROUND_DAYS = 14;

/**
 * An open round dated well before today: screens taken in it keep the round's date (it counts for age,
 * growth and the re-screen date), so a tester is told before screening today's athletes into an old
 * round; one planned for a later day takes no submitted screen before it. Null for a recent round. Short, like the closed notice, so the head line stays the largest text.
 */
export function staleRoundLine(screenedOn: string, today: string, locale?: string): string | null {
  const days = daysBetween(screenedOn, today);
  // Planned for a later day (one day of slack for time zones, as the server allows): screens wait for it.
  if (days < -1) return `Planned for ${formatDate(screenedOn, { locale })}, in ${-days} days: screens can be submitted from then.`;
  if (!(days > STALE_ROUND_DAYS)) return null;
  return `Dated ${formatDate(screenedOn, { locale })}, ${days} days ago: screens here keep that date. Open a new round for today.`;
}

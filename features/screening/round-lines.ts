import { formatDate } from '@/features/ui/format-date';

/**
 * The closed round's notice. Kept well under the round's head line (PAGE_HEADS.round.text in
 * features/shell/page-heads.ts): that line is painted from the page's HTML, and a phone takes the largest
 * text painted as the page's main content (round-lines.test.ts).
 */
export const closedLine = (closedAt: string, by: string | null) => `Closed on ${formatDate(closedAt)}${by ? ` by ${by}` : ''}. A head coach can reopen it.`;

import { describe, expect, it } from 'vitest';
import { PAGE_HEADS } from '@/features/shell/page-heads';
import { closedLine } from './round-lines';

// A phone takes the largest text painted as the page's main content (Largest Contentful Paint). A round's
// head line is painted from the HTML at once; the closed notice only after the JavaScript and the round,
// inside a notice's narrower box. So, with a long name and the longest date, it stays at most two thirds
// of the head line's length (our choice of margin, as for the homes' greetings in features/home).
describe("a closed round's notice stays smaller than the pre-rendered head line", () => {
  it('with a long name', () => {
    const line = closedLine('2026-09-30T18:00:00.000Z', 'Maximiliana Okonkwo-Lindqvist');
    expect(line).toContain('Maximiliana Okonkwo-Lindqvist');
    expect(line.length).toBeLessThanOrEqual((PAGE_HEADS.round.text.length * 2) / 3);
  });

  it('the head line is long enough to stay the largest text', () => {
    expect(PAGE_HEADS.round.text.length).toBeGreaterThan(100);
  });
});

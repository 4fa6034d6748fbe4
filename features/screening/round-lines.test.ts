import { describe, expect, it } from 'vitest';
import { PAGE_HEADS } from '@/features/shell/page-heads';
import { closedLine, STALE_ROUND_DAYS, staleRoundLine } from './round-lines';

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

describe('an open round dated well before today says so (our choice: after 14 days)', () => {
  it('says the date and how long ago, and what to do', () => {
    expect(STALE_ROUND_DAYS).toBe(14);
    // 14 Sep to 5 Dec 2026: 16 (rest of Sep) + 31 + 30 + 5 = 82 days, counted by hand.
    expect(staleRoundLine('2026-09-14', '2026-12-05', 'en-US')).toBe(
      'Dated Sep 14, 2026, 82 days ago: screens here keep that date. Open a new round for today.',
    );
  });
  it('is quiet for a round of the last two weeks, today or tomorrow', () => {
    expect(staleRoundLine('2026-11-21', '2026-12-05')).toBeNull(); // 14 days
    expect(staleRoundLine('2026-12-05', '2026-12-05')).toBeNull();
    expect(staleRoundLine('2026-12-06', '2026-12-05')).toBeNull(); // a day of slack for time zones, as the server
    expect(staleRoundLine('2026-11-20', '2026-12-05')).not.toBeNull(); // 15 days
  });
  it('says a round planned for a later day takes screens from that day (the server refuses them before)', () => {
    expect(staleRoundLine('2026-12-20', '2026-12-05', 'en-US')).toBe('Planned for Dec 20, 2026, in 15 days: screens can be submitted from then.');
    expect(staleRoundLine('2026-12-07', '2026-12-05')).toMatch(/in 2 days/);
  });
  it('stays smaller than the pre-rendered head line, with the longest date', () => {
    const line = staleRoundLine('2026-09-30', '2027-09-29', 'en-GB')!;
    expect(line.length).toBeLessThanOrEqual((PAGE_HEADS.round.text.length * 2) / 3);
    const ahead = staleRoundLine('2027-09-29', '2026-09-30', 'en-GB')!;
    expect(ahead.length).toBeLessThanOrEqual((PAGE_HEADS.round.text.length * 2) / 3);
  });
});

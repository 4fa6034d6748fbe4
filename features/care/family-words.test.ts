import { describe, expect, it } from 'vitest';
import { recheckWords, sessionsSinceWords } from './family-words';

describe('recheckWords', () => {
  it('writes the date as the parent’s locale does, never as the stored YYYY-MM-DD', () => {
    expect(recheckWords('2026-12-20', '2026-12-03', 'en-GB')).toBe('Around 20 Dec 2026.');
    expect(recheckWords('2026-12-20', '2026-12-03', 'en-US')).toBe('Around Dec 20, 2026.');
  });

  it('says a check whose day has passed is due, and the day itself is still ahead', () => {
    expect(recheckWords('2026-10-26', '2026-12-03', 'en-GB')).toBe('It was planned for around 26 Oct 2026 and is due now: the coaches will arrange it.');
    expect(recheckWords('2026-12-03', '2026-12-03', 'en-GB')).toBe('Around 3 Dec 2026.');
  });

  it('leaves the date to the coaches when there is none', () => {
    expect(recheckWords(null, '2026-12-03')).toBe('The coaches will tell you.');
  });
});

describe('sessionsSinceWords (our wording)', () => {
  it('says how many of the squad’s sessions since the check the child took part in', () => {
    expect(sessionsSinceWords('Maya', '2026-09-14', { attended: 14, held: 18 }, 'en-GB')).toBe(
      'Since the check of 14 Sept 2026, Maya took part in 14 of the 18 exercise sessions the squad held.',
    );
    expect(sessionsSinceWords('Maya', '2026-09-14', { attended: 0, held: 1 }, 'en-GB')).toBe(
      'Since the check of 14 Sept 2026, the squad held 1 exercise session; Maya was not there.',
    );
  });

  it('says nothing where the squad keeps no record, or before any released check', () => {
    expect(sessionsSinceWords('Maya', '2026-09-14', { attended: 0, held: 0 })).toBeNull();
    expect(sessionsSinceWords('Maya', '2026-09-14', null)).toBeNull();
  });
});

import { describe, expect, it } from 'vitest';
import { ageGroupCheck, ageLimitOf } from './age-group';

describe('age limit read from a squad name', () => {
  it('reads the usual ways of writing it (common practice, no source)', () => {
    expect(ageLimitOf('Under-13 mixed')).toBe(13);
    expect(ageLimitOf('under 15 girls')).toBe(15);
    expect(ageLimitOf('U17')).toBe(17);
    expect(ageLimitOf('Girls u11')).toBe(11);
    expect(ageLimitOf('Performance squad')).toBeNull();
    expect(ageLimitOf('Court 13')).toBeNull();
  });
});

describe('a child older than the squad name says (our choice: a full year past the limit)', () => {
  it('names a child a year past the limit, with the age in whole years', () => {
    // Born 2012-03-10: 14 on 2026-12-05 (13 until the birthday of 2026-03-10, then 14).
    expect(ageGroupCheck('Under-13 mixed', '2012-03-10', '2026-12-05')).toBe('14 years old today, older than “Under-13 mixed” suggests: check the squad.');
  });

  it('leaves a child who is the limit’s age today, a younger child and a squad with no age', () => {
    // 13 today: still within an Under-13 age group for the season under some federations' dates.
    expect(ageGroupCheck('Under-13 mixed', '2013-03-10', '2026-12-05')).toBeNull();
    // The day before the 14th birthday: still 13.
    expect(ageGroupCheck('Under-13 mixed', '2012-12-06', '2026-12-05')).toBeNull();
    expect(ageGroupCheck('Under-15 mixed', '2016-01-01', '2026-12-05')).toBeNull();
    expect(ageGroupCheck('Performance squad', '2005-01-01', '2026-12-05')).toBeNull();
  });
});

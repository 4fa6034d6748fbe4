import { describe, expect, it } from 'vitest';
import { ageInYears, decimalAge } from './age';

describe('ageInYears', () => {
  // Birthdays: common practice, no source.
  it.each([
    ['2014-03-10', '2026-03-09', 11],
    ['2014-03-10', '2026-03-10', 12],
    ['2012-12-31', '2026-12-01', 13],
    ['2012-02-29', '2026-02-28', 13],
    ['2012-02-29', '2026-03-01', 14],
  ])('born %s, on %s: %i', (dob, on, years) => {
    expect(ageInYears(dob, on)).toBe(years);
  });
});

describe('decimalAge', () => {
  it('is 12.0 on the twelfth birthday within a day (365.25-day years; common practice, no source)', () => {
    expect(decimalAge('2014-06-01', '2026-06-01')).toBeCloseTo(12, 2);
  });
  it('is half a year about 182.6 days after a birthday', () => {
    expect(decimalAge('2014-01-01', '2014-07-02')).toBeCloseTo(0.4983, 3);
  });
  it('refuses a day before birth and malformed dates', () => {
    expect(() => decimalAge('2014-01-01', '2013-12-31')).toThrow(/before the date of birth/);
    expect(() => decimalAge('01/02/2014', '2026-01-01')).toThrow(/YYYY-MM-DD/);
  });
});

import { describe, expect, it } from 'vitest';
import { formatDate, formatDateInWords, formatDateTime } from './format-date';

// Expected strings are what the ICU data in Node 20 writes for each locale (common practice, no source:
// CLDR's conventions, checked by running them here).
describe('formatDate', () => {
  it.each([
    ['2026-09-14', 'en-GB', '14 Sept 2026'],
    ['2026-09-14', 'en-US', 'Sep 14, 2026'],
    ['2026-09-14', 'fr-FR', '14 sept. 2026'],
    ['2026-01-01', 'en-GB', '1 Jan 2026'],
  ])('writes %s in %s as %s', (value, locale, expected) => {
    expect(formatDate(value, { locale })).toBe(expected);
  });

  it('keeps a calendar date on its day whatever the time zone (it is not an instant)', () => {
    expect(formatDate('2026-01-01', { locale: 'en-GB', numeric: true })).toBe('01/01/2026');
    expect(formatDate('2026-01-01', { locale: 'de-DE', numeric: true })).toBe('01.01.2026');
  });

  it('keeps each locale and form apart (the formatters are reused)', () => {
    expect(formatDate('2026-09-14', { locale: 'en-GB' })).toBe('14 Sept 2026');
    expect(formatDate('2026-09-14', { locale: 'en-GB', numeric: true })).toBe('14/09/2026');
    expect(formatDate('2026-09-14', { locale: 'en-US' })).toBe('Sep 14, 2026');
    expect(formatDate('2026-09-14', { locale: 'en-GB' })).toBe('14 Sept 2026');
  });

  it('writes dates in words for e-mails, the same for every reader (a timestamp on its day where the code runs)', () => {
    expect(formatDateInWords('2026-09-14')).toBe('14 September 2026');
    expect(formatDateInWords('2026-12-03T23:10:00.000Z')).toMatch(/^[34] December 2026$/);
    expect(formatDateInWords('nonsense')).toBe('nonsense');
  });

  it('returns unreadable input as it is', () => {
    expect(formatDate('not a date', { locale: 'en-GB' })).toBe('not a date');
  });

  it('writes a timestamp with its time', () => {
    expect(formatDateTime('2026-09-14T08:30:00Z', { locale: 'en-GB', timeZone: 'UTC' })).toBe('14 Sept 2026, 08:30');
  });
});

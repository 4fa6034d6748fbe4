/** Age in decimal years on a given day (both ISO dates), as the maturity equations expect. */
export function decimalAge(dateOfBirth: string, onDate: string): number {
  const birth = Date.parse(`${dateOfBirth}T00:00:00Z`);
  const day = Date.parse(`${onDate}T00:00:00Z`);
  if (Number.isNaN(birth) || Number.isNaN(day)) throw new Error('Dates must be written as YYYY-MM-DD.');
  if (day < birth) throw new Error('The date is before the date of birth.');
  // 365.25-day years: the convention of decimal-age tables (common practice, no source).
  return (day - birth) / (365.25 * 24 * 3600 * 1000);
}

/** Whole years, as people say their age. */
export function ageInYears(dateOfBirth: string, onDate: string): number {
  const [by, bm, bd] = dateOfBirth.split('-').map(Number) as [number, number, number];
  const [y, m, d] = onDate.split('-').map(Number) as [number, number, number];
  return y - by - (m < bm || (m === bm && d < bd) ? 1 : 0);
}

export const todayIso = () => new Date().toISOString().slice(0, 10);

/** Whole days from one ISO date to another (dates only; time zones do not enter). */
export function daysBetween(fromIso: string, toIso: string): number {
  const a = Date.UTC(+fromIso.slice(0, 4), +fromIso.slice(5, 7) - 1, +fromIso.slice(8, 10));
  const b = Date.UTC(+toIso.slice(0, 4), +toIso.slice(5, 7) - 1, +toIso.slice(8, 10));
  return Math.round((b - a) / 86_400_000);
}

import { ageInYears } from './age';

/**
 * The age limit a squad's name states ("Under-13 mixed", "U15 girls"), or null when it states none.
 * Read from the name only: clubs name their squads after their age groups (common practice, no source).
 */
export function ageLimitOf(squadName: string): number | null {
  const m = /\b(?:under|u)[\s-]?(\d{1,2})\b/i.exec(squadName);
  return m ? Number(m[1]) : null;
}

/**
 * A child put in a squad whose name says they are too old for it: said as a check, never refused. Only a
 * child a full year past the limit is named (our choice): federations date their age groups differently
 * (the first day of the year, of the season, ...), and under any of those dates a child who is the
 * limit's age today can still be within it for the season; one a year older cannot. Younger children
 * playing up are common and not named.
 */
export function ageGroupCheck(squadName: string, dateOfBirth: string, today: string): string | null {
  const limit = ageLimitOf(squadName);
  if (limit === null || dateOfBirth > today) return null;
  const age = ageInYears(dateOfBirth, today);
  if (age < limit + 1) return null;
  return `${age} years old today, older than “${squadName}” suggests: check the squad.`;
}

import type { Athlete } from '@/features/athletes/api/types';

/**
 * For the club admin's home: the athletes (not archived) whose family's screening or photo decision is not
 * recorded, and those with no parent account linked, in plain words with what that means. Pure; wording and rule our choice (nobody is screened, and
 * no photo taken, without a recorded "yes").
 */
export function consentGapLines(athletes: readonly Pick<Athlete, 'archived' | 'consents' | 'guardianCount'>[]): string[] {
  const active = athletes.filter((a) => !a.archived);
  const screening = active.filter((a) => !a.consents.screening).length;
  const photos = active.filter((a) => !a.consents.photos).length;
  const unlinked = active.filter((a) => a.guardianCount === 0).length;
  const lines: string[] = [];
  const athletesText = (n: number) => (n === 1 ? '1 athlete has' : `${n} athletes have`);
  if (screening) lines.push(`${athletesText(screening)} no screening decision recorded: not screened until the family's answer is.`);
  if (photos) lines.push(`${athletesText(photos)} no photo decision recorded: no photos are taken of them.`);
  if (!lines.length && active.length) lines.push('Every athlete has a screening and a photo decision recorded.');
  if (unlinked) lines.push(`${athletesText(unlinked)} no parent account linked: no family reads their summaries or answers for them in the app.`);
  return lines;
}

/** Something on the list to act on from the athletes' pages (the all-recorded line alone is not). */
export const hasConsentGaps = (athletes: readonly Pick<Athlete, 'archived' | 'consents' | 'guardianCount'>[]) =>
  athletes.some((a) => !a.archived && (!a.consents.screening || !a.consents.photos || a.guardianCount === 0));

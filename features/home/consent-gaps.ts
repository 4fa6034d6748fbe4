import type { Athlete } from '@/features/athletes/api/types';

/**
 * For the club admin's home: the athletes (not archived) whose family's screening or photo decision is not
 * recorded, in plain words with what that means. Pure; wording and rule our choice (nobody is screened, and
 * no photo taken, without a recorded "yes").
 */
export function consentGapLines(athletes: readonly Pick<Athlete, 'archived' | 'consents'>[]): string[] {
  const active = athletes.filter((a) => !a.archived);
  const screening = active.filter((a) => !a.consents.screening).length;
  const photos = active.filter((a) => !a.consents.photos).length;
  const lines: string[] = [];
  const athletesText = (n: number) => (n === 1 ? '1 athlete has' : `${n} athletes have`);
  if (screening) lines.push(`${athletesText(screening)} no screening decision recorded: not screened until the family's answer is.`);
  if (photos) lines.push(`${athletesText(photos)} no photo decision recorded: no photos are taken of them.`);
  if (!lines.length && active.length) lines.push('Every athlete has a screening and a photo decision recorded.');
  return lines;
}

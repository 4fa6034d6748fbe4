import type { SquadWithRounds } from '@/features/screening/api/get-rounds';
import type { RoundSummary } from '@/features/screening/contract';

/**
 * The order a tester meets the open rounds on their home (our choice): today's round first, then rounds
 * planned for the coming days, soonest first, then rounds left open from earlier days, newest first (the
 * leftovers, not the work at hand). Squads follow their first round: a squad screening today comes first,
 * so the card a tester needs in the hall is the first on the phone. Squads with no open round keep the
 * club's order, after the others.
 */
const rankOf = (day: string, today: string) => (day === today ? 0 : day > today ? 1 : 2);

/** Which of two days comes first in that order. */
const byCourtside = (a: string, b: string, today: string) => {
  const ra = rankOf(a, today);
  const byRank = ra - rankOf(b, today);
  if (byRank !== 0) return byRank;
  // Coming days soonest first; earlier days newest first.
  return ra === 1 ? a.localeCompare(b) : b.localeCompare(a);
};

export function courtsideRounds(open: RoundSummary[], today: string): RoundSummary[] {
  return [...open].sort((a, b) => byCourtside(a.screenedOn, b.screenedOn, today));
}

export type CourtsideSquad = SquadWithRounds & { open: RoundSummary[] };

export function courtsideSquads(bySquad: SquadWithRounds[], isOpen: (r: RoundSummary) => boolean, today: string): CourtsideSquad[] {
  const withOpen = bySquad.map((s, index) => ({ ...s, open: courtsideRounds(s.rounds.filter(isOpen), today), index }));
  return withOpen
    .sort((a, b) => {
      const [fa, fb] = [a.open[0], b.open[0]];
      if (!fa || !fb) return fa ? -1 : fb ? 1 : a.index - b.index;
      return byCourtside(fa.screenedOn, fb.screenedOn, today) || a.index - b.index;
    })
    .map(({ index: _index, ...s }) => s);
}

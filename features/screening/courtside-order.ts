import type { SquadWithRounds } from '@/features/screening/api/get-rounds';
import type { RoundSummary } from '@/features/screening/contract';

/**
 * The order a tester meets the open rounds on their home (our choice): today's round first, then the
 * rounds already begun on earlier days, newest first, then rounds planned for a later day, soonest first.
 * Squads follow their first round: a squad screening today comes first, so the card a tester needs in the
 * hall is the first on the phone. Squads with no open round keep the club's order, after the others.
 */
export function courtsideRounds(open: RoundSummary[], today: string): RoundSummary[] {
  const rank = (r: RoundSummary) => (r.screenedOn === today ? 0 : r.screenedOn < today ? 1 : 2);
  return [...open].sort((a, b) => {
    const byRank = rank(a) - rank(b);
    if (byRank !== 0) return byRank;
    // Earlier days newest first; later days soonest first.
    return rank(a) === 2 ? a.screenedOn.localeCompare(b.screenedOn) : b.screenedOn.localeCompare(a.screenedOn);
  });
}

export type CourtsideSquad = SquadWithRounds & { open: RoundSummary[] };

export function courtsideSquads(bySquad: SquadWithRounds[], isOpen: (r: RoundSummary) => boolean, today: string): CourtsideSquad[] {
  const withOpen = bySquad.map((s, index) => ({ ...s, open: courtsideRounds(s.rounds.filter(isOpen), today), index }));
  const key = (s: (typeof withOpen)[number]) => {
    const first = s.open[0];
    if (!first) return { rank: 3, day: '' };
    return { rank: first.screenedOn === today ? 0 : first.screenedOn < today ? 1 : 2, day: first.screenedOn };
  };
  return withOpen
    .sort((a, b) => {
      const ka = key(a);
      const kb = key(b);
      if (ka.rank !== kb.rank) return ka.rank - kb.rank;
      if (ka.rank === 1 && ka.day !== kb.day) return kb.day.localeCompare(ka.day);
      if (ka.rank === 2 && ka.day !== kb.day) return ka.day.localeCompare(kb.day);
      return a.index - b.index;
    })
    .map(({ index: _index, ...s }) => s);
}

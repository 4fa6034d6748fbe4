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

export function courtsideRounds(open: RoundSummary[], today: string): RoundSummary[] {
  return [...open].sort((a, b) => {
    const ra = rankOf(a.screenedOn, today);
    const byRank = ra - rankOf(b.screenedOn, today);
    if (byRank !== 0) return byRank;
    // Coming days soonest first; earlier days newest first.
    return ra === 1 ? a.screenedOn.localeCompare(b.screenedOn) : b.screenedOn.localeCompare(a.screenedOn);
  });
}

export type CourtsideSquad = SquadWithRounds & { open: RoundSummary[] };

export function courtsideSquads(bySquad: SquadWithRounds[], isOpen: (r: RoundSummary) => boolean, today: string): CourtsideSquad[] {
  const withOpen = bySquad.map((s, index) => ({ ...s, open: courtsideRounds(s.rounds.filter(isOpen), today), index }));
  const key = (s: (typeof withOpen)[number]) => {
    const first = s.open[0];
    return first ? { rank: rankOf(first.screenedOn, today), day: first.screenedOn } : { rank: 3, day: '' };
  };
  return withOpen
    .sort((a, b) => {
      const ka = key(a);
      const kb = key(b);
      if (ka.rank !== kb.rank) return ka.rank - kb.rank;
      if (ka.rank === 1 && ka.day !== kb.day) return ka.day.localeCompare(kb.day);
      if (ka.rank === 2 && ka.day !== kb.day) return kb.day.localeCompare(ka.day);
      return a.index - b.index;
    })
    .map(({ index: _index, ...s }) => s);
}

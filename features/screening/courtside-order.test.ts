import { describe, expect, it } from 'vitest';
import type { RoundSummary } from './contract';
import { courtsideRounds, courtsideSquads } from './courtside-order';

// Our choice (no source): the order a tester meets open rounds on their home.
const round = (id: string, squadId: string, screenedOn: string, open = true): RoundSummary => ({
  id,
  squadId,
  squadName: squadId,
  name: id,
  screenedOn,
  counts: { not_started: open ? 3 : 0, in_progress: 0, submitted: open ? 1 : 4 } as RoundSummary['counts'],
  closedAt: null,
  closedByName: null,
});
const squad = (id: string) => ({ id, name: id, athleteCount: 4 }) as never;
const isOpen = (r: RoundSummary) => r.counts.not_started > 0;

describe('courtside order of open rounds', () => {
  it("puts today's round first, then the coming days soonest first, then earlier days newest first", () => {
    const rounds = [
      round('next-week', 's', '2026-12-12'),
      round('tomorrow', 's', '2026-12-06'),
      round('old', 's', '2026-11-01'),
      round('today', 's', '2026-12-05'),
      round('last-week', 's', '2026-11-28'),
    ];
    expect(courtsideRounds(rounds, '2026-12-05').map((r) => r.id)).toEqual(['today', 'tomorrow', 'next-week', 'last-week', 'old']);
  });

  it('puts the squad screening today first and keeps the club order among the others', () => {
    const bySquad = [
      { squad: squad('A'), rounds: [round('a-done', 'A', '2026-12-05', false)] },
      { squad: squad('B'), rounds: [round('b-later', 'B', '2026-12-20')] },
      { squad: squad('C'), rounds: [round('c-old', 'C', '2026-11-20')] },
      { squad: squad('D'), rounds: [round('d-today', 'D', '2026-12-05'), round('d-old', 'D', '2026-10-01')] },
      { squad: squad('E'), rounds: [] },
      { squad: squad('F'), rounds: [round('f-recent', 'F', '2026-12-01')] },
    ];
    const ordered = courtsideSquads(bySquad, isOpen, '2026-12-05');
    expect(ordered.map((s) => s.squad.id)).toEqual(['D', 'B', 'F', 'C', 'A', 'E']);
    expect(ordered[0]!.open.map((r) => r.id)).toEqual(['d-today', 'd-old']);
    // A round with everyone submitted is not open: squad A shows no open round.
    expect(ordered.find((s) => s.squad.id === 'A')!.open).toEqual([]);
  });
});

// A squad's season reduced to what a head coach acts on first. Pure: the server sums each squad's trends
// table (squadTrends) with it, so the home's numbers are the trends page's numbers.
import type { SortKey, TrendAthlete } from './trends';

export type SquadWatch = {
  squadId: string;
  name: string;
  /** Pain reported at the newest screen, no physiotherapist's decision since. */
  painWaiting: number;
  /** Referred on by a physiotherapist. */
  referred: number;
  /** Training with a physiotherapist's changes. */
  withChanges: number;
  /** In the growth-spurt window at their newest screen. */
  growthSpurt: number;
  /** Re-screen due and no open round has them yet (those who may be screened). */
  rescreenDue: number;
  /** Re-screen due and already waiting in an open round. */
  rescreenPlanned: number;
};

/** Our choice of what counts, in the trends table's own terms (awaitingClearance, clearance, band, due). */
export function watchOf(squadId: string, name: string, athletes: readonly TrendAthlete[]): SquadWatch {
  const count = (test: (a: TrendAthlete) => boolean) => athletes.filter(test).length;
  return {
    squadId,
    name,
    painWaiting: count((a) => a.awaitingClearance),
    referred: count((a) => !a.awaitingClearance && a.clearance === 'referred'),
    withChanges: count((a) => !a.awaitingClearance && a.clearance === 'modified'),
    growthSpurt: count((a) => a.maturityBand === 'circa'),
    rescreenDue: count((a) => a.takingPart && a.rescreenDue && !a.openRound),
    rescreenPlanned: count((a) => a.takingPart && a.rescreenDue && !!a.openRound),
  };
}

/** One squad's numbers in words, the most held back first; only what is not nought (our wording). */
export function watchLines(w: SquadWatch): { text: string; stop: boolean; open: { sort?: SortKey; band?: 'circa' } }[] {
  // `open`: how the squad's trends table opens from the line, to show who (our choice).
  const lines: { text: string; stop: boolean; open: { sort?: SortKey; band?: 'circa' } }[] = [];
  if (w.painWaiting) lines.push({ text: `${w.painWaiting} with pain reported, waiting for a physiotherapist`, stop: true, open: { sort: 'clearance' } });
  if (w.referred) lines.push({ text: `${w.referred} referred on by the physiotherapist`, stop: true, open: { sort: 'clearance' } });
  if (w.withChanges) lines.push({ text: `${w.withChanges} training with the physiotherapist's changes`, stop: false, open: { sort: 'clearance' } });
  if (w.growthSpurt) lines.push({ text: `${w.growthSpurt} in the growth-spurt window: loads capped, landings halved`, stop: false, open: { band: 'circa' } });
  if (w.rescreenDue || w.rescreenPlanned)
    lines.push({
      text: `${w.rescreenDue + w.rescreenPlanned} due a re-screen${w.rescreenPlanned ? ` (${w.rescreenPlanned} already in an open round)` : ''}`,
      stop: false,
      open: { sort: 'rescreenDue' },
    });
  return lines;
}

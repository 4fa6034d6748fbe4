import { describe, expect, it } from 'vitest';
import type { TrendAthlete } from './trends';
import { watchLines, watchOf } from './watch';

const athlete = (o: Partial<TrendAthlete>): TrendAthlete =>
  ({
    id: o.firstName ?? 'x',
    firstName: 'x',
    lastName: 'y',
    sex: 'female',
    dateOfBirth: '2013-01-01',
    ageGroup: 'U13',
    maturityBand: null,
    clearance: null,
    awaitingClearance: false,
    takingPart: true,
    screeningRefused: false,
    latestAssessmentId: 'a',
    lastScreenedOn: '2026-09-14',
    daysSinceLastScreen: 80,
    rescreenDate: '2026-10-26',
    rescreenDue: false,
    openRound: null,
    latestFlags: { left: [], right: [], both: [], unsided: [] },
    sessionsSinceScreen: null,
    ...o,
  }) as TrendAthlete;

// our choice: what a head coach acts on first, counted in the trends table's own terms.
describe('watchOf', () => {
  it('counts pain waiting, referrals, changes, the growth-spurt window and re-screens due or planned', () => {
    const w = watchOf('s1', 'Under-13', [
      athlete({ firstName: 'A', awaitingClearance: true, clearance: 'referred', maturityBand: 'circa' }),
      athlete({ firstName: 'B', clearance: 'referred' }),
      athlete({ firstName: 'C', clearance: 'modified', rescreenDue: true }),
      athlete({ firstName: 'D', maturityBand: 'circa', rescreenDue: true, openRound: 'Winter check' }),
      athlete({ firstName: 'E', rescreenDue: true, takingPart: false }),
      athlete({ firstName: 'F', clearance: 'cleared', maturityBand: 'post' }),
    ]);
    // A waits for a decision on new pain (counted there, not again as referred); E may not be screened.
    expect(w).toEqual({ squadId: 's1', name: 'Under-13', painWaiting: 1, referred: 1, withChanges: 1, growthSpurt: 2, rescreenDue: 1, rescreenPlanned: 1 });
    expect(watchLines(w).map((l) => l.text)).toEqual([
      '1 with pain reported, waiting for a physiotherapist',
      '1 referred on by the physiotherapist',
      "1 training with the physiotherapist's changes",
      '2 in the growth-spurt window: loads capped, landings halved',
      '2 due a re-screen (1 already in an open round)',
    ]);
  });

  it('says nothing for a squad with nothing waiting', () => {
    expect(watchLines(watchOf('s2', 'Under-15', [athlete({})]))).toEqual([]);
  });
});

import { describe, expect, it } from 'vitest';
import {
  addDays,
  ageGroupOf,
  athleteKneeSeries,
  clearanceWords,
  csvRows,
  defaultRoundPair,
  fullRounds,
  screenedCaption,
  filterAthletes,
  kneeMeasurementIds,
  rescreenOf,
  roundKneeAngles,
  shareOf,
  shareSeries,
  sidedPatterns,
  sessionShare,
  sortAthletes,
  type TrendAthlete,
} from './trends';
import { watchLines, watchOf } from './watch';

function athlete(overrides: Partial<TrendAthlete>): TrendAthlete {
  return {
    id: overrides.firstName ?? 'x',
    firstName: 'X',
    lastName: 'Y',
    sex: 'female',
    dateOfBirth: '2014-01-01',
    ageGroup: 'U13',
    maturityBand: null,
    clearance: null,
    awaitingClearance: false,
    takingPart: true,
    screeningRefused: false,
    latestAssessmentId: null,
    lastScreenedOn: null,
    daysSinceLastScreen: null,
    rescreenDate: null,
    rescreenDue: true,
    latestFlags: { left: [], right: [], both: [], unsided: [] },
    sessionsSinceScreen: null,
    ...overrides,
  };
}

describe('age groups (our choice: under-11 to under-19 by whole years on the day)', () => {
  it.each([
    [9, 'U11'],
    [10, 'U11'],
    [11, 'U13'],
    [12, 'U13'],
    [14, 'U15'],
    [16, 'U17'],
    [18, 'U19'],
    [19, 'Open'],
  ])('%i years: %s', (age, group) => expect(ageGroupOf(age)).toBe(group));
});

describe('re-screen due', () => {
  it.each([
    // [last screen, plan date, today, expected date, due]
    ['2026-09-14', '2026-10-26', '2026-10-25', '2026-10-26', false], // the plan date, one day ahead
    ['2026-09-14', '2026-10-26', '2026-10-26', '2026-10-26', true], // due on the day
    ['2026-09-14', null, '2026-10-25', '2026-10-26', false], // no plan date: 6 weeks (the engine default) = 42 days
    [null, null, '2026-10-25', null, true], // never screened
  ] as const)('%s / %s on %s', (last, plan, today, date, due) => {
    expect(rescreenOf(last, plan, today)).toEqual({ date, due });
  });

  it('adds days across a month end', () => expect(addDays('2026-01-30', 3)).toBe('2026-02-02'));
});

describe('flags per side from the flag ids', () => {
  it('groups patterns by side, once each', () => {
    expect(
      sidedPatterns(
        [
          'dynamic-knee-valgus/two-leg-squat/left',
          'dynamic-knee-valgus/drop-landing/left',
          'contralateral-pelvic-drop/single-leg-stance-right/right',
          'heels-lifting/two-leg-squat/both',
          'growth-spurt-window',
        ],
        ['left', 'left', 'right', 'both', null],
      ),
    ).toEqual({ left: ['dynamic-knee-valgus'], right: ['contralateral-pelvic-drop'], both: ['heels-lifting'], unsided: ['growth-spurt-window'] });
  });
});

describe('filters, sorting and the CSV rows agree', () => {
  const rows = [
    athlete({
      firstName: 'Ana',
      lastName: 'Abbott',
      sex: 'female',
      maturityBand: 'circa',
      latestFlags: { left: ['dynamic-knee-valgus'], right: [], both: [], unsided: [] },
      daysSinceLastScreen: 20,
      latestAssessmentId: 'a-ana',
      sessionsSinceScreen: { attended: 3, held: 4 },
    }),
    athlete({
      firstName: 'Ben',
      lastName: 'Brook',
      sex: 'male',
      ageGroup: 'U15',
      maturityBand: 'post',
      daysSinceLastScreen: 80,
      latestAssessmentId: 'a-ben',
      sessionsSinceScreen: { attended: 5, held: 10 },
    }),
    athlete({ firstName: 'Cai', lastName: 'Cole', sex: 'female', maturityBand: null, daysSinceLastScreen: null }),
  ];
  it.each([
    [{ sex: 'female' as const }, ['Ana', 'Cai']],
    [{ ageGroup: 'U15' }, ['Ben']],
    [{ maturityBand: 'unknown' as const }, ['Cai']],
    [{ flag: 'any' as const }, ['Ana']],
    // our choice: never screened (Cai) is not "no movement flag"
    [{ flag: 'none' as const }, ['Ben']],
    [{ flag: 'dynamic-knee-valgus' as const }, ['Ana']],
    [{ sex: 'female' as const, flag: 'none' as const }, []],
  ])('%o', (filters, names) => {
    expect(filterAthletes(rows, filters).map((a) => a.firstName)).toEqual(names);
  });

  it('counts movement flags only for "any", "none" and the flag sort: the growth-spurt window is a stage (our choice)', () => {
    const growing = athlete({
      firstName: 'Gus',
      lastName: 'Gray',
      latestAssessmentId: 'a-gus',
      latestFlags: { left: [], right: [], both: [], unsided: ['growth-spurt-window'] },
    });
    expect(filterAthletes([growing], { flag: 'any' })).toEqual([]);
    expect(filterAthletes([growing], { flag: 'none' })).toEqual([growing]);
    expect(filterAthletes([growing], { flag: 'growth-spurt-window' })).toEqual([growing]);
    expect(sortAthletes([rows[0]!, growing], 'flags').map((a) => a.firstName)).toEqual(['Ana', 'Gus']);
  });

  it('sorts re-screens the longest overdue first, then the next due, then those not to be screened (our choice)', () => {
    const due = (firstName: string, rescreenDate: string | null) => athlete({ firstName, rescreenDue: true, rescreenDate });
    const later = athlete({ firstName: 'Lia', rescreenDue: false, rescreenDate: '2027-02-01' });
    const sooner = athlete({ firstName: 'Kai', rescreenDue: false, rescreenDate: '2027-01-11' });
    const out = athlete({ firstName: 'Ona', takingPart: false, rescreenDue: false, rescreenDate: null });
    const rows = [later, out, due('Cas', '2026-10-26'), sooner, due('Gal', '2026-07-20'), due('New', null)];
    expect(sortAthletes(rows, 'rescreenDue').map((a) => a.firstName)).toEqual(['New', 'Gal', 'Cas', 'Kai', 'Lia', 'Ona']);
  });

  it('sorts, never-screened last by days', () => {
    expect(sortAthletes(rows, 'daysSinceLastScreen').map((a) => a.firstName)).toEqual(['Ana', 'Ben', 'Cai']);
    expect(sortAthletes(rows, 'name', true).map((a) => a.firstName)).toEqual(['Cai', 'Ben', 'Ana']);
    // Most flags first (our choice); the other way round on a second tap.
    expect(sortAthletes(rows, 'flags')[0]!.firstName).toBe('Ana');
  });

  it('sorts by the share of sessions taken part in since the screen, lowest first, nothing to count last (our choice)', () => {
    // Ben 5 of 10 = 0.5, Ana 3 of 4 = 0.75, Cai never screened.
    expect(sortAthletes(rows, 'sessions').map((a) => a.firstName)).toEqual(['Ben', 'Ana', 'Cai']);
    const none = athlete({ firstName: 'Dee', lastName: 'Dunn', sessionsSinceScreen: { attended: 0, held: 0 } });
    expect(sessionShare(none)).toBeNull();
    expect(sortAthletes([none, ...rows], 'sessions').map((a) => a.firstName)).toEqual(['Ben', 'Ana', 'Cai', 'Dee']);
  });

  it('writes one CSV row per athlete after the header', () => {
    const csv = csvRows(filterAthletes(rows, { flag: 'any' }));
    expect(csv).toHaveLength(2);
    // In the screen's words, not the stored codes.
    expect(csv[1]!.slice(0, 7)).toEqual(['Abbott', 'Ana', 'female', 'U13', 'In growth spurt', '', 'Knee valgus']);
    expect(csv[1]!.slice(-2)).toEqual(['3', '4']);
    expect(csvRows([rows[2]!])[1]!.slice(-2)).toEqual(['', '']);
  });

  it('says a clearance in words, pain waiting for one first, and sorts those waiting first (our choice)', () => {
    const waiting = athlete({ firstName: 'Eli', lastName: 'Eze', awaitingClearance: true });
    const referred = athlete({ firstName: 'Fay', lastName: 'Fox', clearance: 'referred' });
    expect([waiting, referred, rows[0]!].map(clearanceWords)).toEqual(['Pain reported: waiting for clearance', 'Refer on', null]);
    expect(sortAthletes([rows[0]!, referred, waiting], 'clearance').map((a) => a.firstName)).toEqual(['Eli', 'Fay', 'Ana']);
    // Then by how much is held back: referred on, with changes, cleared, no decision.
    const modified = athlete({ firstName: 'Gil', lastName: 'Gao', clearance: 'modified' });
    const cleared = athlete({ firstName: 'Hal', lastName: 'Ho', clearance: 'cleared' });
    expect(sortAthletes([cleared, rows[0]!, modified, referred, waiting], 'clearance').map((a) => a.firstName)).toEqual(['Eli', 'Fay', 'Gil', 'Hal', 'Ana']);
    expect(csvRows([waiting])[1]![5]).toBe('Pain reported: waiting for clearance');
  });

  // our choice: a row's knee angles come from one screen, the newest with any; an older value is not mixed in.
  it('ends each row with the knee angles of the athlete’s newest measured round, and names that round', () => {
    const [ana, ben, cai] = rows as [TrendAthlete, TrendAthlete, TrendAthlete];
    const rounds = [
      { id: 'r1', name: 'Pre-season', screenedOn: '2026-09-01', screened: 2, flagged: {} },
      { id: 'r2', name: 'Mid-season', screenedOn: '2026-11-10', screened: 1, flagged: {} },
    ];
    const L = 'single-leg-squat-left/fppa/left';
    const R = 'single-leg-squat-right/fppa/right';
    // Ana: both knees in round 1, only the left in round 2. Ben: round 1 only. Cai: never measured.
    const kneeAngles = {
      athleteIds: [ana.id, ben.id],
      values: {
        [L]: [
          [14.2, 6],
          [9.8, null],
        ],
        [R]: [
          [11, 7.5],
          [null, null],
        ],
      },
    };
    const csv = csvRows([ana, ben, cai], { kneeAngles, rounds });
    expect(csv[0]!.slice(-3)).toEqual([
      'knee_angles_from_round',
      'knee_angle_deg_single_leg_squat_left_left_knee',
      'knee_angle_deg_single_leg_squat_right_right_knee',
    ]);
    // Ana's right knee was not measured in round 2: empty, not round 1's 11.0.
    expect(csv[1]!.slice(-3)).toEqual(['Mid-season (2026-11-10)', '9.8', '']);
    expect(csv[2]!.slice(-3)).toEqual(['Pre-season (2026-09-01)', '6.0', '7.5']);
    expect(csv[3]!.slice(-3)).toEqual(['', '', '']);
    expect(csv.every((row) => row.length === csv[0]!.length)).toBe(true);
  });

  // our choice: an athlete whose family has not agreed to take part is asked for no re-screen.
  it('says why there is no re-screen in the CSV: the family said no, or no decision yet', () => {
    const out = athlete({ firstName: 'Gil', lastName: 'Gray', takingPart: false, screeningRefused: true, rescreenDue: false });
    expect(csvRows([out])[1]![12]).toBe('family said no to screening');
    expect(csvRows([athlete({ takingPart: false, rescreenDue: false })])[1]![12]).toBe('no screening consent yet');
    expect(csvRows([athlete({ rescreenDue: true })])[1]![12]).toBe('yes');
  });
});

describe('share of a round with a flag', () => {
  it.each([
    [3, 2, 2 / 3],
    [2, 1, 0.5],
    [4, 0, 0],
  ])('%i screened, %i flagged', (screened, flagged, share) => {
    expect(shareOf({ id: 'r', name: 'r', screenedOn: '2026-01-01', screened, flagged: { 'dynamic-knee-valgus': flagged } }, 'dynamic-knee-valgus')).toBeCloseTo(
      share,
      10,
    );
  });
  it('is null for a round nobody was screened in', () => {
    expect(shareOf({ id: 'r', name: 'r', screenedOn: '2026-01-01', screened: 0, flagged: {} }, 'heels-lifting')).toBeNull();
  });
  it('flags with the same share sit side by side around the round, never on top of each other (our choice)', () => {
    const rounds = [
      { id: 'a', name: 'a', screenedOn: '2026-01-01', screened: 6, flagged: { 'dynamic-knee-valgus': 1, 'heels-lifting': 1 } },
      { id: 'b', name: 'b', screenedOn: '2026-03-01', screened: 0, flagged: {} },
      { id: 'c', name: 'c', screenedOn: '2026-05-01', screened: 6, flagged: { 'dynamic-knee-valgus': 1, 'heels-lifting': 1 } },
    ];
    const one = shareSeries(rounds, 'dynamic-knee-valgus', 0, 2);
    const two = shareSeries(rounds, 'heels-lifting', 1, 2);
    // Two flags: 0.06 apart, centred on each round; the round nobody was screened in has no point.
    expect(one.map((d) => d.x)).toEqual([-0.03, 1.97]);
    expect(two.map((d) => d.x)).toEqual([0.03, 2.03]);
    expect(one.map((d) => d.y)).toEqual(two.map((d) => d.y));
    // Many flags: spread over at most 0.4 of the gap between rounds.
    const xs = Array.from({ length: 8 }, (_, k) => shareSeries(rounds, 'heels-lifting', k, 8)[0]!.x);
    expect(Math.max(...xs) - Math.min(...xs)).toBeCloseTo(0.4, 10);
    expect(shareSeries(rounds, 'heels-lifting', 0, 1).map((d) => d.x)).toEqual([0, 2]);
  });
});

describe('knee angles sent once (our choice of layout)', () => {
  // Two rounds, three athletes: x left the squad after round 1, z joined for round 2.
  const k = {
    athleteIds: ['x', 'y', 'z'],
    values: {
      'single-leg-squat-right/fppa/right': [
        [14.3, 9.5, null],
        [null, 11.4, 22.6],
      ],
      'drop-landing/fppa/left': [[], [null, null, null]],
    },
  };
  it('lists the measurements with a value, sorted', () => {
    expect(kneeMeasurementIds(k)).toEqual(['single-leg-squat-right/fppa/right']);
  });
  it("gives a round's distribution sorted, leavers included", () => {
    expect(roundKneeAngles(k, 'single-leg-squat-right/fppa/right', 0)).toEqual([9.5, 14.3]);
    expect(roundKneeAngles(k, 'single-leg-squat-right/fppa/right', 1)).toEqual([11.4, 22.6]);
    expect(roundKneeAngles(k, 'drop-landing/fppa/left', 0)).toEqual([]);
    expect(roundKneeAngles(k, 'unknown', 0)).toEqual([]);
  });
  it("gives an athlete's series per round, null where not measured", () => {
    expect(athleteKneeSeries(k, 'y', 'single-leg-squat-right/fppa/right', 2)).toEqual([9.5, 11.4]);
    expect(athleteKneeSeries(k, 'z', 'single-leg-squat-right/fppa/right', 2)).toEqual([null, 22.6]);
    expect(athleteKneeSeries(k, 'y', 'drop-landing/fppa/left', 2)).toEqual([null, null]);
    expect(athleteKneeSeries(k, 'nobody', 'single-leg-squat-right/fppa/right', 2)).toEqual([null, null]);
  });
});

describe('the flag-share chart draws the rounds most of the squad took part in (our choice)', () => {
  const round = (id: string, screened: number) => ({ id, name: id, screenedOn: '2026-09-14', screened, flagged: {} });
  it('leaves out rounds with fewer than half as many screened as the fullest, and counts them', () => {
    // Fullest 12: 6 is half (kept), 5 and 1 are not; a round with nobody screened is neither drawn nor counted.
    const out = fullRounds([round('a', 12), round('b', 1), round('c', 6), round('d', 0), round('e', 5), round('f', 11)]);
    expect(out.rounds.map((r) => r.id)).toEqual(['a', 'c', 'f']);
    expect(out.leftOut).toBe(2);
  });
  it('draws every round with anyone screened when fewer than two are that full', () => {
    const out = fullRounds([round('a', 12), round('b', 2), round('c', 0)]);
    expect(out.rounds.map((r) => r.id)).toEqual(['a', 'b']);
    expect(out.leftOut).toBe(0);
  });
});

describe('the flag-share chart says how many each share is of (our wording)', () => {
  const round = (screenedOn: string, screened: number) => ({ id: screenedOn, name: screenedOn, screenedOn, screened, flagged: {} });
  it('lists the screened count of each round with data, by date', () => {
    expect(screenedCaption([round('2026-09-14', 12), round('2026-10-01', 0), round('2026-12-05', 2)], (d) => d.slice(5))).toBe(
      'Screened per round: 09-14: 12 · 12-05: 2. Each share is of those screened in that round, so a round with few screened moves a lot.',
    );
    expect(screenedCaption([round('2026-10-01', 0)], (d) => d)).toBeNull();
    // The newest eight at most.
    const many = Array.from({ length: 10 }, (_, i) => round(`2026-10-${String(i + 10)}`, i + 1));
    expect(screenedCaption(many, (d) => d.slice(8))).toBe(
      'Screened in the latest 8 rounds: 12: 3 · 13: 4 · 14: 5 · 15: 6 · 16: 7 · 17: 8 · 18: 9 · 19: 10. Each share is of those screened in that round, so a round with few screened moves a lot.',
    );
  });
});

describe('the change chart first compares the newest two well-filled rounds (our choice)', () => {
  const round = (id: string, screened: number) => ({ id, name: id, screenedOn: '2026-01-01', screened, flagged: {} });
  it('skips a round just started and a small extra one', () => {
    expect(defaultRoundPair([round('sep', 12), round('nov', 9), round('extra', 3), round('dec', 2)])).toEqual({ from: 'sep', to: 'nov' });
    expect(defaultRoundPair([round('sep', 12), round('nov', 9), round('dec', 6)])).toEqual({ from: 'nov', to: 'dec' });
  });
  it('falls back to the two newest with anyone screened, or nothing', () => {
    expect(defaultRoundPair([round('sep', 12), round('dec', 2)])).toEqual({ from: 'sep', to: 'dec' });
    expect(defaultRoundPair([round('sep', 12)])).toEqual({ from: '', to: 'sep' });
    expect(defaultRoundPair([round('sep', 0)])).toEqual({ from: '', to: '' });
  });
});

// our choice: what a head coach acts on first, counted in the trends table's own terms.
describe('watchOf', () => {
  it('counts pain waiting, referrals, changes, the growth-spurt window and re-screens due or planned', () => {
    const w = watchOf('s1', 'Under-13', [
      athlete({ firstName: 'A', awaitingClearance: true, clearance: 'referred', maturityBand: 'circa', rescreenDue: false }),
      athlete({ firstName: 'B', clearance: 'referred', rescreenDue: false }),
      athlete({ firstName: 'C', clearance: 'modified', rescreenDue: true }),
      athlete({ firstName: 'D', maturityBand: 'circa', rescreenDue: true, openRound: 'Winter check' }),
      athlete({ firstName: 'E', rescreenDue: true, takingPart: false }),
      athlete({ firstName: 'F', clearance: 'cleared', maturityBand: 'post', rescreenDue: false }),
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
    expect(watchLines(watchOf('s2', 'Under-15', [athlete({ rescreenDue: false })]))).toEqual([]);
  });
});

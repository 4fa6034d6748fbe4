import { describe, expect, it } from 'vitest';
import type { Flag, Measurement, MetricId, TaskId } from '@/features/screening/engine';
import { compareFlags, compareMeasurement, compareScreens, daysBetween, ERROR_MARGINS, planTimeBetween, type ScreenForComparison } from './compare';
import { barelyCleared, coachSummary, familySummary } from './wording';

const MUNRO2012 =
  'Munro A, Herrington L, Carolan M. Reliability of 2-dimensional video assessment of frontal-plane dynamic knee valgus during common athletic screening tasks. J Sport Rehabil. 2012;21(1):7-11';
const POWDEN2015 =
  'Powden CJ, Hoch JM, Hoch MC. Reliability and minimal detectable change of the weight-bearing lunge test: a systematic review. Man Ther. 2015;20(4):524-532';

function m(id: string, metric: MetricId, value: number, unit: Measurement['unit'], taskId: TaskId | null = null): Measurement {
  return { id, metric, taskId, side: 'right', value, unit, label: id };
}

describe('published error margins', () => {
  it.each([
    // [metric, value, unit, source]
    ['fppa', 8.93, 'deg', `${MUNRO2012}: smallest detectable difference 7.54-8.93 deg, upper end (our choice)`],
    ['knee-to-wall', 1.9, 'cm', `${POWDEN2015}: MDC 1.6 cm between clinicians, 1.9 cm within; the larger (our choice)`],
  ] as const)('%s: %s %s (%s)', (metric, value, unit, source) => {
    const margin = ERROR_MARGINS[metric]!;
    expect(margin.value).toBe(value);
    expect(margin.unit).toBe(unit);
    expect(source.startsWith(margin.source.slice(0, 40))).toBe(true);
    expect(margin.certainty).toBe('checked');
  });

  it('no other metric has a figure (no published figure was found for them)', () => {
    expect(Object.keys(ERROR_MARGINS).sort()).toEqual(['fppa', 'knee-to-wall']);
  });
});

describe('compareMeasurement: worked examples by hand', () => {
  it.each([
    // [what, metric, unit, earlier, later, change, margin, verdict, direction, source of the margin]
    ['single-leg squat FPPA falls 12.2 deg', 'fppa', 'deg', 18.4, 6.2, -12.2, 8.93, 'real-change', 'down', `${MUNRO2012}: |-12.2| > 8.93`],
    ['FPPA falls 4.5 deg', 'fppa', 'deg', 14.0, 9.5, -4.5, 8.93, 'within-error', null, `${MUNRO2012}: |-4.5| <= 8.93`],
    ['FPPA rises exactly the SDD', 'fppa', 'deg', 10.0, 18.93, 8.93, 8.93, 'within-error', null, `${MUNRO2012}: 8.93 is not more than 8.93`],
    ['FPPA rises 9 deg', 'fppa', 'deg', 5.0, 14.0, 9.0, 8.93, 'real-change', 'up', `${MUNRO2012}: 9.0 > 8.93`],
    ['knee-to-wall gains 2.5 cm', 'knee-to-wall', 'cm', 7.5, 10.0, 2.5, 1.9, 'real-change', 'up', `${POWDEN2015}: 2.5 > 1.9`],
    ['knee-to-wall gains 1.5 cm', 'knee-to-wall', 'cm', 11.0, 12.5, 1.5, 1.9, 'within-error', null, `${POWDEN2015}: 1.5 <= 1.9`],
    [
      'knee-to-wall gains 1.8 cm: above 1.6, not above 1.9',
      'knee-to-wall',
      'cm',
      8.0,
      9.8,
      1.8,
      1.9,
      'within-error',
      null,
      `${POWDEN2015}: 1.8 <= 1.9 (the larger figure)`,
    ],
    ['knee-to-wall loses 2.0 cm', 'knee-to-wall', 'cm', 12.0, 10.0, -2.0, 1.9, 'real-change', 'down', `${POWDEN2015}: |-2.0| > 1.9`],
    ['pelvic drop falls 6 deg', 'pelvic-obliquity', 'deg', 9.0, 3.0, -6.0, null, 'no-published-figure', null, 'no published figure'],
    ['knee-to-wall LSI rises 23 points', 'knee-to-wall-lsi', 'percent', 68.0, 91.0, 23.0, null, 'no-published-figure', null, 'no published figure'],
    [
      'FPPA left-right difference falls 7 deg',
      'fppa-difference',
      'deg',
      9.0,
      2.0,
      -7.0,
      null,
      'no-published-figure',
      null,
      'no published figure for a difference of two angles',
    ],
    [
      'maturity offset rises 0.4 y',
      'maturity-offset',
      'years',
      -0.9,
      -0.5,
      0.4,
      null,
      'no-published-figure',
      null,
      'SEE of an equation is not a re-test error',
    ],
  ] as const)('%s', (_what, metric, unit, earlier, later, change, margin, verdict, direction, _source) => {
    const c = compareMeasurement(m('x', metric, earlier, unit), m('x', metric, later, unit));
    expect(c.change).toBeCloseTo(change, 10);
    expect(c.errorMargin).toBe(margin);
    expect(c.verdict).toBe(verdict);
    expect(c.direction).toBe(direction);
    expect(c.source === null).toBe(margin === null);
  });
});

const flag = (
  id: string,
  pattern: Flag['pattern'],
  taskId: TaskId | null,
  side: Flag['side'],
  severity: Flag['severity'] = 'watch',
  comparesTasks?: [TaskId, TaskId],
): Flag =>
  ({
    id,
    pattern,
    title: pattern,
    taskId,
    side,
    severity,
    evidence: [],
    thresholdsMet: [],
    source: '',
    comparesTasks,
    threshold: {} as Flag['threshold'],
  }) as Flag;

function screen(
  id: string,
  screenedOn: string,
  tasksDone: TaskId[],
  flags: Flag[],
  measurements: Measurement[] = [],
  plan: Partial<ScreenForComparison['result']['plan']> = {},
): ScreenForComparison {
  return {
    assessmentId: id,
    screenedOn,
    tasksDone,
    result: {
      measurements,
      flags,
      maturity: null,
      plan: { status: 'ready', rescreenWeeks: 6, ...plan },
    },
  };
}

describe('compareFlags', () => {
  const A = flag('dynamic-knee-valgus/single-leg-squat-right/right', 'dynamic-knee-valgus', 'single-leg-squat-right', 'right', 'concern');
  const B = flag('contralateral-pelvic-drop/single-leg-stance-left/left', 'contralateral-pelvic-drop', 'single-leg-stance-left', 'left');
  const C = flag('left-right-asymmetry/knee-to-wall/right', 'left-right-asymmetry', null, 'right', 'watch', ['knee-to-wall-left', 'knee-to-wall-right']);
  const D = flag('dynamic-knee-valgus/drop-landing/right', 'dynamic-knee-valgus', 'drop-landing', 'right');
  const E = flag('limited-ankle-dorsiflexion/knee-to-wall-left/left', 'limited-ankle-dorsiflexion', 'knee-to-wall-left', 'left');
  const laterA = { ...A, severity: 'watch' as const };
  const earlier = screen(
    'e',
    '2026-03-09',
    ['single-leg-squat-right', 'single-leg-stance-left', 'knee-to-wall-left', 'knee-to-wall-right', 'drop-landing'],
    [A, B, C, D],
  );
  const later = screen('l', '2026-06-08', ['single-leg-squat-right', 'single-leg-stance-left', 'knee-to-wall-left', 'knee-to-wall-right'], [laterA, E]);

  it('sorts each flag into cleared, new, persisting or not re-tested', () => {
    const f = compareFlags(earlier, later);
    expect(f.persisting.map((x) => [x.id, x.earlierSeverity, x.severity])).toEqual([[A.id, 'concern', 'watch']]);
    expect(f.cleared.map((x) => x.id)).toEqual([B.id, C.id]);
    expect(f.new.map((x) => x.id)).toEqual([E.id]);
    // The landing was not done again: its flag is neither cleared nor persisting.
    expect(f.notRetested.map((x) => x.id)).toEqual([D.id]);
  });
});

describe('plan time between screens (our choice: at least the plan re-screen interval)', () => {
  it.each([
    // [earlier, later, days by hand, long enough with the default 6 weeks = 42 days]
    ['2026-03-09', '2026-06-08', 91, true], // 22 (rest of March) + 30 + 31 + 8
    ['2026-03-09', '2026-04-06', 28, false], // 22 + 6
    ['2026-03-09', '2026-04-20', 42, true], // exactly six weeks
    ['2026-03-09', '2026-04-19', 41, false],
    ['2026-12-28', '2027-01-04', 7, false], // across the year end
  ] as const)('%s to %s: %i days', (a, b, days, long) => {
    expect(daysBetween(a, b)).toBe(days);
    const t = planTimeBetween(screen('e', a, [], [flag('x', 'heels-lifting', 'two-leg-squat', null)]), screen('l', b, [], []));
    expect(t.days).toBe(days);
    expect(t.longEnough).toBe(long);
    expect(t.noPlanNeeded).toBe(false);
  });

  it('uses the plan own interval and notes a plan waiting for clearance', () => {
    const t = planTimeBetween(screen('e', '2026-03-09', [], [], [], { rescreenWeeks: 10, status: 'clearance-needed' }), screen('l', '2026-05-04', [], []));
    expect(t).toEqual({ days: 56, neededWeeks: 10, longEnough: false, waitedForClearance: true, noPlanNeeded: true });
  });
});

describe('compareScreens: a left-right comparison whose shorter side changed', () => {
  it('is still compared, as one measurement (our choice)', () => {
    const pair = ['knee-to-wall-left', 'knee-to-wall-right'] as const;
    const earlier = screen(
      'e',
      '2026-03-09',
      [],
      [],
      [{ ...m('knee-to-wall/knee-to-wall-lsi/left', 'knee-to-wall-lsi', 78, 'percent'), side: 'left', comparesTasks: pair }],
    );
    const later = screen('l', '2026-06-08', [], [], [{ ...m('knee-to-wall/knee-to-wall-lsi/right', 'knee-to-wall-lsi', 94, 'percent'), comparesTasks: pair }]);
    const c = compareScreens(earlier, later);
    expect(c.measurements.map((x) => [x.metric, x.earlier, x.later, x.change, x.verdict])).toEqual([['knee-to-wall-lsi', 78, 94, 16, 'no-published-figure']]);
  });
  it('a measurement of one task and side is never matched with the other side', () => {
    const earlier = screen('e', '2026-03-09', [], [], [m('single-leg-squat-left/fppa/left', 'fppa', 14, 'deg', 'single-leg-squat-left')]);
    const later = screen('l', '2026-06-08', [], [], [m('single-leg-squat-left/fppa/right', 'fppa', 4, 'deg', 'single-leg-squat-left')]);
    expect(compareScreens(earlier, later).measurements).toEqual([]);
  });
});

describe('compareScreens and its wording', () => {
  const valgus = flag('dynamic-knee-valgus/single-leg-squat-right/right', 'dynamic-knee-valgus', 'single-leg-squat-right', 'right');
  const earlier = screen(
    'e',
    '2026-03-09',
    ['single-leg-squat-right', 'knee-to-wall-left'],
    [valgus],
    [
      m('single-leg-squat-right/fppa/right', 'fppa', 18.4, 'deg', 'single-leg-squat-right'),
      m('knee-to-wall-left/knee-to-wall/left', 'knee-to-wall', 11.0, 'cm', 'knee-to-wall-left'),
      m('single-leg-squat-right/pelvic-obliquity/right', 'pelvic-obliquity', 4.0, 'deg', 'single-leg-squat-right'),
      m('only-earlier', 'fppa', 3, 'deg'),
    ],
  );
  const later = screen(
    'l',
    '2026-06-08',
    ['single-leg-squat-right', 'knee-to-wall-left'],
    [],
    [
      m('single-leg-squat-right/fppa/right', 'fppa', 6.2, 'deg', 'single-leg-squat-right'),
      m('knee-to-wall-left/knee-to-wall/left', 'knee-to-wall', 12.5, 'cm', 'knee-to-wall-left'),
      m('single-leg-squat-right/pelvic-obliquity/right', 'pelvic-obliquity', 3.0, 'deg', 'single-leg-squat-right'),
    ],
  );
  const c = compareScreens(earlier, later);

  it('compares only measurements present in both screens', () => {
    expect(c.measurements.map((x) => [x.measurementId, x.verdict])).toEqual([
      ['single-leg-squat-right/fppa/right', 'real-change'],
      ['knee-to-wall-left/knee-to-wall/left', 'within-error'],
      ['single-leg-squat-right/pelvic-obliquity/right', 'no-published-figure'],
    ]);
    expect(c.flags.cleared.map((f) => f.id)).toEqual([valgus.id]);
  });

  it('staff wording: never better or worse, numbers judged against the named error', () => {
    const s = coachSummary(c);
    const all = [s.headline, ...s.lines, ...s.realChanges, ...s.withinError].join(' ');
    expect(all).not.toMatch(/\b(better|worse|improv)/i);
    expect(s.headline).toBe(
      '1 of 2 measurements changed beyond their published re-test error; 1 more has no published error figure and is shown without a verdict.',
    );
    expect(s.realChanges[0]).toContain('18.4° → 6.2°, down 12.2°, more than the 8.93° a re-test can differ by');
    expect(s.withinError[0]).toContain('not a change we can tell from measuring error');
  });

  // Our rule: a flag that went while its own measurement moved by less than the re-test error is said to be
  // barely cleared. Knee-to-wall 8.7 -> 10.4 cm: 1.7 cm, inside the 1.9 cm error used here (made-up figure
  // for the check, not a published one).
  it("says which cleared flags moved by less than their measurement's re-test error", () => {
    const ankle = flag('limited-ankle-dorsiflexion/knee-to-wall-right/right', 'limited-ankle-dorsiflexion', 'knee-to-wall-right', 'right');
    const e = screen(
      'e',
      '2026-03-09',
      ['knee-to-wall-right'],
      [ankle],
      [m('knee-to-wall-right/knee-to-wall/right', 'knee-to-wall', 8.7, 'cm', 'knee-to-wall-right')],
    );
    const l = screen(
      'l',
      '2026-06-08',
      ['knee-to-wall-right'],
      [],
      [m('knee-to-wall-right/knee-to-wall/right', 'knee-to-wall', 10.4, 'cm', 'knee-to-wall-right')],
    );
    const cmp = compareScreens(e, l);
    const within = { ...cmp, measurements: cmp.measurements.map((x) => ({ ...x, errorMargin: 1.9, verdict: 'within-error' as const })) };
    expect(barelyCleared(within).map((f) => f.id)).toEqual([ankle.id]);
    expect(coachSummary(within).lines.some((x) => x.startsWith("Of these, cleared by less than the measurement's re-test error"))).toBe(true);
    // The valgus flag above cleared with a real change of its own angle: not barely.
    expect(barelyCleared(c)).toEqual([]);
  });

  it('staff headline in whole words when one or none of the measurements can be judged (our wording)', () => {
    const only = (...verdicts: string[]) => coachSummary({ ...c, measurements: c.measurements.filter((m) => verdicts.includes(m.verdict)) }).headline;
    expect(only('real-change')).toBe('1 of 1 measurement changed beyond its published re-test error.');
    expect(only('no-published-figure')).toBe(
      'No measurement with a published re-test error was taken at both screens; 1 has no published error figure and is shown without a verdict.',
    );
    expect(only()).toBe('No measurement with a published re-test error was taken at both screens.');
  });

  it('family wording: no angles, distances or trade terms', () => {
    const text = familySummary(c).join(' ');
    expect(text).toContain('no longer saw knees turning inward');
    expect(text).toContain('about 13 weeks'); // 91 days
    expect(text).not.toMatch(/\d\s*(°|cm|%|deg)/);
    expect(text).not.toMatch(/valgus|FPPA|dorsiflexion|error/i);
    expect(text).toContain('not a medical diagnosis');
  });
});

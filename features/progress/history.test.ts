import { describe, expect, it } from 'vitest';
import type { Measurement } from '@/features/screening/engine';
import { ERROR_MARGINS } from './compare';
import { concernFor, historySeries, thresholdFor } from './history';
import type { ProgressResponse, ProgressScreen } from './progress-types';

const HM2010 = 'Herrington L, Munro A. Phys Ther Sport. 2010;11(2):56-59';

describe('thresholdFor: the watch line drawn on each chart', () => {
  it.each([
    // [metric, measurement id, sex, value, flag when, source]
    ['fppa', 'single-leg-squat-left/fppa/left', 'female', 12, 'above', `${HM2010}: step landing, females 5-12 deg, upper end`],
    ['fppa', 'single-leg-squat-left/fppa/left', 'male', 9, 'above', `${HM2010}: step landing, males 1-9 deg, upper end`],
    ['fppa', 'drop-landing/fppa/right', 'female', 13, 'above', `${HM2010}: drop jump, females 7-13 deg, upper end`],
    ['fppa', 'two-leg-squat/fppa/right', 'male', 8, 'above', `${HM2010}: drop jump, males 3-8 deg, upper end`],
    ['pelvic-obliquity', 'single-leg-stance-left/pelvic-obliquity/left', 'female', 5, 'above', 'common practice, no source'],
    ['knee-to-wall', 'knee-to-wall-left/knee-to-wall/left', 'male', 10, 'below', 'common practice, no source'],
  ] as const)('%s %s (%s): %s, flagged %s (%s)', (metric, id, sex, value, when, _source) => {
    expect(thresholdFor(metric, id, sex)).toMatchObject({ value, flagWhen: when });
  });
});

describe('concernFor: the concern line beside the watch line', () => {
  // Worked by hand: the engine's concern line for knee angles is the upper end of the normal range
  // (Herrington L, Munro A. Phys Ther Sport. 2010;11(2):56-59) plus 1.96 x 2.72 deg = 5.3312 deg, the 95 %
  // margin of one measurement from the standard error of measurement (Munro A, Herrington L, Carolan M.
  // J Sport Rehabil. 2012;21(1):7-11); pelvic drop 10 deg is our choice.
  it.each([
    ['fppa', 'single-leg-squat-left/fppa/left', 'female', 17.33], // 12 + 5.3312
    ['fppa', 'drop-landing/fppa/right', 'female', 18.33], // 13 + 5.3312
    ['fppa', 'single-leg-squat-right/fppa/right', 'male', 14.33], // 9 + 5.3312
    ['pelvic-obliquity', 'single-leg-stance-left/pelvic-obliquity/left', 'female', 10],
  ] as const)('%s %s (%s): %s', (metric, id, sex, value) => {
    expect(concernFor(metric, id, sex)).toEqual({ value });
  });
});

function screen(i: number, measurements: Measurement[], offsetYears: number | null = null): ProgressScreen {
  return {
    assessmentId: `a${i}`,
    roundId: `r${i}`,
    roundName: `Round ${i}`,
    screenedOn: `2026-0${i + 1}-01`,
    measurements,
    flags: [],
    maturity: offsetYears === null ? null : { offsetYears, band: 'circa', method: 'moore2015' },
    plan: { status: 'ready', rescreenWeeks: 6, rescreenDate: null, exercises: 0 },
  };
}
const fppa = (value: number): Measurement => ({
  id: 'single-leg-squat-left/fppa/left',
  metric: 'fppa',
  taskId: 'single-leg-squat-left',
  side: 'left',
  value,
  unit: 'deg',
  label: 'FPPA left',
});
const lsi = (value: number): Measurement => ({
  id: 'knee-to-wall/knee-to-wall-lsi/left',
  metric: 'knee-to-wall-lsi',
  taskId: null,
  side: 'left',
  value,
  unit: 'percent',
  label: 'LSI',
});

describe('historySeries', () => {
  const progress: ProgressResponse = {
    athlete: { id: 'x', sex: 'female' },
    screens: [screen(0, [fppa(20), lsi(70)], -0.8), screen(1, [fppa(15), lsi(80)], -0.4), screen(2, [fppa(10)], 0.1)],
    comparison: null,
    sessionsBetween: null,
    sessionsSinceLatest: null,
    errorMargins: ERROR_MARGINS,
  };
  const series = historySeries(progress);

  it('one series per measurement, maturity last', () => {
    expect(series.map((s) => s.key)).toEqual(['single-leg-squat-left/fppa/left', 'knee-to-wall/knee-to-wall-lsi/left', 'maturity-offset']);
    expect(series[0]!.points.map((p) => p.value)).toEqual([20, 15, 10]);
    expect(series[2]!.points.map((p) => p.value)).toEqual([-0.8, -0.4, 0.1]);
    // The growth-spurt window shaded on the maturity chart only: -1 to +1 year, the engine's "circa" band
    // (common practice, no source).
    expect(series[2]!.window).toEqual({ low: -1, high: 1 });
    expect(series[0]!.window).toBeUndefined();
  });

  it('draws the error band around the earlier of the last two screens (Munro 2012: 8.93 deg)', () => {
    // 15 +- 8.93 = 6.07 .. 23.93: the latest 10 deg sits inside, so it is no change we can tell.
    expect(series[0]!.band).toMatchObject({ around: 15, margin: 8.93 });
    expect(series[0]!.band!.low).toBeCloseTo(6.07, 10);
    expect(series[0]!.band!.high).toBeCloseTo(23.93, 10);
  });

  it('keeps a left-right comparison in one series when its shorter side changes between screens (our choice)', () => {
    const pair = ['knee-to-wall-left', 'knee-to-wall-right'] as const;
    const left = { ...lsi(86), comparesTasks: pair };
    const right = { ...lsi(92), id: 'knee-to-wall/knee-to-wall-lsi/right', side: 'right' as const, comparesTasks: pair };
    const swapped = historySeries({ ...progress, screens: [screen(0, [left]), screen(1, [right])] });
    expect(swapped.map((s) => s.key)).toEqual(['knee-to-wall/knee-to-wall-lsi']);
    expect(swapped[0]!.points.map((p) => p.value)).toEqual([86, 92]);
  });

  it('has no band where there is no published figure', () => {
    expect(series[1]!.band).toBeNull();
    expect(series[2]!.band).toBeNull();
  });
});

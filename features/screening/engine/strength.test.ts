import { describe, expect, it } from 'vitest';
import { asymmetry, EngineInputError, estimateOneRepMax, limbSymmetryIndex, loadRangeKg, progressionStepKg, strengthEnduranceLoad } from './index';
import type { OneRepMaxFormula } from './index';

const EPLEY = 'Epley B. Poundage Chart. Boyd Epley Workout. Lincoln, NE: Body Enterprises; 1985 (secondary)';
const BRZYCKI = 'Brzycki M. Strength testing: predicting a one-rep max from reps-to-fatigue. JOPERD. 1993;64(1):88-90 (secondary)';
const NSCA_TABLE =
  'Haff GG, Triplett NT, eds. Essentials of Strength Training and Conditioning, 4th ed., 2016: %1RM by reps table (secondary; from memory that it is this table)';
const COMMON = 'common practice, no source';
const LSI = 'limb symmetry index, smaller over larger x 100 (secondary)';

describe('estimateOneRepMax', () => {
  it.each<[number, number, OneRepMaxFormula, number, string]>([
    // w * (1 + r/30)
    [60, 5, 'epley', 70, EPLEY],
    [80, 10, 'epley', 80 * (1 + 10 / 30), EPLEY],
    [100, 1, 'epley', 100, `${EPLEY}; r = 1 defined as 1RM = w`],
    [40, 12, 'epley', 56, EPLEY],
    // w * 36 / (37 - r)
    [60, 5, 'brzycki', 67.5, BRZYCKI],
    [50, 10, 'brzycki', (50 * 36) / 27, BRZYCKI],
    [100, 1, 'brzycki', 100, BRZYCKI],
    [80, 12, 'brzycki', 115.2, BRZYCKI],
  ])('%f kg x %i (%s) -> %f kg (%s)', (load, reps, formula, expected, _source) => {
    expect(estimateOneRepMax(load, reps, formula)).toBeCloseTo(expected, 9);
  });

  it.each<[number, number, OneRepMaxFormula]>([
    [75, 10, 'epley'],
    [75, 10, 'brzycki'],
  ])(`%f kg x %i (%s) lands on 100 kg, matching 10 reps at 75%% 1RM (${NSCA_TABLE})`, (load, reps, formula) => {
    expect(estimateOneRepMax(load, reps, formula)).toBeCloseTo(100, 9);
  });

  it.each<[number, number]>([
    [3, 93],
    [5, 87],
    [6, 85],
    [8, 80],
  ])(`both formulas stay within 3%% of the table: %i reps at %i%% 1RM (${NSCA_TABLE})`, (reps, percent) => {
    for (const formula of ['epley', 'brzycki'] as const) {
      const estimate = estimateOneRepMax(percent, reps, formula);
      expect(Math.abs(estimate - 100)).toBeLessThan(3);
    }
  });

  it.each<[string, () => unknown, string]>([
    ['0 reps', () => estimateOneRepMax(60, 0, 'epley'), 'reps'],
    ['13 reps (beyond about 10-12, from memory)', () => estimateOneRepMax(60, 13, 'brzycki'), 'reps'],
    ['37 reps (Brzycki divides by zero)', () => estimateOneRepMax(60, 37, 'brzycki'), 'reps'],
    ['fractional reps', () => estimateOneRepMax(60, 5.5, 'epley'), 'reps'],
    ['zero load', () => estimateOneRepMax(0, 5, 'epley'), 'loadKg'],
    ['negative load', () => estimateOneRepMax(-10, 5, 'epley'), 'loadKg'],
    ['unknown formula', () => estimateOneRepMax(60, 5, 'lombardi' as OneRepMaxFormula), 'formula'],
  ])('refuses %s', (_n, run, field) => {
    expect(run).toThrow(expect.objectContaining({ name: 'EngineInputError', field }));
  });

  it('says why in the message', () => {
    expect(() => estimateOneRepMax(60, 15, 'brzycki')).toThrow(/no longer meaningful/);
  });
});

describe(`strengthEnduranceLoad: 50-65% of 1RM, 3-4 sets (${COMMON}); top rounded down, bottom up (our choice)`, () => {
  it.each<[number, number, number | null, number | null, string]>([
    // 50 and 65 kg are whole steps of 1.25 kg.
    [100, 1.25, 50, 65, COMMON],
    // 40 kg; 52 / 2.5 = 20.8 steps -> down to 20 -> 50 kg (rounding to the nearest gave 52.5 kg = 65.6%).
    [80, 2.5, 40, 50, COMMON],
    // 18.5 / 2 = 9.25 -> up to 10 -> 20 kg; 24.05 / 2 = 12.025 -> down to 12 -> 24 kg.
    [37, 2, 20, 24, COMMON],
    // 30.5 exactly; 39.65 / 0.5 = 79.3 -> 79 -> 39.5.
    [61, 0.5, 30.5, 39.5, COMMON],
    // 0.1 kg steps must not produce binary noise: 3.3 / 0.1 = 33 -> 3.3; 4.29 -> 42 -> 4.2.
    [6.6, 0.1, 3.3, 4.2, COMMON],
    // A small 1RM with the usual 2.5 kg step: 5 to 6.5 kg -> only 5 kg fits (50%); rounding to the nearest gave 7.5 kg = 75%.
    [10, 2.5, 5, 5, COMMON],
    // 3 to 3.9 kg: no multiple of 2.5 kg fits (2.5 kg = 42%, 5 kg = 83%): no load, bodyweight instead.
    [6, 2.5, null, null, COMMON],
    // A coarse step: 2.5 to 3.25 kg with 5 kg plates; rounding to the nearest gave 5 kg = 100% of 1RM.
    [5, 5, null, null, COMMON],
    // The step is coarser than the 1RM itself: nothing fits.
    [4, 5, null, null, COMMON],
  ])('1RM %f kg, step %f kg -> %s to %s kg (%s)', (orm, inc, min, max) => {
    const r = strengthEnduranceLoad(orm, inc);
    expect(r.minKg).toBe(min);
    expect(r.maxKg).toBe(max);
    expect(r.minPercent).toBe(50);
    expect(r.maxPercent).toBe(65);
    expect(r.sets).toEqual({ min: 3, max: 4 });
    expect(r.reps).toMatch(/close to fatigue/);
    expect(r.tempo).toMatch(/slow/);
    expect(r.rangeOfMotion).toMatch(/full range/);
  });

  it('a growth-spurt cap: 50-55% of an 80 kg 1RM in 2.5 kg steps is 40-42.5 kg (44 kg rounded down)', () => {
    expect(loadRangeKg(80, 2.5, 50, 55)).toEqual({ minKg: 40, maxKg: 42.5 });
  });

  it.each<[string, number, number, string]>([
    ['zero 1RM', 0, 2.5, 'oneRepMaxKg'],
    ['negative 1RM', -50, 2.5, 'oneRepMaxKg'],
    ['zero increment', 80, 0, 'incrementKg'],
    ['NaN increment', 80, Number.NaN, 'incrementKg'],
  ])('refuses %s', (_n, orm, inc, field) => {
    expect(() => strengthEnduranceLoad(orm, inc)).toThrow(expect.objectContaining({ name: 'EngineInputError', field }));
  });
});

const LOAD_STEPS = 'Faigenbaum et al. 2009, J Strength Cond Res 23(5 Suppl):S60-S79: load increases of about 5-10% (from memory)';

describe(`progressionStepKg: the largest step of at most 10% (${LOAD_STEPS})`, () => {
  it.each<[number, number, number | null]>([
    // 10% of 40 kg = 4 kg -> one 2.5 kg step (6.25%).
    [40, 2.5, 2.5],
    // 10% of 50 kg = 5 kg -> four 1.25 kg steps (10%).
    [50, 1.25, 5],
    // 10% of 20 kg = 2 kg: one 2.5 kg step would be 12.5%: add repetitions first.
    [20, 2.5, null],
    // 10% of 100 kg = 10 kg -> five 2 kg steps.
    [100, 2, 10],
  ])('working load %f kg, step %f kg -> %s kg', (kg, inc, expected) => {
    expect(progressionStepKg(kg, inc)).toBe(expected);
  });
});

describe(`limbSymmetryIndex (${LSI})`, () => {
  it.each<[number, number, number, string]>([
    [8, 10, 80, LSI],
    [10, 8, 80, `${LSI}: independent of which side is larger`],
    [9, 10, 90, `${LSI}; >= 90% is the usual return-to-sport criterion (secondary)`],
    [8.5, 10, 85, `${LSI}; 85% traced to Noyes FR et al. Am J Sports Med. 1991;19(5):513-518 (from memory)`],
    [12, 12, 100, LSI],
    [0, 0, 100, `${LSI}: equal values are symmetrical (our convention for 0/0)`],
    [0, 5, 0, LSI],
  ])('left %f, right %f -> %f%% (%s)', (l, r, expected) => {
    expect(limbSymmetryIndex(l, r)).toBeCloseTo(expected, 9);
  });

  it('refuses negative values', () => {
    expect(() => limbSymmetryIndex(-1, 5)).toThrow(EngineInputError);
    expect(() => limbSymmetryIndex(5, -1)).toThrow(expect.objectContaining({ field: 'right' }));
  });
});

describe('asymmetry (absolute difference)', () => {
  it.each<[number, number, number]>([
    [8, 10, 2],
    [10, 8, 2],
    [-3, 4, 7],
    [5.5, 5.5, 0],
  ])('|%f - %f| = %f', (l, r, expected) => {
    expect(asymmetry(l, r)).toBeCloseTo(expected, 12);
  });

  it('refuses non-finite values', () => {
    expect(() => asymmetry(Number.POSITIVE_INFINITY, 1)).toThrow(EngineInputError);
  });
});

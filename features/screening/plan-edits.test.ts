import { describe, expect, it } from 'vitest';
import { checkExercise, EXERCISES, type LoadingContext } from './engine';
import { finalizeAdjustment, fromLibrary, goesPastLimit, shiftLoad, shiftSets } from './plan-edits';

const percentSpec = EXERCISES.find((e) => e.prescription.load.kind === 'percent-1rm')!;
const bodyweightSpec = EXERCISES.find((e) => e.prescription.load.kind === 'bodyweight' && e.phase !== 'mobility')!;
const post = (oneRepMaxKg: number | null): LoadingContext => ({ stage: 'post', unknownReason: null, painUncleared: false, oneRepMaxKg, loadIncrementKg: 2.5 });
const circa = (oneRepMaxKg: number | null): LoadingContext => ({ ...post(oneRepMaxKg), stage: 'circa' });

describe('plan edits', () => {
  it('adds an exercise from the library with the same limits and kg loads as the engine plan', () => {
    const ex = fromLibrary(percentSpec, post(40), 1);
    // 50-65% of 40 kg = 20-26 kg; top rounded down to 25 kg (62.5%).
    expect(ex.prescription.load).toMatchObject({ kind: 'percent-1rm', kg: { min: 20, max: 25, incrementKg: 2.5 } });
    expect(fromLibrary(percentSpec, post(null), 1).prescription.load).toMatchObject({ kg: null });
    // In the growth-spurt window: 50-55% of 40 kg = 20-22 kg -> 20 kg, 3 sets.
    const capped = fromLibrary(percentSpec, circa(40), 1);
    expect(capped.prescription.load).toMatchObject({ maxPercent: 55, kg: { min: 20, max: 20 } });
    expect(capped.prescription.sets.max).toBe(3);
    expect(capped.adjustments.at(-1)).toBe('Added by the tester from the exercise library.');
  });

  it('moves sets within 1 to 6; past the youth limit of 3 is a breach', () => {
    const ex = fromLibrary(bodyweightSpec, post(null), 1);
    const { min, max } = ex.prescription.sets;
    expect(shiftSets(ex, 1).prescription.sets).toEqual({ min: min + 1, max: max + 1 });
    expect(shiftSets(shiftSets(ex, -min), 0).prescription.sets).toEqual(ex.prescription.sets);
    const four = shiftSets(shiftSets(ex, 3 - max), 1);
    expect(four.prescription.sets.max).toBe(4);
    expect(goesPastLimit(ex, four, post(null))).toBe(true);
    expect(checkExercise(four, post(null)).map((b) => b.limit)).toEqual(['sets']);
  });

  it('steps a kg load and never below one step; heavier past the cap is a breach', () => {
    const ex = fromLibrary(percentSpec, post(40), 1);
    const heavier = shiftLoad(ex, 1);
    expect(heavier.prescription.load).toMatchObject({ kg: { min: 22.5, max: 27.5 } });
    // 27.5 / 40 = 68.75% > 65%.
    expect(goesPastLimit(ex, heavier, post(40))).toBe(true);
    expect(goesPastLimit(ex, shiftLoad(ex, -1), post(40))).toBe(false);
    const light = fromLibrary(percentSpec, post(10), 1);
    expect(shiftLoad(shiftLoad(light, -1), -1).prescription.load).toEqual(shiftLoad(light, -1).prescription.load);
  });

  it('writes out what the tester changed and renumbers', () => {
    const a = fromLibrary(bodyweightSpec, post(null), 1);
    const out = finalizeAdjustment([shiftSets(a, 1)], [a]);
    expect(out[0]!.order).toBe(1);
    expect(out[0]!.adjustments.at(-1)).toMatch(/^Changed by the tester: .* sets instead of /);
  });
});

import { describe, expect, it } from 'vitest';
import { EXERCISES } from './engine';
import { finalizeAdjustment, fromLibrary, shiftLoad, shiftSets } from './plan-edits';

const percentSpec = EXERCISES.find((e) => e.prescription.load.kind === 'percent-1rm')!;
const bodyweightSpec = EXERCISES.find((e) => e.prescription.load.kind === 'bodyweight')!;

describe('plan edits', () => {
  it('adds an exercise from the library with kg loads when a 1RM is known', () => {
    const ex = fromLibrary(percentSpec, 40, 1);
    // 50-65% of 40 kg, to the nearest 2.5 kg: 20 and 26 -> 25 kg (strengthEnduranceLoad).
    expect(ex.prescription.load).toMatchObject({ kind: 'percent-1rm', kg: { min: 20, max: 25, incrementKg: 2.5 } });
    expect(fromLibrary(percentSpec, null, 1).prescription.load).toMatchObject({ kg: null });
  });

  it('moves sets within 1 to 6', () => {
    const ex = fromLibrary(bodyweightSpec, null, 1);
    const { min, max } = ex.prescription.sets;
    expect(shiftSets(ex, 1).prescription.sets).toEqual({ min: min + 1, max: max + 1 });
    expect(shiftSets(shiftSets(ex, -min), 0).prescription.sets).toEqual(ex.prescription.sets);
  });

  it('steps a kg load and never below one step', () => {
    const ex = fromLibrary(percentSpec, 40, 1);
    expect(shiftLoad(ex, 1).prescription.load).toMatchObject({ kg: { min: 22.5, max: 27.5 } });
    const light = fromLibrary(percentSpec, 6, 1);
    expect(shiftLoad(shiftLoad(light, -1), -1).prescription.load).toEqual(shiftLoad(light, -1).prescription.load);
  });

  it('writes out what the tester changed and renumbers', () => {
    const a = fromLibrary(bodyweightSpec, null, 1);
    const out = finalizeAdjustment([shiftSets(a, 1)], [a]);
    expect(out[0]!.order).toBe(1);
    expect(out[0]!.adjustments.at(-1)).toMatch(/^Changed by the tester: .* sets instead of /);
  });
});

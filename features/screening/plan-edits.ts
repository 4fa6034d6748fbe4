// The tester's changes to the engine's plan: drop, add back from the library, re-dose. Pure.
import { DEFAULT_LOAD_INCREMENT_KG, strengthEnduranceLoad } from './engine/for-screens';
import type { ExerciseSpec, PlannedExercise, Prescription } from './engine';
import { loadText, setsText } from './labels';

export const MAX_SETS = 6;
export const TESTER_MARK = 'Changed by the tester:';

/** An exercise from the library as a planned one, with kg loads when a 1RM is known. */
export function fromLibrary(spec: ExerciseSpec, oneRepMaxKg: number | null | undefined, order: number): PlannedExercise {
  const { prescription, addresses, ...rest } = spec;
  let load = prescription.load;
  if (load.kind === 'percent-1rm') {
    if (oneRepMaxKg != null && oneRepMaxKg > DEFAULT_LOAD_INCREMENT_KG) {
      const range = strengthEnduranceLoad(oneRepMaxKg, DEFAULT_LOAD_INCREMENT_KG);
      load = { ...load, kg: { min: range.minKg, max: range.maxKg, incrementKg: DEFAULT_LOAD_INCREMENT_KG } };
    } else {
      load = { ...load, kg: null };
    }
  }
  return {
    ...rest,
    order,
    prescription: { ...prescription, load },
    flagIds: [],
    patterns: [...addresses],
    adjustments: ['Added by the tester from the exercise library.'],
  };
}

export function shiftSets(ex: PlannedExercise, delta: number): PlannedExercise {
  const { min, max } = ex.prescription.sets;
  if (min + delta < 1 || max + delta > MAX_SETS) return ex;
  return { ...ex, prescription: { ...ex.prescription, sets: { min: min + delta, max: max + delta } } };
}

/** Heavier or lighter by one step: a kg step for a %1RM load, light/medium for a band. */
export function shiftLoad(ex: PlannedExercise, delta: 1 | -1): PlannedExercise {
  const load = ex.prescription.load;
  let next: Prescription['load'] = load;
  if (load.kind === 'percent-1rm' && load.kg) {
    const step = load.kg.incrementKg * delta;
    if (load.kg.min + step < load.kg.incrementKg) return ex;
    next = { ...load, kg: { ...load.kg, min: load.kg.min + step, max: load.kg.max + step } };
  } else if (load.kind === 'band') {
    const resistance = delta > 0 ? 'medium' : 'light';
    if (resistance === load.resistance) return ex;
    next = { ...load, resistance };
  } else {
    return ex;
  }
  return { ...ex, prescription: { ...ex.prescription, load: next } };
}

export function canShiftLoad(ex: PlannedExercise): boolean {
  const load = ex.prescription.load;
  return (load.kind === 'percent-1rm' && load.kg !== null) || load.kind === 'band';
}

/** The list as it will be saved: in order, with the tester's changes to each exercise written out. */
export function finalizeAdjustment(edited: PlannedExercise[], proposal: PlannedExercise[]): PlannedExercise[] {
  return edited.map((ex, i) => {
    const original = proposal.find((p) => p.id === ex.id);
    const kept = ex.adjustments.filter((a) => !a.startsWith(TESTER_MARK));
    const changes: string[] = [];
    if (original) {
      const a = original.prescription;
      const b = ex.prescription;
      if (a.sets.min !== b.sets.min || a.sets.max !== b.sets.max) changes.push(`${setsText(b.sets)} instead of ${setsText(a.sets)}`);
      if (JSON.stringify(a.load) !== JSON.stringify(b.load)) changes.push(`load ${loadText(b.load)} instead of ${loadText(a.load)}`);
    }
    return { ...ex, order: i + 1, adjustments: changes.length ? [...kept, `${TESTER_MARK} ${changes.join('; ')}.`] : kept };
  });
}

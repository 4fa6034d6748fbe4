// The tester's changes to the engine's plan: drop, add back from the library, re-dose. Pure. The limits
// come from the engine's `limits.ts`, the same functions the server runs on the saved plan.
import type { ExerciseSpec, LimitBreach, LoadingContext, PlannedExercise, Prescription } from './engine';
import { checkExercise, plannedFromLibrary } from './engine/limits';
import { loadText, setsText } from './labels';

/** Hard ceiling of the editor's buttons; the youth limits (3 sets) apply well before it. */
export const MAX_SETS = 6;
export const TESTER_MARK = 'Changed by the tester:';

/** An exercise from the library as the engine would plan it for this athlete: the same limits, the same loads. */
export function fromLibrary(spec: ExerciseSpec, ctx: LoadingContext, order: number): PlannedExercise {
  const planned = plannedFromLibrary(spec, ctx, order);
  return { ...planned, adjustments: [...planned.adjustments, 'Added by the tester from the exercise library.'] };
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
    const kg = (n: number) => Math.round(n * 1e6) / 1e6;
    next = { ...load, kg: { ...load.kg, min: kg(load.kg.min + step), max: kg(load.kg.max + step) } };
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

/**
 * What a change would break, for the editor to refuse it (a tester) or to ask for a reason (a head coach
 * or physiotherapist). Empty when the change stays within the limits.
 */
export function breachesOf(ex: PlannedExercise, ctx: LoadingContext): LimitBreach[] {
  return checkExercise(ex, ctx);
}

/** True when `next` breaks a limit that `current` did not: the change goes past a limit. */
export function goesPastLimit(current: PlannedExercise, next: PlannedExercise, ctx: LoadingContext): boolean {
  const before = new Set(checkExercise(current, ctx).map((b) => b.limit));
  return checkExercise(next, ctx).some((b) => !before.has(b.limit));
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

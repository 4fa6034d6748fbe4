// The rule that holds back loaded strength work until a physiotherapist clears the athlete. Pure.
import type { ClearanceStatus } from './choices';

type ExerciseLike = { phase: string; prescription: { load: { kind: string } } };
type PlanLike = { status: 'ready' | 'clearance-needed' };

/** Loaded strength work: the strength phase, or anything prescribed as a share of 1RM (our choice). */
export function isLoadedStrength(exercise: ExerciseLike): boolean {
  return exercise.phase === 'strength' || exercise.prescription.load.kind === 'percent-1rm';
}

export type StrengthBlock = { blocked: false } | { blocked: true; reason: 'referred' | 'clearance-needed'; words: string };

/**
 * "Refer on" blocks loaded strength work until a later clearance says otherwise; a plan that needs
 * clearance (pain was reported) is blocked until a clearance is recorded after that result (our choice,
 * following the engine's own "start only once cleared" caution).
 */
export function strengthBlock(plan: PlanLike, clearance: { status: ClearanceStatus; setAt: string } | null, resultCreatedAt: string): StrengthBlock {
  if (clearance?.status === 'referred') {
    return {
      blocked: true,
      reason: 'referred',
      words: 'Loaded strength work is on hold: the athlete was referred on. It starts again once a physiotherapist clears it.',
    };
  }
  if (plan.status === 'clearance-needed' && !(clearance && clearance.setAt >= resultCreatedAt)) {
    return {
      blocked: true,
      reason: 'clearance-needed',
      words: 'Loaded strength work is on hold until a physiotherapist has seen the athlete and cleared it (pain was reported).',
    };
  }
  return { blocked: false };
}

/** The exercises that may be done now, and those held back. */
export function splitByBlock<E extends ExerciseLike>(exercises: readonly E[], block: StrengthBlock): { now: E[]; held: E[] } {
  if (!block.blocked) return { now: [...exercises], held: [] };
  return { now: exercises.filter((e) => !isLoadedStrength(e)), held: exercises.filter(isLoadedStrength) };
}

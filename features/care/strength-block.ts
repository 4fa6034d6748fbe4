// The rule that holds back loaded strength work and landing work until a physiotherapist clears the
// athlete. Pure.
import { holdsWords, type ClearanceHold, type ClearanceStatus } from './choices';

export { holdsWords };

type ExerciseLike = { phase: string; isJump?: boolean; prescription: { load: { kind: string } } };
type PlanLike = { status: 'ready' | 'clearance-needed' };

/** Loaded strength work: the strength phase, or anything prescribed as a share of 1RM (our choice). */
export function isLoadedStrength(exercise: ExerciseLike): boolean {
  return exercise.phase === 'strength' || exercise.prescription.load.kind === 'percent-1rm';
}

/**
 * What waits for a physiotherapist's clearance: loaded strength work and jump or landing work, the same
 * two kinds the engine leaves out while reported pain is not cleared (our choice).
 */
export function isHeldUntilCleared(exercise: ExerciseLike): boolean {
  return isLoadedStrength(exercise) || exercise.isJump === true;
}

/** Whether `holds` set this exercise apart: loaded strength work, jump and landing work, or both. */
export function isHeldBy(exercise: ExerciseLike, holds: readonly ClearanceHold[]): boolean {
  return (holds.includes('loaded') && isLoadedStrength(exercise)) || (holds.includes('landing') && exercise.isJump === true);
}

export type StrengthBlock =
  | { blocked: false }
  | { blocked: true; reason: 'referred' | 'clearance-needed' | 'changes'; holds: readonly ClearanceHold[]; words: string };

const BOTH: readonly ClearanceHold[] = ['loaded', 'landing'];

/**
 * "Refer on" blocks loaded strength and landing work until a later clearance says otherwise; a plan that
 * needs clearance (pain was reported) is blocked until a clearance is recorded after that result; "train
 * with changes" blocks the kinds of work the physiotherapist ticked, until a new clearance (our choice,
 * following the engine's own "start only once cleared" caution).
 */
export function strengthBlock(
  plan: PlanLike,
  clearance: { status: ClearanceStatus; setAt: string; holds?: readonly ClearanceHold[] } | null,
  resultCreatedAt: string,
): StrengthBlock {
  if (clearance?.status === 'referred') {
    return {
      blocked: true,
      reason: 'referred',
      holds: BOTH,
      words: 'Loaded strength work and landing work are on hold: the athlete was referred on. They start again once a physiotherapist clears the athlete.',
    };
  }
  if (plan.status === 'clearance-needed' && !(clearance && clearance.setAt >= resultCreatedAt)) {
    return {
      blocked: true,
      reason: 'clearance-needed',
      holds: BOTH,
      words: 'Loaded strength work and landing work are on hold until a physiotherapist has seen the athlete and cleared them (pain was reported).',
    };
  }
  const holds = clearance?.status === 'modified' ? (clearance.holds ?? []) : [];
  if (holds.length > 0) {
    const subject = holdsWords(holds);
    return {
      blocked: true,
      reason: 'changes',
      holds,
      words: `${subject} ${holds.length > 1 ? 'are' : 'is'} on hold on the physiotherapist's advice, until a new clearance.`,
    };
  }
  return { blocked: false };
}

/** The exercises that may be done now, and those held back. */
export function splitByBlock<E extends ExerciseLike>(exercises: readonly E[], block: StrengthBlock): { now: E[]; held: E[] } {
  if (!block.blocked) return { now: [...exercises], held: [] };
  return { now: exercises.filter((e) => !isHeldBy(e, block.holds)), held: exercises.filter((e) => isHeldBy(e, block.holds)) };
}

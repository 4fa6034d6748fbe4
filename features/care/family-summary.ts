// Builds the plain-words family summary of a screen from the engine's result. Pure.
// No angles, no measurements, no diagnosis words: what was checked, what was seen, what to work on.
import { getTask, TASK_IDS, type AssessmentResult, type FlagSide, type PatternId, type PlannedExercise } from '@/features/screening/engine';
import { doseText, perWeekText, setsText } from '@/features/screening/labels';
import { formatDateInWords } from '@/features/ui/format-date';
import type { ClearanceView, FamilySummary } from './types';
import { holdsWords, isHeldUntilCleared, splitByBlock, type StrengthBlock } from './strength-block';
import { capitalise } from '@/features/ui/capitalise';

/** What a parent reads for each pattern (our wording). */
export const PATTERN_FAMILY_WORDS: Record<PatternId, string> = {
  'dynamic-knee-valgus': 'the knee moved inward during the movement',
  'contralateral-pelvic-drop': 'the hips dipped to one side when standing on one leg',
  'limited-ankle-dorsiflexion': 'the ankle did not bend forward as far as we would like',
  'left-right-asymmetry': 'one side moved differently from the other',
  'heels-lifting': 'the heels came up in the deep squat',
  'squat-depth-not-reached': 'the deep squat did not go all the way down',
  'excessive-trunk-lean': 'the upper body leaned more than we would like',
  'growth-spurt-window': 'a fast-growing phase seems to be under way, so training is kept lighter for now',
};

/**
 * Why each exercise of the library is there, for a parent (our wording): what it helps with in everyday
 * words, where the library's purpose is written for coaches. An exercise not listed keeps its own purpose.
 */
export const EXERCISE_FAMILY_WHY: Record<string, string> = {
  'wall-ankle-rocks': 'Helps the ankle bend further forward with the heel on the ground, which lets the knee travel over the foot.',
  'slow-heel-drops': 'Makes the calf stronger over its whole length, so the ankle can bend well while carrying weight.',
  'side-lying-hip-abduction': 'Strengthens the muscles at the side of the hip, which keep the hips level and the knee pointing the right way.',
  'banded-lateral-walk': 'Works the same side-hip muscles standing up, the way they work when moving around the court.',
  'single-leg-glute-bridge': 'Builds strength in the hip one leg at a time, so both sides become more even.',
  'side-plank-from-knees': 'Teaches the body and hips to hold a straight line, which helps stop the hips dipping.',
  'dowel-hip-hinge': 'Teaches how to bend at the hips while keeping the back long and steady.',
  'single-leg-reach': 'Practises keeping the hips and knee steady on one leg while the body moves, as in court footwork.',
  'snap-down-and-stick': 'Practises landing softly with the knees in line, without the force of a full jump.',
  'mini-band-squat': 'Practises squatting with the knees staying in line with the feet; the light band reminds the knees not to drift inward.',
  'counterbalance-box-squat': 'Helps reach a full squat with the chest up; a light weight held in front helps with balance.',
  'split-squat-endurance': 'Builds leg strength and stamina one leg at a time, in the lunge position used on court.',
};

/** "Chosen for what we saw: ..." from the patterns an exercise works on (the growth phase is not something seen to work on). */
function forWhat(patterns: readonly PatternId[]): { forWhat?: string } {
  const seen = [...new Set(patterns)].filter((p) => p !== 'growth-spurt-window');
  return seen.length ? { forWhat: `Chosen for what we saw: ${seen.map((p) => PATTERN_FAMILY_WORDS[p]).join('; ')}.` } : {};
}

const SIDE_WORDS: Record<Exclude<FlagSide, null>, string> = { left: ' (left side)', right: ' (right side)', both: ' (both sides)' };

export const FAMILY_CAUTIONS = (name: string, clubOnly = false) => [
  `This summary describes how ${name} moved on the day of the screen. It is not a diagnosis.`,
  `If ${name} has pain, swelling, or a change in how they move, stop the exercises and see a physiotherapist or doctor.`,
  ...(clubOnly ? [`Exercises with weights or landings are done at the club with a qualified coach watching, never alone at home.`] : []),
  'Follow the advice of your own health professionals over this plan, and the rules of your sport and country.',
];

/** Task titles in the order the screen runs them (the stored input lists them in the database's key order), once each. */
function taskTitles(ids: readonly string[]): string[] {
  const runOrder = (id: string) => {
    const i = TASK_IDS.indexOf(id as never);
    return i === -1 ? TASK_IDS.length : i;
  };
  return [
    ...new Set(
      [...ids]
        .sort((a, b) => runOrder(a) - runOrder(b))
        .map((id) => {
          try {
            return getTask(id as never).title;
          } catch {
            return null;
          }
        })
        .filter((t): t is string => t !== null),
    ),
  ];
}

export function buildFamilySummary(input: {
  firstName: string;
  clubName: string;
  screenedOn: string;
  result: AssessmentResult;
  /** The plan as it stands (a coach's or physio's change replaces the engine's). */
  exercises: readonly PlannedExercise[];
  taskIds: readonly string[];
  block: StrengthBlock;
  /** The physiotherapist's decision in force, if any: the family reads who decided and when. */
  clearance?: ClearanceView;
  contactName: string | null;
  /** Tasks in which the athlete reported pain at this screen (ids). */
  painTaskIds?: readonly string[];
}): FamilySummary {
  const { firstName, result } = input;
  const checked = taskTitles(input.taskIds);

  // One line per pattern, in the order the flags come, with every side it was seen on: a knee that moved
  // inward on the left in one task and on the right in another reads "(both sides)", once (our choice).
  const sidesOf = new Map<PatternId, Set<Exclude<FlagSide, null>>>();
  for (const flag of result.flags) {
    const sides = sidesOf.get(flag.pattern) ?? new Set();
    if (flag.side && flag.pattern !== 'growth-spurt-window') sides.add(flag.side);
    sidesOf.set(flag.pattern, sides);
  }
  const seen: string[] = [];
  for (const [pattern, sides] of sidesOf) {
    const side = sides.has('both') || (sides.has('left') && sides.has('right')) ? 'both' : sides.has('left') ? 'left' : sides.has('right') ? 'right' : null;
    seen.push(`${capitalise(PATTERN_FAMILY_WORDS[pattern])}${side ? SIDE_WORDS[side] : ''}.`);
  }
  if (seen.length === 0) seen.push('Nothing that needs extra work was seen on the day.');

  const { now, held } = splitByBlock(input.exercises, input.block);
  const exercises = [...now]
    .sort((a, b) => a.order - b.order)
    .map((e) => ({
      name: e.name,
      purpose: EXERCISE_FAMILY_WHY[e.id] ?? e.purpose,
      // What was seen that it works on, in the words of "What we saw" (the engine lists the patterns).
      ...forWhat(e.patterns),
      howTo: [...e.howTo],
      cue: e.cue,
      howMuch: `${setsText(e.prescription.sets)} of ${doseText(e.prescription.dose)}`,
      howOften: perWeekText(e.prescription.perWeek),
      ...(isHeldUntilCleared(e) ? { clubOnly: true } : {}),
    }));
  const maxPerWeek = Math.max(0, ...now.map((e) => e.prescription.perWeek));
  // What waits for a clearance, by name: what the hold sets apart here, and what the engine already left
  // out of the plan because pain was reported.
  const heldNames = [...new Set([...held.map((e) => e.name), ...(result.plan.withheld ?? []).map((w) => w.name)])];
  const byChanges = input.block.blocked && input.block.reason === 'changes';
  const onHold = !input.block.blocked
    ? null
    : byChanges
      ? heldNames.length > 0
        ? `${heldNames.join(', ')}: on hold on the physiotherapist's advice, until they say ${firstName} can start again.`
        : `${holdsWords(input.block.holds)} ${input.block.holds.length > 1 ? 'are' : 'is'} on hold on the physiotherapist's advice.`
      : heldNames.length > 0
        ? `${heldNames.join(', ')}: on hold until a physiotherapist clears ${firstName} for loaded strength and landing work.`
        : `Loaded strength and landing work are on hold until a physiotherapist clears ${firstName}.`;

  // A family is told that their child said something hurt, and in which movement (our choice: a parent
  // learning it from a list of exercises on hold, or not at all, was the alternative).
  const painTitles = taskTitles(input.painTaskIds ?? []);
  const pain =
    painTitles.length === 0
      ? null
      : `At the screen, ${firstName} said something hurt during: ${painTitles.join(', ')}.` +
        (input.block.blocked && input.block.reason === 'clearance-needed'
          ? ` Until a physiotherapist has seen ${firstName}, the exercises of this plan are done only where they cause no pain.`
          : '');

  return {
    athleteFirstName: firstName,
    clubName: input.clubName,
    screenedOn: input.screenedOn,
    checked,
    seen,
    exercises,
    pain,
    onHold,
    clearance: clearanceWords(input.clearance ?? null, firstName),
    howOften:
      exercises.length === 0
        ? `Nothing extra to work on for now: ${firstName} keeps training as usual.`
        : `Each exercise says how often (up to ${perWeekText(maxPerWeek)}). The coaches fit them into club sessions; ask them before doing any at home.`,
    recheckDate: result.plan.rescreenDate,
    contact: input.contactName
      ? `Questions? Speak to ${input.contactName} or the coaches at ${input.clubName}.`
      : `Questions? Speak to the coaches at ${input.clubName}.`,
    cautions: FAMILY_CAUTIONS(
      firstName,
      exercises.some((e) => e.clubOnly),
    ),
  };
}

/**
 * The physiotherapist's decision in force, in words for the family: who and when, never the free-text
 * detail (it is written for the team and may name a clinic or a condition).
 */
export function clearanceWords(clearance: ClearanceView, firstName: string): string | null {
  if (!clearance) return null;
  const who = clearance.setByName ? `${clearance.setByName} (physiotherapist)` : 'A physiotherapist';
  // In words: the sentence goes out in the e-mail too, whose reader's locale is not known.
  const day = formatDateInWords(clearance.setAt.slice(0, 10));
  switch (clearance.status) {
    case 'cleared':
      return `${who} cleared ${firstName} on ${day} to take part as planned, with nothing changed.`;
    case 'modified':
      return clearance.holds?.length
        ? // "Decided", not "cleared": to a parent "cleared" reads as all well, beside work that waits.
          `${who} decided on ${day} that ${firstName} can keep training, with some changes: ${holdsWords(clearance.holds).toLowerCase()} ${clearance.holds.length > 1 ? 'wait' : 'waits'} for now, and the coaches will explain any other change.`
        : `${who} decided on ${day} that ${firstName} can keep training, with some changes; the coaches will explain them.`;
    case 'referred':
      return `${who} asked on ${day} for ${firstName} to be seen by another health professional; loaded strength and landing work wait until then.`;
  }
}

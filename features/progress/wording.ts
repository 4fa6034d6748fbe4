/**
 * The comparison of two screens in words: one version for staff (with numbers and the error they are
 * judged against) and one for families (no angles, no distances, no jargon). Pure.
 */
import type { FlagSide, PatternId, TaskId } from '@/features/screening/engine';
import { getTask } from '@/features/screening/engine/battery';
import { THRESHOLDS } from '@/features/screening/engine/thresholds';
import type { FlagRef, MeasurementChange, ScreenComparison } from './compare';
import type { ProgressResponse, ProgressScreen } from './progress-types';
import { formatDate } from '@/features/ui/format-date';

const UNIT: Record<MeasurementChange['unit'], string> = { deg: '°', cm: ' cm', percent: ' %', years: ' y', grades: ' grades' };

export function formatValue(value: number, unit: MeasurementChange['unit']): string {
  return `${Math.round(value * 100) / 100}${UNIT[unit]}`;
}

function pairName(taskId: TaskId): string {
  return `${(taskName(taskId) ?? taskId).replace(/, (left|right) (leg|ankle)$/, '')}, left against right`;
}

function taskName(taskId: TaskId | null): string | null {
  if (!taskId) return null;
  try {
    return getTask(taskId).title.toLowerCase();
  } catch {
    return taskId;
  }
}

function sideWords(side: FlagSide): string {
  if (side === 'left' || side === 'right') return `${side} side`;
  if (side === 'both') return 'both sides';
  return '';
}

/**
 * Flags in words, one entry per pattern: its title, then each task that showed it once, with the sides
 * ("Knee collapsing inward: drop landing from a low box (both sides); single-leg squat, left leg (left
 * side)"). Our choice: listed one flag at a time, a squad's usual knee flags repeated the same title up
 * to seven times in one sentence.
 */
export function flagGroups(flags: readonly FlagRef[]): string[] {
  const byTitle = new Map<string, Map<string, Set<FlagSide>>>();
  for (const f of flags) {
    const tasks = byTitle.get(f.title) ?? byTitle.set(f.title, new Map()).get(f.title)!;
    // A left-right difference names the pair it compares ("single-leg squat, left against right"): two of
    // them, one cleared and one new, read as the same flag in both lines.
    const task = taskName(f.taskId) ?? (f.comparesTasks ? pairName(f.comparesTasks[0]) : '');
    (tasks.get(task) ?? tasks.set(task, new Set()).get(task)!).add(f.side);
  }
  return [...byTitle].map(([title, tasks]) => {
    const where = [...tasks]
      .filter(([task]) => task)
      .map(([task, sides]) => {
        const both = sides.has('both') || (sides.has('left') && sides.has('right'));
        const side = both ? sideWords('both') : [...sides].map(sideWords).filter(Boolean).join(', ');
        return side ? `${task} (${side})` : task;
      });
    return where.length ? `${title}: ${where.join('; ')}` : title;
  });
}

/** How long the plan had, in the coach's words. */
export function planTimeSentence(c: ScreenComparison): string {
  const t = c.planTime;
  const weeks = Math.floor(t.days / 7);
  if (t.noPlanNeeded) return `${t.days} days between the screens; the earlier screen raised no flag, so no corrective plan was needed.`;
  if (t.days === 0) return 'Both screens were on the same day: the plan had no time to work, so an unchanged result says little.';
  const clearance = t.waitedForClearance ? ' The earlier plan waited for a clinician first (pain was reported), so it may have started later.' : '';
  return t.longEnough
    ? `The plan had ${weeks} weeks (${t.days} days), at least the ${t.neededWeeks} weeks it asks for: long enough to expect a change.${clearance}`
    : `The plan had only ${weeks} weeks (${t.days} days) of the ${t.neededWeeks} weeks it asks for: too soon to expect a change, so an unchanged result says little.${clearance}`;
}

/**
 * How many corrective sessions the athlete took part in between the two screens, as recorded on the
 * training sheet (our choice of wording). Empty when there is nothing to compare, no plan was needed, or the squad
 * recorded no session in that time (a club that does not keep the record reads nothing about it).
 */
export function sessionsSentence(sessions: ProgressResponse['sessionsBetween'], c: ScreenComparison): string {
  if (!sessions || c.planTime.noPlanNeeded || sessions.held === 0) return '';
  const { attended, held } = sessions;
  return `Took part in ${attended} of ${held === 1 ? '1 corrective session' : `the ${held} corrective sessions`} the squad recorded on the training sheet between the screens.`;
}

/**
 * How many corrective sessions the athlete took part in since their newest screen, up to today, as
 * recorded on the training sheet (our choice of wording and rule: said only beside a plan with exercises,
 * and nothing where the squad recorded no session in that time). `screenedOn` is YYYY-MM-DD.
 */
export function sessionsSinceSentence(
  sessions: ProgressResponse['sessionsSinceLatest'],
  newest: Pick<ProgressScreen, 'screenedOn' | 'plan'> | undefined,
  locale?: string,
): string {
  if (!sessions || !newest || newest.plan.exercises === 0 || sessions.held === 0) return '';
  const { attended, held } = sessions;
  const since = formatDate(newest.screenedOn, { locale });
  return held === 1
    ? `Since the screen of ${since}, the squad recorded 1 corrective session on the training sheet: ${attended ? 'took part' : 'not there'}.`
    : `Since the screen of ${since}: took part in ${attended} of the ${held} corrective sessions the squad recorded on the training sheet.`;
}

function changeSentence(m: MeasurementChange): string {
  const span = `${formatValue(m.earlier, m.unit)} → ${formatValue(m.later, m.unit)}`;
  if (m.verdict === 'real-change') {
    return `${m.label}: ${span}, ${m.direction} ${formatValue(Math.abs(m.change), m.unit)}, more than the ${formatValue(m.errorMargin!, m.unit)} a re-test can differ by: a real change.`;
  }
  if (m.verdict === 'within-error') {
    return `${m.label}: ${span}, within the ${formatValue(m.errorMargin!, m.unit)} a re-test can differ by: not a change we can tell from measuring error.`;
  }
  return `${m.label}: ${span}; no published measurement error, so the change is not judged.`;
}

/** Whether the engine flags a pattern from this metric (a row of its threshold table says so). */
const flaggedFrom = (pattern: PatternId, metric: string) => THRESHOLDS.some((t) => t.pattern === pattern && t.metric === metric);

/**
 * Cleared flags whose own measurement (same task and side) moved by less than its published re-test
 * error: the flag went, but the number may simply have crossed the threshold by chance (our rule).
 */
export function barelyCleared(c: ScreenComparison): ScreenComparison['flags']['cleared'] {
  return c.flags.cleared.filter((fl) =>
    c.measurements.some(
      (m) => m.verdict === 'within-error' && flaggedFrom(fl.pattern, m.metric) && m.taskId === fl.taskId && (m.side === fl.side || fl.side === 'both'),
    ),
  );
}

/** The staff comparison: flags first (what the coach acts on), then the measurements with a figure. */
export function coachSummary(c: ScreenComparison): { headline: string; lines: string[]; realChanges: string[]; withinError: string[] } {
  const lines: string[] = [];
  const f = c.flags;
  for (const g of flagGroups(f.cleared)) lines.push(`No longer flagged: ${g}.`);
  const barely = barelyCleared(c);
  if (barely.length) lines.push(`Of these, cleared by less than the measurement's re-test error, so it may return: ${flagGroups(barely).join('; ')}.`);
  for (const g of flagGroups(f.persisting)) lines.push(`Still flagged: ${g}.`);
  for (const g of flagGroups(f.new)) lines.push(`Newly flagged: ${g}.`);
  for (const g of flagGroups(f.notRetested)) lines.push(`Not re-tested (task not done again): ${g}.`);
  if (!f.cleared.length && !f.persisting.length && !f.new.length) lines.push('No flags at either screen.');
  const judged = c.measurements.filter((m) => m.verdict !== 'no-published-figure');
  const realChanges = judged.filter((m) => m.verdict === 'real-change').map(changeSentence);
  const withinError = judged.filter((m) => m.verdict === 'within-error').map(changeSentence);
  const unjudged = c.measurements.length - judged.length;
  const judgedPart =
    judged.length === 0
      ? 'No measurement with a published re-test error was taken at both screens'
      : judged.length === 1
        ? `${realChanges.length} of 1 measurement changed beyond its published re-test error`
        : `${realChanges.length} of ${judged.length} measurements changed beyond their published re-test error`;
  // "1 more has" after a count of judged ones; "1 has" when none could be judged.
  const more = judged.length === 0 ? '' : ' more';
  const unjudgedPart =
    unjudged === 0
      ? ''
      : unjudged === 1
        ? `; 1${more} has no published error figure and is shown without a verdict`
        : `; ${unjudged}${more} have no published error figure and are shown without a verdict`;
  const headline = `${judgedPart}${unjudgedPart}.`;
  return { headline, lines, realChanges, withinError };
}

/** Family names of the patterns: no trade terms, no numbers. */
export const FAMILY_PATTERN_WORDS: Record<PatternId, string> = {
  'dynamic-knee-valgus': 'knees turning inward when bending or landing',
  'contralateral-pelvic-drop': 'the hip dipping on the side of the lifted leg',
  'limited-ankle-dorsiflexion': 'stiff ankles (the knee does not travel far forward over the foot)',
  'left-right-asymmetry': 'a difference between the left and right side',
  'heels-lifting': 'heels lifting in the deep squat',
  'squat-depth-not-reached': 'not yet reaching a full deep squat',
  'excessive-trunk-lean': 'leaning the upper body a lot to keep balance',
  'growth-spurt-window': 'a growth spurt, when training is adjusted',
};

const GROWTH: PatternId = 'growth-spurt-window';

function familyList(flags: FlagRef[]): string {
  // One mention per pattern: a family does not need every task and side.
  const words = [...new Set(flags.map((f) => FAMILY_PATTERN_WORDS[f.pattern]))];
  return words.join('; ');
}

/**
 * The comparison in family wording: what the coach no longer sees, still sees or newly sees, whether the
 * exercises had long enough (and, where the coaches record sessions, how many the child took part in), and
 * that small differences mean nothing. No angles, distances or percentages.
 */
export function familySummary(c: ScreenComparison, sessions: ProgressResponse['sessionsBetween'] = null): string[] {
  const out: string[] = [];
  const f = c.flags;
  const weeks = Math.floor(c.planTime.days / 7);
  // The growth-spurt window is a stage of growing, not something the exercises work on: said apart.
  const movement = (flags: FlagRef[]) => flags.filter((x) => x.pattern !== GROWTH);
  const growth = (flags: FlagRef[]) => flags.some((x) => x.pattern === GROWTH);
  if (movement(f.cleared).length) out.push(`Good news: at the latest check we no longer saw ${familyList(movement(f.cleared))}.`);
  if (movement(f.persisting).length) out.push(`We still saw ${familyList(movement(f.persisting))}. The exercises keep working on this.`);
  if (movement(f.new).length) out.push(`This time we also noticed ${familyList(movement(f.new))}. The coach has added exercises for it.`);
  if (growth(f.persisting)) out.push('Your child still seems to be in a growth spurt, so the coaches keep the training lighter for now.');
  if (growth(f.new)) out.push('Your child now seems to be in a growth spurt, so the coaches make the training lighter for now.');
  if (growth(f.cleared))
    out.push('The latest check no longer places your child in the fastest part of a growth spurt; the coaches adjust the training to match.');
  if (!f.cleared.length && !f.persisting.length && !f.new.length) out.push('Neither check showed anything we needed to work on.');
  if (!c.planTime.noPlanNeeded) {
    out.push(
      c.planTime.longEnough
        ? `The exercises had about ${weeks} weeks between the two checks, which is usually enough time to see a difference.`
        : weeks === 0
          ? 'The two checks were less than a week apart, which is too soon to see a difference.'
          : `${weeks === 1 ? 'There was only about 1 week' : `There were only about ${weeks} weeks`} between the two checks, which is usually too soon to see a difference.`,
    );
    // Only where the coaches keep the record of who took part (our choice of wording).
    if (sessions && sessions.held > 0) {
      const { attended, held } = sessions;
      out.push(
        held === 1
          ? `The squad held 1 exercise session between the two checks; your child ${attended ? 'took part' : 'was not there'}.`
          : `Your child took part in ${attended} of the ${held} exercise sessions the squad held between the two checks.`,
      );
    }
  }
  const withinError = c.measurements.filter((m) => m.verdict === 'within-error').length;
  if (withinError) out.push('Small differences between two checks are normal when measuring by eye and photo, so we do not read anything into them.');
  out.push('Screening is not a medical diagnosis. If your child has pain, please see a physiotherapist or doctor.');
  return out;
}

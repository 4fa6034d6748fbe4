/**
 * A squad's training sheet: every current member's corrective plan on one page, grouped by exercise, so
 * a coach running a group session sees who does which exercise, at what dose and load, and whose loaded
 * work is on hold. Pure: the server builds it (`server/training/`), the screen only draws it.
 *
 * Each member's plan is the one in force on their newest submitted screen: the newest adjustment of its
 * current result when someone adjusted it, otherwise the engine's proposal. Loaded strength work is held
 * back by the same rule as on the result screen (`strengthBlock`: pain not yet cleared, or referred on).
 */
import { holdsWords, splitByBlock, strengthBlock } from '@/features/care/strength-block';
import type { ClearanceHold, ClearanceStatus } from '@/features/care/choices';
import { rescreenOf } from '@/features/progress/trends';
import { PHASE_ORDER } from '@/features/screening/engine/exercises';
import type { Phase, Plan, PlannedExercise, Prescription } from '@/features/screening/engine/types';

/** One current member of the squad as the repository reads them. */
export type SheetMember = {
  id: string;
  firstName: string;
  lastName: string;
  assessmentId: string | null;
  screenedOn: string | null;
  /** When the current result version was made (ISO); null without a screen. */
  resultCreatedAt: string | null;
  plan: Pick<Plan, 'status' | 'exercises' | 'growthSpurtAdjusted' | 'rescreenDate'> | null;
  /** The newest adjustment of that result, if any. */
  adjusted: { exercises: PlannedExercise[]; at: string; byName: string | null } | null;
  /** The clearance in force (the newest), if any, with the physiotherapist's words. */
  clearance: { status: ClearanceStatus; setAt: string; detail?: string; holds?: readonly ClearanceHold[] } | null;
  /** The family agreed to screening and corrective exercises (no decision on record: false). */
  takingPart: boolean;
  /** The family's decision in force is a no (false where none is recorded). */
  screeningRefused: boolean;
};

/** One athlete's line under an exercise. */
export type SheetEntry = {
  athleteId: string;
  name: string;
  prescription: Prescription;
  /** Changes to the library prescription in plain words (growth-spurt limits, a coach's edit). */
  adjustments: string[];
  /** Loaded strength work held back for this athlete (see the athlete's `hold`). */
  held: boolean;
  /** The athlete trains with a physiotherapist's changes (see the athlete's `physioChanges`). */
  physioChanges: boolean;
};

export type SheetExercise = {
  id: string;
  name: string;
  phase: Phase;
  cue: string;
  isJump: boolean;
  entries: SheetEntry[];
};

export type SheetAthleteState = 'consent-refused' | 'consent-missing' | 'no-screen' | 'no-exercises' | 'plan';

export type SheetAthlete = {
  id: string;
  name: string;
  assessmentId: string | null;
  screenedOn: string | null;
  state: SheetAthleteState;
  /** Whose plan this is: the engine's proposal or a person's adjustment of it. */
  source: 'engine' | 'adjusted' | null;
  adjustedAt: string | null;
  adjustedByName: string | null;
  /** The plan was cut to the growth-spurt loading limits. */
  growthSpurt: boolean;
  /** Why loaded strength work is held back, in plain words; null when nothing is. */
  hold: string | null;
  /**
   * The physiotherapist's changes in force ("train with changes"), in their words: the plan's exercises
   * stay listed, and the coach checks each against these before the session. Null otherwise.
   */
  physioChanges: string | null;
  exerciseCount: number;
  rescreenDate: string | null;
  rescreenDue: boolean;
};

export type TrainingSheet = {
  squad: { id: string; name: string };
  /** The day re-screens were counted as due on. */
  today: string;
  athletes: SheetAthlete[];
  exercises: SheetExercise[];
};

const nameOf = (m: Pick<SheetMember, 'firstName' | 'lastName'>) => `${m.firstName} ${m.lastName}`;

/**
 * The sheet from the squad's members (in the order they are listed: by last name). Exercises come in
 * session order (phase, then those most athletes share, then name); under each, its athletes in the
 * members' order. Phases in the library's session order (`PHASE_ORDER`: mobility first, strength last).
 * The order and grouping are our choice; the hold is the result screen's rule.
 */
export function buildSheet(squad: TrainingSheet['squad'], members: readonly SheetMember[], today: string): TrainingSheet {
  const athletes: SheetAthlete[] = [];
  const byExercise = new Map<string, SheetExercise>();

  for (const m of members) {
    const name = nameOf(m);
    // Without the family's agreement (withdrawn, or never recorded) the athlete is on no exercise of the
    // sheet, whatever an earlier screen proposed, and no re-screen is asked for (our rule).
    if (!m.takingPart || !m.assessmentId || !m.plan || !m.resultCreatedAt) {
      athletes.push({
        id: m.id,
        name,
        assessmentId: null,
        screenedOn: null,
        state: m.takingPart ? 'no-screen' : m.screeningRefused ? 'consent-refused' : 'consent-missing',
        source: null,
        adjustedAt: null,
        adjustedByName: null,
        growthSpurt: false,
        hold: null,
        physioChanges: null,
        exerciseCount: 0,
        rescreenDate: null,
        rescreenDue: m.takingPart,
      });
      continue;
    }
    const exercises = m.adjusted ? m.adjusted.exercises : m.plan.exercises;
    const block = strengthBlock(m.plan, m.clearance, m.resultCreatedAt);
    const { held } = splitByBlock(exercises, block);
    const heldIds = new Set(held.map((e) => e.id));
    const rescreen = rescreenOf(m.screenedOn, m.plan.rescreenDate, today);
    const ticked = m.clearance?.holds ?? [];
    const physioChanges =
      m.clearance?.status === 'modified'
        ? m.clearance.detail?.trim() || (ticked.length ? `${holdsWords(ticked)} on hold.` : 'Ask the physiotherapist what changes.')
        : null;
    athletes.push({
      id: m.id,
      name,
      assessmentId: m.assessmentId,
      screenedOn: m.screenedOn,
      state: exercises.length ? 'plan' : 'no-exercises',
      source: m.adjusted ? 'adjusted' : 'engine',
      adjustedAt: m.adjusted?.at ?? null,
      adjustedByName: m.adjusted?.byName ?? null,
      growthSpurt: m.plan.growthSpurtAdjusted,
      hold: block.blocked ? block.words : null,
      physioChanges,
      exerciseCount: exercises.length,
      rescreenDate: rescreen.date,
      rescreenDue: rescreen.due,
    });
    for (const e of [...exercises].sort((a, b) => a.order - b.order)) {
      let group = byExercise.get(e.id);
      if (!group) {
        group = { id: e.id, name: e.name, phase: e.phase, cue: e.cue, isJump: e.isJump, entries: [] };
        byExercise.set(e.id, group);
      }
      group.entries.push({
        athleteId: m.id,
        name,
        prescription: e.prescription,
        adjustments: e.adjustments,
        held: heldIds.has(e.id),
        physioChanges: physioChanges !== null,
      });
    }
  }

  const exercises = [...byExercise.values()].sort(
    (a, b) => PHASE_ORDER.indexOf(a.phase) - PHASE_ORDER.indexOf(b.phase) || b.entries.length - a.entries.length || a.name.localeCompare(b.name, 'en'),
  );
  return { squad, today, athletes, exercises };
}

// The training sheet's grouping and holds. Every rule checked here is ours (`our choice`): which plan is in
// force, the order exercises are listed in, and that held work stays listed but marked. The hold itself is
// the result screen's rule (`strengthBlock`), checked in features/care/strength-block.test.ts.
import { describe, expect, it } from 'vitest';
import { getExercise } from '@/features/screening/engine/exercises';
import type { PlannedExercise } from '@/features/screening/engine/types';
import { buildSheet, type SheetMember } from './sheet';

const SQUAD = { id: 'squad-1', name: 'Under-13 mixed' };
const TODAY = '2026-12-04';

function planned(id: string, order: number, change?: Partial<PlannedExercise['prescription']>): PlannedExercise {
  const { addresses: _addresses, prescription, ...spec } = getExercise(id);
  return { ...spec, order, prescription: { ...prescription, ...change }, flagIds: [], patterns: [], adjustments: [] };
}

function member(id: string, lastName: string, over: Partial<SheetMember> = {}): SheetMember {
  return {
    id,
    firstName: id.toUpperCase(),
    lastName,
    assessmentId: `a-${id}`,
    screenedOn: '2026-11-20',
    resultCreatedAt: '2026-11-20T10:00:00.000Z',
    plan: { status: 'ready', exercises: [], growthSpurtAdjusted: false, rescreenDate: '2027-01-15' },
    adjusted: null,
    clearance: null,
    takingPart: true,
    screeningRefused: false,
    ...over,
  };
}

describe('buildSheet', () => {
  it('groups the squad by exercise in session order, then by how many share it', () => {
    const sheet = buildSheet(
      SQUAD,
      [
        member('ana', 'Adler', {
          plan: {
            status: 'ready',
            growthSpurtAdjusted: false,
            rescreenDate: '2027-01-15',
            exercises: [planned('counterbalance-box-squat', 1), planned('side-lying-hip-abduction', 2), planned('wall-ankle-rocks', 3)],
          },
        }),
        member('ben', 'Brook', {
          plan: {
            status: 'ready',
            growthSpurtAdjusted: false,
            rescreenDate: '2027-01-15',
            exercises: [planned('banded-lateral-walk', 1), planned('side-lying-hip-abduction', 2)],
          },
        }),
      ],
      TODAY,
    );
    // Mobility before activation before strength; within activation the exercise both share comes first.
    expect(sheet.exercises.map((e) => e.id)).toEqual(['wall-ankle-rocks', 'side-lying-hip-abduction', 'banded-lateral-walk', 'counterbalance-box-squat']);
    expect(sheet.exercises[1]!.entries.map((e) => e.name)).toEqual(['ANA Adler', 'BEN Brook']);
    expect(sheet.athletes.map((a) => [a.name, a.state, a.exerciseCount])).toEqual([
      ['ANA Adler', 'plan', 3],
      ['BEN Brook', 'plan', 2],
    ]);
  });

  it('uses the newest adjustment over the engine proposal, with its own doses', () => {
    const engine = [planned('side-lying-hip-abduction', 1), planned('mini-band-squat', 2)];
    const adjusted = [planned('side-lying-hip-abduction', 1, { sets: { min: 2, max: 2 } })];
    const [row] = [
      member('cai', 'Cole', {
        plan: { status: 'ready', growthSpurtAdjusted: true, rescreenDate: null, exercises: engine },
        adjusted: { exercises: adjusted, at: '2026-11-21T09:00:00.000Z', byName: 'Lena Fischer' },
      }),
    ];
    const sheet = buildSheet(SQUAD, [row!], TODAY);
    expect(sheet.exercises.map((e) => e.id)).toEqual(['side-lying-hip-abduction']);
    expect(sheet.exercises[0]!.entries[0]!.prescription.sets).toEqual({ min: 2, max: 2 });
    expect(sheet.athletes[0]).toMatchObject({ source: 'adjusted', adjustedByName: 'Lena Fischer', growthSpurt: true, exerciseCount: 1 });
  });

  it('keeps held loaded work on the sheet, marked, while pain is not cleared', () => {
    const exercises = [planned('side-lying-hip-abduction', 1), planned('counterbalance-box-squat', 2)];
    const waiting = member('dan', 'Dyer', { plan: { status: 'clearance-needed', growthSpurtAdjusted: false, rescreenDate: null, exercises } });
    const sheet = buildSheet(SQUAD, [waiting], TODAY);
    const held = Object.fromEntries(sheet.exercises.map((e) => [e.id, e.entries[0]!.held]));
    expect(held).toEqual({ 'side-lying-hip-abduction': false, 'counterbalance-box-squat': true });
    expect(sheet.athletes[0]!.hold).toMatch(/on hold until a physiotherapist/);

    // A clearance recorded after that result lifts the hold; one from before it does not.
    const after = buildSheet(SQUAD, [{ ...waiting, clearance: { status: 'cleared', setAt: '2026-11-22T08:00:00.000Z' } }], TODAY);
    expect(after.exercises.every((e) => e.entries.every((x) => !x.held))).toBe(true);
    expect(after.athletes[0]!.hold).toBeNull();
    const before = buildSheet(SQUAD, [{ ...waiting, clearance: { status: 'cleared', setAt: '2026-11-01T08:00:00.000Z' } }], TODAY);
    expect(before.athletes[0]!.hold).not.toBeNull();

    // Referred on: loaded work held whatever the plan says.
    const referred = buildSheet(
      SQUAD,
      [
        member('eve', 'Ekwe', {
          plan: { status: 'ready', growthSpurtAdjusted: false, rescreenDate: null, exercises },
          clearance: { status: 'referred', setAt: '2026-11-25T08:00:00.000Z' },
        }),
      ],
      TODAY,
    );
    expect(referred.athletes[0]!.hold).toMatch(/referred on/);
    expect(referred.exercises.find((e) => e.id === 'counterbalance-box-squat')!.entries[0]!.held).toBe(true);
  });

  it("says a physiotherapist's changes in their words beside the athlete and marks their exercises, holding nothing (our choice)", () => {
    const exercises = [planned('counterbalance-box-squat', 1), planned('side-lying-hip-abduction', 2)];
    const plan = { status: 'ready' as const, growthSpurtAdjusted: false, rescreenDate: null, exercises };
    const sheet = buildSheet(
      SQUAD,
      [
        member('fay', 'Ford', { plan, clearance: { status: 'modified', setAt: '2026-11-25T08:00:00.000Z', detail: ' No drop landings for three weeks. ' } }),
        member('gil', 'Gray', { plan, clearance: { status: 'cleared', setAt: '2026-11-25T08:00:00.000Z', detail: 'Fine to train.' } }),
        member('hal', 'Hart', { plan, clearance: { status: 'modified', setAt: '2026-11-25T08:00:00.000Z', detail: '' } }),
      ],
      TODAY,
    );
    expect(sheet.athletes.map((a) => [a.name, a.physioChanges, a.hold])).toEqual([
      ['FAY Ford', 'No drop landings for three weeks.', null],
      ['GIL Gray', null, null],
      ['HAL Hart', 'Ask the physiotherapist what changes.', null],
    ]);
    for (const e of sheet.exercises) {
      expect(e.entries.map((x) => [x.name, x.physioChanges, x.held])).toEqual([
        ['FAY Ford', true, false],
        ['GIL Gray', false, false],
        ['HAL Hart', true, false],
      ]);
    }
  });

  it('lists members without a screen or without exercises, and counts re-screens due on the day', () => {
    const sheet = buildSheet(
      SQUAD,
      [
        member('fay', 'Frost', { assessmentId: null, screenedOn: null, resultCreatedAt: null, plan: null }),
        member('gus', 'Grey', { plan: { status: 'ready', growthSpurtAdjusted: false, rescreenDate: TODAY, exercises: [] } }),
        member('hal', 'Hart', { plan: { status: 'ready', growthSpurtAdjusted: false, rescreenDate: '2026-12-05', exercises: [] } }),
      ],
      TODAY,
    );
    expect(sheet.exercises).toEqual([]);
    expect(sheet.athletes.map((a) => [a.name, a.state, a.rescreenDue])).toEqual([
      ['FAY Frost', 'no-screen', true],
      ['GUS Grey', 'no-exercises', true],
      ['HAL Hart', 'no-exercises', false],
    ]);
  });

  // our choice: without the family's agreement to screening and exercises (withdrawn or never recorded)
  // an athlete is on no exercise, whatever their newest screen proposed, and no re-screen is asked for.
  it('leaves an athlete off every exercise while the family has not agreed to take part', () => {
    const plan = { status: 'ready' as const, growthSpurtAdjusted: false, rescreenDate: '2026-11-01', exercises: [planned('side-lying-hip-abduction', 1)] };
    const sheet = buildSheet(
      SQUAD,
      [
        member('ida', 'Ives', { plan, takingPart: false, screeningRefused: true }),
        member('jo', 'Jones', { plan }),
        member('kit', 'Kerr', { assessmentId: null, screenedOn: null, resultCreatedAt: null, plan: null, takingPart: false }),
      ],
      TODAY,
    );
    expect(sheet.exercises.map((e) => [e.id, e.entries.map((x) => x.name)])).toEqual([['side-lying-hip-abduction', ['JO Jones']]]);
    expect(sheet.athletes.map((a) => [a.name, a.state, a.rescreenDue, a.exerciseCount])).toEqual([
      ['IDA Ives', 'consent-refused', false, 0],
      ['JO Jones', 'plan', true, 1],
      ['KIT Kerr', 'consent-missing', false, 0],
    ]);
  });
});

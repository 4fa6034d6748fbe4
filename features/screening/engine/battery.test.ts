import { describe, expect, it } from 'vitest';
import { criterionSide, getTask } from './battery';
import { exercisesFor } from './exercises';
import { PATTERN_ORDER } from './flags';
import { BATTERY, EXERCISES, LANDMARKS, TASK_IDS } from './index';
import type { PatternId, TaskId } from './types';

const KEBAB = /^[a-z0-9]+(?:-[a-z0-9]+)*$/;

describe('screening battery data', () => {
  it('holds the agreed tasks, in capture order', () => {
    expect(TASK_IDS).toEqual<TaskId[]>([
      'two-leg-squat',
      'single-leg-squat-left',
      'single-leg-squat-right',
      'drop-landing',
      'single-leg-stance-left',
      'single-leg-stance-right',
      'knee-to-wall-left',
      'knee-to-wall-right',
      'racket-side-lunge',
    ]);
  });

  it('uses unique kebab-case ids for tasks, criteria (within a task) and landmarks', () => {
    expect(new Set(TASK_IDS).size).toBe(TASK_IDS.length);
    for (const t of BATTERY) {
      expect(t.id).toMatch(KEBAB);
      const ids = t.criteria.map((c) => c.id);
      expect(new Set(ids).size, t.id).toBe(ids.length);
      for (const id of ids) expect(id).toMatch(KEBAB);
    }
    const lm = LANDMARKS.map((l) => l.id);
    expect(new Set(lm).size).toBe(lm.length);
    for (const id of lm) expect(id).toMatch(KEBAB);
  });

  it('asks only for catalogued landmarks of the right view', () => {
    const view = new Map(LANDMARKS.map((l) => [l.id, l.view]));
    for (const t of BATTERY) {
      expect(t.views.length, t.id).toBeGreaterThan(0);
      for (const v of t.views) {
        expect(v.landmarks.length, `${t.id} ${v.view}`).toBeGreaterThan(0);
        for (const id of v.landmarks) expect(view.get(id), `${t.id} ${v.view} ${id}`).toBe(v.view);
      }
    }
  });

  it('gives every landmark a label and a placement hint', () => {
    for (const l of LANDMARKS) {
      expect(l.label.length).toBeGreaterThan(3);
      expect(l.hint.length).toBeGreaterThan(10);
    }
  });

  it.each<[TaskId, string[], string[], boolean]>([
    ['two-leg-squat', ['front', 'side'], [], false],
    ['single-leg-squat-left', ['front'], [], false],
    ['single-leg-squat-right', ['front'], [], false],
    ['drop-landing', ['front'], [], false],
    ['single-leg-stance-left', ['front'], [], false],
    ['single-leg-stance-right', ['front'], [], false],
    ['knee-to-wall-left', [], ['side'], true],
    ['knee-to-wall-right', [], ['side'], true],
    ['racket-side-lunge', ['front', 'side'], [], false],
  ])('%s needs photos %j, optional photos %j, distance %s', (id, required, optional, distance) => {
    const t = getTask(id);
    expect(t.views.filter((v) => v.required).map((v) => v.view)).toEqual(required);
    expect(t.views.filter((v) => !v.required).map((v) => v.view)).toEqual(optional);
    expect(t.distance !== null).toBe(distance);
  });

  it('front view of the two-leg squat asks for both legs, both ASIS, mid-shoulder and mid-hip', () => {
    const front = getTask('two-leg-squat').views.find((v) => v.view === 'front');
    expect([...(front?.landmarks ?? [])].sort()).toEqual(
      ['right-hip', 'right-knee', 'right-ankle', 'left-hip', 'left-knee', 'left-ankle', 'right-asis', 'left-asis', 'mid-shoulder', 'mid-hip'].sort(),
    );
    const side = getTask('two-leg-squat').views.find((v) => v.view === 'side');
    expect([...(side?.landmarks ?? [])].sort()).toEqual(['near-ankle', 'near-hip', 'near-knee', 'near-shoulder']);
  });

  it('single-leg squat asks for the stance leg only', () => {
    const left = getTask('single-leg-squat-left').views[0]?.landmarks ?? [];
    expect(left).toContain('left-knee');
    expect(left).not.toContain('right-knee');
  });

  it('every task carries a stop-on-pain safety note; the drop landing names box height and a spotter', () => {
    for (const t of BATTERY)
      expect(
        t.safety.some((s) => /pain/i.test(s)),
        t.id,
      ).toBe(true);
    const landing = getTask('drop-landing').safety.join(' ');
    expect(landing).toMatch(/20-30 cm/);
    expect(landing).toMatch(/spotter/i);
  });

  it('single-leg squat criteria cover the five areas of Crossley KM, Zhang WJ, Schache AG, Bryant A, Cowan SM. Am J Sports Med. 2011;39(4):866-873', () => {
    for (const id of ['single-leg-squat-left', 'single-leg-squat-right'] as const) {
      const areas = new Set(getTask(id).criteria.map((c) => c.area));
      expect([...areas].sort()).toEqual(['hip', 'knee', 'overall', 'pelvis', 'trunk']);
      expect(getTask(id).rated).toBe(true);
    }
  });

  it('every task with criteria has what-to-look-at text and instructions', () => {
    for (const t of BATTERY) {
      expect(t.lookFor.length, t.id).toBeGreaterThan(20);
      expect(t.instructions.length, t.id).toBeGreaterThan(20);
      expect(t.criteria.length, t.id).toBeGreaterThan(0);
    }
  });

  it('every pattern but two can be ticked; ankle dorsiflexion is measured (cm) and the growth-spurt window computed', () => {
    const ticked = new Set<PatternId>();
    for (const t of BATTERY) for (const c of t.criteria) if (c.indicates) ticked.add(c.indicates);
    const notTicked = PATTERN_ORDER.filter((p) => !ticked.has(p));
    expect(notTicked).toEqual(['limited-ankle-dorsiflexion', 'growth-spurt-window']);
  });

  it.each<[TaskId, string, 'left' | 'right' | undefined, 'left' | 'right' | 'both' | null]>([
    ['two-leg-squat', 'squat-left-knee-in', undefined, 'left'],
    ['two-leg-squat', 'squat-heels-lift', undefined, 'both'],
    ['two-leg-squat', 'squat-chest-drops', undefined, null],
    ['single-leg-squat-right', 'sls-pelvis-drop', undefined, 'right'],
    ['racket-side-lunge', 'lunge-knee-in', 'left', 'left'],
    ['racket-side-lunge', 'lunge-knee-in', undefined, 'both'],
  ])('criterion side: %s %s (racket %s) -> %s', (taskId, criterionId, racket, side) => {
    const t = getTask(taskId);
    const c = t.criteria.find((x) => x.id === criterionId);
    if (!c) throw new Error('missing criterion');
    expect(criterionSide(t, c, racket)).toBe(side);
  });
});

describe('exercise library', () => {
  it.each(PATTERN_ORDER.map((p) => [p]))('pattern %s maps to at least one exercise', (p) => {
    expect(exercisesFor(p).length).toBeGreaterThan(0);
  });

  it('every exercise is complete: name, purpose, how-to, cue, fault, progression, regression, prescription', () => {
    const ids = EXERCISES.map((e) => e.id);
    expect(new Set(ids).size).toBe(ids.length);
    for (const e of EXERCISES) {
      expect(e.id).toMatch(KEBAB);
      for (const text of [e.name, e.purpose, e.cue, e.commonFault, e.progression, e.regression]) {
        expect(text.length, e.id).toBeGreaterThan(3);
      }
      expect(e.howTo.length, e.id).toBeGreaterThan(0);
      expect(e.addresses.length, e.id).toBeGreaterThan(0);
      const rx = e.prescription;
      expect(rx.sets.min).toBeGreaterThanOrEqual(1);
      expect(rx.sets.max).toBeGreaterThanOrEqual(rx.sets.min);
      expect(rx.dose.max).toBeGreaterThanOrEqual(rx.dose.min);
      expect(rx.restSeconds).toBeGreaterThan(0);
      expect(rx.perWeek).toBeGreaterThanOrEqual(1);
      expect(rx.perWeek).toBeLessThanOrEqual(7);
      expect(rx.tempo.length).toBeGreaterThan(3);
    }
  });

  it('loaded work follows the strength-endurance rule: 50-65% 1RM, 3-4 sets, close to fatigue (common practice, no source)', () => {
    const loaded = EXERCISES.filter((e) => e.prescription.load.kind === 'percent-1rm');
    expect(loaded.length).toBeGreaterThan(0);
    for (const e of loaded) {
      const load = e.prescription.load;
      if (load.kind !== 'percent-1rm') continue;
      expect([load.minPercent, load.maxPercent]).toEqual([50, 65]);
      expect(e.prescription.sets).toEqual({ min: 3, max: 4 });
      expect(e.prescription.dose.kind === 'reps' && e.prescription.dose.toNearFatigue).toBe(true);
    }
  });

  it('strength work is 2-3 days a week (Faigenbaum AD, Kraemer WJ, Blimkie CJR, et al. J Strength Cond Res. 2009;23(5 Suppl):S60-S79, content from memory)', () => {
    for (const e of EXERCISES.filter((x) => x.phase === 'strength')) {
      expect(e.prescription.perWeek).toBeGreaterThanOrEqual(2);
      expect(e.prescription.perWeek).toBeLessThanOrEqual(3);
    }
  });
});

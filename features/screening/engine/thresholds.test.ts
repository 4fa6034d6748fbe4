import { describe, expect, it } from 'vitest';
import { BATTERY, pairTasks } from './battery';
import { detectFlags, PATTERN_ORDER, type Observation } from './flags';
import * as SOURCES from './sources';
import { derivationText, FPPA_SINGLE_MEASUREMENT_MARGIN_DEG, THRESHOLDS, type ThresholdRow } from './thresholds';
import type { Measurement, PairId, Sex, TaskId } from './types';

const HM2010 =
  'Herrington L, Munro A. Drop jump landing knee valgus angle; normative data in a physically active population. Phys Ther Sport. 2010;11(2):56-59';
const MUNRO2012 =
  'Munro A, Herrington L, Carolan M. Reliability of 2-dimensional video assessment of frontal-plane dynamic knee valgus during common athletic screening tasks. J Sport Rehabil. 2012;21(1):7-11';
const BACKMAN2011 =
  'Backman LJ, Danielson P. Low range of ankle dorsiflexion predisposes for patellar tendinopathy in junior elite basketball players. Am J Sports Med. 2011;39(12):2626-2633';
const COMMON = 'common practice, no source';

/**
 * Every row, written out again by hand: the value, and whether a flag is
 * raised at the value, just below it and just above it. A row added to the
 * table without a line here fails the first test.
 */
type Bound = 'lower' | 'upper';
const EXPECTED: readonly [
  rowId: string,
  value: number,
  unit: string,
  atFlags: boolean,
  belowFlags: boolean,
  aboveFlags: boolean,
  step: number,
  source: string,
  bound?: Bound,
][] = [
  ['fppa-bilateral-female-watch', 13, 'deg', false, false, true, 0.01, `${HM2010}: drop jump, females 7-13 deg, upper end (adult norms)`],
  ['fppa-bilateral-female-concern', 18.33, 'deg', false, false, true, 0.01, `${HM2010} 13 deg + 1.96 x ${MUNRO2012} SEM 2.72 deg (5.33)`],
  ['fppa-bilateral-male-watch', 8, 'deg', false, false, true, 0.01, `${HM2010}: drop jump, males 3-8 deg, upper end (adult norms)`],
  ['fppa-bilateral-male-concern', 13.33, 'deg', false, false, true, 0.01, `${HM2010} 8 deg + 1.96 x ${MUNRO2012} SEM 2.72 deg (5.33)`],
  ['fppa-single-leg-female-watch', 12, 'deg', false, false, true, 0.01, `${HM2010}: step landing, females 5-12 deg, upper end (adult norms)`],
  ['fppa-single-leg-female-concern', 17.33, 'deg', false, false, true, 0.01, `${HM2010} 12 deg + 1.96 x ${MUNRO2012} SEM 2.72 deg (5.33)`],
  ['fppa-single-leg-male-watch', 9, 'deg', false, false, true, 0.01, `${HM2010}: step landing, males 1-9 deg, upper end (adult norms)`],
  ['fppa-single-leg-male-concern', 14.33, 'deg', false, false, true, 0.01, `${HM2010} 9 deg + 1.96 x ${MUNRO2012} SEM 2.72 deg (5.33)`],
  ['knee-valgus-observed', 1, 'criteria', true, false, true, 1, COMMON],
  ['pelvic-drop-watch', 5, 'deg', false, false, true, 0.01, COMMON],
  ['pelvic-drop-concern', 10, 'deg', false, false, true, 0.01, COMMON],
  ['pelvic-drop-observed', 1, 'criteria', true, false, true, 1, COMMON],
  ['knee-to-wall-short', 10, 'cm', false, true, false, 0.01, COMMON],
  ['lunge-angle-low', 36.5, 'deg', false, true, false, 0.01, `${BACKMAN2011}: below 36.5 deg, juniors`],
  ['knee-to-wall-difference', 2, 'cm', true, false, true, 0.01, COMMON],
  ['fppa-difference', 7.54, 'deg', false, false, true, 0.01, `${MUNRO2012}: SDD 7.54-8.93 deg, lower end`],
  ['squat-pelvic-tilt', 5, 'deg', false, false, true, 0.01, COMMON],
  ['single-leg-squat-rating-gap', 2, 'grades', true, false, true, 1, `${COMMON} (rating is our design)`],
  ['asymmetry-observed', 1, 'criteria', true, false, true, 1, COMMON],
  ['heels-lifting-observed', 1, 'criteria', true, false, true, 1, COMMON],
  ['squat-depth-thigh', 0, 'deg', false, false, true, 0.01, COMMON],
  ['squat-depth-observed', 1, 'criteria', true, false, true, 1, COMMON],
  ['trunk-lean-sideways', 10, 'deg', false, false, true, 0.01, COMMON],
  ['trunk-ahead-of-shin', 15, 'deg', false, false, true, 0.01, COMMON],
  ['lunge-trunk-forward', 30, 'deg', false, false, true, 0.01, COMMON],
  ['trunk-lean-observed', 1, 'criteria', true, false, true, 1, COMMON],
  ['growth-spurt-window', -1, 'years', true, false, true, 0.01, `${COMMON}: circa band -1 to +1 y, lower bound`, 'lower'],
  ['growth-spurt-window', 1, 'years', true, true, false, 0.01, `${COMMON}: circa band -1 to +1 y, upper bound`, 'upper'],
];

function row(id: string): ThresholdRow {
  const r = THRESHOLDS.find((t) => t.id === id);
  if (!r) throw new Error(`no row ${id}`);
  return r;
}

function sexFor(r: ThresholdRow): Sex {
  return r.population.sex === 'any' ? 'female' : r.population.sex;
}

/** Does the row fire when the engine sees `value`? Goes through detectFlags, not the comparison helper. */
function fires(r: ThresholdRow, value: number): boolean {
  const sex = sexFor(r);
  let measurements: Measurement[] = [];
  let observations: Observation[] = [];
  if (r.metric === 'observed-criteria') {
    const task = BATTERY.find((t) => t.criteria.some((c) => c.indicates === r.pattern));
    const criterion = task?.criteria.find((c) => c.indicates === r.pattern);
    if (!task || !criterion) throw new Error(`no criterion indicates ${r.pattern}`);
    observations = Array.from({ length: value }, () => ({
      taskId: task.id,
      criterionId: criterion.id,
      text: criterion.text,
      pattern: r.pattern,
      side: 'left' as const,
    }));
  } else {
    const scope = r.appliesTo === 'all' ? null : r.appliesTo[0];
    if (scope === undefined) throw new Error(`row ${r.id} applies to nothing`);
    const isTask = scope !== null && BATTERY.some((t) => t.id === scope);
    const m: Measurement = {
      id: `test/${r.metric}`,
      metric: r.metric,
      taskId: isTask ? (scope as TaskId) : null,
      side: 'left',
      value,
      unit: r.unit as Measurement['unit'],
      label: 'test value',
    };
    if (scope !== null && !isTask) {
      const [l, rr] = pairTasks(scope as PairId);
      m.comparesTasks = [l.id, rr.id];
    }
    measurements = [m];
  }
  return detectFlags(measurements, observations, sex).some((f) => f.thresholdsMet.some((t) => t.rowId === r.id));
}

describe('threshold table', () => {
  it('every row has a hand-written expectation below (and no expectation is stale)', () => {
    const expectedIds = new Set(EXPECTED.map((e) => e[0]));
    expect([...new Set(THRESHOLDS.map((r) => r.id))].sort()).toEqual([...expectedIds].sort());
  });

  it('row ids are unique', () => {
    const ids = THRESHOLDS.map((r) => r.id);
    expect(new Set(ids).size).toBe(ids.length);
  });

  it.each(EXPECTED)('%s has value %f %s (%s)', (id, value, unit, _at, _below, _above, _step, _source, bound) => {
    const r = row(id);
    expect(bound === 'upper' ? r.upperValue : r.value).toBe(value);
    expect(r.unit).toBe(unit);
  });

  it.each(EXPECTED)('%s: at %f -> flag %s, just below -> %s, just above -> %s', (id, value, _unit, at, below, above, step) => {
    const r = row(id);
    expect(fires(r, value)).toBe(at);
    expect(fires(r, value - step)).toBe(below);
    expect(fires(r, value + step)).toBe(above);
  });

  it('every pattern has at least one row', () => {
    for (const p of PATTERN_ORDER) expect(THRESHOLDS.some((r) => r.pattern === p)).toBe(true);
  });

  it('every row names a known source in full, common practice, or our choice, with a kind and a certainty', () => {
    const citations = new Set<string>(SOURCES.SHORT_CITATIONS.map((c) => c.full));
    for (const r of THRESHOLDS) {
      if (r.sourceKind === 'common-practice') {
        expect(r.source, r.id).toBe(SOURCES.COMMON_PRACTICE);
        expect(r.certainty, r.id).toBe('no source');
      } else if (r.sourceKind === 'our-choice') {
        expect(r.source, r.id).toBe(SOURCES.OUR_CHOICE);
        expect(r.certainty, r.id).toBe('no source');
      } else {
        // Titles contain semicolons, so strip the known citations rather than split.
        let rest = r.source;
        let found = 0;
        for (const c of [...citations].sort((a, b) => b.length - a.length)) {
          if (rest.includes(c)) found += 1;
          rest = rest.split(c).join('');
        }
        expect(found, r.id).toBeGreaterThan(0);
        expect(rest.replace(/[;\s]/g, ''), `${r.id}: unknown text in source`).toBe('');
        expect(['checked', 'secondary', 'from memory'], r.id).toContain(r.certainty);
      }
      expect(r.note.length, r.id).toBeGreaterThan(10);
    }
  });

  it('a derived value names its published parts, and they add up to it', () => {
    const derived = THRESHOLDS.filter((r) => r.sourceKind === 'derived');
    expect(derived.length).toBeGreaterThan(0);
    for (const r of derived) {
      expect(r.derivedFrom?.length, r.id).toBeGreaterThan(0);
      const sum = r.derivedFrom!.reduce((s, p) => s + p.value, 0);
      expect(sum, r.id).toBeCloseTo(r.value, 9);
      for (const p of r.derivedFrom!) expect(SOURCES.citationsIn(p.source).length, `${r.id}: ${p.what}`).toBeGreaterThan(0);
      expect(derivationText(r), r.id).toBeDefined();
    }
    for (const r of THRESHOLDS.filter((x) => x.sourceKind !== 'derived')) expect(r.derivedFrom, r.id).toBeUndefined();
  });

  it('a single measurement against a cut-off uses 1.96 x SEM; a left-right difference uses the smallest detectable difference', () => {
    // Munro, Herrington, Carolan 2012 (checked): SEM 2.72-3.01 deg, SDD 7.54-8.93 deg. 1.96 x 2.72 = 5.3312.
    expect(FPPA_SINGLE_MEASUREMENT_MARGIN_DEG).toBe(5.33);
    for (const r of THRESHOLDS.filter((x) => x.id.startsWith('fppa-') && x.id.endsWith('-concern'))) {
      expect(r.derivedFrom?.[1]).toMatchObject({ value: 5.33, formula: '1.96 x 2.72' });
    }
    expect(row('fppa-difference').derivedFrom?.[0]?.value).toBe(7.54);
    // SDD = 1.96 x sqrt(2) x SEM: 1.96 x 1.4142 x 2.72 = 7.54 (the published lower ends agree).
    expect(1.96 * Math.SQRT2 * 2.72).toBeCloseTo(7.54, 2);
  });

  it('a value from another population says who beside the flag', () => {
    for (const r of THRESHOLDS.filter((x) => x.sourceKind === 'published-other-population')) {
      expect(r.populationNote, r.id).toMatch(/applied to/);
    }
    for (const r of THRESHOLDS.filter((x) => x.population.ageGroup.includes('adult'))) {
      expect(r.populationNote, r.id).toMatch(/[Aa]dult/);
    }
  });

  it('flags carry the kind, the certainty and the population note into the result', () => {
    const flags = detectFlags(
      [{ id: 'drop-landing/fppa/left', metric: 'fppa', taskId: 'drop-landing', side: 'left', value: 30, unit: 'deg', label: 'test' }],
      [],
      'female',
    );
    expect(flags[0]?.threshold).toMatchObject({ sourceKind: 'derived', certainty: 'checked' });
    expect(flags[0]?.threshold.derivation).toMatch(/13° .*Herrington & Munro 2010.* \+ 5\.33° .*1\.96 x the standard error.* = 18\.33°/);
    expect(flags[0]?.threshold.populationNote).toMatch(/Adult norms/);
  });

  it('knee valgus rows are sex-specific and say they are adult norms (Herrington & Munro 2010)', () => {
    const fppa = THRESHOLDS.filter((r) => r.metric === 'fppa');
    expect(fppa.length).toBe(8);
    for (const r of fppa) {
      expect(r.population.sex).not.toBe('any');
      expect(r.population.ageGroup).toMatch(/adult/);
      expect(r.note).toMatch(/Adult norms/);
    }
  });

  it('applies only to known tasks and pairs', () => {
    const scopes = new Set<string>([...BATTERY.map((t) => t.id), 'single-leg-squat', 'single-leg-stance', 'knee-to-wall']);
    for (const r of THRESHOLDS) {
      if (r.appliesTo === 'all') continue;
      for (const s of r.appliesTo) expect(scopes.has(s), `${r.id}: ${s}`).toBe(true);
    }
  });
});

describe('sex-specific knee valgus thresholds (Herrington & Munro 2010, adult norms)', () => {
  const fppaIn = (taskId: TaskId, value: number): Measurement => ({
    id: `${taskId}/fppa/left`,
    metric: 'fppa',
    taskId,
    side: 'left',
    value,
    unit: 'deg',
    label: 'test',
  });

  it.each<[TaskId, number, Sex, 'watch' | 'concern' | null, string]>([
    ['drop-landing', 10, 'female', null, `${HM2010}: 10 deg is inside the female drop-jump range 7-13`],
    ['drop-landing', 10, 'male', 'watch', `${HM2010}: 10 deg is above the male drop-jump range 3-8`],
    ['drop-landing', 16, 'male', 'concern', `${HM2010} + ${MUNRO2012}: above 8 + 1.96 x 2.72`],
    ['drop-landing', 16, 'female', 'watch', `${HM2010}: above 13, below 13 + 1.96 x 2.72`],
    ['single-leg-squat-left', 12.5, 'female', 'watch', `${HM2010}: above the female step-landing range 5-12`],
    ['single-leg-squat-left', 8.5, 'male', null, `${HM2010}: inside the male step-landing range 1-9`],
    ['knee-to-wall-left', 40, 'female', null, 'FPPA is not measured in the knee-to-wall task: no row applies'],
  ])('%s, %f deg, %s -> %s (%s)', (taskId, value, sex, severity) => {
    const flags = detectFlags([fppaIn(taskId, value)], [], sex);
    expect(flags[0]?.severity ?? null).toBe(severity);
    expect(flags.length).toBe(severity ? 1 : 0);
  });
});

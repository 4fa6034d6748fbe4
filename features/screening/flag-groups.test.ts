import { describe, expect, it } from 'vitest';
import { evaluateAssessment, THRESHOLDS, type AssessmentInput, type AssessmentResult } from './engine';
import { mulberry32, randomAssessment } from './engine/random-assessment';
import { groupFlags, thresholdWhereText } from './flag-groups';
import { basisText, thresholdText, valueText } from './labels';
import type { RoundAthlete } from './contract';
import { nextUnscreened } from './round-order';

const girl: AssessmentInput['athlete'] = { sex: 'female', ageYears: 12.5, statureCm: 152 };

describe('flags grouped by pattern and side', () => {
  it('one card per pattern and side, with every task that showed it as evidence inside', () => {
    const r = evaluateAssessment({
      athlete: girl,
      tasks: {
        'two-leg-squat': { criteria: ['squat-right-knee-in'] },
        'drop-landing': { criteria: ['landing-right-knee-in', 'landing-left-knee-in'] },
        'single-leg-squat-right': { criteria: ['sls-knee-in'] },
      },
    });
    const valgus = r.flags.filter((f) => f.pattern === 'dynamic-knee-valgus');
    expect(valgus.length).toBeGreaterThan(2);
    const groups = groupFlags(r.flags).filter((g) => g.pattern === 'dynamic-knee-valgus');
    expect(groups.map((g) => g.side).sort()).toEqual(['left', 'right']);
    const right = groups.find((g) => g.side === 'right')!;
    expect(right.tasks.map((t) => t.where).sort()).toEqual(['Drop landing from a low box', 'Single-leg squat, right leg', 'Two-leg full squat']);
    // No two cards share a title and a side.
    const keys = groupFlags(r.flags).map((g) => `${g.title}/${g.side}`);
    expect(new Set(keys).size).toBe(keys.length);
    // Every flag is in exactly one group.
    expect(
      groupFlags(r.flags)
        .flatMap((g) => g.tasks.map((t) => t.flagId))
        .sort(),
    ).toEqual(r.flags.map((f) => f.id).sort());
  });

  it('a group takes its most severe flag and lists each threshold once', () => {
    const groups = groupFlags(evaluateAssessment(randomAssessment(mulberry32(7))).flags);
    for (const g of groups) {
      expect(new Set(g.thresholds.map((t) => t.rowId)).size).toBe(g.thresholds.length);
      if (g.tasks.some((t) => t.severity === 'concern')) expect(g.severity).toBe('concern');
    }
  });

  it('says where each threshold was met: exactly the tasks whose flags met it (our choice)', () => {
    const r = evaluateAssessment(randomAssessment(mulberry32(7)));
    for (const g of groupFlags(r.flags)) {
      expect(Object.keys(g.thresholdWhere).sort()).toEqual(g.thresholds.map((t) => t.rowId).sort());
      for (const t of g.thresholds) {
        const expected = g.tasks
          .filter((task) => r.flags.find((f) => f.id === task.flagId)!.thresholdsMet.some((x) => x.rowId === t.rowId))
          .map((task) => task.where);
        expect(g.thresholdWhere[t.rowId]!.sort()).toEqual([...new Set(expected)].sort());
      }
    }
  });

  it("names the tasks only where some of the card's tasks met the threshold (our choice)", () => {
    expect(thresholdWhereText(['Single-leg squat, left'], 1)).toBeNull();
    expect(thresholdWhereText(['Drop landing', 'Single-leg squat, left'], 2)).toBe('Met in both tasks');
    expect(thresholdWhereText(['A', 'B', 'C'], 3)).toBe('Met in all 3 tasks');
    expect(thresholdWhereText(['Drop landing'], 3)).toBe('Met in: Drop landing');
    expect(thresholdWhereText(['Drop landing', 'Tuck jump'], 3)).toBe('Met in: Drop landing; Tuck jump');
    expect(thresholdWhereText([], 3)).toBeNull();
  });
});

/** Every piece of text the result screen shows for flags. */
function textsOf(r: AssessmentResult): string[] {
  const out: string[] = [];
  for (const g of groupFlags(r.flags)) {
    out.push(g.title);
    for (const t of g.tasks) {
      out.push(t.where);
      for (const e of t.evidence) out.push(e.kind === 'measurement' ? `${e.label}: ${valueText(e.value, e.unit)}` : `Seen: ${e.label}`);
    }
    for (const t of g.thresholds) out.push(thresholdText(t), basisText(t), t.derivation ?? '', t.populationNote ?? '');
  }
  for (const c of r.plan.cautions) out.push(c.text);
  for (const e of r.plan.exercises) out.push(...e.adjustments, e.loadRule ?? '');
  for (const m of r.measurements) out.push(m.label);
  return out;
}

const INTERNAL_IDS = [
  'moore2015',
  'mirwald2002',
  ...THRESHOLDS.map((t) => t.id).filter((id) => id.includes('-') && !['growth-spurt-window'].includes(id)),
  'painUncleared',
  'percent-1rm',
];

describe('plain English on the result (our own rule for the wording)', () => {
  it('no doubled words and no internal ids in anything a generated result shows', () => {
    const bad: string[] = [];
    for (let seed = 0; seed < 300; seed += 1) {
      for (const text of textsOf(evaluateAssessment(randomAssessment(mulberry32(seed))))) {
        if (/\b(\w+)\s+\1\b/i.test(text)) bad.push(`doubled word: ${text}`);
        const id = INTERNAL_IDS.find((i) => text.includes(i));
        if (id) bad.push(`${id} in: ${text}`);
      }
    }
    expect([...new Set(bad)]).toEqual([]);
  });
});

describe('next athlete of the round', () => {
  const a = (id: string, status: RoundAthlete['status'], screeningConsent = true): RoundAthlete => ({
    assessmentId: id,
    athleteId: `athlete-${id}`,
    firstName: id,
    lastName: 'X',
    status,
    photoConsent: true,
    screeningConsent,
    screeningRefused: false,
    flagCount: null,
    flags: [],
  });

  it.each([
    ['the next one not yet submitted after the current', [a('1', 'submitted'), a('2', 'submitted'), a('3', 'submitted'), a('4', 'not_started')], '2', '4'],
    ['wraps round to the start', [a('1', 'in_progress'), a('2', 'submitted'), a('3', 'submitted')], '3', '1'],
    ['skips the current one', [a('1', 'submitted'), a('2', 'in_progress')], '2', null],
    ['nobody left', [a('1', 'submitted'), a('2', 'submitted')], '1', null],
    // our choice: nobody is screened without the family's agreement on record
    ['passes over an athlete whose family has not agreed to screening', [a('1', 'submitted'), a('2', 'not_started', false), a('3', 'not_started')], '1', '3'],
    ['nobody left who may be screened', [a('1', 'submitted'), a('2', 'in_progress', false)], '1', null],
  ] as const)('%s', (_n, athletes, current, expected) => {
    expect(nextUnscreened(athletes, current)?.assessmentId ?? null).toBe(expected);
  });
});

import { describe, expect, it } from 'vitest';
import type { AssessmentDraft } from '@/features/screening/contract';
import { draftToInput, hasTaskData } from '@/features/screening/draft-to-input';
import { evaluateAssessment, MATURITY_AGE_RANGE } from '@/features/screening/engine';

const athlete = { sex: 'female' as const, ageYears: 12.4, racketHand: 'right' as const };

describe('draftToInput', () => {
  it('maps body numbers, tasks, landmarks and the screening date', () => {
    const draft: AssessmentDraft = {
      body: { statureCm: 152.5, sittingHeightCm: 79, massKg: 41 },
      oneRepMaxKg: 30,
      step: 'two-leg-squat',
      tasks: {
        'two-leg-squat': {
          criteria: ['squat-heels-lift'],
          notes: 'tired after school',
          landmarks: {
            front: { 'right-hip': { x: 400, y: 700 }, 'left-hip': { x: 500, y: 700 } },
            side: { 'near-hip': { x: 420, y: 760 } },
          },
          painReported: false,
        },
        'knee-to-wall-left': { criteria: [], distanceCm: 8.5 },
      },
    };
    expect(draftToInput({ athlete, draft, screenedOn: '2026-09-14' })).toEqual({
      athlete: { sex: 'female', ageYears: 12.4, racketHand: 'right', statureCm: 152.5, sittingHeightCm: 79, massKg: 41 },
      tasks: {
        'two-leg-squat': {
          criteria: ['squat-heels-lift'],
          photos: {
            front: { landmarks: { 'right-hip': { x: 400, y: 700 }, 'left-hip': { x: 500, y: 700 } } },
            side: { landmarks: { 'near-hip': { x: 420, y: 760 } } },
          },
          painReported: false,
        },
        'knee-to-wall-left': { criteria: [], distanceCm: 8.5 },
      },
      oneRepMaxKg: 30,
      options: { today: '2026-09-14' },
    });
  });

  it.each([
    ['null body numbers', { body: { statureCm: null, sittingHeightCm: null, massKg: null }, tasks: {} }],
    ['missing body numbers', { body: {}, tasks: {} }],
    ['a null 1RM', { body: {}, tasks: {}, oneRepMaxKg: null }],
  ] satisfies [string, AssessmentDraft][])('omits %s instead of sending null', (_name, draft) => {
    const input = draftToInput({ athlete, draft, screenedOn: '2026-09-14' });
    expect(input.athlete).toEqual({ sex: 'female', ageYears: 12.4, racketHand: 'right' });
    expect('oneRepMaxKg' in input).toBe(false);
  });

  it('sends a 1RM the check questions only once the tester has confirmed it (our choice)', () => {
    const draft: AssessmentDraft = { body: { massKg: 40 }, tasks: {}, oneRepMaxKg: 90 };
    expect('oneRepMaxKg' in draftToInput({ athlete, draft, screenedOn: '2026-09-14' })).toBe(false);
    expect(draftToInput({ athlete, draft: { ...draft, oneRepMaxCheckedKg: 90 }, screenedOn: '2026-09-14' }).oneRepMaxKg).toBe(90);
  });

  it('leaves skipped tasks out and keeps tasks done with nothing seen', () => {
    const draft: AssessmentDraft = {
      body: {},
      tasks: {
        'drop-landing': { criteria: ['landing-stiff'], skipped: true, skipReason: 'sore ankle' },
        'single-leg-stance-left': { criteria: [] },
      },
    };
    const input = draftToInput({ athlete, draft, screenedOn: '2026-09-14' });
    expect(Object.keys(input.tasks)).toEqual(['single-leg-stance-left']);
    expect(hasTaskData(draft)).toBe(true);
    expect(hasTaskData({ body: {}, tasks: { 'drop-landing': { criteria: [], skipped: true } } })).toBe(false);
    expect(hasTaskData({ body: { statureCm: 150 }, tasks: {} })).toBe(false);
  });

  it('sends a skipped task with pain reported, so that the plan asks for clearance (our choice: pain wins over a skip)', () => {
    const draft: AssessmentDraft = {
      body: {},
      tasks: { 'drop-landing': { criteria: [], skipped: true, skipReason: 'sore knee', painReported: true } },
    };
    const input = draftToInput({ athlete, draft, screenedOn: '2026-09-14' });
    expect(input.tasks).toEqual({ 'drop-landing': { criteria: [], painReported: true } });
    expect(hasTaskData(draft)).toBe(true);
    // The engine holds the loaded work and asks for clearance from that pain.
    const result = evaluateAssessment({ ...input, oneRepMaxKg: 30 });
    expect(result.plan.status).toBe('clearance-needed');
  });

  it('drops empty landmark sets and a null distance', () => {
    const draft: AssessmentDraft = {
      body: {},
      tasks: { 'knee-to-wall-right': { criteria: [], distanceCm: null, landmarks: { side: {} } } },
    };
    expect(draftToInput({ athlete, draft, screenedOn: '2026-09-14' }).tasks).toEqual({ 'knee-to-wall-right': { criteria: [] } });
  });

  // The engine refuses an age outside the equation's range (MATURITY_AGE_RANGE, from the engine's
  // sources) unless maturity is turned off; an older junior must still get a result.
  it.each([
    ['female', MATURITY_AGE_RANGE.female.max + 0.5, 'none'],
    ['male', MATURITY_AGE_RANGE.male.min - 0.5, 'none'],
    ['female', 12, undefined],
  ] as const)('turns maturity off for a %s aged %s outside the equations (%s)', (sex, ageYears, method) => {
    const draft: AssessmentDraft = { body: { statureCm: 165, sittingHeightCm: 86, massKg: 55 }, tasks: { 'two-leg-squat': { criteria: [] } } };
    const input = draftToInput({ athlete: { sex, ageYears }, draft, screenedOn: '2026-09-14' });
    expect(input.options?.maturityMethod).toBe(method);
    expect(() => evaluateAssessment(input)).not.toThrow();
  });

  it('feeds the engine an input it accepts, with the re-screen date counted from the round', () => {
    const draft: AssessmentDraft = {
      body: { statureCm: 150 },
      tasks: {
        'single-leg-squat-left': {
          criteria: ['sls-knee-in'],
          landmarks: { front: { 'left-hip': { x: 560, y: 700 }, 'left-knee': { x: 520, y: 900 }, 'left-ankle': { x: 565, y: 1120 } } },
        },
      },
    };
    const result = evaluateAssessment(draftToInput({ athlete, draft, screenedOn: '2026-09-14' }));
    expect(result.flags.map((f) => f.pattern)).toContain('dynamic-knee-valgus');
    expect(result.plan.rescreenDate).toBe('2026-10-26');
  });
});

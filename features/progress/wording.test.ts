import { describe, expect, it } from 'vitest';
import type { FlagRef, ScreenComparison } from './compare';
import { flagGroups, sessionsSentence } from './wording';

const flag = (pattern: FlagRef['pattern'], title: string, taskId: FlagRef['taskId'], side: FlagRef['side']): FlagRef => ({
  id: `${pattern}/${taskId ?? 'athlete'}/${side ?? 'none'}`,
  pattern,
  title,
  taskId,
  side,
  severity: 'watch',
});

describe('flags in words, one entry per pattern (our choice)', () => {
  const valgus = 'Knee collapsing inward';
  it('names each pattern once, each task once with its sides, in the order they came', () => {
    const groups = flagGroups([
      flag('dynamic-knee-valgus', valgus, 'drop-landing', 'left'),
      flag('dynamic-knee-valgus', valgus, 'drop-landing', 'right'),
      flag('growth-spurt-window', 'Growth-spurt window', null, null),
      flag('dynamic-knee-valgus', valgus, 'two-leg-squat', 'left'),
      flag('dynamic-knee-valgus', valgus, 'two-leg-squat', 'both'),
    ]);
    expect(groups).toEqual(['Knee collapsing inward: drop landing from a low box (both sides); two-leg full squat (both sides)', 'Growth-spurt window']);
  });

  it('keeps a single side and a flag without a side as they are', () => {
    expect(flagGroups([flag('dynamic-knee-valgus', valgus, 'drop-landing', 'right')])).toEqual([
      'Knee collapsing inward: drop landing from a low box (right side)',
    ]);
    expect(flagGroups([flag('heels-lifting', 'Heels lifting', 'two-leg-squat', null)])).toEqual(['Heels lifting: two-leg full squat']);
    expect(flagGroups([])).toEqual([]);
  });
});

describe('sessions between two screens in words (our wording)', () => {
  const comparison = (noPlanNeeded: boolean) =>
    ({ planTime: { days: 70, neededWeeks: 6, longEnough: true, noPlanNeeded, waitedForClearance: false } }) as unknown as ScreenComparison;
  it('counts the sessions recorded on the training sheet, and says when none were', () => {
    expect(sessionsSentence(7, comparison(false))).toBe('7 corrective sessions with this athlete recorded on the training sheet between the screens.');
    expect(sessionsSentence(1, comparison(false))).toBe('1 corrective session with this athlete recorded on the training sheet between the screens.');
    expect(sessionsSentence(0, comparison(false))).toBe('No corrective session with this athlete was recorded on the training sheet between the screens.');
  });
  it('says nothing without a comparison or when no plan was needed', () => {
    expect(sessionsSentence(null, comparison(false))).toBe('');
    expect(sessionsSentence(3, comparison(true))).toBe('');
  });
});

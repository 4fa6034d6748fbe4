import { describe, expect, it } from 'vitest';
import type { FlagRef } from './compare';
import { flagGroups } from './wording';

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

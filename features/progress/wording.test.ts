import { describe, expect, it } from 'vitest';
import type { FlagRef, ScreenComparison } from './compare';
import { familySummary, flagGroups, sessionsSentence } from './wording';

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

describe('sessions between two screens in words (our choice)', () => {
  const comparison = (noPlanNeeded: boolean) =>
    ({ planTime: { days: 70, neededWeeks: 6, longEnough: true, noPlanNeeded, waitedForClearance: false } }) as unknown as ScreenComparison;
  it('counts the sessions the athlete took part in against those the squad recorded', () => {
    expect(sessionsSentence({ attended: 7, held: 9 }, comparison(false))).toBe(
      'Took part in 7 of the 9 corrective sessions the squad recorded on the training sheet between the screens.',
    );
    expect(sessionsSentence({ attended: 0, held: 1 }, comparison(false))).toBe(
      'Took part in 0 of the 1 corrective session the squad recorded on the training sheet between the screens.',
    );
  });
  it('says nothing without a comparison, when no plan was needed, or when the squad kept no record', () => {
    expect(sessionsSentence(null, comparison(false))).toBe('');
    expect(sessionsSentence({ attended: 3, held: 3 }, comparison(true))).toBe('');
    expect(sessionsSentence({ attended: 0, held: 0 }, comparison(false))).toBe('');
  });
});

describe('the family comparison with sessions (our choice)', () => {
  const c = {
    flags: { cleared: [], persisting: [], new: [] },
    measurements: [],
    planTime: { days: 70, neededWeeks: 6, longEnough: true, noPlanNeeded: false, waitedForClearance: false },
  } as unknown as ScreenComparison;
  it("says how many of the squad's sessions the child took part in, after the time the exercises had", () => {
    const lines = familySummary(c, { attended: 12, held: 18 });
    const weeks = lines.findIndex((l) => l.startsWith('The exercises had about 10 weeks'));
    expect(lines[weeks + 1]).toBe('Your child took part in 12 of the 18 exercise sessions the squad held between the two checks.');
  });
  it('says nothing of sessions where none was recorded, or when no plan was needed', () => {
    expect(familySummary(c, { attended: 0, held: 0 }).join(' ')).not.toMatch(/session/);
    expect(familySummary(c).join(' ')).not.toMatch(/session/);
    const none = { ...c, planTime: { ...c.planTime, noPlanNeeded: true } } as ScreenComparison;
    expect(familySummary(none, { attended: 5, held: 6 }).join(' ')).not.toMatch(/session/);
  });
});

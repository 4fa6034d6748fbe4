import { describe, expect, it } from 'vitest';
import type { FlagRef, ScreenComparison } from './compare';
import { familySummary, flagGroups, planTimeSentence, sessionsSentence, sessionsSinceSentence } from './wording';

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

  it('names the pair a left-right difference compares, so that two of them are told apart', () => {
    const asym = (a: FlagRef['taskId'], b: FlagRef['taskId']): FlagRef => ({
      ...flag('left-right-asymmetry', 'Left-right difference (asymmetry)', null, null),
      comparesTasks: [a!, b!],
    });
    expect(flagGroups([asym('single-leg-squat-left', 'single-leg-squat-right')])).toEqual([
      'Left-right difference (asymmetry): single-leg squat, left against right',
    ]);
    expect(flagGroups([asym('knee-to-wall-left', 'knee-to-wall-right')])).toEqual([
      'Left-right difference (asymmetry): knee-to-wall lunge, left against right',
    ]);
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
      'Took part in 0 of 1 corrective session the squad recorded on the training sheet between the screens.',
    );
  });
  it('says nothing without a comparison, when no plan was needed, or when the squad kept no record', () => {
    expect(sessionsSentence(null, comparison(false))).toBe('');
    expect(sessionsSentence({ attended: 3, held: 3 }, comparison(true))).toBe('');
    expect(sessionsSentence({ attended: 0, held: 0 }, comparison(false))).toBe('');
  });
});

describe('how long the plan had, in words (our choice)', () => {
  const withDays = (days: number, longEnough: boolean, noPlanNeeded = false) =>
    ({ planTime: { days, neededWeeks: 6, longEnough, noPlanNeeded, waitedForClearance: false } }) as unknown as ScreenComparison;
  it('weeks and days against the weeks the plan asks for', () => {
    expect(planTimeSentence(withDays(45, true))).toBe('The plan had 6 weeks (45 days), at least the 6 weeks it asks for: long enough to expect a change.');
    expect(planTimeSentence(withDays(20, false))).toBe(
      'The plan had only 2 weeks (20 days) of the 6 weeks it asks for: too soon to expect a change, so an unchanged result says little.',
    );
  });
  it('two screens on the same day: no time at all, not "0 weeks"', () => {
    expect(planTimeSentence(withDays(0, false))).toBe('Both screens were on the same day: the plan had no time to work, so an unchanged result says little.');
    expect(planTimeSentence(withDays(0, false, true))).toMatch(/no corrective plan was needed/);
  });
});

describe('sessions since the newest screen (our choice)', () => {
  const newest = (exercises: number) => ({
    screenedOn: '2026-09-16',
    plan: { status: 'ready' as const, rescreenWeeks: 6, rescreenDate: '2026-10-28', exercises },
  });
  it('counts the sessions the athlete took part in since the newest screen, beside a plan with exercises', () => {
    expect(sessionsSinceSentence({ attended: 14, held: 18 }, newest(3), 'en-GB')).toBe(
      'Since the screen of 16 Sept 2026: took part in 14 of the 18 corrective sessions the squad recorded on the training sheet.',
    );
    expect(sessionsSinceSentence({ attended: 0, held: 1 }, newest(3), 'en-US')).toBe(
      'Since the screen of Sep 16, 2026, the squad recorded 1 corrective session on the training sheet: not there.',
    );
    expect(sessionsSinceSentence({ attended: 1, held: 1 }, newest(3), 'en-US')).toBe(
      'Since the screen of Sep 16, 2026, the squad recorded 1 corrective session on the training sheet: took part.',
    );
  });
  it('says nothing with no screen, no exercises to do, or no session recorded', () => {
    expect(sessionsSinceSentence(null, newest(3))).toBe('');
    expect(sessionsSinceSentence({ attended: 2, held: 2 }, undefined)).toBe('');
    expect(sessionsSinceSentence({ attended: 2, held: 2 }, newest(0))).toBe('');
    expect(sessionsSinceSentence({ attended: 0, held: 0 }, newest(3))).toBe('');
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
    expect(familySummary(c, { attended: 0, held: 1 })).toContain('The squad held 1 exercise session between the two checks; your child was not there.');
  });
  it('says the growth spurt apart from what the exercises work on (our wording)', () => {
    const drop = flag('contralateral-pelvic-drop', 'Pelvic drop', 'single-leg-squat-left', 'left');
    const growth = flag('growth-spurt-window', 'Growth-spurt window', null, null);
    const lines = familySummary({ ...c, flags: { cleared: [], persisting: [drop, growth], new: [] } } as unknown as ScreenComparison);
    expect(lines).toContain('We still saw the hip dipping on the side of the lifted leg. The exercises keep working on this.');
    expect(lines).toContain('Your child still seems to be in a growth spurt, so the coaches keep the training lighter for now.');
    expect(lines.join(' ')).not.toMatch(/growth spurt, when training/);
    const onlyGrowth = familySummary({ ...c, flags: { cleared: [], persisting: [], new: [growth] } } as unknown as ScreenComparison);
    expect(onlyGrowth).toContain('Your child now seems to be in a growth spurt, so the coaches make the training lighter for now.');
    expect(onlyGrowth.join(' ')).not.toMatch(/added exercises/);
  });
  it('checks less than a week apart, or one week apart, in whole words', () => {
    const short = (days: number) => familySummary({ ...c, planTime: { ...c.planTime, days, longEnough: false } } as ScreenComparison);
    expect(short(0)).toContain('The two checks were less than a week apart, which is too soon to see a difference.');
    expect(short(6)).toContain('The two checks were less than a week apart, which is too soon to see a difference.');
    expect(short(9)).toContain('There was only about 1 week between the two checks, which is usually too soon to see a difference.');
    expect(short(20)).toContain('There were only about 2 weeks between the two checks, which is usually too soon to see a difference.');
  });
  it('says nothing of sessions where none was recorded, or when no plan was needed', () => {
    expect(familySummary(c, { attended: 0, held: 0 }).join(' ')).not.toMatch(/session/);
    expect(familySummary(c).join(' ')).not.toMatch(/session/);
    const none = { ...c, planTime: { ...c.planTime, noPlanNeeded: true } } as ScreenComparison;
    expect(familySummary(none, { attended: 5, held: 6 }).join(' ')).not.toMatch(/session/);
  });
});

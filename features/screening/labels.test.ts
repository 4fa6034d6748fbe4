import { describe, expect, it } from 'vitest';
import { doseText, loadText, rescreenWords, restText, setsText, thresholdText, valueText } from './labels';

describe('labels', () => {
  it.each([
    [12.345, 'deg', '12.3°'],
    [8, 'cm', '8 cm'],
    [1, 'criteria', '1 ticked criterion'],
    [2, 'grades', '2 grades'],
    // our choice: a maturity offset of -0.03 years reads "0.0 years", not "-0.0".
    [-0.03, 'years', '0.0 years'],
    [-0.05, 'years', '-0.1 years'],
  ] as const)('valueText(%s, %s)', (v, unit, expected) => {
    expect(valueText(v, unit)).toBe(expected);
  });

  it('thresholds read as plain words', () => {
    expect(
      thresholdText({
        rowId: 'x',
        comparison: 'greater-than',
        value: 13,
        unit: 'deg',
        severity: 'watch',
        source: 's',
        sourceKind: 'our-choice',
        certainty: 'no source',
      }),
    ).toBe('Flagged above 13°');
    expect(
      thresholdText({
        rowId: 'x',
        comparison: 'within',
        value: -1,
        upperValue: 1,
        unit: 'years',
        severity: 'watch',
        source: 's',
        sourceKind: 'our-choice',
        certainty: 'no source',
      }),
    ).toBe('Flagged between -1 years and 1 years');
  });

  it('prescriptions read as plain words', () => {
    expect(setsText({ min: 2, max: 3 })).toBe('2-3 sets');
    expect(doseText({ kind: 'reps', min: 8, max: 12, perSide: true, toNearFatigue: true })).toBe('8-12 reps per side, close to fatigue');
    expect(doseText({ kind: 'seconds', min: 30, max: 30, perSide: false })).toBe('30 s');
    expect(loadText({ kind: 'percent-1rm', minPercent: 50, maxPercent: 65, kg: { min: 20, max: 25, incrementKg: 2.5 }, note: 'Slow.' })).toBe(
      '50-65% of 1RM: 20-25 kg (in 2.5 kg steps). Slow.',
    );
    // A note written to follow other words starts its own sentence (our choice of wording).
    expect(loadText({ kind: 'bodyweight', note: 'a light plate held forward as a counterbalance' })).toBe(
      'Bodyweight. A light plate held forward as a counterbalance',
    );
    // Without a 1RM, bodyweight first and the share after it (our wording); the engine's own "No 1RM
    // recorded" sentence at the end of its note is said this way instead.
    expect(loadText({ kind: 'percent-1rm', minPercent: 50, maxPercent: 55, kg: null, note: 'close to fatigue; full range.' })).toBe(
      'Bodyweight until a 1RM has been estimated (from a submaximal set, under qualified supervision); then 50-55% of 1RM. Close to fatigue; full range.',
    );
    expect(
      loadText({
        kind: 'percent-1rm',
        minPercent: 50,
        maxPercent: 55,
        kg: null,
        note: 'Slow. No 1RM recorded: use bodyweight until a 1RM has been estimated from a submaximal set under qualified supervision.',
      }),
    ).toBe('Bodyweight until a 1RM has been estimated (from a submaximal set, under qualified supervision); then 50-55% of 1RM. Slow.');
    expect(restText(60)).toBe('60 s rest');
    expect(restText(120)).toBe('2 min rest');
  });
});

describe('rescreenWords (our wording)', () => {
  it('a date still ahead: on or after it, counted from the screen', () => {
    expect(rescreenWords('2027-01-20', 6, '2026-12-05', 'en-GB')).toBe('On or after 20 Jan 2027 (6 weeks after this screen).');
  });
  it('a date gone by, or today: due since then, never "on or after" a past day', () => {
    expect(rescreenWords('2026-07-20', 6, '2026-12-05', 'en-US')).toBe(
      'Due since Jul 20, 2026 (6 weeks after this screen), unless the athlete has been screened again.',
    );
    expect(rescreenWords('2026-12-05', 1, '2026-12-05', 'en-US')).toBe(
      'Due since Dec 5, 2026 (1 week after this screen), unless the athlete has been screened again.',
    );
  });
  it('no date stored: the interval alone', () => {
    expect(rescreenWords(null, 8, '2026-12-05')).toBe('8 weeks after this screen.');
  });
});

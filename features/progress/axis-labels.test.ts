import { describe, expect, it } from 'vitest';
import { axisDateLabels, labelledPoints, changeTicks } from './axis-labels';

// Our choice (no source): labels at least 52 px apart, the first and the last always labelled.
const gaps = (points: number[], count: number, width: number) => points.slice(1).map((p, i) => ((p - points[i]!) / (count - 1)) * width);

describe('date labels on a chart of many rounds', () => {
  it('labels every round while they fit', () => {
    expect(labelledPoints(0, 300)).toEqual([]);
    expect(labelledPoints(1, 300)).toEqual([0]);
    expect(labelledPoints(6, 300)).toEqual([0, 1, 2, 3, 4, 5]); // 300 / 52 -> 5 gaps, 6 labels
  });

  it('spreads the labels evenly once they would touch, keeping the first and the last', () => {
    expect(labelledPoints(7, 300)).toEqual([0, 2, 4, 6]);
    expect(labelledPoints(24, 300)).toEqual([0, 5, 10, 15, 23]); // 20 gives way to the last
    expect(labelledPoints(40, 1000)).toEqual([0, 3, 6, 9, 12, 15, 18, 21, 24, 27, 30, 33, 36, 39]);
  });

  it('never puts two labels closer than the gap, at phone and wide widths', () => {
    for (const width of [250, 296, 336, 640, 1000]) {
      for (let count = 2; count <= 60; count++) {
        const points = labelledPoints(count, width);
        expect(points[0]).toBe(0);
        expect(points[points.length - 1]).toBe(count - 1);
        for (const gap of gaps(points, count, width)) expect(gap).toBeGreaterThanOrEqual(52 - 1e-9);
      }
    }
  });
});

describe('date labels tell two rounds of one month apart (our choice)', () => {
  it('gives month and year where the neighbours are in other months', () => {
    const dates = ['2026-03-09', '2026-06-08', '2026-09-14'];
    expect([...axisDateLabels(dates, [0, 1, 2]).values()]).toEqual(['Mar ’26', 'Jun ’26', 'Sep ’26']);
  });

  it('gives day and month to labelled neighbours in the same month, only to them', () => {
    const dates = ['2026-08-31', '2026-09-01', '2026-09-29', '2026-11-02'];
    expect([...axisDateLabels(dates, [0, 1, 2, 3]).values()]).toEqual(['Aug ’26', '1 Sep', '29 Sep', 'Nov ’26']);
  });

  it('compares only the points that carry a label', () => {
    const dates = ['2026-09-01', '2026-09-10', '2026-09-29', '2026-10-20'];
    // 1 and 2 are not labelled: 0 (Sep) and 3 (Oct) are neighbours on the axis.
    expect(axisDateLabels(dates, [0, 3])).toEqual(
      new Map([
        [0, 'Sep ’26'],
        [3, 'Oct ’26'],
      ]),
    );
  });

  it('keeps the year apart: the same month of two seasons is not a twin', () => {
    expect([...axisDateLabels(['2025-09-15', '2026-09-14'], [0, 1]).values()]).toEqual(['Sep ’25', 'Sep ’26']);
  });

  it('labels rounds of one day once (our choice)', () => {
    const dates = ['2026-09-14', '2026-11-30', '2026-11-30', '2026-11-30', '2026-12-05'];
    expect([...axisDateLabels(dates, [0, 1, 2, 3, 4]).values()]).toEqual(['Sep ’26', 'Nov ’26', '', '', 'Dec ’26']);
  });
});

// Our choice: the change chart's axis always shows 0, with a round step.
describe('changeTicks', () => {
  it('runs from -max to +max through 0 in steps of 5, 10 or 20 degrees', () => {
    expect(changeTicks(10.9)).toEqual([-10, -5, 0, 5, 10]);
    expect(changeTicks(14)).toEqual([-10, 0, 10]);
    expect(changeTicks(41)).toEqual([-40, -20, 0, 20, 40]);
    expect(changeTicks(4)).toEqual([0]);
  });
});

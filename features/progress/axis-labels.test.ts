import { describe, expect, it } from 'vitest';
import { labelledPoints } from './axis-labels';

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

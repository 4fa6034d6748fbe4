/** Room right of a date axis: half a label, so the last date is not cut off at the chart's edge. */
export const DATE_AXIS_RIGHT = 24;

/**
 * Which points of a chart's x axis get a date label, so that labels never run into each other when a
 * squad has many rounds (a season of monthly screens, or several seasons): at most one label per
 * `minGapPx` of the plot's width, evenly spread, always the first and the last point. Our choice: 52 px
 * holds a short date ("Mar 26") at the charts' 11 px type with room between.
 */
export function labelledPoints(count: number, plotWidthPx: number, minGapPx = 52): number[] {
  if (count <= 0) return [];
  if (count === 1) return [0];
  const fit = Math.max(2, Math.floor(plotWidthPx / minGapPx) + 1);
  const all = Array.from({ length: count }, (_, i) => i);
  if (count <= fit) return all;
  const step = Math.ceil((count - 1) / (fit - 1));
  const picked = all.filter((i) => i % step === 0);
  const last = count - 1;
  // The last point always has its label; one closer to it than a step would collide, so it gives way.
  if (picked[picked.length - 1] !== last) {
    if (last - picked[picked.length - 1]! < step) picked.pop();
    picked.push(last);
  }
  return picked;
}

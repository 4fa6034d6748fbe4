/** Room right of a date axis: half a label, so the last date is not cut off at the chart's edge. */
export const DATE_AXIS_RIGHT = 24;

/**
 * Which points of a chart's x axis get a date label, so that labels never run into each other when a
 * squad has many rounds (a season of monthly screens, or several seasons): at most one label per
 * `minGapPx` of the plot's width, evenly spread, always the first and the last point. Our choice: 52 px
 * holds a short date ("Mar ’26") at the charts' 11 px type with room between.
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

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
/**
 * '2026-03-09' -> 'Mar ’26': short enough for a phone's axis; the apostrophe keeps the year from reading
 * as a day beside a '29 Sep' (our choice).
 */
export const shortDate = (iso: string) => `${MONTHS[Number(iso.slice(5, 7)) - 1] ?? ''} ’${iso.slice(2, 4)}`;
/** '2026-03-09' -> '9 Mar': for two labelled rounds in the same month. */
const dayMonth = (iso: string) => `${Number(iso.slice(8, 10))} ${MONTHS[Number(iso.slice(5, 7)) - 1] ?? ''}`;

/**
 * The label of each labelled point (`points` from `labelledPoints`, `dates` ISO dates of every point):
 * month and year ("Mar ’26"), or day and month ("9 Mar") where the labelled point before or after it
 * falls in the same month, so two rounds of one month never carry the same label. Our choice: a
 * re-test a few weeks after a screen often falls in the same month; both forms fit the 52 px gap.
 */
export function axisDateLabels(dates: readonly string[], points: readonly number[]): Map<number, string> {
  const labels = new Map<number, string>();
  points.forEach((p, k) => {
    // A round on the same day as the labelled point before it shares that label (our choice: three
    // rounds of one day read "30 Nov" once, not three times).
    const prev = points[k - 1];
    if (prev !== undefined && dates[prev] !== undefined && dates[prev] === dates[p]) {
      labels.set(p, '');
      return;
    }
    const month = dates[p]?.slice(0, 7);
    const twin = [points[k - 1], points[k + 1]].some((q) => q !== undefined && dates[q] !== dates[p] && dates[q]?.slice(0, 7) === month);
    labels.set(p, dates[p] === undefined ? '' : twin ? dayMonth(dates[p]) : shortDate(dates[p]));
  });
  return labels;
}

/** Ticks for a change axis from -max to +max: 0 always, and a round step (5°, 10° or 20°). */
export function changeTicks(maxAbs: number): number[] {
  const step = maxAbs <= 12 ? 5 : maxAbs <= 30 ? 10 : 20;
  const n = Math.floor(maxAbs / step);
  return Array.from({ length: 2 * n + 1 }, (_, i) => (i - n) * step);
}

/**
 * One athlete's screens turned into chart series: one series per measurement (knee angle per task and
 * side, pelvic drop, knee-to-wall per side, limb symmetry) and the maturity offset, each with its flag
 * threshold and its error band. Pure, so the charts only draw.
 */
import type { MetricId, Sex } from '@/features/screening/engine';
import { THRESHOLDS } from '@/features/screening/engine/thresholds';
import { measurementKey, type ErrorMargin } from './compare';
import type { ProgressResponse } from './progress-types';

export type HistoryPoint = { index: number; screenedOn: string; roundName: string; value: number };
export type HistorySeries = {
  key: string;
  title: string;
  metric: MetricId | 'maturity-offset';
  unit: string;
  points: HistoryPoint[];
  /** The watch threshold for this athlete (sex, task), or null where none applies. */
  threshold: { value: number; flagWhen: 'above' | 'below'; source: string } | null;
  /** The concern threshold beyond it, where the engine has one (absent in series made before it was drawn). */
  concern?: { value: number } | null;
  /** The maturity offset's growth-spurt window, shaded (the engine's "circa" band: -1 to +1 year from PHV). */
  window?: { low: number; high: number } | null;
  /**
   * The published error around the earlier of the last two screens (or the only one): a later point inside
   * the band is no change we can tell from measuring error.
   */
  band: { low: number; high: number; around: number; margin: number; source: string } | null;
};

/** The measurements charted over time, in the order shown. */
export const CHARTED_METRICS: readonly MetricId[] = ['fppa', 'pelvic-obliquity', 'knee-to-wall', 'knee-to-wall-lsi'];

export function thresholdFor(metric: MetricId, measurementId: string, sex: Sex, severity: 'watch' | 'concern' = 'watch'): HistorySeries['threshold'] {
  const scope = measurementId.split('/')[0];
  const row = THRESHOLDS.find(
    (r) =>
      r.metric === metric &&
      r.severity === severity &&
      (r.comparison === 'greater-than' || r.comparison === 'less-than' || r.comparison === 'at-least' || r.comparison === 'at-most') &&
      (r.population.sex === 'any' || r.population.sex === sex) &&
      (r.appliesTo === 'all' || (r.appliesTo as readonly string[]).includes(scope ?? '')),
  );
  if (!row) return null;
  return { value: row.value, flagWhen: row.comparison === 'greater-than' || row.comparison === 'at-least' ? 'above' : 'below', source: row.source };
}

/** The concern line: drawn only beside a watch line on the same side of it (our choice: one scale, two lines). */
export function concernFor(metric: MetricId, measurementId: string, sex: Sex): HistorySeries['concern'] {
  const watch = thresholdFor(metric, measurementId, sex);
  const concern = thresholdFor(metric, measurementId, sex, 'concern');
  if (!watch || !concern || concern.flagWhen !== watch.flagWhen) return null;
  return { value: concern.value };
}

function bandFor(points: HistoryPoint[], margin: ErrorMargin | undefined): HistorySeries['band'] {
  if (!margin || points.length === 0) return null;
  const around = points[Math.max(0, points.length - 2)]!.value;
  return { low: around - margin.value, high: around + margin.value, around, margin: margin.value, source: margin.source };
}

const UNIT_TEXT: Record<string, string> = { deg: '°', cm: 'cm', percent: '%', years: 'years' };

export function historySeries(progress: ProgressResponse): HistorySeries[] {
  const byId = new Map<string, HistorySeries>();
  progress.screens.forEach((screen, index) => {
    for (const m of screen.measurements) {
      if (!CHARTED_METRICS.includes(m.metric)) continue;
      const key = measurementKey(m);
      let s = byId.get(key);
      if (!s) {
        s = {
          key,
          title: m.label,
          metric: m.metric,
          unit: UNIT_TEXT[m.unit] ?? m.unit,
          points: [],
          threshold: thresholdFor(m.metric, m.id, progress.athlete.sex),
          concern: concernFor(m.metric, m.id, progress.athlete.sex),
          band: null,
        };
        byId.set(key, s);
      }
      s.title = m.label;
      s.points.push({ index, screenedOn: screen.screenedOn, roundName: screen.roundName, value: m.value });
    }
  });
  const series = [...byId.values()].sort(
    (a, b) => CHARTED_METRICS.indexOf(a.metric as MetricId) - CHARTED_METRICS.indexOf(b.metric as MetricId) || a.key.localeCompare(b.key),
  );
  for (const s of series) s.band = bandFor(s.points, progress.errorMargins[s.metric as MetricId]);

  const maturity: HistoryPoint[] = [];
  progress.screens.forEach((screen, index) => {
    if (screen.maturity) maturity.push({ index, screenedOn: screen.screenedOn, roundName: screen.roundName, value: screen.maturity.offsetYears });
  });
  if (maturity.length) {
    series.push({
      key: 'maturity-offset',
      title: 'Maturity offset (years from peak height velocity; -1 to +1 is the growth-spurt window)',
      metric: 'maturity-offset',
      unit: 'years',
      points: maturity,
      threshold: null,
      // The equations' standard error is not a re-test error: no band.
      band: null,
      // Where the loads and landings are lowered (maturityBand, common practice, no source).
      window: { low: -1, high: 1 },
    });
  }
  return series;
}

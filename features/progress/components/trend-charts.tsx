import { createContext, useContext, useState, type ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { VictoryArea, VictoryAxis, VictoryBar, VictoryChart, VictoryLine, VictoryScatter } from 'victory-native';
import type { PatternId } from '@/features/screening/engine';
import { Text } from '@/features/ui/components/text';
import { colors, radius, space } from '@/features/ui/theme';
import { axisDateLabels, changeTicks, DATE_AXIS_RIGHT, labelledPoints } from '../axis-labels';
import { ERROR_MARGINS, verdictFor } from '../compare';
import { PATTERN_COLOURS, PATTERN_SHORT } from '../labels';
import {
  athleteKneeSeries,
  fullRounds,
  roundKneeAngles,
  screenedCaption,
  shareOf,
  shareSeries,
  type TrendAthlete,
  type TrendKneeAngles,
  type TrendRound,
} from '../trends';
import { formatDate } from '@/features/ui/format-date';
import { AXIS_STYLE } from './history-chart';
import { NumbersTable } from './numbers-table';

const pct = (n: number | null) => (n === null ? '–' : `${Math.round(n * 100)}%`);
const r1 = (n: number) => Math.round(n * 10) / 10;

/**
 * The width a chart is drawn at before its own layout is known, while printing: a phone's report drawn
 * again in the wide layout for the page mounts its charts anew, and the page is taken before they
 * measure themselves (they printed empty). 0: wait for the layout, as on screen.
 */
export const ChartPrintWidth = createContext(0);

function ChartFrame({
  title,
  note,
  children,
  table,
  testID,
}: {
  title: string;
  note?: string;
  children: (width: number) => ReactNode;
  table: ReactNode;
  testID?: string;
}) {
  const [measured, setWidth] = useState(0);
  const printWidth = useContext(ChartPrintWidth);
  const width = measured || printWidth;
  return (
    <View style={styles.frame} testID={testID}>
      <Text variant="label">{title}</Text>
      <View style={styles.chart} onLayout={(e) => setWidth(Math.round(e.nativeEvent.layout.width))} aria-hidden>
        {width > 0 ? children(width) : null}
      </View>
      {note ? <Text variant="small">{note}</Text> : null}
      {table}
    </View>
  );
}

// The two charts across rounds share their frame and date axis.
const ROUNDS_PADDING = { top: 10, bottom: 30, left: 42, right: DATE_AXIS_RIGHT };

/** The rounds' dates below the chart (also when every value is negative), thinned to fit its width. */
function roundDateAxis(rounds: readonly TrendRound[], width: number) {
  const picked = labelledPoints(rounds.length, width - ROUNDS_PADDING.left - ROUNDS_PADDING.right);
  const labels = axisDateLabels(
    rounds.map((r) => r.screenedOn),
    picked,
  );
  return <VictoryAxis orientation="bottom" offsetY={30} tickValues={picked} tickFormat={(i: number) => labels.get(i) ?? ''} style={AXIS_STYLE} />;
}

export function patternsIn(rounds: readonly TrendRound[]): PatternId[] {
  const seen = new Set<PatternId>();
  for (const r of rounds) for (const p of Object.keys(r.flagged) as PatternId[]) seen.add(p);
  return (Object.keys(PATTERN_SHORT) as PatternId[]).filter((p) => seen.has(p));
}

/** Share of the screened squad with each flag, per round. */
export function FlagShareChart({ rounds: all, title, testID }: { rounds: TrendRound[]; title: string; testID?: string }) {
  // Drawn for the rounds most of the squad took part in; the numbers table has them all.
  const { rounds, leftOut } = fullRounds(all);
  const patterns = patternsIn(all);
  const withData = rounds;
  return (
    <ChartFrame
      title={title}
      testID={testID}
      table={
        <NumbersTable
          caption={`${title}: share of screened athletes with each flag`}
          columns={['Round', 'Screened', ...patterns.map((p) => PATTERN_SHORT[p])]}
          rows={all.map((r) => [r.name, r.screened, ...patterns.map((p) => pct(shareOf(r, p)))])}
        />
      }
    >
      {(width) =>
        withData.length === 0 ? (
          <Text variant="small">No screen submitted yet.</Text>
        ) : (
          <View>
            <VictoryChart width={width} height={190} padding={ROUNDS_PADDING} domain={{ x: [-0.3, Math.max(1, rounds.length - 1) + 0.3], y: [0, 1] }}>
              {roundDateAxis(rounds, width)}
              <VictoryAxis dependentAxis offsetX={42} tickValues={[0, 0.25, 0.5, 0.75, 1]} tickFormat={(v: number) => `${v * 100}%`} style={AXIS_STYLE} />
              {patterns.map((p, k) => (
                <VictoryLine
                  key={p}
                  data={shareSeries(rounds, p, k, patterns.length)}
                  // The growth-spurt window is a stage of growing, not a movement fault: dashed, and said so
                  // in the key (its rise over a season is children growing, not the work failing).
                  style={{ data: { stroke: PATTERN_COLOURS[p], strokeWidth: 2, ...(p === 'growth-spurt-window' ? { strokeDasharray: '5,4' } : {}) } }}
                />
              ))}
              {patterns.map((p, k) => (
                <VictoryScatter key={`${p}-dots`} data={shareSeries(rounds, p, k, patterns.length)} size={3} style={{ data: { fill: PATTERN_COLOURS[p] } }} />
              ))}
            </VictoryChart>
            <View style={styles.legend}>
              {patterns.map((p) => (
                <View key={p} style={styles.legendItem}>
                  <View style={[styles.swatch, { backgroundColor: PATTERN_COLOURS[p] }]} />
                  <Text variant="small" style={styles.legendText}>
                    {p === 'growth-spurt-window' ? `${PATTERN_SHORT[p]} (a stage of growth, dashed)` : PATTERN_SHORT[p]}
                  </Text>
                </View>
              ))}
            </View>
            <Text variant="small" testID="flag-share-screened">
              {screenedCaption(rounds, (day) => formatDate(day))}
            </Text>
            {leftOut > 0 ? (
              <Text variant="small" testID="flag-share-left-out">
                {`Not drawn: ${leftOut === 1 ? '1 round' : `${leftOut} rounds`} with fewer than half as many screened as the fullest round (in the numbers table).`}
              </Text>
            ) : null}
          </View>
        )
      }
    </ChartFrame>
  );
}

function quartiles(sorted: number[]): { min: number; median: number; max: number } | null {
  if (!sorted.length) return null;
  const mid = Math.floor(sorted.length / 2);
  const median = sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
  return { min: sorted[0]!, median, max: sorted[sorted.length - 1]! };
}

/** Every screened athlete's knee angle per round (dots) with the round's median (bar). */
export function KneeDistributionChart({
  rounds,
  kneeAngles,
  measurementId,
  name,
}: {
  rounds: TrendRound[];
  kneeAngles: TrendKneeAngles;
  measurementId: string;
  name: string;
}) {
  const sorted = rounds.map((_, i) => roundKneeAngles(kneeAngles, measurementId, i));
  // Drawn for the rounds with this angle only, side by side: rounds without it (not measured, nobody
  // screened) took their places on the axis and pushed the season into its left edge.
  const drawn = sorted.map((list, i) => ({ round: rounds[i]!, list })).filter((d) => d.list.length > 0);
  const points = drawn.flatMap((d, x) => d.list.map((v) => ({ x, y: v })));
  const medians = drawn.map((d, x) => ({ x, y: quartiles(d.list)!.median }));
  return (
    <ChartFrame
      title={`Knee angle from the front per round: ${name}`}
      note="Each dot is one athlete; the dark dash is the round's median. Higher = knee further inward (valgus)."
      testID="knee-distribution-chart"
      table={
        <NumbersTable
          caption={`Knee angles, ${name}, per round`}
          columns={['Round', 'Athletes', 'Lowest (°)', 'Median (°)', 'Highest (°)']}
          rows={rounds.map((r, i) => {
            const q = quartiles(sorted[i]!);
            return [r.name, sorted[i]!.length, q ? r1(q.min) : '–', q ? r1(q.median) : '–', q ? r1(q.max) : '–'];
          })}
        />
      }
    >
      {(width) =>
        points.length === 0 ? (
          <Text variant="small">No knee angle of this task yet.</Text>
        ) : (
          <VictoryChart width={width} height={190} padding={ROUNDS_PADDING} domain={{ x: [-0.5, Math.max(1, drawn.length - 1) + 0.5] }}>
            {roundDateAxis(
              drawn.map((d) => d.round),
              width,
            )}
            <VictoryAxis dependentAxis offsetX={42} tickFormat={(v: number) => `${v}°`} style={AXIS_STYLE} />
            <VictoryScatter data={points} size={3} style={{ data: { fill: colors.pine, opacity: 0.55 } }} />
            <VictoryScatter data={medians} symbol="minus" size={6} style={{ data: { fill: colors.ink, stroke: colors.ink, strokeWidth: 3 } }} />
          </VictoryChart>
        )
      }
    </ChartFrame>
  );
}

/** Change in one knee angle per athlete between two rounds, against the published error band. */
export function ChangeChart({
  athletes,
  rounds,
  kneeAngles,
  from,
  to,
  measurementId,
  name,
}: {
  athletes: TrendAthlete[];
  rounds: TrendRound[];
  kneeAngles: TrendKneeAngles;
  from: TrendRound;
  to: TrendRound;
  measurementId: string;
  name: string;
}) {
  const margin = ERROR_MARGINS.fppa!;
  const fromIndex = rounds.indexOf(from);
  const toIndex = rounds.indexOf(to);
  // Athletes of the table without this angle in both rounds: named under the chart, not left out silently.
  const notDrawn: string[] = [];
  const rows = athletes
    .map((a) => {
      const series = athleteKneeSeries(kneeAngles, a.id, measurementId, rounds.length);
      const before = series[fromIndex];
      const after = series[toIndex];
      if (before === undefined || before === null || after === undefined || after === null) {
        notDrawn.push(`${a.firstName} ${a.lastName.slice(0, 1)}.`);
        return null;
      }
      const change = Math.round((after - before) * 100) / 100;
      return { name: `${a.firstName} ${a.lastName.slice(0, 1)}.`, before, after, change, verdict: verdictFor(change, margin.value) };
    })
    .filter((r) => r !== null);
  const maxAbs = Math.max(margin.value + 2, ...rows.map((r) => Math.abs(r.change) + 1));
  const height = Math.max(140, rows.length * 22 + 50);
  return (
    <ChartFrame
      title={`Change per athlete, ${from.name} → ${to.name}: ${name}`}
      note={`Bars to the right of 0°: the knee angle grew (the knee travelled further inward); to the left: it fell. Shaded: ±${margin.value}° smallest detectable difference (Munro, Herrington and Carolan 2012). A bar inside it is not a change we can tell from measuring error.${notDrawn.length ? ` Not drawn, without this angle in both rounds: ${notDrawn.join(', ')}.` : ''}`}
      testID="change-chart"
      table={
        <NumbersTable
          caption={`Knee angle change per athlete, ${from.name} to ${to.name}`}
          columns={['Athlete', `${from.name} (°)`, `${to.name} (°)`, 'Change (°)', 'Verdict']}
          rows={rows.map((r) => [r.name, r1(r.before), r1(r.after), r1(r.change), r.verdict === 'real-change' ? 'real change' : 'within error'])}
        />
      }
    >
      {(width) =>
        rows.length === 0 ? (
          <Text variant="small">Nobody has this knee angle in both rounds.</Text>
        ) : (
          <VictoryChart
            horizontal
            width={width}
            height={height}
            padding={{ top: 10, bottom: 30, left: 80, right: 16 }}
            domain={{ x: [0.4, rows.length + 0.6], y: [-maxAbs, maxAbs] }}
          >
            <VictoryArea
              data={[
                { x: 0.4, y: margin.value, y0: -margin.value },
                { x: rows.length + 0.6, y: margin.value, y0: -margin.value },
              ]}
              style={{ data: { fill: colors.pineSoft, stroke: 'none' } }}
            />
            {/* Names at the left edge, not where the change is zero (the bars would cover them). */}
            <VictoryAxis tickValues={rows.map((_, i) => i + 1)} tickFormat={(i: number) => rows[i - 1]?.name ?? ''} offsetX={80} style={AXIS_STYLE} />
            <VictoryAxis
              dependentAxis
              offsetY={30}
              tickValues={changeTicks(maxAbs)}
              tickFormat={(v: number) => `${v > 0 ? '+' : ''}${v}°`}
              style={AXIS_STYLE}
            />
            <VictoryBar
              data={rows.map((r, i) => ({ x: i + 1, y: r.change, verdict: r.verdict }))}
              barWidth={12}
              style={{ data: { fill: ({ datum }: { datum?: { verdict: string } }) => (datum?.verdict === 'real-change' ? colors.ink : colors.inkMuted) } }}
            />
          </VictoryChart>
        )
      }
    </ChartFrame>
  );
}

const styles = StyleSheet.create({
  frame: { gap: space.xs, padding: space.md, borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, backgroundColor: colors.surface },
  chart: { width: '100%', minHeight: 120 },
  legend: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  // A long item wraps inside the card instead of running past its edge.
  legendItem: { flexDirection: 'row', alignItems: 'center', gap: 4, maxWidth: '100%' },
  legendText: { flexShrink: 1 },
  swatch: { width: 12, height: 12, borderRadius: 2 },
});

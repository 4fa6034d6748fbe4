import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { VictoryArea, VictoryAxis, VictoryChart, VictoryLine, VictoryScatter } from 'victory-native';
import { Text } from '@/features/ui/components/text';
import { colors, fonts, radius, space } from '@/features/ui/theme';
import { axisDateLabels, DATE_AXIS_RIGHT, labelledPoints } from '../axis-labels';
import type { HistorySeries } from '../history';
import { NumbersTable } from './numbers-table';
import { formatDate } from '@/features/ui/format-date';

const round1 = (n: number) => Math.round(n * 10) / 10;
export const AXIS_STYLE = {
  axis: { stroke: colors.line },
  tickLabels: { fontFamily: fonts.regular, fontSize: 11, fill: colors.inkMuted, padding: 4 },
  grid: { stroke: 'transparent' },
};

/** One measurement over time: the athlete's values, the flag threshold (dashed) and the error band (shaded). */
export function HistoryChart({ series }: { series: HistorySeries }) {
  const [width, setWidth] = useState(0);
  const xs = series.points.map((p) => p.index);
  const minX = Math.min(...xs) - 0.4;
  const maxX = Math.max(...xs) + 0.4;
  const ys = series.points.map((p) => p.value);
  if (series.threshold) ys.push(series.threshold.value);
  if (series.concern) ys.push(series.concern.value);
  if (series.band) ys.push(series.band.low, series.band.high);
  // The window and its edges in sight (a season's offsets from -1.0 to -0.4 hid where it begins).
  if (series.window) ys.push(series.window.low, series.window.high);
  const pad = Math.max(1, (Math.max(...ys) - Math.min(...ys)) * 0.1);
  const domainY: [number, number] = [Math.min(...ys) - pad, Math.max(...ys) + pad];
  const picked = width > 0 ? labelledPoints(xs.length, width - 40 - DATE_AXIS_RIGHT) : [];
  const dateLabels = axisDateLabels(
    series.points.map((p) => p.screenedOn),
    picked,
  );
  const dateOf = new Map(picked.map((i) => [xs[i]!, dateLabels.get(i) ?? '']));
  const summary = series.points.map((p) => `${p.roundName} ${round1(p.value)}${series.unit === '°' ? '°' : ` ${series.unit}`}`).join(', ');

  return (
    <View style={styles.wrap} testID="history-chart">
      {/* The unit by the title: the axis carries numbers only (a unit on every tick did not fit its 40 px). */}
      <Text variant="label">
        {series.title}
        {series.title.includes(series.unit) ? '' : ` (${series.unit})`}
      </Text>
      <View onLayout={(e) => setWidth(Math.round(e.nativeEvent.layout.width))} accessibilityLabel={`Chart: ${series.title}. ${summary}.`} style={styles.chart}>
        {width > 0 ? (
          <VictoryChart width={width} height={170} padding={{ top: 10, bottom: 28, left: 40, right: DATE_AXIS_RIGHT }} domain={{ x: [minX, maxX], y: domainY }}>
            {series.window ? (
              <VictoryArea
                data={[
                  { x: minX, y: series.window.high, y0: series.window.low },
                  { x: maxX, y: series.window.high, y0: series.window.low },
                ]}
                style={{ data: { fill: colors.amberSoft, stroke: 'none' } }}
              />
            ) : null}
            {series.band ? (
              <VictoryArea
                data={[
                  { x: minX, y: series.band.high, y0: series.band.low },
                  { x: maxX, y: series.band.high, y0: series.band.low },
                ]}
                style={{ data: { fill: colors.pineSoft, stroke: 'none' } }}
              />
            ) : null}
            {/* The watch line dashed, the concern line dotted beyond it. */}
            {[
              { at: series.threshold?.value, dash: '5,4', width: 1.5 },
              { at: series.concern?.value, dash: '1,3', width: 2.5 },
            ].map((line) =>
              line.at === undefined ? null : (
                <VictoryLine
                  key={line.dash}
                  data={[
                    { x: minX, y: line.at },
                    { x: maxX, y: line.at },
                  ]}
                  style={{ data: { stroke: colors.brick, strokeDasharray: line.dash, strokeWidth: line.width } }}
                />
              ),
            )}
            <VictoryLine data={series.points.map((p) => ({ x: p.index, y: p.value }))} style={{ data: { stroke: colors.ink, strokeWidth: 2 } }} />
            <VictoryScatter data={series.points.map((p) => ({ x: p.index, y: p.value }))} size={4} style={{ data: { fill: colors.pine } }} />
            {/* Axes last and pinned to the chart's edges (not where the other value is zero), so the band never covers them;
                the dates stay below when every value is negative (a maturity offset before the growth spurt). */}
            <VictoryAxis
              orientation="bottom"
              offsetY={28}
              tickValues={picked.map((i) => xs[i]!)}
              tickFormat={(x: number) => dateOf.get(x) ?? ''}
              style={AXIS_STYLE}
            />
            <VictoryAxis dependentAxis orientation="left" offsetX={40} style={AXIS_STYLE} tickCount={4} />
          </VictoryChart>
        ) : null}
      </View>
      <View style={styles.legend}>
        {series.threshold ? (
          <Text variant="small">
            <Text variant="small" style={{ color: colors.brick }}>
              - - -
            </Text>{' '}
            flagged {series.threshold.flagWhen} {series.threshold.value}
            {series.unit === '°' ? '°' : ` ${series.unit}`}
          </Text>
        ) : null}
        {series.concern && series.threshold ? (
          <Text variant="small" testID="history-concern-key">
            <Text variant="small" style={{ color: colors.brick }}>
              · · ·
            </Text>{' '}
            concern {series.threshold.flagWhen} {series.concern.value}
            {series.unit === '°' ? '°' : ` ${series.unit}`}
          </Text>
        ) : null}
        {series.window ? (
          <Text variant="small" testID="history-window-key">
            <Text variant="small" style={styles.windowKey}>
              {'   '}
            </Text>{' '}
            the growth-spurt window, {series.window.low} to +{series.window.high} year: loads and landings are lowered there
          </Text>
        ) : null}
        {series.band ? (
          <Text variant="small">
            <Text variant="small" style={styles.bandKey}>
              {'   '}
            </Text>{' '}
            ±{series.band.margin}
            {series.unit === '°' ? '°' : ` ${series.unit}`} measuring error around {round1(series.band.around)}: a later point inside it is not a change
          </Text>
        ) : (
          <Text variant="small">No published measuring error: changes are shown, not judged.</Text>
        )}
      </View>
      <NumbersTable
        caption={`${series.title}: values per screen`}
        columns={['Screen', 'Date', `Value (${series.unit})`]}
        rows={series.points.map((p) => [p.roundName, formatDate(p.screenedOn), round1(p.value)])}
      />
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs, padding: space.md, borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, backgroundColor: colors.surface },
  chart: { width: '100%', minHeight: 170 },
  legend: { gap: 2 },
  bandKey: { backgroundColor: colors.pineSoft },
  windowKey: { backgroundColor: colors.amberSoft },
});

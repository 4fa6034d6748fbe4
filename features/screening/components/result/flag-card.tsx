import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import type { ThresholdRef } from '@/features/screening/engine';
import { citationsIn, shortSource } from '@/features/screening/engine/sources';
import { thresholdWhereText, type FlagGroup } from '@/features/screening/flag-groups';
import { basisText, sideLabel, thresholdText, valueText } from '@/features/screening/labels';
import { Text } from '@/features/ui/components/text';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/features/ui/theme';
import { SeverityTag } from '../status-tag';

/**
 * One pattern on one side, in plain words: how serious, the tasks that showed it with their evidence,
 * each threshold with the kind of source and how sure it is, and the full references behind "Sources".
 */
export function FlagCard({ group }: { group: FlagGroup }) {
  const side = sideLabel(group.side);
  const [open, setOpen] = useState(false);
  const references = uniqueCitations(group.thresholds);
  return (
    <View style={[styles.card, group.severity === 'concern' ? styles.concern : styles.watch]} testID={`flag-group-${group.key.replace('/', '-')}`}>
      <View style={styles.head}>
        <SeverityTag severity={group.severity} />
        {side ? <Text variant="label">{side}</Text> : null}
      </View>
      <Text variant="heading">{group.title}</Text>
      <Text variant="small">{group.tasks.length === 1 ? 'Seen in 1 task' : `Seen in ${group.tasks.length} tasks`}</Text>
      <View style={styles.tasks} testID="flag-evidence">
        {group.tasks.map((t) => (
          <View key={t.flagId} style={styles.task}>
            <Text style={styles.taskTitle}>{t.where}</Text>
            {t.evidence.map((e) => (
              <Text key={e.kind === 'measurement' ? e.measurementId : `${e.taskId}:${e.criterionId}`}>
                {e.kind === 'measurement' ? `• ${e.label}: ${valueText(e.value, e.unit)}` : `• Seen: ${e.label}`}
              </Text>
            ))}
          </View>
        ))}
      </View>
      {group.thresholds.map((t, i) => (
        // The same population note on several thresholds of one card is said once, on the first.
        <ThresholdLine
          key={t.rowId}
          threshold={t}
          where={thresholdWhereText(group.thresholdWhere[t.rowId] ?? [], new Set(group.tasks.map((x) => x.where)).size)}
          showPopulation={!group.thresholds.slice(0, i).some((x) => x.populationNote === t.populationNote)}
        />
      ))}
      <Pressable accessibilityRole="button" aria-expanded={open} onPress={() => setOpen((o) => !o)} style={styles.more} testID="flag-sources-toggle">
        <Text style={styles.moreText}>{open ? 'Hide sources ▲' : 'Sources ▼'}</Text>
      </Pressable>
      {open ? (
        <View style={styles.sources} testID="flag-sources">
          {group.thresholds
            .filter((t) => t.derivation)
            .map((t) => (
              <Text key={t.rowId} variant="small">
                How the {valueText(t.value, t.unit, 2)} threshold is derived: {t.derivation}.
              </Text>
            ))}
          {references.length === 0 ? (
            <Text variant="small">No published source: these thresholds are common practice or Squadline&apos;s own choice.</Text>
          ) : null}
          {references.map((r) => (
            <Text key={r} variant="small">
              {r}
            </Text>
          ))}
        </View>
      ) : null}
    </View>
  );
}

/** One threshold met; on a card of several tasks, where it was met (`thresholdWhereText`). */
function ThresholdLine({ threshold: t, where, showPopulation }: { threshold: ThresholdRef; where: string | null; showPopulation: boolean }) {
  return (
    <View style={styles.threshold} testID="flag-threshold">
      <Text variant="small" style={styles.thresholdMain}>
        {thresholdText(t)} ({t.severity} level){citationsIn(t.source).length > 0 ? ` · ${shortSource(t.source)}` : ''}
      </Text>
      {where ? (
        <Text variant="small" testID="flag-threshold-where">
          {where}
        </Text>
      ) : null}
      <Text variant="small" testID="flag-basis">
        {basisText(t)}
      </Text>
      {t.populationNote && showPopulation ? (
        <Text variant="small" style={styles.population} testID="flag-population">
          ⚠ {t.populationNote}
        </Text>
      ) : null}
    </View>
  );
}

function uniqueCitations(thresholds: readonly ThresholdRef[]): string[] {
  const out: string[] = [];
  for (const t of thresholds) for (const c of citationsIn(t.source)) if (!out.includes(c.full)) out.push(c.full);
  return out;
}

const styles = StyleSheet.create({
  card: {
    gap: space.xs,
    padding: space.md,
    borderRadius: radius.md,
    backgroundColor: colors.surface,
    borderWidth: 1,
    borderColor: colors.line,
    borderLeftWidth: 6,
  },
  watch: { borderLeftColor: colors.amber },
  concern: { borderLeftColor: colors.brick },
  head: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  tasks: { gap: space.sm, paddingVertical: space.xs },
  task: { gap: 2 },
  taskTitle: { fontFamily: fonts.bold },
  threshold: { gap: 2, paddingTop: space.xs, borderTopWidth: 1, borderTopColor: colors.line },
  thresholdMain: { fontFamily: fonts.bold, color: colors.ink },
  population: { color: colors.amber, fontFamily: fonts.bold },
  more: { minHeight: TOUCH_MIN, justifyContent: 'center', alignSelf: 'flex-start' },
  moreText: { fontFamily: fonts.bold, color: colors.pine },
  sources: { gap: space.xs },
});

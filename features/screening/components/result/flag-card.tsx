import { StyleSheet, View } from 'react-native';
import { getTask } from '@/features/screening/engine/for-screens';
import type { Flag } from '@/features/screening/engine';
import { sideLabel, thresholdText, valueText } from '@/features/screening/labels';
import { Text } from '@/features/ui/components/text';
import { colors, radius, space } from '@/features/ui/theme';
import { SeverityTag } from '../status-tag';

export function flagScope(flag: Flag): string {
  if (flag.taskId) return getTask(flag.taskId).title;
  if (flag.comparesTasks) return `${getTask(flag.comparesTasks[0]).title} compared with the ${flag.comparesTasks[1].endsWith('right') ? 'right' : 'other'} side`;
  return 'Whole assessment';
}

/** A flag in plain words: what, where, how serious, the evidence, the threshold and its source. */
export function FlagCard({ flag }: { flag: Flag }) {
  const side = sideLabel(flag.side);
  return (
    <View style={[styles.card, flag.severity === 'concern' ? styles.concern : styles.watch]} testID={`flag-${flag.id}`}>
      <View style={styles.head}>
        <SeverityTag severity={flag.severity} />
        {side ? <Text variant="label">{side}</Text> : null}
      </View>
      <Text variant="heading">{flag.title}</Text>
      <Text variant="small">{flagScope(flag)}</Text>
      <View style={styles.evidence}>
        {flag.evidence.map((e) => (
          <Text key={e.kind === 'measurement' ? e.measurementId : e.criterionId}>
            {e.kind === 'measurement' ? `• ${e.label}: ${valueText(e.value, e.unit)}` : `• Seen: ${e.label}`}
          </Text>
        ))}
      </View>
      <Text variant="small">
        {thresholdText(flag.threshold)} ({flag.threshold.severity === 'concern' ? 'concern' : 'watch'} level). Source: {flag.source}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.xs, padding: space.md, borderRadius: radius.md, backgroundColor: colors.surface, borderWidth: 1, borderColor: colors.line, borderLeftWidth: 6 },
  watch: { borderLeftColor: colors.amber },
  concern: { borderLeftColor: colors.brick },
  head: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  evidence: { gap: 2, paddingVertical: space.xs },
});

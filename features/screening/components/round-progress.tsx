import { StyleSheet, View } from 'react-native';
import type { RoundSummary } from '@/features/screening/contract';
import { Text } from '@/features/ui/components/text';
import { space } from '@/features/ui/theme';
import { ProgressBar } from './progress-bar';

export function roundTotal(r: RoundSummary): number {
  return r.counts.not_started + r.counts.in_progress + r.counts.submitted;
}

/** "4 of 12 submitted · 2 in progress" with a bar. */
export function RoundProgress({ round }: { round: RoundSummary }) {
  const total = roundTotal(round);
  const text = `${round.counts.submitted} of ${total} submitted${round.counts.in_progress ? ` · ${round.counts.in_progress} in progress` : ''}`;
  return (
    <View style={styles.wrap}>
      <Text variant="small">{text}</Text>
      <ProgressBar fraction={total ? round.counts.submitted / total : 0} label={text} />
    </View>
  );
}

const styles = StyleSheet.create({ wrap: { gap: space.xs } });

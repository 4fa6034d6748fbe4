import { StyleSheet, View } from 'react-native';
import type { AssessmentStatus, RoundSummary } from '@/features/screening/contract';
import { Text } from '@/features/ui/components/text';
import { space } from '@/features/ui/theme';
import { ProgressBar } from './progress-bar';

export function roundTotal(r: RoundSummary): number {
  return r.counts.not_started + r.counts.in_progress + r.counts.submitted;
}

/**
 * "4 of 12 submitted · 2 in progress" with a bar; submits kept on this phone (`waiting`) are counted
 * apart, as the rows say them ("1 submitted on this phone, waiting to send"), not as in progress.
 */
export function RoundProgress({ round, waiting = [] }: { round: RoundSummary; waiting?: readonly AssessmentStatus[] }) {
  const total = roundTotal(round);
  const inProgress = Math.max(0, round.counts.in_progress - waiting.filter((s) => s === 'in_progress').length);
  const text = `${round.counts.submitted} of ${total} submitted${waiting.length ? ` · ${waiting.length} submitted on this phone, waiting to send` : ''}${inProgress ? ` · ${inProgress} in progress` : ''}`;
  return (
    <View style={styles.wrap}>
      <Text variant="small">{text}</Text>
      <ProgressBar fraction={total ? round.counts.submitted / total : 0} label={text} />
    </View>
  );
}

const styles = StyleSheet.create({ wrap: { gap: space.xs } });

import { StyleSheet, View } from 'react-native';
import { useClearanceOf, usePainWaitingOf } from '@/features/care/api/get-clearances';
import type { TaskDraft } from '@/features/screening/contract';
import type { TaskId } from '@/features/screening/engine';
import { Button } from '@/features/ui/components/button';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { formatDate } from '@/features/ui/format-date';
import { space } from '@/features/ui/theme';

/** The battery's landing task: the one a hold on landing work keeps an athlete from (our choice). */
export const LANDING_TASK: TaskId = 'drop-landing';

/**
 * Why landing work waits for this athlete, in a line for the tester, or null: pain reported at the newest
 * screen with no physiotherapist's decision since, a referral, or "train with changes" holding landings.
 */
export function landingHoldReason(firstName: string, clearance: ReturnType<typeof useClearanceOf>, pain: ReturnType<typeof usePainWaitingOf>): string | null {
  if (pain) return `pain was reported at the screen of ${formatDate(pain.screenedOn)} and no physiotherapist has decided since`;
  if (clearance?.status === 'referred')
    return `${clearance.setByName ?? 'a physiotherapist'} referred ${firstName} on (${formatDate(clearance.setAt.slice(0, 10))})`;
  if (clearance?.status === 'modified' && clearance.holds.includes('landing')) return `the physiotherapist holds landing work back until a new clearance`;
  return null;
}

/**
 * Courtside, where it is read before the athlete moves: on the body step, that the landing task is to be
 * skipped and why; on the landing task itself, not to run it, with one tap to skip it with the reason.
 */
export function CaptureHoldNotice({
  athleteId,
  firstName,
  taskId,
  task,
  onSkip,
}: {
  athleteId: string;
  firstName: string;
  /** null on the body step. */
  taskId: TaskId | null;
  task?: TaskDraft;
  onSkip?: (reason: string) => void;
}) {
  const reason = landingHoldReason(firstName, useClearanceOf(athleteId), usePainWaitingOf(athleteId));
  if (!reason || (taskId !== null && taskId !== LANDING_TASK)) return null;
  if (taskId === null) {
    return (
      <Notice tone="error" title={`${firstName}: no landing task today`} testID="capture-hold">
        {`Skip the drop landing: ${reason}. Stop any task that hurts.`}
      </Notice>
    );
  }
  const skipReason = `On hold: ${reason}.`;
  return (
    <Notice tone="error" title={`Do not run this task with ${firstName}`} testID="capture-hold">
      <View style={styles.body}>
        <Text>{`Landing work waits: ${reason}.`}</Text>
        {task?.painReported ? null : task?.skipped ? (
          <Text variant="small">Skipped, with the reason kept.</Text>
        ) : onSkip ? (
          <Button label="Skip it: on hold" tone="secondary" testID="capture-hold-skip" onPress={() => onSkip(skipReason)} />
        ) : null}
      </View>
    </Notice>
  );
}

const styles = StyleSheet.create({
  body: { gap: space.sm },
});

import { StyleSheet, View } from 'react-native';
import { useClearanceOf, usePainWaitingOf } from '@/features/care/api/get-clearances';
import type { TaskDraft } from '@/features/screening/contract';
import type { TaskId } from '@/features/screening/engine';
import { getTask } from '@/features/screening/engine/battery';
import { LANDING_TASK, painEarlierToday } from './pain-today';
import { Button } from '@/features/ui/components/button';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { formatDate } from '@/features/ui/format-date';
import { space } from '@/features/ui/theme';

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
 * The tasks not to run with this athlete today: the landing task while landing work waits (pain undecided,
 * a referral, landings held), and every task that hurt at the screen whose pain still waits for a
 * physiotherapist (our choice: running again what hurt, before anyone has looked, is what the pain box
 * stops).
 */
export function heldTasks(clearance: ReturnType<typeof useClearanceOf>, pain: ReturnType<typeof usePainWaitingOf>, firstName: string): TaskId[] {
  const out = new Set<TaskId>();
  if (landingHoldReason(firstName, clearance, pain)) out.add(LANDING_TASK);
  for (const id of pain?.taskIds ?? []) out.add(id as TaskId);
  return [...out];
}

const titleOf = (id: TaskId) => {
  try {
    return getTask(id).title;
  } catch {
    return id;
  }
};

/**
 * Courtside, where it is read before the athlete moves: on the body step, which tasks to skip and why; on
 * such a task itself, not to run it, with one tap to skip it with the reason.
 */
export function CaptureHoldNotice({
  athleteId,
  firstName,
  taskId,
  task,
  tasks,
  onSkip,
}: {
  athleteId: string;
  firstName: string;
  /** null on the body step. */
  taskId: TaskId | null;
  task?: TaskDraft;
  /** This screen's tasks so far: pain ticked on one holds what follows (PainTodayNotice). */
  tasks?: Partial<Record<TaskId, TaskDraft>>;
  onSkip?: (reason: string) => void;
}) {
  const clearance = useClearanceOf(athleteId);
  const pain = usePainWaitingOf(athleteId);
  const reason = landingHoldReason(firstName, clearance, pain);
  const held = heldTasks(clearance, pain, firstName);
  const earlierHold = !!reason && held.length > 0 && (taskId === null || held.includes(taskId));
  const hurtToday = taskId !== null && tasks ? painEarlierToday(tasks, taskId) : [];
  if (!earlierHold) {
    return hurtToday.length > 0 && taskId !== null ? (
      <PainTodayNotice firstName={firstName} taskId={taskId} hurt={hurtToday} task={task} onSkip={onSkip} />
    ) : null;
  }
  if (!reason) return null;
  if (taskId === null) {
    return (
      <Notice tone="error" title={`${firstName}: tasks to skip today`} testID="capture-hold">
        {`Skip the ${held.map(lowerTitle).join(', the ')}: ${reason}. Stop any task that hurts.`}
      </Notice>
    );
  }
  const hurtHere = pain?.taskIds.includes(taskId) === true;
  const why = hurtHere ? `it hurt at the screen of ${formatDate(pain!.screenedOn)}, and no physiotherapist has decided since` : reason;
  return (
    <Notice tone="error" title={`Do not run this task with ${firstName}`} testID="capture-hold">
      <View style={styles.body}>
        <Text>{hurtHere ? `Not today: ${why}.` : `Landing work waits: ${why}.`}</Text>
        <SkipAction task={task} onSkip={onSkip} label="Skip it: on hold" reason={`On hold: ${why}.`} testID="capture-hold-skip" />
      </View>
    </Notice>
  );
}

/**
 * Pain ticked earlier in this screen: the landing task is not run (the plan will hold landing work until a
 * physiotherapist decides); any other task only if the athlete says nothing hurts now, stopped at once if
 * it does (our choice, with the usual rule of stopping a screen on pain).
 */
function PainTodayNotice({
  firstName,
  taskId,
  hurt,
  task,
  onSkip,
}: {
  firstName: string;
  taskId: TaskId;
  hurt: TaskId[];
  task?: TaskDraft;
  onSkip?: (reason: string) => void;
}) {
  const during = hurt.map(lowerTitle).join(', the ');
  const landing = taskId === LANDING_TASK;
  const why = `pain was reported today during the ${during}`;
  return (
    <Notice
      tone={landing ? 'error' : 'caution'}
      title={landing ? `Do not run this task with ${firstName}` : `${firstName} said something hurt`}
      testID="capture-pain-today"
    >
      <View style={styles.body}>
        <Text>
          {landing
            ? `Landing work waits: ${why}, and the plan holds landings until a physiotherapist decides.`
            : `Pain was reported during the ${during}. Ask ${firstName} whether anything hurts now: run this task only if nothing does, and stop at once if it hurts. Otherwise skip it.`}
        </Text>
        <SkipAction
          task={task}
          onSkip={onSkip}
          label={landing ? 'Skip it: on hold' : 'Skip it'}
          reason={landing ? `On hold: ${why}.` : `Not run: ${why}.`}
          testID="capture-pain-today-skip"
        />
      </View>
    </Notice>
  );
}

/** A task's title inside a sentence ("the drop landing from a low box"). */
const lowerTitle = (id: TaskId) => titleOf(id).replace(/^./, (c) => c.toLowerCase());

/** The one tap that skips a held task with its reason; said once it is skipped; nothing on a task that hurt. */
function SkipAction({
  task,
  onSkip,
  label,
  reason,
  testID,
}: {
  task?: TaskDraft;
  onSkip?: (reason: string) => void;
  label: string;
  reason: string;
  testID: string;
}) {
  if (task?.painReported) return null;
  if (task?.skipped) return <Text variant="small">Skipped, with the reason kept.</Text>;
  return onSkip ? <Button label={label} tone="secondary" testID={testID} onPress={() => onSkip(reason)} /> : null;
}

const styles = StyleSheet.create({
  body: { gap: space.sm },
});

import { Pressable, StyleSheet, View } from 'react-native';
import type { AssessmentDetail, AssessmentDraft, PhotoView } from '@/features/screening/contract';
import { BATTERY } from '@/features/screening/engine/battery';
import type { TaskId, View as PhotoSide } from '@/features/screening/engine';
import { Notice } from '@/features/ui/components/notice';
import { oneRepMaxWarning, usableOneRepMax } from '@/features/screening/one-rep-max';
import { Text } from '@/features/ui/components/text';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/features/ui/theme';

type Props = {
  detail: AssessmentDetail;
  /** Tasks not to run with this athlete today (capture's stop notices): said as such, never asked for. */
  held?: readonly TaskId[];
  draft: AssessmentDraft;
  photoFor(taskId: TaskId, view: PhotoSide): PhotoView | undefined;
  goTo(step: string): void;
};

function bodySummary(draft: AssessmentDraft): string {
  const b = draft.body ?? {};
  const parts = [
    b.statureCm != null ? `standing ${b.statureCm} cm` : null,
    b.sittingHeightCm != null ? `sitting ${b.sittingHeightCm} cm` : null,
    b.massKg != null ? `${b.massKg} kg` : null,
    draft.oneRepMaxKg != null ? `split-squat 1RM ${draft.oneRepMaxKg} kg` : null,
  ].filter(Boolean);
  return parts.length ? parts.join(' · ') : 'Not measured';
}

/** What was captured, what is missing, then submit (the button is in the bottom bar). */
export function ReviewStep({ detail, draft, photoFor, goTo, held = [] }: Props) {
  const missing: string[] = [];
  const noPhoto: string[] = [];
  let toMeasure = 0;
  const rows = BATTERY.map((task, i) => {
    const t = draft.tasks[task.id];
    const lines: string[] = [];
    let state: 'todo' | 'done' | 'partial' | 'skipped' = 'todo';
    if (t?.skipped) {
      state = 'skipped';
      lines.push(`Skipped${t.skipReason ? `: ${t.skipReason}` : ''}`);
      // The task asks for the reason, for the record: its absence is listed with what is missing.
      if (!t.skipReason?.trim()) missing.push(`${task.title}: why it was skipped`);
    } else if (held.includes(task.id) && !t?.painReported) {
      // Run anyway or passed with Next: not a gap to fill but a task to skip with its reason.
      state = 'partial';
      lines.push('On hold today: skip it');
      missing.push(`${task.title}: on hold today, skip it (its stop says why)`);
    } else if (t) {
      state = 'done';
      lines.push(t.criteria.length === 0 ? 'Nothing ticked' : `${t.criteria.length} ticked`);
      if (task.distance) {
        lines.push(t.distanceCm != null ? `${t.distanceCm} cm` : 'no distance');
        if (t.distanceCm == null) {
          state = 'partial';
          missing.push(`${task.title}: distance`);
        }
      }
      for (const v of task.views) {
        // No photo without consent, nor of a task stopped because it hurt.
        if (!detail.athlete.photoConsent || t.painReported) continue;
        const photo = photoFor(task.id, v.view);
        const placed = Object.values(t.landmarks?.[v.view] ?? {}).filter(Boolean).length;
        if (photo && placed === 0) toMeasure += 1;
        if (photo) lines.push(placed === 0 ? `${v.view} photo, landmarks later` : `${v.view} photo, ${placed}/${v.landmarks.length} points`);
        else if (v.required) {
          // Photos are optional (no photo, no angle from it): listed apart from the gaps, and the task stays
          // ticked off (our choice: seven "!" for photos hid a missing distance or skip reason).
          lines.push(`no ${v.view} photo`);
          if (!noPhoto.includes(task.title)) noPhoto.push(task.title);
        }
      }
    } else {
      missing.push(`${task.title}: not done`);
    }
    return { task, i, state, lines };
  });
  // As the engine is told (draftToInput): pain counts even on a task marked skipped.
  const painTasks = rows.filter((r) => draft.tasks[r.task.id]?.painReported);
  const painNotice =
    painTasks.length > 0 ? (
      <Notice tone="error" title="Pain was reported" testID="review-pain">
        {`During: ${painTasks.map((r) => r.task.title).join(', ')}. The plan will ask for clearance by a physiotherapist or doctor before it starts.`}
      </Notice>
    ) : null;

  return (
    <View style={styles.wrap}>
      {/* First, where the eye lands: pain decides what the plan may start with. */}
      {painNotice}
      {/* Above the rows, where it is seen: under ten rows it sat behind the bottom bar. */}
      {missing.length > 0 ? (
        <Notice tone="caution" title="Not everything is captured" testID="review-missing">
          <View style={styles.list}>
            <Text>You can still submit: what is missing is left out of the result.</Text>
            {missing.map((m) => (
              <Text key={m}>• {m}</Text>
            ))}
          </View>
        </Notice>
      ) : null}
      {noPhoto.length > 0 ? (
        <Text variant="small" testID="review-no-photo">
          {`No photo for: ${noPhoto.join(', ')}. Photos are optional: the angles measured on them are left out, the ticks count.`}
        </Text>
      ) : null}
      <Pressable accessibilityRole="button" onPress={() => goTo('body')} style={styles.row}>
        <Text style={styles.mark}>{bodySummary(draft) === 'Not measured' ? '○' : '✓'}</Text>
        <View style={styles.rowText}>
          <Text variant="label">Body measurements</Text>
          <Text variant="small">{bodySummary(draft)}</Text>
          {oneRepMaxWarning(draft.oneRepMaxKg, draft.body?.massKg) ? (
            <Text variant="small" style={styles.warn} testID="review-one-rep-max-warning">
              {usableOneRepMax(draft) == null
                ? `Not confirmed: the plan will use bodyweight, not ${draft.oneRepMaxKg} kg. ${oneRepMaxWarning(draft.oneRepMaxKg, draft.body?.massKg)}`
                : `Confirmed by you after the check: loads are worked out from ${draft.oneRepMaxKg} kg.`}
            </Text>
          ) : null}
        </View>
      </Pressable>
      {rows.map(({ task, i, state, lines }) => (
        <Pressable key={task.id} accessibilityRole="button" onPress={() => goTo(task.id)} style={styles.row} testID={`review-${task.id}`}>
          {/* A task with a gap is not ticked off: "!" in amber, as the notice above lists it. */}
          <Text style={[styles.mark, state === 'partial' && styles.partial]}>{MARKS[state]}</Text>
          <View style={styles.rowText}>
            <Text variant="label">
              {i + 1}. {task.title}
            </Text>
            <Text variant="small">{state === 'todo' ? 'Not done yet' : lines.join(' · ')}</Text>
            {draft.tasks[task.id]?.painReported ? (
              <Text variant="small" style={styles.pain}>
                Pain reported
              </Text>
            ) : null}
          </View>
        </Pressable>
      ))}
      {toMeasure > 0 ? (
        <Notice title="Landmarks can wait" testID="review-to-measure">
          {`${toMeasure === 1 ? 'One photo has' : `${toMeasure} photos have`} no landmarks yet. Submit now: the result uses what you ticked and typed. The photos wait in the "To measure" list; once their points are placed there, the result is worked out again as a new version.`}
        </Notice>
      ) : null}
      <Notice>
        {detail.status === 'submitted'
          ? 'This assessment was submitted before. Submitting again replaces its result; the earlier one stays in its history.'
          : 'Submitting computes the flags and the corrective plan. You can still edit and submit again later.'}
      </Notice>
    </View>
  );
}

const MARKS = { done: '✓', partial: '!', skipped: '–', todo: '○' } as const;

const styles = StyleSheet.create({
  partial: { color: colors.amber, fontFamily: fonts.bold },
  wrap: { gap: space.sm },
  warn: { color: colors.amber, fontFamily: fonts.bold },
  pain: { color: colors.brick, fontFamily: fonts.bold },
  row: {
    minHeight: TOUCH_MIN + 8,
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    padding: space.md,
    borderRadius: radius.md,
    backgroundColor: colors.surface,
    borderWidth: 1,
    borderColor: colors.line,
  },
  mark: { fontFamily: fonts.bold, fontSize: 20, width: 24, textAlign: 'center', color: colors.pine },
  rowText: { flex: 1, gap: 2 },
  list: { gap: space.xs },
});

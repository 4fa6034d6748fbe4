import { useEffect, useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { ValidationError } from 'yup';
import type { AssessmentDetail, PhotoView, TaskDraft } from '@/features/screening/contract';
import { taskDraftSchema } from '@/features/screening/contract';
import type { TaskSpec, View as PhotoSide } from '@/features/screening/engine';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { TextField } from '@/features/ui/components/text-field';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/features/ui/theme';
import { TickBox } from '../tick-box';
import { NumberField } from './number-field';
import { PhotoSlot } from './photo-slot';

type Props = {
  task: TaskSpec;
  value: TaskDraft | undefined;
  onChange(change: (t: TaskDraft) => TaskDraft): void;
  detail: AssessmentDetail;
  photos: Partial<Record<PhotoSide, PhotoView>>;
  /** A new photo was taken for a view: the points placed on the old one no longer apply. */
  onNewPhoto(view: PhotoSide): void;
  onPlaceLandmarks(view: PhotoSide): void;
};

/** The contract's check of a distance, said with the field's own label ("Big toe to wall (cm) must be ..."). */
function distanceError(n: number | null, label: string): string | null {
  try {
    taskDraftSchema.validateSyncAt('distanceCm', { distanceCm: n });
    return null;
  } catch (e) {
    return e instanceof ValidationError ? e.message.replace(/^Distance \(cm\)/, label) : 'Check this value.';
  }
}

/** One task of the battery: safety and pain first, what to watch, then the distance, photos (beside on a wide screen) and ticks, notes. */
/** The tasks whose guidance this tab has shown in full (session storage, our choice: a round screens a
 * dozen athletes through the same tasks, and the guidance read twelve times was two swipes a task). */
const GUIDED_KEY = 'squadline.capture.guided';
function guidedTasks(): string[] {
  try {
    const seen: unknown = JSON.parse(globalThis.sessionStorage?.getItem(GUIDED_KEY) ?? '[]');
    return Array.isArray(seen) ? seen.filter((x): x is string => typeof x === 'string') : [];
  } catch {
    return [];
  }
}
function markGuided(taskId: string): void {
  try {
    const list = guidedTasks();
    if (!list.includes(taskId)) globalThis.sessionStorage?.setItem(GUIDED_KEY, JSON.stringify([...list, taskId]));
  } catch {
    // No storage: shown in full every time.
  }
}

export function TaskStep({ task, value, onChange, detail, photos, onNewPhoto, onPlaceLandmarks }: Props) {
  const { isWide } = useBreakpoints();
  const [showHow, setShowHow] = useState(false);
  // Shown in full the first time in this tab; afterwards folded under one line (the safety and pain box stay).
  const [folded] = useState(() => !isWide && guidedTasks().includes(task.id));
  useEffect(() => markGuided(task.id), [task.id]);
  // Burst: once a photo is picked, the task's next slot without a photo opens by itself.
  const [armed, setArmed] = useState<PhotoSide | null>(null);
  const armAfter = (view: PhotoSide) => {
    const i = task.views.findIndex((v) => v.view === view);
    const following = task.views.slice(i + 1).find((v) => v.required && !photos[v.view]);
    setArmed(following?.view ?? null);
  };
  const t: TaskDraft = value ?? { criteria: [] };
  const ticked = new Set(t.criteria);
  const skipped = t.skipped === true;
  const toggle = (id: string, on: boolean) =>
    onChange((d) => ({ ...d, criteria: on ? [...d.criteria.filter((c) => c !== id), id] : d.criteria.filter((c) => c !== id) }));

  // A task that hurt is stopped: no photo is asked for (our choice: a photo slot still open was a nudge to
  // run it again).
  const photoPanel =
    task.views.length > 0 && t.painReported === true ? (
      <Notice title="No photo" testID="photos-pain">
        The task stopped when it hurt: no photo is needed. Tick what you saw before it stopped.
      </Notice>
    ) : task.views.length > 0 && !skipped && !detail.athlete.photoConsent ? (
      <Notice tone="caution" title="No photo consent" testID="photos-no-consent">
        {`No photo consent is recorded for ${detail.athlete.firstName}, so no photo is taken. Tick what you see; the angles are left out.`}
      </Notice>
    ) : task.views.length > 0 && !skipped ? (
      <View style={styles.section}>
        {task.views.map((v) => (
          <PhotoSlot
            key={v.view}
            assessmentId={detail.id}
            taskId={task.id}
            spec={v}
            photo={photos[v.view]}
            placed={Object.values(t.landmarks?.[v.view] ?? {}).filter(Boolean).length}
            onNewPhoto={() => onNewPhoto(v.view)}
            onPlaceLandmarks={() => onPlaceLandmarks(v.view)}
            armed={armed === v.view}
            onPicked={() => armAfter(v.view)}
          />
        ))}
      </View>
    ) : null;

  return (
    <View style={styles.wrap}>
      <Notice tone="caution" title="Safety" testID="task-safety">
        <View style={styles.bullets}>
          {task.safety.map((s) => (
            <Text key={s}>• {s}</Text>
          ))}
        </View>
      </Notice>
      {/* Right under the safety words that ask for it, where no scrolling is needed to reach it. Shown on a
          skipped task too: pain ticked there takes the task back from "skipped", as pain always wins. */}
      <TickBox
        tone="caution"
        label="Pain reported during this task"
        hint={folded ? undefined : 'Stop the task. The plan will then ask for clearance by a physiotherapist or doctor before it starts.'}
        checked={t.painReported === true}
        onChange={(on) => onChange((d) => ({ ...d, painReported: on, ...(on ? { skipped: false } : {}) }))}
        testID="task-pain"
      />
      <View style={styles.look}>
        {folded && !showHow ? null : (
          <>
            <Text variant="label">What to look at</Text>
            <Text>{task.lookFor}</Text>
          </>
        )}
        <Pressable accessibilityRole="button" aria-expanded={showHow} onPress={() => setShowHow((s) => !s)} style={styles.howToggle} testID="task-how">
          <Text style={styles.howToggleText}>{showHow ? 'Hide how to run it ▲' : folded ? 'What to look at, how to run it ▼' : 'How to run it ▼'}</Text>
        </Pressable>
        {showHow ? <Text>{task.instructions}</Text> : null}
      </View>

      <View style={[styles.columns, isWide && styles.columnsWide]}>
        {isWide && photoPanel ? <View style={styles.wideLeft}>{photoPanel}</View> : null}
        <View style={[styles.section, isWide && styles.wideRight]}>
          {task.distance && !skipped ? (
            <NumberField
              label={task.distance.label}
              hint={task.distance.hint}
              testID="task-distance"
              value={t.distanceCm}
              validate={(n) => distanceError(n, task.distance!.label)}
              onCommit={(n) => onChange((d) => ({ ...d, distanceCm: n }))}
            />
          ) : null}
          {/* On a phone the camera comes before the ticks: the photo is taken at the lowest point of the
              movement, the ticks after it (below them it was two screens down on every task). */}
          {!isWide && photoPanel}
          {skipped ? null : (
            <View style={styles.section} accessibilityRole="list">
              <Text variant="label">Tick what you saw</Text>
              <Text variant="small">Leave a box empty when you did not see it.</Text>
              {task.criteria.map((c) => (
                <TickBox key={c.id} label={c.text} checked={ticked.has(c.id)} onChange={(on) => toggle(c.id, on)} testID={`criterion-${c.id}`} />
              ))}
            </View>
          )}
          <TextField
            label="Notes"
            testID="task-notes"
            multiline
            numberOfLines={3}
            style={styles.notes}
            placeholder="Anything worth remembering"
            value={t.notes ?? ''}
            onChangeText={(text) => onChange((d) => ({ ...d, notes: text.slice(0, 2000) }))}
          />
          <TickBox
            label="Skip this task"
            hint={
              t.painReported
                ? 'Pain was reported: keep the task (not skipped) so the plan asks for clearance.'
                : 'Refused, no time, no equipment… the reason is kept.'
            }
            checked={skipped}
            disabled={t.painReported === true && !skipped}
            onChange={(on) => {
              onChange((d) => ({ ...d, skipped: on }));
              // The reason's field opens below the fold on a phone, under the step's bar: brought to the
              // middle of the screen and focused, so that the reason is not passed by (web only).
              if (on && !t.skipReason?.trim() && typeof document !== 'undefined') {
                setTimeout(() => {
                  const field = document.querySelector<HTMLElement>('[data-testid="task-skip-reason"]');
                  field?.scrollIntoView({ block: 'center', behavior: 'smooth' });
                  field?.focus({ preventScroll: true });
                }, 50);
              }
            }}
            testID="task-skip"
          />
          {skipped ? (
            <TextField
              label="Why was it skipped?"
              hint="If it hurt, tick “Pain reported” above instead: the plan then asks for clearance."
              testID="task-skip-reason"
              value={t.skipReason ?? ''}
              onChangeText={(text) => onChange((d) => ({ ...d, skipReason: text.slice(0, 500) }))}
              error={(t.skipReason ?? '').trim() === '' ? 'Say why, for the record.' : undefined}
            />
          ) : null}
        </View>
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.lg },
  bullets: { gap: space.xs },
  look: { gap: space.xs },
  howToggle: { minHeight: TOUCH_MIN, justifyContent: 'center', alignSelf: 'flex-start', borderRadius: radius.sm },
  howToggleText: { fontFamily: fonts.bold, color: colors.pine, fontSize: 16 },
  columns: { gap: space.lg },
  columnsWide: { flexDirection: 'row', alignItems: 'flex-start' },
  wideLeft: { flex: 1 },
  wideRight: { flex: 1 },
  section: { gap: space.sm },
  notes: { minHeight: 88, paddingVertical: space.sm, textAlignVertical: 'top' },
});

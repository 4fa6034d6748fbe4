import { AthleteClearanceBadge } from '@/features/care/components/clearance-badge';
import { can } from '@/features/access/permissions';
import { useQueryClient } from '@tanstack/react-query';
import { Link, Redirect, useLocalSearchParams, useRouter } from 'expo-router';
import { useCallback, useEffect, useMemo, useRef, useState, useSyncExternalStore } from 'react';
import { StyleSheet, View, type ScrollView } from 'react-native';
import { useAssessmentQuery } from '@/features/screening/api/get-assessment';
import { screeningKeys } from '@/features/screening/api/keys';
import { careKeys } from '@/features/care/api/keys';
import { connectivity, outbox } from '@/features/offline/device-handle';
import { queueSubmit } from '@/features/screening/api/submit-assessment';
import { queueDraftSave } from '@/features/screening/draft/registry';
import type { AssessmentDetail, LandmarkSet, PhotoView, TaskDraft } from '@/features/screening/contract';
import { BATTERY, getTask } from '@/features/screening/engine/battery';
import type { TaskId, View as PhotoSide } from '@/features/screening/engine';
import { useAssessmentDraft } from '@/features/screening/hooks/use-assessment-draft';
import { useUnfinishedUploads } from '@/features/screening/hooks/use-upload';
import { slotOf } from '@/features/screening/photos/upload-queue';
import { uploadQueue } from '@/features/screening/photos/upload-registry';
import { useActiveClub } from '@/features/session/active-club';
import { usePageTitle } from '@/features/ui/page-title';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Button } from '@/features/ui/components/button';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { colors, space, TOUCH_MIN } from '@/features/ui/theme';
import { LazyLandmarkEditor } from '../landmarks/lazy-landmark-editor';
import { TAKING_PART_WORDS } from '@/features/athletes/taking-part';
import { capitalise } from '@/features/ui/capitalise';
import { ProgressBar } from '../progress-bar';
import { PlainTag } from '../status-tag';
import { BodyStep } from './body-step';
import { CaptureFrame, CaptureLayout, captureStyles } from './capture-layout';
import { ReviewStep } from './review-step';
import { SaveStatusBadge } from './save-status';
import { TaskStep } from './task-step';
import { CaptureHoldNotice, heldTasks } from './hold-notice';
import { heldWithPainToday } from './pain-today';
import { useClearanceOf, usePainWaitingOf } from '@/features/care/api/get-clearances';
import { InvalidFieldsContext } from './invalid-fields';

const STEPS: readonly string[] = ['body', ...BATTERY.map((t) => t.id), 'review'];
const TASK_COUNT = BATTERY.length;

/** The field with this test id in the middle of the screen (web; nothing where there is no document). */
function bringIntoView(testID: string) {
  if (typeof document === 'undefined') return;
  document.querySelector(`[data-testid="${testID}"]`)?.scrollIntoView({ block: 'center', behavior: 'smooth' });
}

/** The newest photo of each task and view. */
function photoIndex(photos: PhotoView[]): Map<string, PhotoView> {
  const map = new Map<string, PhotoView>();
  for (const p of photos) {
    const key = `${p.taskId}:${p.view}`;
    const known = map.get(key);
    if (!known || known.createdAt < p.createdAt) map.set(key, p);
  }
  return map;
}

/**
 * Screening one athlete, one step per screen: body measurements, each task of the battery in order, then
 * review and submit. Back and Next sit at the bottom, within thumb reach; every edit is autosaved.
 */
export function CaptureFlow({ id }: { id: string }) {
  const { membership } = useActiveClub();
  if (!can(membership.role, 'screening.write')) return <Redirect href={`/screening/assessments/${id}/result`} />;
  return <CaptureLoader id={id} />;
}

function CaptureLoader({ id }: { id: string }) {
  const query = useAssessmentQuery(id);
  const draftState = useAssessmentDraft(query.data, id);
  if (query.error && !draftState.ready)
    return (
      <Centered>
        <Notice tone="error">{query.error.message}</Notice>
      </Centered>
    );
  // The same frame as the pre-rendered page: the head and the bar are in place before the data.
  if (!query.data || !draftState.ready) return <CaptureFrame />;
  // A closed round's screens are read, not changed: straight to the result (or its absence).
  if (query.data.roundClosedAt) return <Redirect href={`/screening/assessments/${id}/result`} />;
  if (!query.data.athlete.screeningConsent) return <NotTakingPart detail={query.data} />;
  return <Capture detail={query.data} draftState={draftState} />;
}

/** No screen without the family's agreement on record: what to do instead, in plain words. */
function NotTakingPart({ detail }: { detail: AssessmentDetail }) {
  const { membership } = useActiveClub();
  const name = `${detail.athlete.firstName} ${detail.athlete.lastName}`;
  usePageTitle(`${name}: not to be screened`);
  return (
    <Centered>
      <Notice tone="caution" title={`Do not screen ${name}`} testID="capture-not-taking-part">
        {`${capitalise(TAKING_PART_WORDS[detail.athlete.screeningRefused ? 'refused' : 'unrecorded'])}, so nothing of this screen can be saved.${
          detail.status === 'submitted' ? ' The screen done before stays as it was.' : ''
        }`}
      </Notice>
      <Link href={`/screening/rounds/${detail.roundId}`} style={styles.notTakingPartLink} testID="capture-not-taking-part-back">
        <Text variant="label" style={styles.roundLinkText}>
          ← Back to {detail.roundName}
        </Text>
      </Link>
      {can(membership.role, 'consent.manage') && !detail.athlete.screeningRefused ? (
        <Link href={`/athletes/${detail.athlete.id}`} style={styles.notTakingPartLink}>
          <Text variant="label" style={styles.roundLinkText}>{`Record ${detail.athlete.firstName}'s consent →`}</Text>
        </Link>
      ) : null}
    </Centered>
  );
}

function Centered({ children }: { children: React.ReactNode }) {
  return <View style={styles.centered}>{children}</View>;
}

function Capture({ detail, draftState }: { detail: AssessmentDetail; draftState: ReturnType<typeof useAssessmentDraft> }) {
  const { draft, status, update, flushSoon, mergedFromServer, online } = draftState;
  const { isTabletUp } = useBreakpoints();
  const router = useRouter();
  const qc = useQueryClient();
  const { membership } = useActiveClub();
  const [submitting, setSubmitting] = useState(false);
  const scroll = useRef<ScrollView>(null);
  // `?step=body` (from the result's "Enter an estimated 1RM"): the step asked for, not the one saved.
  const { step: asked } = useLocalSearchParams<{ step?: string }>();
  const [stepIndex, setStepIndex] = useState(() => Math.max(0, STEPS.indexOf(asked === 'body' ? 'body' : (draft.step ?? 'body'))));
  const [editing, setEditing] = useState<{ taskId: TaskId; view: PhotoSide } | null>(null);
  const [submitError, setSubmitError] = useState<string | null>(null);
  const photos = useMemo(() => photoIndex(detail.photos), [detail.photos]);
  const unfinishedUploads = useUnfinishedUploads(detail.id);
  useSyncExternalStore(uploadQueue.subscribe, uploadQueue.getVersion, uploadQueue.getVersion);
  const step = STEPS[stepIndex] ?? 'body';
  const task = step !== 'body' && step !== 'review' ? getTask(step as TaskId) : null;
  const athleteName = `${detail.athlete.firstName} ${detail.athlete.lastName}`;
  const heldToday = heldTasks(useClearanceOf(detail.athlete.id), usePainWaitingOf(detail.athlete.id), detail.athlete.firstName);
  usePageTitle(`Screening ${athleteName}`);

  useEffect(() => {
    scroll.current?.scrollTo({ y: 0, animated: false });
  }, [stepIndex, editing]);

  const goTo = (target: string) => {
    const i = STEPS.indexOf(target);
    if (i < 0) return;
    setEditing(null);
    setStepIndex(i);
    // The step is saved to resume on another phone; a submitted assessment is only browsed.
    if (detail.status !== 'submitted') update((d) => (d.step === target ? d : { ...d, step: target }));
  };

  const updateTask = (taskId: TaskId, change: (t: TaskDraft) => TaskDraft) =>
    update((d) => ({ ...d, tasks: { ...d.tasks, [taskId]: change(d.tasks[taskId] ?? { criteria: [] }) } }));

  // A step opened from "Review and submit" goes straight back there (it took Next through every task).
  // Opened from the result's 1RM link: Next goes straight back to review and submit, the 1RM in view.
  const [fromReview, setFromReview] = useState(asked === 'body');
  useEffect(() => {
    if (asked !== 'body' || typeof document === 'undefined') return;
    const t = setTimeout(() => bringIntoView('body-one-rep-max'), 300);
    return () => clearTimeout(t);
  }, [asked]);
  // Fields of this step holding text that is not kept: Next stops and names them (InvalidFieldsContext).
  const invalid = useRef(new Map<string, { label: string; testID?: string }>());
  const [stopped, setStopped] = useState<string[] | null>(null);
  // How many, for the save badge: "saved" beside a value that is not kept read as if it were.
  const [notKept, setNotKept] = useState(0);
  const report = useCallback((fieldId: string, label: string | null, testID?: string) => {
    if (label) invalid.current.set(fieldId, { label, testID });
    else invalid.current.delete(fieldId);
    setNotKept(invalid.current.size);
    if (invalid.current.size === 0) setStopped(null);
  }, []);
  const next = () => {
    if (invalid.current.size > 0) {
      const fields = [...invalid.current.values()];
      setStopped([...new Set(fields.map((f) => f.label))]);
      // The first such field is brought into view (on a phone it was below the fold). Web only.
      const first = fields.find((f) => f.testID)?.testID;
      if (first) bringIntoView(first);
      return;
    }
    // Moving on from a task means it was done, even with nothing ticked ("nothing seen"). A submitted
    // assessment is only browsed: any save would put it back in progress.
    if (task && !draft.tasks[task.id] && detail.status !== 'submitted') updateTask(task.id, (t) => t);
    setFromReview(false);
    goTo(fromReview ? 'review' : (STEPS[stepIndex + 1] ?? 'review'));
  };

  // Points belong to the photo they were placed on: a new photo starts without them.
  const onNewPhoto = (taskId: TaskId, view: PhotoSide) =>
    updateTask(taskId, (t) => {
      if (!t.landmarks?.[view]) return t;
      const { [view]: _old, ...rest } = t.landmarks;
      return { ...t, landmarks: rest };
    });

  // The submit is queued behind the draft and the photos of this assessment (integration point with
  // features/offline): online it goes out at once and the result opens; offline it waits on the phone.
  const onSubmit = async () => {
    setSubmitError(null);
    setSubmitting(true);
    try {
      flushSoon();
      await queueDraftSave(detail.id);
      const entry = await queueSubmit(detail.id);
      if (!online) {
        router.replace(`/screening/rounds/${detail.roundId}`);
        return;
      }
      // The connection may drop while it goes out: then it waits on the phone like an offline submit.
      let unsubscribe: (() => void) | undefined;
      const wentOffline = new Promise<'offline'>((resolve) => {
        unsubscribe = connectivity.subscribe(() => {
          if (!connectivity.isOnline()) resolve('offline');
        });
      });
      const outcome = await Promise.race([outbox.whenDone(entry.seq).then(() => 'sent' as const), wentOffline]).finally(() => unsubscribe?.());
      if (outcome === 'offline') {
        router.replace(`/screening/rounds/${detail.roundId}`);
        return;
      }
      void qc.invalidateQueries({ queryKey: screeningKeys.club(membership.clubId) });
      // Pain reported (or no longer) at this screen changes who waits for a physiotherapist.
      void qc.invalidateQueries({ queryKey: careKeys.clearances(membership.clubId) });
      router.replace(`/screening/assessments/${detail.id}/result`);
    } catch (e) {
      setSubmitError(e instanceof Error ? e.message : typeof e === 'object' && e && 'message' in e ? String(e.message) : String(e));
    } finally {
      setSubmitting(false);
    }
  };

  // A photo waiting on the phone (taken offline) stands in for the stored one: landmarks are placed on
  // it in its own pixels, which the server keeps (it is already scaled to the stored size).
  const photoFor = (taskId: TaskId, view: PhotoSide): PhotoView | undefined => {
    const waiting = uploadQueue.get(detail.id, slotOf(taskId, view));
    if (waiting && waiting.state !== 'failed' && waiting.previewUri) {
      return {
        id: `on-device-${waiting.seq}`,
        taskId,
        view,
        width: waiting.width,
        height: waiting.height,
        url: waiting.previewUri,
        thumbUrl: waiting.previewUri,
        createdAt: new Date().toISOString(),
      };
    }
    return photos.get(`${taskId}:${view}`);
  };
  const title = editing
    ? `${getTask(editing.taskId).title}: ${editing.view} landmarks`
    : step === 'body'
      ? 'Body measurements'
      : step === 'review'
        ? 'Review and submit'
        : task!.title;
  const counter = task ? `Task ${stepIndex} of ${TASK_COUNT}` : step === 'body' ? 'Before the tasks' : `All ${TASK_COUNT} tasks`;
  const editingPhoto = editing ? photoFor(editing.taskId, editing.view) : undefined;

  return (
    <InvalidFieldsContext.Provider value={report}>
      <CaptureLayout
        scrollRef={scroll}
        wide={isTabletUp}
        aboveBar={
          stopped && !editing ? (
            <Notice tone="error" title="Not moved on" testID="step-invalid">
              {`Fix or clear first: ${stopped.join(', ')}. What is typed there now is not kept.`}
            </Notice>
          ) : null
        }
        header={
          <>
            <View style={captureStyles.headerTop}>
              <Link href={`/screening/rounds/${detail.roundId}`} style={captureStyles.roundLink}>
                <Text variant="small" style={styles.roundLinkText}>
                  ← {detail.roundName}
                </Text>
              </Link>
              <SaveStatusBadge status={status} notKept={notKept} />
            </View>
            <Text variant="heading" accessibilityRole="header" testID="step-title">
              {title}
            </Text>
            <View style={captureStyles.who}>
              <Text variant="label" testID="capture-athlete">
                {athleteName}
              </Text>
              <Text variant="small" testID="step-counter">
                {counter}
              </Text>
              {!detail.athlete.photoConsent ? <PlainTag label="No photo consent" /> : null}
              <AthleteClearanceBadge athleteId={detail.athlete.id} />
            </View>
            <ProgressBar fraction={stepIndex / (STEPS.length - 1)} label={counter} />
          </>
        }
        bar={
          editing ? (
            <Button label="Done: back to the task" testID="landmarks-done" onPress={() => setEditing(null)} style={captureStyles.barButton} />
          ) : (
            <>
              <Button
                tone="secondary"
                label="Back"
                testID="step-back"
                disabled={stepIndex === 0}
                onPress={() => goTo(STEPS[stepIndex - 1] ?? 'body')}
                style={captureStyles.barButton}
              />
              {step === 'review' ? (
                <Button
                  label={detail.status === 'submitted' ? 'Submit again' : 'Submit'}
                  testID="submit-assessment"
                  busy={submitting}
                  onPress={() => void onSubmit()}
                  style={[captureStyles.barButton, captureStyles.barPrimary]}
                />
              ) : step === 'body' && draft.hurtsToday === true && detail.status !== 'submitted' ? (
                // Not screened today: the way on is back to the round, for the next athlete.
                <Button
                  label="Next athlete: back to the round"
                  testID="step-hurts-back"
                  onPress={() => router.push(`/screening/rounds/${detail.roundId}`)}
                  style={[captureStyles.barButton, captureStyles.barPrimary]}
                />
              ) : (
                <Button
                  label={fromReview ? 'Back to review' : 'Next'}
                  testID="step-next"
                  onPress={next}
                  style={[captureStyles.barButton, captureStyles.barPrimary]}
                />
              )}
            </>
          )
        }
      >
        {mergedFromServer ? (
          <Notice title="Merged with a newer save">
            This assessment was also saved on another phone. Both are kept: where the same field was changed, your edits on this phone win.
          </Notice>
        ) : null}
        {status.kind === 'refused' ? (
          <Notice tone="error" title="Not saved" testID="save-refused">
            {`${status.message} What you typed is kept on this phone.`}
          </Notice>
        ) : null}
        {/* Above the list, where they are read before Submit (below it, a phone never showed them). */}
        {!online && step === 'review' && !editing ? (
          <Notice title="No connection" testID="submit-offline">
            Submitting now keeps the submit on this phone. It is sent after the draft and photos when the connection is back; the result appears then.
          </Notice>
        ) : null}
        {unfinishedUploads > 0 && step === 'review' && !editing ? (
          <Notice tone="caution" title={unfinishedUploads === 1 ? 'A photo is not uploaded yet' : 'Photos not uploaded yet'} testID="uploads-unfinished">
            {`${unfinishedUploads === 1 ? 'One photo is' : `${unfinishedUploads} photos are`} kept on this phone and not on the server yet. A submit waits for ${unfinishedUploads === 1 ? 'it' : 'them'}: they are sent first, in order.`}
          </Notice>
        ) : null}
        {editing && editingPhoto ? (
          <LazyLandmarkEditor
            key={`${editing.taskId}:${editing.view}:${editingPhoto.id}`}
            task={getTask(editing.taskId)}
            view={editing.view}
            photo={editingPhoto}
            value={draft.tasks[editing.taskId]?.landmarks?.[editing.view] ?? {}}
            racketHand={detail.athlete.racketHand}
            onChange={(next: LandmarkSet) => updateTask(editing.taskId, (t) => ({ ...t, landmarks: { ...t.landmarks, [editing.view]: next } }))}
          />
        ) : step === 'body' ? (
          <>
            <CaptureHoldNotice athleteId={detail.athlete.id} firstName={detail.athlete.firstName} taskId={null} />
            <BodyStep draft={draft} update={update} firstName={detail.athlete.firstName} athleteId={detail.athlete.id} />
          </>
        ) : step === 'review' ? (
          <ReviewStep
            detail={detail}
            draft={draft}
            held={detail.status === 'submitted' ? [] : heldWithPainToday(heldToday, draft.tasks)}
            photoFor={photoFor}
            goTo={(target) => {
              setFromReview(true);
              goTo(target);
            }}
          />
        ) : task ? (
          <>
            {detail.status !== 'submitted' ? (
              <CaptureHoldNotice
                athleteId={detail.athlete.id}
                firstName={detail.athlete.firstName}
                taskId={task.id}
                task={draft.tasks[task.id]}
                tasks={draft.tasks}
                onSkip={(reason) => updateTask(task.id, (t) => ({ ...t, skipped: true, skipReason: reason }))}
              />
            ) : null}
            <TaskStep
              key={task.id}
              task={task}
              value={draft.tasks[task.id]}
              onChange={(change) => updateTask(task.id, change)}
              detail={detail}
              photos={{ front: photoFor(task.id, 'front'), side: photoFor(task.id, 'side') }}
              onNewPhoto={(view) => onNewPhoto(task.id, view)}
              onPlaceLandmarks={(view) => setEditing({ taskId: task.id, view })}
            />
          </>
        ) : null}
        {submitError && step === 'review' ? (
          <Notice tone="error" title="Not submitted" testID="submit-error">
            {submitError}
          </Notice>
        ) : null}
      </CaptureLayout>
    </InvalidFieldsContext.Provider>
  );
}

const styles = StyleSheet.create({
  centered: { flex: 1, alignItems: 'center', justifyContent: 'center', padding: space.xl, gap: space.md },
  notTakingPartLink: { minHeight: TOUCH_MIN, justifyContent: 'center', paddingVertical: space.sm },
  roundLinkText: { color: colors.pine },
});

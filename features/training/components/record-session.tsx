import { useFormik } from 'formik';
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { can } from '@/features/access/permissions';
import { showServerError } from '@/features/api/client';
import { useOutboxState } from '@/features/offline/device-handle';
import type { AttendanceEntry } from '@/features/offline/outbox';
import { todayIsoLocal } from '@/features/screening/labels';
import { useActiveClub } from '@/features/session/active-club';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Button } from '@/features/ui/components/button';
import { Card } from '@/features/ui/components/card';
import { Chips } from '@/features/ui/components/chips';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { TextField } from '@/features/ui/components/text-field';
import { formatDate } from '@/features/ui/format-date';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/features/ui/theme';
import { useRecordSessionMutation, useSessionsQuery, type RecordOutcome } from '../api/sessions';
import { recordSessionSchema, type SessionView } from '../schemas';
import { isCalendarDate, withDateDashes } from '@/features/athletes/schemas';
import type { SheetAthlete, TrainingSheet } from '../sheet';

/** The family has not agreed (said no, or nothing recorded): on no exercise, never recorded as taking part. */
export const withoutConsent = (a: Pick<SheetAthlete, 'state'>) => a.state === 'consent-refused' || a.state === 'consent-missing';

const DAY_MS = 24 * 3600 * 1000;
/** Today, yesterday and the day before, on the phone's calendar: a session is recorded that day or soon after (our choice). */
const recentDays = (now = Date.now()) => [0, 1, 2].map((back) => todayIsoLocal(new Date(now - back * DAY_MS)));
/** The chip that opens a field for a day further back. */
const OTHER_DAY = 'other';

/** What the last save did: sent, or kept on this phone (the notice follows the record until it is sent). */
type Saved = { how: RecordOutcome; heldOn: string; what: string };

function SavedNotice({ saved, waiting }: { saved: Saved | null; waiting: AttendanceEntry[] }) {
  if (!saved) return null;
  const mine = waiting.find((e) => e.record.heldOn === saved.heldOn);
  // A record the server refused says so in its own line below; the notice would contradict it.
  if (saved.how === 'kept' && mine?.state === 'refused') return null;
  const [title, words] =
    saved.how === 'sent'
      ? ['Recorded', saved.what]
      : mine
        ? ['Kept on this phone', `${saved.what} It goes to the server as soon as the connection allows.`]
        : ['Recorded', `${saved.what} Sent once the connection came back.`];
  return (
    <Notice title={title} testID="sheet-recorded">
      {words}
    </Notice>
  );
}

/** Records of this squad's sessions kept on this phone and not on the server yet, oldest first. */
function useWaitingRecords(squadId: string): AttendanceEntry[] {
  return useOutboxState().entries.filter((e): e is AttendanceEntry => e.kind === 'attendance' && e.squadId === squadId);
}

/** The squad's recorded sessions, and a way to record who took part (ticked from the squad's list). */
export function SessionsCard({ sheet, canRecord }: { sheet: TrainingSheet; canRecord: boolean }) {
  const sessions = useSessionsQuery(sheet.squad.id);
  const waiting = useWaitingRecords(sheet.squad.id);
  // Those who screen keep a queue on the phone, so they may record without a connection.
  const queues = can(useActiveClub().membership.role, 'screening.write');
  const [open, setOpen] = useState(false);
  const [saved, setSaved] = useState<Saved | null>(null);
  const [all, setAll] = useState(false);
  const list = sessions.data?.sessions ?? [];
  // Who took part, in the sheet's name order (the server lists ids), and how many have left the squad since.
  const namesOf = (ids: readonly string[]) => {
    const names = sheet.athletes.filter((a) => ids.includes(a.id)).map((a) => a.name);
    const gone = ids.length - names.length;
    return gone ? [...names, `${gone} now in another squad`] : names;
  };

  return (
    <Card style={styles.card} testID="sheet-sessions">
      <Text variant="heading" accessibilityRole="header" aria-level={2}>
        Sessions
      </Text>
      {sessions.error ? <Notice tone="error">{sessions.error.message}</Notice> : null}
      <SavedNotice saved={saved} waiting={waiting} />
      {canRecord && open && (sessions.data || queues) ? (
        <RecordForm
          sheet={sheet}
          sessions={list}
          waiting={waiting}
          onDone={(done) => {
            setSaved(done);
            setOpen(false);
          }}
          onCancel={() => setOpen(false)}
        />
      ) : canRecord ? (
        <View style={styles.row}>
          <Button
            label="Record who took part"
            tone="secondary"
            onPress={() => {
              setSaved(null);
              setOpen(true);
            }}
            disabled={!sessions.data && !(queues && sessions.error)}
            testID="sheet-record-open"
          />
        </View>
      ) : null}
      {waiting.map((e) => (
        <View key={e.seq} style={styles.session} testID="sheet-session-waiting">
          <Text variant="label">{`${formatDate(e.record.heldOn)} · ${e.record.athleteIds.length} ${e.record.athleteIds.length === 1 ? 'athlete' : 'athletes'}`}</Text>
          <Text variant="small" style={e.state === 'refused' ? styles.error : styles.waiting}>
            {e.state === 'refused'
              ? `Not accepted: ${e.error?.message ?? 'the server refused it.'} Record the day again, or send or discard it from the status at the top.`
              : `Kept on this phone: sent when the connection is back${list.some((x) => x.heldOn === e.record.heldOn) ? ', in place of that day’s earlier record' : ''}.`}
          </Text>
        </View>
      ))}
      {sessions.data && list.length === 0 && waiting.length === 0 ? <Text variant="small">No session recorded yet.</Text> : null}
      {list.slice(0, all ? 10 : 1).map((s) => (
        <View key={s.id} style={styles.session} testID="sheet-session">
          <Text variant="label">{`${all ? '' : 'Last: '}${formatDate(s.heldOn)} · ${s.athleteIds.length} ${s.athleteIds.length === 1 ? 'athlete' : 'athletes'}`}</Text>
          {/* Who took part only once asked for: a squad's names would push the plans down a phone. */}
          {all ? (
            <Text variant="small">
              {namesOf(s.athleteIds).join(', ')}
              {s.recordedByName ? ` · recorded by ${s.recordedByName}` : ''}
            </Text>
          ) : null}
          {s.note ? <Text variant="small">{`“${s.note}”`}</Text> : null}
        </View>
      ))}
      {list.length > 0 && !all ? (
        <View style={styles.row}>
          <Button
            label={list.length > 1 ? 'Who took part, and earlier sessions' : 'Who took part'}
            tone="quiet"
            onPress={() => setAll(true)}
            testID="sheet-sessions-all"
          />
        </View>
      ) : null}
    </Card>
  );
}

function RecordForm({
  sheet,
  sessions,
  waiting,
  onDone,
  onCancel,
}: {
  sheet: TrainingSheet;
  sessions: SessionView[];
  waiting: AttendanceEntry[];
  onDone: (done: Saved) => void;
  onCancel: () => void;
}) {
  const { isTabletUp } = useBreakpoints();
  const record = useRecordSessionMutation(sheet.squad.id);
  const days = recentDays();
  const [typing, setTyping] = useState(false);
  const [typed, setTyped] = useState('');
  // Those whose family has not agreed to corrective exercises are never recorded as having done them.
  const eligible = sheet.athletes.filter((a) => !withoutConsent(a));
  const notEligible = sheet.athletes.filter((a) => !eligible.includes(a));
  // A day already recorded starts from what was recorded (on this phone if not sent yet); a new day from
  // everyone with a plan whose work is not on hold (our choice: a child waiting for a physiotherapist after
  // pain, or referred on, is ticked only by someone who saw them take part in what they may still do).
  const recordOf = (day: string) => [...waiting].reverse().find((e) => e.record.heldOn === day)?.record ?? sessions.find((s) => s.heldOn === day);
  const startFor = (day: string) => {
    const earlier = recordOf(day);
    return earlier
      ? { athleteIds: earlier.athleteIds.filter((id) => eligible.some((a) => a.id === id)), note: earlier.note }
      : { athleteIds: sheet.athletes.filter((a) => a.state === 'plan' && !a.hold).map((a) => a.id), note: '' };
  };
  const form = useFormik({
    initialValues: { heldOn: days[0]!, ...startFor(days[0]!) },
    validationSchema: recordSessionSchema,
    onSubmit: async (values, helpers) => {
      try {
        const input = await recordSessionSchema.validate(values);
        const how = await record.mutateAsync(input);
        const n = input.athleteIds.length;
        const what = `${n} ${n === 1 ? 'athlete' : 'athletes'} on ${formatDate(input.heldOn)}.`;
        onDone({ how, heldOn: input.heldOn, what });
      } catch (error) {
        showServerError(error, helpers);
      }
    },
  });
  const ticked = new Set(form.values.athleteIds);
  const toggle = (id: string) =>
    form.setFieldValue(
      'athleteIds',
      eligible.filter((a) => (a.id === id ? !ticked.has(id) : ticked.has(a.id))).map((a) => a.id),
    );
  const earlier = recordOf(form.values.heldOn);
  const recorded = !!earlier;
  // Who recorded the day, when the server has it: replacing a colleague's record is said with their name.
  const recordedBy = earlier && 'recordedByName' in earlier ? earlier.recordedByName : null;

  return (
    <View style={styles.form} testID="sheet-record-form">
      <Chips
        label="Day of the session"
        options={[
          ...days.map((d, i) => ({ value: d, label: i === 0 ? 'Today' : i === 1 ? 'Yesterday' : formatDate(d) })),
          { value: OTHER_DAY, label: 'Another day' },
        ]}
        value={typing ? OTHER_DAY : form.values.heldOn}
        onChange={(d) => {
          // Another day is typed: until it is a whole day, nothing is saved against a day not meant.
          setTyping(d === OTHER_DAY);
          const day = d === OTHER_DAY ? typed : d;
          void form.setValues({ heldOn: day, ...(isCalendarDate(day) ? startFor(day) : { athleteIds: form.values.athleteIds, note: form.values.note }) });
        }}
        testID="sheet-record-day"
      />
      {typing ? (
        <TextField
          label="Day of the session (YYYY-MM-DD)"
          value={typed}
          inputMode="numeric"
          testID="sheet-record-other-day"
          onChangeText={(t) => {
            const day = withDateDashes(t);
            setTyped(day);
            void form.setValues({ heldOn: day, ...(isCalendarDate(day) ? startFor(day) : { athleteIds: form.values.athleteIds, note: form.values.note }) });
          }}
          error={form.submitCount > 0 && form.errors.heldOn}
        />
      ) : null}
      {recorded ? (
        <Text variant="small" testID="sheet-record-replaces">
          {`This day is already recorded${recordedBy ? ` by ${recordedBy}` : ''} (${earlier!.athleteIds.length} took part): saving replaces who took part.`}
        </Text>
      ) : null}
      <Text variant="label">{`Who took part: ${ticked.size} of ${eligible.length}`}</Text>
      <View style={styles.row}>
        <Button
          label="Tick all"
          tone="quiet"
          onPress={() =>
            form.setFieldValue(
              'athleteIds',
              eligible.map((a) => a.id),
            )
          }
        />
        <Button label="Untick all" tone="quiet" onPress={() => form.setFieldValue('athleteIds', [])} />
      </View>
      <View style={[styles.ticks, isTabletUp && styles.ticksWide]}>
        {eligible.map((a) => {
          const on = ticked.has(a.id);
          return (
            <Pressable
              key={a.id}
              role="checkbox"
              aria-checked={on}
              onPress={() => toggle(a.id)}
              style={[styles.tick, isTabletUp && styles.tickWide, on && styles.tickOn]}
              testID={`sheet-tick-${a.id}`}
            >
              <Text style={[styles.box, on && styles.boxOn]}>{on ? '✓' : ' '}</Text>
              <Text style={styles.tickName}>{a.name}</Text>
              {a.state !== 'plan' ? <Text variant="small">no plan</Text> : null}
              {/* What the sheet says at the top, beside the name: taking part is not doing everything. */}
              {a.hold ? (
                <Text variant="small">{a.physioChanges ? "physio's changes, work on hold" : 'loads, landings on hold'}</Text>
              ) : a.physioChanges ? (
                <Text variant="small">physio&apos;s changes</Text>
              ) : null}
            </Pressable>
          );
        })}
      </View>
      {!recorded && eligible.some((a) => a.state === 'plan' && a.hold) ? (
        <Text variant="small" testID="sheet-record-held-unticked">
          {`Not ticked to start with, their work being on hold: ${eligible
            .filter((a) => a.state === 'plan' && a.hold)
            .map((a) => a.name)
            .join(', ')}. Tick them only if they took part in what they may still do.`}
        </Text>
      ) : null}
      {notEligible.length ? (
        <Text variant="small" testID="sheet-record-not-eligible">
          {`Not in corrective work, so not listed: ${notEligible.map((a) => `${a.name} (${a.state === 'consent-refused' ? 'family said no' : 'no consent yet'})`).join(', ')}.`}
        </Text>
      ) : null}
      {form.submitCount > 0 && typeof form.errors.athleteIds === 'string' ? <Text style={styles.error}>{form.errors.athleteIds}</Text> : null}
      {form.submitCount > 0 && form.errors.heldOn && !typing ? <Text style={styles.error}>{form.errors.heldOn}</Text> : null}
      <TextField
        label="Note (optional)"
        value={form.values.note}
        onChangeText={form.handleChange('note')}
        error={form.submitCount > 0 && form.errors.note}
        testID="sheet-record-note"
      />
      {form.status ? <Notice tone="error">{String(form.status)}</Notice> : null}
      {/* Beside the button that was tapped: the day's error sits at the top of a long list on a phone. */}
      {form.submitCount > 0 && (form.errors.heldOn || form.errors.athleteIds || form.errors.note) ? (
        <Text style={styles.error} testID="sheet-record-not-saved">
          {`Not saved: ${String(form.errors.heldOn ?? form.errors.athleteIds ?? form.errors.note)}`}
        </Text>
      ) : null}
      <View style={styles.row}>
        <Button label="Save" busy={form.isSubmitting} onPress={() => form.handleSubmit()} testID="sheet-record-save" />
        <Button label="Cancel" tone="quiet" onPress={onCancel} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.sm },
  row: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  form: { gap: space.md },
  ticks: { gap: space.xs },
  ticksWide: { flexDirection: 'row', flexWrap: 'wrap' },
  tick: {
    minHeight: TOUCH_MIN,
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.sm,
    paddingHorizontal: space.sm,
    borderWidth: 1,
    borderColor: colors.line,
    borderRadius: radius.md,
    backgroundColor: colors.surface,
  },
  tickWide: { width: '32%', flexGrow: 1 },
  tickOn: { borderColor: colors.pine, backgroundColor: colors.pineSoft },
  box: {
    width: 26,
    height: 26,
    lineHeight: 24,
    textAlign: 'center',
    borderWidth: 2,
    borderColor: colors.inkMuted,
    borderRadius: radius.sm,
    fontFamily: fonts.bold,
    color: colors.surface,
  },
  boxOn: { backgroundColor: colors.pine, borderColor: colors.pine },
  tickName: { flex: 1 },
  session: { borderTopWidth: 1, borderTopColor: colors.line, paddingTop: space.sm, gap: 2 },
  error: { color: colors.brick },
  waiting: { color: colors.amber },
});

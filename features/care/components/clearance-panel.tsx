import { useState } from 'react';
import { useFormik } from 'formik';
import { useKeptForm } from '../kept-form';
import { StyleSheet, View } from 'react-native';
import { can } from '@/features/access/permissions';
import { showServerError } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import { Button } from '@/features/ui/components/button';
import { Card } from '@/features/ui/components/card';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { TextField } from '@/features/ui/components/text-field';
import { space } from '@/features/ui/theme';
import { useClearanceHistory } from '../api/get-clearance-history';
import { useClearanceOf, usePainWaitingOf } from '../api/get-clearances';
import { useSetClearanceMutation } from '../api/set-clearance';
import { CLEARANCE_HOLDS, CLEARANCE_LABELS, CLEARANCE_STATUSES, holdsWords, type ClearanceHold, type ClearanceStatus } from '../choices';
import { clearanceSchema } from '../schemas';
import { ClearanceBadge } from './clearance-badge';
import { Chips } from '@/features/ui/components/chips';
import { formatDate } from '@/features/ui/format-date';

const OPTIONS = CLEARANCE_STATUSES.map((s) => ({ value: s, label: CLEARANCE_LABELS[s] }));
const DETAIL_LABEL: Record<ClearanceStatus, string> = { cleared: 'Remarks (optional)', modified: 'What to change', referred: 'Referred to whom' };
/** The two holds as one choice of four (a tick box each would be one more control to load for two boxes). */
const HOLD_CHOICES = { none: [], loaded: ['loaded'], landing: ['landing'], both: ['loaded', 'landing'] } as const satisfies Record<
  string,
  readonly ClearanceHold[]
>;
type HoldChoice = keyof typeof HOLD_CHOICES;
const HOLD_OPTIONS: { value: HoldChoice; label: string }[] = [
  { value: 'none', label: 'Nothing held back' },
  { value: 'loaded', label: 'Loaded strength work' },
  { value: 'landing', label: 'Jumps and landings' },
  { value: 'both', label: 'Both' },
];
const holdChoiceOf = (holds: readonly ClearanceHold[]): HoldChoice =>
  holds.includes('loaded') ? (holds.includes('landing') ? 'both' : 'loaded') : holds.includes('landing') ? 'landing' : 'none';

/** What a decision holding `held` brings back, in the words the panel already uses for holds. */
function comeBackWords(held: readonly ClearanceHold[]): string {
  const back = CLEARANCE_HOLDS.filter((h) => !held.includes(h));
  return `${holdsWords(back).toLowerCase()} come${back.length > 1 ? '' : 's'} back`;
}

/** The clearance in force, and for a physiotherapist the form to record a new decision. */
const DETAIL_HINT = "Read by the club's coaches and testers (training sheet, athlete page), never by the family: the family reads the decision only.";

export function ClearancePanel({ athleteId }: { athleteId: string }) {
  const { membership } = useActiveClub();
  const clearance = useClearanceOf(athleteId);
  // A clearance kept on a device before holds existed has none.
  const held = clearance?.holds ?? [];
  const set = useSetClearanceMutation(athleteId);
  const canSet = can(membership.role, 'clearance.set');
  // Earlier decisions stay in sight (a hold lifted left no trace on the panel), and a new one is confirmed.
  const history = useClearanceHistory(athleteId, canSet);
  const [recorded, setRecorded] = useState<string | null>(null);
  const pain = usePainWaitingOf(athleteId);
  // What waits is chosen, never preset (our choice): "nothing held back" shown chosen had let one tap on
  // "Record clearance" bring landing and loaded work back for a child who reported pain.
  const initialValues = { status: '' as ClearanceStatus | '', detail: '', holds: [] as ClearanceHold[], holdChoice: '' as HoldChoice | '' };
  const form = useFormik({
    initialValues,
    validationSchema: clearanceSchema,
    onSubmit: async ({ holdChoice, ...values }, helpers) => {
      if (values.status === 'modified' && holdChoice === '') {
        helpers.setFieldError('holdChoice', 'Choose what waits until a new clearance, or "Nothing held back".');
        return;
      }
      try {
        const sent = await clearanceSchema.validate(values);
        await set.mutateAsync(sent);
        setRecorded(`Recorded: ${CLEARANCE_LABELS[sent.status as ClearanceStatus]}.`);
        helpers.resetForm();
      } catch (error) {
        showServerError(error, helpers);
      }
    },
  });
  useKeptForm(`clearance.${athleteId}`, form.values, initialValues, (v) => void form.setValues(v));
  return (
    <Card testID="clearance-panel">
      <Text variant="heading" accessibilityRole="header" aria-level={2}>
        Clearance
      </Text>
      {clearance ? (
        <View style={styles.current}>
          <ClearanceBadge clearance={clearance} />
          {held.length ? <Text testID="clearance-holds">{`On hold until a new clearance: ${holdsWords(held).toLowerCase()}.`}</Text> : null}
          {clearance.detail ? <Text>{clearance.detail}</Text> : null}
          <Text variant="small">
            {clearance.setByName ?? 'Former member'} · {formatDate(clearance.setAt)}
          </Text>
        </View>
      ) : (
        <Text variant="small">No clearance recorded.</Text>
      )}
      {canSet ? (
        <View style={styles.form}>
          <Chips
            variant="form"
            label="New decision"
            options={OPTIONS}
            value={form.values.status}
            onChange={(v) => {
              form.setFieldValue('status', v);
              if (v !== 'modified') void form.setValues({ ...form.values, status: v, holds: [], holdChoice: '' });
              // A new choice shows its own field afresh: no error for a field the user has not yet seen.
              void form.setFieldTouched('detail', false, false);
            }}
            testID="clearance-status"
            error={form.submitCount > 0 && form.errors.status}
          />
          {form.values.status === 'modified' ? (
            <Chips
              variant="form"
              label="What waits until a new clearance"
              options={HOLD_OPTIONS}
              value={form.values.holdChoice || (form.values.holds.length ? holdChoiceOf(form.values.holds) : '')}
              onChange={(v) => void form.setValues({ ...form.values, holds: [...HOLD_CHOICES[v]], holdChoice: v })}
              testID="clearance-holds-choice"
              error={form.errors.holdChoice}
            />
          ) : null}
          {pain &&
          ((form.values.status === 'modified' && form.values.holdChoice !== '' && form.values.holdChoice !== 'both') || form.values.status === 'cleared') ? (
            // Said before it is saved: what comes back for a child whose pain waits for this decision.
            <Notice tone="caution" testID="clearance-pain-lifts">
              {`Pain was reported at the screen of ${formatDate(pain.screenedOn)}. Once this is recorded, ${comeBackWords(
                form.values.status === 'cleared' ? [] : HOLD_CHOICES[form.values.holdChoice || 'none'],
              )} to the plan and the training sheet.`}
            </Notice>
          ) : null}
          {form.values.status ? (
            <TextField
              label={form.values.status === 'modified' && form.values.holds.length ? 'Other changes (optional)' : DETAIL_LABEL[form.values.status]}
              multiline
              numberOfLines={3}
              style={styles.detail}
              hint={`${DETAIL_HINT}${form.values.detail.length > 800 ? ` ${form.values.detail.length} of 1000 characters.` : ''}`}
              testID="clearance-detail"
              value={form.values.detail}
              onChangeText={form.handleChange('detail')}
              // The error keeps the hint's words: who reads this matters most when it is long.
              error={
                form.submitCount > 0 && form.touched.detail && form.errors.detail
                  ? `${form.errors.detail} (${form.values.detail.length} now.) ${DETAIL_HINT}`
                  : false
              }
            />
          ) : null}
          {form.values.status === 'cleared' && clearance && (clearance.status === 'referred' || held.length > 0) ? (
            <Text variant="small" testID="clearance-lifts">
              {`This lifts what waits now: ${clearance.status === 'referred' ? 'loaded strength work and landing work' : holdsWords(held).toLowerCase()} come${clearance.status === 'referred' || held.length > 1 ? '' : 's'} back to the plan and the training sheet.`}
            </Text>
          ) : null}
          {form.values.status === 'referred' ? (
            // What the family reads of a referral, before it is saved: the decision, not the words above.
            <Text variant="small" testID="clearance-referral-family">
              The family&apos;s page will say that you asked for the athlete to be seen by another health professional, with your name and the day, and that
              loaded and landing work wait; not to whom or why. No e-mail goes out: to tell them more, add a note shared with the family below, or call them.
            </Text>
          ) : null}
          {form.status ? <Notice tone="error">{String(form.status)}</Notice> : null}
          {recorded && !form.dirty ? <Notice testID="clearance-recorded">{recorded}</Notice> : null}
          <Button label="Record clearance" busy={form.isSubmitting} onPress={() => form.handleSubmit()} testID="clearance-save" />
          {(history.data?.history.length ?? 0) > 1 ? (
            <View style={styles.earlier} testID="clearance-earlier">
              <Text variant="label">Earlier decisions</Text>
              {history.data!.history.slice(1, 4).map((h) => (
                <Text key={h.id} variant="small">
                  {`${formatDate(h.setAt)} · ${CLEARANCE_LABELS[h.status]}${h.holds?.length ? ` (${holdsWords(h.holds).toLowerCase()} on hold)` : ''} · ${h.setByName ?? 'Former member'}${h.detail ? `: “${h.detail}”` : ''}`}
                </Text>
              ))}
            </View>
          ) : null}
          <Text variant="small" testID="clearance-effect">
            The plan and the training sheet follow the decision at once: work held back waits there; other changes are shown in your words. A summary already
            shared with the family is updated to say it, without a new e-mail.
          </Text>
        </View>
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  current: { gap: space.xs },
  form: { gap: space.md },
  earlier: { gap: 2 },
  detail: { minHeight: 88, textAlignVertical: 'top' },
});

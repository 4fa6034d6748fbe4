import { useFormik } from 'formik';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { ValidationError } from 'yup';
import { fieldErrorsOf, messageOf } from '@/features/api/client';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Button } from '@/features/ui/components/button';
import { Card } from '@/features/ui/components/card';
import { Confirm } from '@/features/ui/components/confirm';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { TextField } from '@/features/ui/components/text-field';
import { space } from '@/features/ui/theme';
import { useCareSettingsQuery, useRetentionDryRunQuery, useSaveCareSettingsMutation } from '../api/care-settings';
import { careSettingsSchema } from '../schemas';
import type { CareSettingsView } from '../types';
import { Chips } from '@/features/ui/components/chips';
import { formatDate } from '@/features/ui/format-date';

const YES_NO = [
  { value: 'yes', label: 'Yes' },
  { value: 'no', label: 'No' },
] as const;

/** The club's care settings (automatic release, photo retention, family photos, testers and team notes) and the retention dry run. */
export function CareSettingsForm() {
  const query = useCareSettingsQuery();
  const { isWide } = useBreakpoints();
  if (query.isPending) return <Text>Loading…</Text>;
  if (query.error) return <Notice tone="error">{query.error.message}</Notice>;
  // Side by side on a wide screen: the settings, and what the nightly deletion would take now.
  return (
    <View style={[styles.wrap, isWide && styles.columns]}>
      <View style={[styles.wrap, isWide && styles.column]}>
        <Form settings={query.data.settings} />
      </View>
      <View style={[styles.wrap, isWide && styles.column]}>
        <DryRun />
      </View>
    </View>
  );
}

function Form({ settings }: { settings: CareSettingsView }) {
  const save = useSaveCareSettingsMutation();
  const form = useFormik({
    initialValues: {
      autoReleaseDays: settings.autoReleaseDays === null ? '' : String(settings.autoReleaseDays),
      photoGraceDays: String(settings.photoGraceDays),
      photoRetentionMonths: String(settings.photoRetentionMonths),
      familyPhotos: settings.familyPhotos ? 'yes' : 'no',
      testersReadTeamNotes: settings.testersReadTeamNotes ? 'yes' : 'no',
    },
    onSubmit: async (values, helpers) => {
      try {
        const input = await careSettingsSchema.validate(
          {
            autoReleaseDays: values.autoReleaseDays.trim() === '' ? null : Number(values.autoReleaseDays),
            // An emptied field is an error, never a nought: 0 days of grace deleted withdrawn photos at once.
            photoGraceDays: values.photoGraceDays.trim() === '' ? undefined : Number(values.photoGraceDays),
            photoRetentionMonths: values.photoRetentionMonths.trim() === '' ? undefined : Number(values.photoRetentionMonths),
            familyPhotos: values.familyPhotos === 'yes',
            testersReadTeamNotes: values.testersReadTeamNotes === 'yes',
          },
          { abortEarly: false },
        );
        await save.mutateAsync(input);
        helpers.setStatus('Saved.');
      } catch (error) {
        const fields = error instanceof ValidationError ? Object.fromEntries(error.inner.map((e) => [e.path ?? '_', e.message])) : fieldErrorsOf(error);
        if (fields) helpers.setErrors(fields);
        else helpers.setStatus(messageOf(error));
      }
    },
  });
  const [confirming, setConfirming] = useState(false);
  const typed = (v: string) => (v.trim() === '' ? null : Number(v));
  const grace = typed(form.values.photoGraceDays);
  const months = typed(form.values.photoRetentionMonths);
  const shorter = [
    grace !== null && Number.isInteger(grace) && grace < settings.photoGraceDays
      ? `photos of a withdrawn consent deleted after ${grace} days instead of ${settings.photoGraceDays}`
      : null,
    months !== null && Number.isInteger(months) && months >= 1 && months < settings.photoRetentionMonths
      ? `photos kept ${months} months instead of ${settings.photoRetentionMonths}, so those older than ${months} months go`
      : null,
  ].filter((s): s is string => s !== null);
  return (
    <Card testID="care-settings">
      <Text variant="heading">Family summaries, photos and notes</Text>
      <TextField
        label="Send family summaries automatically after (days)"
        hint="Counted from the day the screen was submitted. Only reviewed screens go out by themselves. Leave empty to release by hand only."
        keyboardType="number-pad"
        value={form.values.autoReleaseDays}
        onChangeText={form.handleChange('autoReleaseDays')}
        error={form.errors.autoReleaseDays}
      />
      <TextField
        label="Delete photos after photo consent is withdrawn (days)"
        hint="Counted from the day the withdrawal is recorded; the photos are hidden at once."
        keyboardType="number-pad"
        value={form.values.photoGraceDays}
        testID="care-settings-grace"
        onChangeText={form.handleChange('photoGraceDays')}
        error={form.errors.photoGraceDays}
      />
      <TextField
        label="Keep photos for (months)"
        hint="Counted from the day each photo was taken; older photos are deleted."
        keyboardType="number-pad"
        value={form.values.photoRetentionMonths}
        testID="care-settings-months"
        onChangeText={form.handleChange('photoRetentionMonths')}
        error={form.errors.photoRetentionMonths}
      />
      <Chips
        variant="form"
        label="Parents may see their own child's screening photos"
        options={YES_NO}
        value={form.values.familyPhotos as 'yes' | 'no'}
        onChange={(v) => form.setFieldValue('familyPhotos', v)}
      />
      <Chips
        variant="form"
        label="Testers may read team-only notes"
        options={YES_NO}
        value={form.values.testersReadTeamNotes as 'yes' | 'no'}
        onChange={(v) => form.setFieldValue('testersReadTeamNotes', v)}
      />
      <Text variant="small">Team-only notes can hold health details from the physiotherapist: say yes only if your testers need them to screen safely.</Text>
      {form.status ? <Text>{String(form.status)}</Text> : null}
      {confirming ? (
        <Confirm
          text={`Shorter periods delete photos sooner, and deleted photos cannot be brought back: ${shorter.join('; ')}. The nightly job applies it from tonight.`}
          confirmLabel="Yes, save the shorter periods"
          cancelLabel="Check again"
          testID="care-settings-shorter-confirm"
          busy={form.isSubmitting}
          onConfirm={() => {
            setConfirming(false);
            form.handleSubmit();
          }}
          onCancel={() => setConfirming(false)}
        />
      ) : (
        <Button
          label="Save settings"
          busy={form.isSubmitting}
          // A shorter period deletes photos for good: said and confirmed first (our choice).
          onPress={() => (shorter.length > 0 ? setConfirming(true) : form.handleSubmit())}
          testID="care-settings-save"
        />
      )}
    </Card>
  );
}

function DryRun() {
  const [asked, setAsked] = useState(false);
  const query = useRetentionDryRunQuery(asked);
  return (
    <Card>
      <Text variant="heading">Photo retention</Text>
      <Text variant="small">A job deletes due photos every night and records each deletion in the audit trail. See what it would delete now:</Text>
      <Button label="Show what would be deleted" tone="secondary" onPress={() => setAsked(true)} />
      {query.error ? <Notice tone="error">{query.error.message}</Notice> : null}
      {query.data ? (
        query.data.candidates.length === 0 ? (
          <Text>Nothing is due for deletion.</Text>
        ) : (
          query.data.candidates.map((c) => (
            <Text key={c.photoId} variant="small">
              {c.athleteName} · photo of {formatDate(c.takenAt)} · {c.reason === 'consent-withdrawn' ? 'photo consent withdrawn' : 'retention period over'}
            </Text>
          ))
        )
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.lg },
  columns: { flexDirection: 'row', alignItems: 'flex-start' },
  column: { flex: 1, minWidth: 0 },
});

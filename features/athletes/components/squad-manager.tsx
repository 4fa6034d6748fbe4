import { can } from '@/features/access/permissions';
import { Confirm } from '@/features/ui/components/confirm';
import { Formik } from 'formik';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { fieldErrorsOf, messageOf } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Button } from '@/features/ui/components/button';
import { Card } from '@/features/ui/components/card';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { TextField } from '@/features/ui/components/text-field';
import { colors, space } from '@/features/ui/theme';
import { useSquadsQuery } from '../api/get-squads';
import { useArchiveSquadMutation, useCreateSquadMutation, useRenameSquadMutation } from '../api/manage-squads';
import type { SquadSummary } from '../api/types';
import { squadSchema, type SquadInput } from '../schemas';

/** The club's squads: add, rename, and archive the empty ones. */
export function SquadManager() {
  const { membership } = useActiveClub();
  const { isTabletUp } = useBreakpoints();
  const squads = useSquadsQuery();
  if (!can(membership.role, 'roster.manage')) return <Notice>Only the club admin and head coaches manage squads.</Notice>;
  return (
    <View style={[styles.cols, isTabletUp && styles.colsWide]}>
      <Card style={isTabletUp ? styles.main : undefined}>
        <Text variant="heading">Squads</Text>
        {squads.error ? <Notice tone="error">{squads.error.message}</Notice> : null}
        {squads.isPending ? <Text>Loading squads…</Text> : null}
        {squads.data?.squads.length === 0 ? <Text>No squads yet.</Text> : null}
        {squads.data?.squads.map((s) => (
          <SquadRow key={s.id} squad={s} />
        ))}
      </Card>
      <Card style={isTabletUp ? styles.side : undefined}>
        <Text variant="heading">New squad</Text>
        <SquadNameForm submitLabel="Add squad" testID="squad-new" />
      </Card>
    </View>
  );
}

function SquadRow({ squad }: { squad: SquadSummary }) {
  const [renaming, setRenaming] = useState(false);
  const [confirming, setConfirming] = useState(false);
  const archive = useArchiveSquadMutation(squad.id);
  return (
    <View style={styles.row} testID={`squad-row-${squad.name}`}>
      {renaming ? (
        <SquadNameForm squad={squad} submitLabel="Save name" testID="squad-rename" onDone={() => setRenaming(false)} />
      ) : (
        <>
          <View style={styles.rowHead}>
            <Text variant="label">{squad.name}</Text>
            <Text variant="small">
              {squad.athleteCount} athlete{squad.athleteCount === 1 ? '' : 's'}
            </Text>
          </View>
          <View style={styles.buttons}>
            <Button label="Rename" tone="secondary" accessibilityLabel={`Rename ${squad.name}`} onPress={() => setRenaming(true)} />
            <Button
              label="Archive"
              tone="secondary"
              accessibilityLabel={`Archive ${squad.name}`}
              disabled={squad.athleteCount > 0}
              onPress={() => setConfirming(true)}
            />
          </View>
          {confirming ? (
            <Confirm
              text={`Archive ${squad.name}? It leaves the lists and the menus; its rounds and results are kept.`}
              confirmLabel="Yes, archive it"
              cancelLabel="Keep it"
              testID="squad-archive-confirm"
              busy={archive.isPending}
              onConfirm={() => archive.mutate()}
              onCancel={() => setConfirming(false)}
            />
          ) : null}
          {squad.athleteCount > 0 ? <Text variant="small">To archive it, move or archive its athletes first.</Text> : null}
          {archive.error ? <Notice tone="error">{archive.error.message}</Notice> : null}
        </>
      )}
    </View>
  );
}

function SquadNameForm({ squad, submitLabel, testID, onDone }: { squad?: SquadSummary; submitLabel: string; testID: string; onDone?: () => void }) {
  const create = useCreateSquadMutation();
  const rename = useRenameSquadMutation(squad?.id ?? '');
  const [failure, setFailure] = useState<string | null>(null);
  return (
    <Formik<SquadInput>
      initialValues={{ name: squad?.name ?? '' }}
      validationSchema={squadSchema}
      onSubmit={async (values, helpers) => {
        setFailure(null);
        try {
          const input = squadSchema.cast(values);
          if (squad) await rename.mutateAsync(input);
          else await create.mutateAsync(input);
          helpers.resetForm();
          onDone?.();
        } catch (error) {
          const fields = fieldErrorsOf(error);
          if (fields) helpers.setErrors(fields);
          else setFailure(messageOf(error));
        }
      }}
    >
      {({ values, errors, touched, handleChange, handleBlur, handleSubmit, isSubmitting }) => (
        <View style={styles.form}>
          {failure ? <Notice tone="error">{failure}</Notice> : null}
          <TextField
            label="Squad name"
            testID={`${testID}-name`}
            placeholder="e.g. Under-11 beginners"
            value={values.name}
            onChangeText={handleChange('name')}
            onBlur={handleBlur('name')}
            error={touched.name && errors.name}
          />
          <View style={styles.buttons}>
            <Button label={submitLabel} testID={`${testID}-save`} busy={isSubmitting} onPress={() => handleSubmit()} />
            {onDone ? <Button label="Cancel" tone="secondary" onPress={onDone} disabled={isSubmitting} /> : null}
          </View>
        </View>
      )}
    </Formik>
  );
}

const styles = StyleSheet.create({
  cols: { gap: space.lg },
  colsWide: { flexDirection: 'row', alignItems: 'flex-start' },
  main: { flexGrow: 3, flexBasis: 0, minWidth: 0 },
  side: { flexGrow: 2, flexBasis: 0, minWidth: 0 },
  row: { gap: space.sm, paddingVertical: space.md, borderBottomWidth: 1, borderBottomColor: colors.line },
  rowHead: { gap: 2 },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  form: { gap: space.md },
});

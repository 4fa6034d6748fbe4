import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { Button } from '@/features/ui/components/button';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { colors, space } from '@/features/ui/theme';
import { useArchiveAthleteMutation } from '../api/archive-athlete';
import type { Athlete } from '../api/types';

/** Archive or restore, each after a plain confirmation. Nothing is deleted: results stay with the athlete. */
export function ArchiveControl({ athlete }: { athlete: Athlete }) {
  const [confirming, setConfirming] = useState(false);
  const mutation = useArchiveAthleteMutation(athlete.id);
  const archive = !athlete.archived;
  const run = () => mutation.mutate(archive, { onSuccess: () => setConfirming(false) });
  if (!confirming) {
    return (
      <View style={styles.wrap}>
        {athlete.archived ? <Text variant="small">Archived: not in squad lists or new screening rounds. Earlier results are kept.</Text> : null}
        <Button
          label={archive ? 'Archive athlete' : 'Restore athlete'}
          tone={archive ? 'secondary' : 'primary'}
          testID={archive ? 'athlete-archive' : 'athlete-restore'}
          onPress={() => setConfirming(true)}
        />
      </View>
    );
  }
  return (
    <Notice
      tone={archive ? 'caution' : 'info'}
      title={archive ? `Archive ${athlete.firstName} ${athlete.lastName}?` : `Restore ${athlete.firstName} ${athlete.lastName}?`}
    >
      <Text>
        {archive
          ? `${athlete.firstName} leaves the squad lists and new screening rounds. Nothing is deleted: earlier results stay, and you can restore ${athlete.firstName} at any time.`
          : `${athlete.firstName} comes back to the roster${athlete.squadName ? ` in ${athlete.squadName}` : ''}.`}
      </Text>
      {mutation.error ? <Text style={styles.error}>{mutation.error.message}</Text> : null}
      <View style={styles.actions}>
        <Button
          label={archive ? 'Yes, archive' : 'Yes, restore'}
          tone={archive ? 'danger' : 'primary'}
          testID="athlete-archive-confirm"
          busy={mutation.isPending}
          onPress={run}
        />
        <Button label="Cancel" tone="secondary" onPress={() => setConfirming(false)} disabled={mutation.isPending} />
      </View>
    </Notice>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, marginTop: space.sm },
  error: { color: colors.brick },
});

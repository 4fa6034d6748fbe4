import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { Button } from '@/features/ui/components/button';
import { Notice } from '@/features/ui/components/notice';
import { space } from '@/features/ui/theme';
import { useSquadsQuery } from '../api/get-squads';
import type { Athlete } from '../api/types';
import { useUpdateAthleteMutation } from '../api/update-athlete';
import { moveSquadSchema } from '../schemas';
import { Chips } from '@/features/ui/components/chips';

/** Moves the athlete to another squad of the club: pick the squad, then confirm. */
export function MoveSquad({ athlete }: { athlete: Athlete }) {
  const [open, setOpen] = useState(false);
  const [target, setTarget] = useState<string>('');
  const [error, setError] = useState<string | null>(null);
  const squads = useSquadsQuery();
  const move = useUpdateAthleteMutation(athlete.id);
  if (!open) {
    return (
      <View style={styles.wrap}>
        {move.isSuccess ? <Notice>Moved to {athlete.squadName}.</Notice> : null}
        <Button label="Move to another squad" tone="secondary" testID="athlete-move" onPress={() => setOpen(true)} />
      </View>
    );
  }
  const options = (squads.data?.squads ?? []).filter((s) => s.id !== athlete.squadId).map((s) => ({ value: s.id, label: s.name }));
  const submit = async () => {
    setError(null);
    try {
      const input = await moveSquadSchema.validate({ squadId: target });
      await move.mutateAsync(input);
      setOpen(false);
      setTarget('');
    } catch (e) {
      setError(e instanceof Error ? e.message : String(e));
    }
  };
  return (
    <View style={styles.wrap}>
      {squads.error ? <Notice tone="error">{squads.error.message}</Notice> : null}
      {squads.data && options.length === 0 ? <Notice>The club has no other squad.</Notice> : null}
      <Chips variant="form" label="Move to" testID="move-squad" options={options} value={target} onChange={setTarget} error={error ?? undefined} />
      <View style={styles.actions}>
        <Button label="Move" testID="athlete-move-confirm" busy={move.isPending} onPress={submit} />
        <Button label="Cancel" tone="secondary" onPress={() => setOpen(false)} disabled={move.isPending} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});

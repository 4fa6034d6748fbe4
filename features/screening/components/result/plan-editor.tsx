import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { ValidationError } from 'yup';
import { useAdjustPlanMutation } from '@/features/screening/api/adjust-plan';
import { planAdjustmentSchema, type PlanAdjustmentInput } from '@/features/screening/contract';
import { EXERCISES, type PlannedExercise } from '@/features/screening/engine';
import { canShiftLoad, finalizeAdjustment, fromLibrary, shiftLoad, shiftSets } from '@/features/screening/plan-edits';
import { loadText, setsText } from '@/features/screening/labels';
import { Button } from '@/features/ui/components/button';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { TextField } from '@/features/ui/components/text-field';
import { colors, radius, space } from '@/features/ui/theme';

type Props = {
  assessmentId: string;
  /** Where the editing starts: the current adjustment, or the engine's proposal. */
  start: PlannedExercise[];
  startNote: string;
  /** The plan this edit starts from, so an edit against a plan changed meanwhile is refused (409). */
  basedOn: PlanAdjustmentInput['basedOn'];
  proposal: PlannedExercise[];
  oneRepMaxKg: number | null | undefined;
  onClose(): void;
};

/** Drop an exercise, add one back from the library, change sets or load; saved beside the engine's proposal. */
export function PlanEditor({ assessmentId, start, startNote, basedOn, proposal, oneRepMaxKg, onClose }: Props) {
  const [list, setList] = useState<PlannedExercise[]>(start);
  const [note, setNote] = useState(startNote);
  const [error, setError] = useState<string | null>(null);
  const save = useAdjustPlanMutation(assessmentId);
  const available = EXERCISES.filter((e) => !list.some((x) => x.id === e.id));
  const replace = (i: number, ex: PlannedExercise) => setList((l) => l.map((x, j) => (j === i ? ex : x)));

  const onSave = async () => {
    setError(null);
    try {
      const input = await planAdjustmentSchema.validate({ exercises: finalizeAdjustment(list, proposal), note, basedOn });
      await save.mutateAsync(input);
      onClose();
    } catch (e) {
      setError(e instanceof ValidationError || e instanceof Error ? e.message : String(e));
    }
  };

  return (
    <View style={styles.wrap} testID="plan-editor">
      {list.map((ex, i) => (
        <View key={ex.id} style={styles.item} testID={`edit-exercise-${ex.id}`}>
          <Text variant="label">
            {i + 1}. {ex.name}
          </Text>
          <View style={styles.row}>
            <Text style={styles.value}>{setsText(ex.prescription.sets)}</Text>
            <Button tone="secondary" label="− set" accessibilityLabel={`One set fewer for ${ex.name}`} onPress={() => replace(i, shiftSets(ex, -1))} />
            <Button tone="secondary" label="+ set" accessibilityLabel={`One set more for ${ex.name}`} onPress={() => replace(i, shiftSets(ex, 1))} />
          </View>
          <Text variant="small">Load: {loadText(ex.prescription.load)}</Text>
          {canShiftLoad(ex) ? (
            <View style={styles.row}>
              <Button tone="secondary" label="Lighter" accessibilityLabel={`Lighter load for ${ex.name}`} onPress={() => replace(i, shiftLoad(ex, -1))} />
              <Button tone="secondary" label="Heavier" accessibilityLabel={`Heavier load for ${ex.name}`} onPress={() => replace(i, shiftLoad(ex, 1))} />
            </View>
          ) : null}
          <Button tone="quiet" label="Drop this exercise" testID={`drop-${ex.id}`} onPress={() => setList((l) => l.filter((_, j) => j !== i))} />
        </View>
      ))}
      {available.length > 0 ? (
        <View style={styles.library}>
          <Text variant="label">Add from the exercise library</Text>
          {available.map((spec) => (
            <View key={spec.id} style={styles.libraryItem}>
              <View style={styles.libraryText}>
                <Text>{spec.name}</Text>
                <Text variant="small">{spec.purpose}</Text>
              </View>
              <Button
                tone="secondary"
                label="Add"
                accessibilityLabel={`Add ${spec.name}`}
                testID={`add-${spec.id}`}
                onPress={() => setList((l) => [...l, fromLibrary(spec, oneRepMaxKg, l.length + 1)])}
              />
            </View>
          ))}
        </View>
      ) : null}
      <TextField label="Why the change (optional)" testID="plan-note" multiline value={note} onChangeText={setNote} style={styles.note} />
      {error ? <Notice tone="error">{error}</Notice> : null}
      <View style={styles.row}>
        <Button tone="secondary" label="Cancel" onPress={onClose} style={styles.grow} />
        <Button label="Save the plan" testID="plan-save" busy={save.isPending} onPress={() => void onSave()} style={styles.grow} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  item: { gap: space.xs, padding: space.md, borderRadius: radius.md, borderWidth: 1, borderColor: colors.line, backgroundColor: colors.surface },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  value: { minWidth: 80 },
  library: { gap: space.sm },
  libraryItem: { flexDirection: 'row', alignItems: 'center', gap: space.md, paddingVertical: space.xs, borderTopWidth: 1, borderTopColor: colors.line },
  libraryText: { flex: 1 },
  note: { minHeight: 72, paddingVertical: space.sm, textAlignVertical: 'top' },
  grow: { flex: 1 },
});

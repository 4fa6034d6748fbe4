import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { ValidationError } from 'yup';
import { useAdjustPlanMutation } from '@/features/screening/api/adjust-plan';
import { planAdjustmentSchema, type PlanAdjustmentInput, type PlanOverrideView } from '@/features/screening/contract';
import type { LimitBreach, LoadingContext, PlannedExercise } from '@/features/screening/engine';
import { EXERCISES } from '@/features/screening/engine/exercises';
import { checkExercise } from '@/features/screening/engine/limits';
import { loadText, setsText } from '@/features/screening/labels';
import { canShiftLoad, finalizeAdjustment, fromLibrary, goesPastLimit, shiftLoad, shiftSets } from '@/features/screening/plan-edits';
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
  startOverrides: PlanOverrideView[];
  /** The plan this edit starts from, so an edit against a plan changed meanwhile is refused (409). */
  basedOn: PlanAdjustmentInput['basedOn'];
  proposal: PlannedExercise[];
  /** The limits the engine applied to this athlete; the server checks the saved plan against the same. */
  loading: LoadingContext;
  /** Head coach or physiotherapist: may go past a limit, with a reason. */
  canOverride: boolean;
  onClose(): void;
};

const breachKey = (b: Pick<LimitBreach, 'exerciseId' | 'limit'>) => `${b.exerciseId}:${b.limit}`;
const PAST_LIMIT_FOR_OTHERS =
  'That goes past a youth or growth-spurt limit for this athlete. Only a head coach or a physiotherapist can do that, with a reason.';

/**
 * Drop an exercise, add one back from the library, change sets or load; saved beside the engine's
 * proposal. Every change meets the same limits as the engine's own plan: a tester cannot go past one,
 * a head coach or physiotherapist can, giving a reason that stays in the plan's history.
 */
export function PlanEditor({ assessmentId, start, startNote, startOverrides, basedOn, proposal, loading, canOverride, onClose }: Props) {
  const [list, setList] = useState<PlannedExercise[]>(start);
  const [note, setNote] = useState(startNote);
  const [reasons, setReasons] = useState<Record<string, string>>(() => Object.fromEntries(startOverrides.map((o) => [breachKey(o), o.reason])));
  const [error, setError] = useState<string | null>(null);
  const save = useAdjustPlanMutation(assessmentId);
  const available = EXERCISES.filter((e) => !list.some((x) => x.id === e.id));
  const breaches = list.flatMap((ex) => checkExercise(ex, loading));

  /** Applies a change, unless it goes past a limit and the user may not do that. */
  const change = (i: number, next: PlannedExercise) => {
    const current = list[i]!;
    if (next === current) return;
    if (!canOverride && goesPastLimit(current, next, loading)) {
      setError(PAST_LIMIT_FOR_OTHERS);
      return;
    }
    setError(null);
    setList((l) => l.map((x, j) => (j === i ? next : x)));
  };

  const add = (spec: (typeof EXERCISES)[number]) => {
    const ex = fromLibrary(spec, loading, list.length + 1);
    if (!canOverride && checkExercise(ex, loading).length > 0) {
      setError(PAST_LIMIT_FOR_OTHERS);
      return;
    }
    setError(null);
    setList((l) => [...l, ex]);
  };

  const onSave = async () => {
    setError(null);
    const missing = breaches.filter((b) => (reasons[breachKey(b)] ?? '').trim().length < 5);
    if (missing.length > 0) {
      setError(
        canOverride ? 'Give a reason (a few words) for each limit the plan goes past, or undo the change.' : `${missing[0]!.message} ${PAST_LIMIT_FOR_OTHERS}`,
      );
      return;
    }
    try {
      const overrides = breaches.map((b) => ({ exerciseId: b.exerciseId, limit: b.limit, reason: (reasons[breachKey(b)] ?? '').trim() }));
      const input = await planAdjustmentSchema.validate({ exercises: finalizeAdjustment(list, proposal), note, overrides, basedOn });
      await save.mutateAsync(input);
      onClose();
    } catch (e) {
      setError(e instanceof ValidationError || e instanceof Error ? e.message : String(e));
    }
  };

  return (
    <View style={styles.wrap} testID="plan-editor">
      {list.map((ex, i) => {
        const own = breaches.filter((b) => b.exerciseId === ex.id);
        // At a limit a tester may not pass: said at the button, which stays pressed-looking no more (the
        // refusal was shown by the Save button, a screen further down).
        const blocked = (next: PlannedExercise) => !canOverride && next !== ex && goesPastLimit(ex, next, loading);
        const heavierBlocked = blocked(shiftLoad(ex, 1));
        const moreSetsBlocked = blocked(shiftSets(ex, 1));
        return (
          <View key={ex.id} style={[styles.item, own.length > 0 && styles.itemPast]} testID={`edit-exercise-${ex.id}`}>
            <Text variant="label">
              {i + 1}. {ex.name}
            </Text>
            <View style={styles.row}>
              <Text style={styles.value}>{setsText(ex.prescription.sets)}</Text>
              <Button tone="secondary" label="− set" accessibilityLabel={`One set fewer for ${ex.name}`} onPress={() => change(i, shiftSets(ex, -1))} />
              <Button
                tone="secondary"
                label="+ set"
                accessibilityLabel={`One set more for ${ex.name}`}
                testID={`more-sets-${ex.id}`}
                disabled={moreSetsBlocked}
                onPress={() => change(i, shiftSets(ex, 1))}
              />
            </View>
            {moreSetsBlocked ? (
              <Text variant="small" testID={`at-limit-sets-${ex.id}`}>
                Most sets allowed for this athlete.
              </Text>
            ) : null}
            <Text variant="small">Load: {loadText(ex.prescription.load)}</Text>
            {canShiftLoad(ex) ? (
              <View style={styles.row}>
                <Button tone="secondary" label="Lighter" accessibilityLabel={`Lighter load for ${ex.name}`} onPress={() => change(i, shiftLoad(ex, -1))} />
                <Button
                  tone="secondary"
                  label="Heavier"
                  accessibilityLabel={`Heavier load for ${ex.name}`}
                  testID={`heavier-${ex.id}`}
                  disabled={heavierBlocked}
                  onPress={() => change(i, shiftLoad(ex, 1))}
                />
              </View>
            ) : null}
            {canShiftLoad(ex) && heavierBlocked ? (
              <Text variant="small" testID={`at-limit-load-${ex.id}`}>
                Heaviest load allowed for this athlete: the youth and growth-spurt limits stop it here.
              </Text>
            ) : null}
            {own.map((b) => (
              <View key={breachKey(b)} style={styles.breach} testID={`breach-${ex.id}-${b.limit}`}>
                <Text style={styles.breachText}>⚠ Past a limit: {b.message}</Text>
                {canOverride ? (
                  <TextField
                    label="Reason for going past this limit (kept in the plan's history)"
                    testID={`override-reason-${ex.id}-${b.limit}`}
                    value={reasons[breachKey(b)] ?? ''}
                    onChangeText={(t) => setReasons((r) => ({ ...r, [breachKey(b)]: t }))}
                  />
                ) : (
                  <Text variant="small">Only a head coach or a physiotherapist can keep this, with a reason.</Text>
                )}
              </View>
            ))}
            <Button tone="quiet" label="Drop this exercise" testID={`drop-${ex.id}`} onPress={() => setList((l) => l.filter((_, j) => j !== i))} />
          </View>
        );
      })}
      {available.length > 0 ? (
        <View style={styles.library}>
          <Text variant="label">Add from the exercise library</Text>
          <Text variant="small">Added exercises get the same limits as the engine&apos;s own plan for this athlete.</Text>
          {available.map((spec) => (
            <View key={spec.id} style={styles.libraryItem}>
              <View style={styles.libraryText}>
                <Text>{spec.name}</Text>
                <Text variant="small">{spec.purpose}</Text>
              </View>
              <Button tone="secondary" label="Add" accessibilityLabel={`Add ${spec.name}`} testID={`add-${spec.id}`} onPress={() => add(spec)} />
            </View>
          ))}
        </View>
      ) : null}
      <TextField label="Why the change (optional)" testID="plan-note" multiline value={note} onChangeText={setNote} style={styles.note} />
      {error ? (
        <Notice tone="error" testID="plan-editor-error">
          {error}
        </Notice>
      ) : null}
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
  itemPast: { borderColor: colors.amber, borderLeftWidth: 6 },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  value: { minWidth: 80 },
  breach: { gap: space.xs, padding: space.sm, borderRadius: radius.sm, backgroundColor: colors.amberSoft },
  breachText: { color: colors.ink },
  library: { gap: space.sm },
  libraryItem: { flexDirection: 'row', alignItems: 'center', gap: space.md, paddingVertical: space.xs, borderTopWidth: 1, borderTopColor: colors.line },
  libraryText: { flex: 1 },
  note: { minHeight: 72, paddingVertical: space.sm, textAlignVertical: 'top' },
  grow: { flex: 1 },
});

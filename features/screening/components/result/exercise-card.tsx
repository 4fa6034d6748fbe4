import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import type { PlannedExercise } from '@/features/screening/engine';
import { doseText, loadText, PHASE_WORDS, perWeekText, restText, setsText } from '@/features/screening/labels';
import { Text } from '@/features/ui/components/text';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/features/ui/theme';

/** One exercise with its full prescription: sets, reps or time, tempo, load, rest, days a week. */
export function ExerciseCard({
  exercise,
  index,
  onHold = false,
  children,
}: {
  exercise: PlannedExercise;
  index: number;
  /** Held back from the plan: no place in the plan's order, marked as on hold. */
  onHold?: boolean;
  children?: React.ReactNode;
}) {
  const [open, setOpen] = useState(false);
  const p = exercise.prescription;
  return (
    <View style={styles.card} testID={`exercise-${exercise.id}`}>
      <Text variant="small">{onHold ? `On hold · ${PHASE_WORDS[exercise.phase]}` : `${index + 1}. ${PHASE_WORDS[exercise.phase]}`}</Text>
      <Text variant="heading">{exercise.name}</Text>
      <Text>{exercise.purpose}</Text>
      <View style={styles.rx}>
        <Text style={styles.rxMain}>
          {setsText(p.sets)} × {doseText(p.dose)}
        </Text>
        <Text variant="small">Tempo: {p.tempo}</Text>
        <Text variant="small">Load: {loadText(p.load)}</Text>
        <Text variant="small">
          {restText(p.restSeconds)} · {perWeekText(p.perWeek)}
        </Text>
      </View>
      {exercise.adjustments.map((a) => (
        <Text key={a} variant="small" style={styles.adjustment}>
          {a}
        </Text>
      ))}
      {children}
      <Pressable accessibilityRole="button" aria-expanded={open} onPress={() => setOpen((o) => !o)} style={styles.more}>
        <Text style={styles.moreText}>{open ? 'Hide how to do it ▲' : 'How to do it ▼'}</Text>
      </Pressable>
      {open ? (
        <View style={styles.how}>
          {exercise.howTo.map((h, i) => (
            <Text key={h}>
              {i + 1}. {h}
            </Text>
          ))}
          <Text variant="small">Cue: {exercise.cue}</Text>
          <Text variant="small">Watch for: {exercise.commonFault}</Text>
          <Text variant="small">Harder: {exercise.progression}</Text>
          <Text variant="small">Easier: {exercise.regression}</Text>
          {exercise.loadRule ? <Text variant="small">Moving on: {exercise.loadRule}</Text> : null}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.xs, padding: space.md, borderRadius: radius.md, backgroundColor: colors.surface, borderWidth: 1, borderColor: colors.line },
  rx: { gap: 2, backgroundColor: colors.pineSoft, borderRadius: radius.sm, padding: space.sm, marginTop: space.xs },
  rxMain: { fontFamily: fonts.bold, fontSize: 17, color: colors.pineDark },
  adjustment: { color: colors.amber },
  more: { minHeight: TOUCH_MIN, justifyContent: 'center', alignSelf: 'flex-start' },
  moreText: { fontFamily: fonts.bold, color: colors.pine },
  how: { gap: space.xs },
});

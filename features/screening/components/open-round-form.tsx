import { plural } from '@/features/ui/plural';
import { useRouter } from 'expo-router';
import { Formik } from 'formik';
import { Pressable, StyleSheet, View } from 'react-native';
import { fieldErrorsOf } from '@/features/api/client';
import type { SquadSummary } from '@/features/athletes/api/types';
import { useCreateRoundMutation } from '@/features/screening/api/create-round';
import { createRoundSchema, type CreateRoundInput } from '@/features/screening/contract';
import { todayIsoLocal } from '@/features/screening/labels';
import { Button } from '@/features/ui/components/button';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { DateField } from '@/features/ui/components/date-field';
import { TextField } from '@/features/ui/components/text-field';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/features/ui/theme';

/** Opens a screening round for a squad on a date; the round then lists the squad's athletes. */
export function OpenRoundForm({ squads, initialSquadId }: { squads: SquadSummary[]; initialSquadId?: string }) {
  const router = useRouter();
  const create = useCreateRoundMutation();
  return (
    <Formik<CreateRoundInput>
      initialValues={{ squadId: initialSquadId ?? (squads.length === 1 ? squads[0]!.id : ''), name: '', screenedOn: todayIsoLocal() }}
      // A function: yup and the schemas are built at the first validation, not while the page starts.
      validationSchema={() => createRoundSchema}
      onSubmit={async (values, helpers) => {
        try {
          const res = await create.mutateAsync(createRoundSchema.cast(values));
          router.push(`/screening/rounds/${res.round.id}`);
        } catch (error) {
          const fields = fieldErrorsOf(error);
          if (fields) helpers.setErrors(fields);
        }
      }}
    >
      {({ handleChange, handleBlur, handleSubmit, setFieldValue, setFieldTouched, values, errors, touched, isSubmitting, submitCount }) => (
        <View style={styles.form}>
          {create.error ? (
            <Notice tone="error" testID="open-round-error">
              {create.error.message}
            </Notice>
          ) : null}
          <View style={styles.field} accessibilityRole="radiogroup" accessibilityLabel="Squad">
            <Text variant="label">Squad</Text>
            {squads.map((s) => {
              const selected = values.squadId === s.id;
              return (
                <Pressable
                  key={s.id}
                  accessibilityRole="radio"
                  aria-checked={selected}
                  testID={`round-squad-${s.id}`}
                  onPress={() => {
                    void setFieldValue('squadId', s.id);
                    void setFieldTouched('squadId', true, false);
                  }}
                  style={[styles.choice, selected && styles.choiceOn]}
                >
                  <View style={[styles.dot, selected && styles.dotOn]} />
                  <Text style={styles.choiceText}>{s.name}</Text>
                  <Text variant="small">{plural(s.athleteCount, 'athlete', 'athletes')}</Text>
                </Pressable>
              );
            })}
            {(touched.squadId || submitCount > 0) && errors.squadId ? (
              <Text variant="small" style={styles.error} accessibilityRole="alert">
                {errors.squadId}
              </Text>
            ) : null}
          </View>
          <TextField
            label="Round name"
            testID="round-name"
            placeholder="Pre-season"
            value={values.name}
            onChangeText={handleChange('name')}
            onBlur={handleBlur('name')}
            error={touched.name && errors.name}
          />
          <DateField
            label="Screening date"
            testID="round-date"
            hint="The day the squad is screened."
            value={values.screenedOn}
            onChange={handleChange('screenedOn')}
            onBlur={() => handleBlur('screenedOn')({ target: { name: 'screenedOn' } })}
            error={touched.screenedOn && errors.screenedOn}
          />
          <Button label="Open the round" testID="open-round-submit" busy={isSubmitting} onPress={() => handleSubmit()} />
        </View>
      )}
    </Formik>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.lg },
  field: { gap: space.sm },
  choice: {
    minHeight: TOUCH_MIN,
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    paddingHorizontal: space.md,
    borderWidth: 2,
    borderColor: colors.line,
    borderRadius: radius.md,
    backgroundColor: colors.surface,
  },
  choiceOn: { borderColor: colors.pine, backgroundColor: colors.pineSoft },
  dot: { width: 22, height: 22, borderRadius: 11, borderWidth: 2, borderColor: colors.inkMuted },
  dotOn: { borderColor: colors.pine, borderWidth: 7 },
  choiceText: { flex: 1 },
  error: { color: colors.brick, fontFamily: fonts.bold },
});

import { Formik } from 'formik';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { fieldErrorsOf, messageOf } from '@/features/api/client';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Button } from '@/features/ui/components/button';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { TextField } from '@/features/ui/components/text-field';
import { space } from '@/features/ui/theme';
import { useSquadsQuery } from '../api/get-squads';
import type { Athlete } from '../api/types';
import {
  athleteSchema,
  isCalendarDate,
  JUNIOR_AGE,
  withDateDashes,
  SEX_LABELS,
  SEX_VALUES,
  SIDE_LABELS,
  SIDE_VALUES,
  type AthleteInput,
  type Sex,
  type Side,
} from '../schemas';
import { Chips } from '@/features/ui/components/chips';
import { todayIso } from '../age';
import { ageGroupCheck } from '../age-group';

type Values = {
  firstName: string;
  lastName: string;
  dateOfBirth: string;
  sex: Sex | '';
  racketHand: Side | '';
  takeOffLeg: Side | '';
  squadId: string;
};

const sexOptions = SEX_VALUES.map((v) => ({ value: v, label: SEX_LABELS[v] }));
const sideOptions = SIDE_VALUES.map((v) => ({ value: v, label: SIDE_LABELS[v] }));

/** Creates or edits an athlete. The same yup schema checks the request on the server. */
export function AthleteForm({
  athlete,
  submitLabel,
  onSubmit,
  onCancel,
}: {
  athlete?: Athlete;
  submitLabel: string;
  onSubmit: (values: AthleteInput) => Promise<unknown>;
  onCancel?: () => void;
}) {
  const squads = useSquadsQuery();
  const { isTabletUp } = useBreakpoints();
  const [failure, setFailure] = useState<string | null>(null);
  const initial: Values = {
    firstName: athlete?.firstName ?? '',
    lastName: athlete?.lastName ?? '',
    dateOfBirth: athlete?.dateOfBirth ?? '',
    sex: athlete?.sex ?? '',
    racketHand: athlete?.racketHand ?? '',
    takeOffLeg: athlete?.takeOffLeg ?? '',
    squadId: athlete?.squadId ?? '',
  };
  return (
    <Formik<Values>
      initialValues={initial}
      validationSchema={athleteSchema}
      onSubmit={async (values, helpers) => {
        setFailure(null);
        try {
          await onSubmit(athleteSchema.cast(values) as AthleteInput);
        } catch (error) {
          const fields = fieldErrorsOf(error);
          if (fields) helpers.setErrors(fields);
          else setFailure(messageOf(error));
        }
      }}
    >
      {({ values, errors, touched, submitCount, handleChange, handleBlur, handleSubmit, setFieldValue, isSubmitting }) => {
        // Choices have no blur: their errors show once the person tried to save.
        const show = (field: keyof Values) => (touched[field] || submitCount > 0) && errors[field];
        return (
          <View style={styles.form}>
            {failure ? <Notice tone="error">{failure}</Notice> : null}
            <View style={[styles.pair, isTabletUp && styles.pairWide]}>
              <View style={isTabletUp ? styles.cell : undefined}>
                <TextField
                  label="First name"
                  testID="athlete-first-name"
                  value={values.firstName}
                  onChangeText={handleChange('firstName')}
                  onBlur={handleBlur('firstName')}
                  autoComplete="off"
                  error={show('firstName')}
                />
              </View>
              <View style={isTabletUp ? styles.cell : undefined}>
                <TextField
                  label="Last name"
                  testID="athlete-last-name"
                  value={values.lastName}
                  onChangeText={handleChange('lastName')}
                  onBlur={handleBlur('lastName')}
                  autoComplete="off"
                  error={show('lastName')}
                />
              </View>
            </View>
            <TextField
              label="Date of birth"
              testID="athlete-date-of-birth"
              placeholder="YYYY-MM-DD"
              hint={`Year-month-day, e.g. 2014-03-09 (or 20140309). Athletes are ${JUNIOR_AGE.min} to ${JUNIOR_AGE.max} years old.`}
              inputMode="numeric"
              value={values.dateOfBirth}
              onChangeText={(v) => setFieldValue('dateOfBirth', withDateDashes(v))}
              onBlur={handleBlur('dateOfBirth')}
              error={show('dateOfBirth')}
            />
            <View style={[styles.pair, isTabletUp && styles.pairWide]}>
              <View style={isTabletUp ? styles.cell : undefined}>
                <Chips
                  variant="form"
                  label="Sex"
                  testID="sex"
                  options={sexOptions}
                  value={values.sex}
                  onChange={(v) => setFieldValue('sex', v)}
                  error={show('sex')}
                />
              </View>
              <View style={isTabletUp ? styles.cell : undefined}>
                <Chips
                  variant="form"
                  label="Racket hand"
                  testID="racketHand"
                  options={sideOptions}
                  value={values.racketHand}
                  onChange={(v) => setFieldValue('racketHand', v)}
                  error={show('racketHand')}
                />
              </View>
              <View style={isTabletUp ? styles.cell : undefined}>
                <Chips
                  variant="form"
                  label="Take-off leg"
                  testID="takeOffLeg"
                  options={sideOptions}
                  value={values.takeOffLeg}
                  onChange={(v) => setFieldValue('takeOffLeg', v)}
                  error={show('takeOffLeg')}
                />
              </View>
            </View>
            {squads.error ? <Notice tone="error">{squads.error.message}</Notice> : null}
            {squads.data && squads.data.squads.length === 0 ? <Notice tone="caution">The club has no squad yet: create one under Squads first.</Notice> : null}
            <Chips
              variant="form"
              label="Squad"
              testID="squad"
              options={(squads.data?.squads ?? []).map((s) => ({ value: s.id, label: s.name }))}
              value={values.squadId}
              onChange={(v) => setFieldValue('squadId', v)}
              error={show('squadId')}
            />
            {squads.isPending ? <Text variant="small">Loading squads…</Text> : null}
            <AgeGroupCheck squadName={squads.data?.squads.find((s) => s.id === values.squadId)?.name} dateOfBirth={values.dateOfBirth} />
            <View style={[styles.actions, isTabletUp && styles.actionsWide]}>
              <Button label={submitLabel} testID="athlete-save" busy={isSubmitting} onPress={() => handleSubmit()} />
              {onCancel ? <Button label="Cancel" tone="secondary" onPress={onCancel} disabled={isSubmitting} /> : null}
            </View>
          </View>
        );
      }}
    </Formik>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.lg },
  pair: { gap: space.lg },
  pairWide: { flexDirection: 'row', flexWrap: 'wrap' },
  cell: { flexGrow: 1, flexBasis: 200 },
  actions: { gap: space.sm },
  actionsWide: { flexDirection: 'row' },
});

/** A child older than the chosen squad's name says: a second look, not a refusal (the same words as the import's). */
function AgeGroupCheck({ squadName, dateOfBirth }: { squadName: string | undefined; dateOfBirth: string }) {
  if (!squadName || !isCalendarDate(dateOfBirth)) return null;
  const check = ageGroupCheck(squadName, dateOfBirth, todayIso());
  return check ? (
    <Notice tone="caution" testID="athlete-age-group-check">
      {check}
    </Notice>
  ) : null;
}

import { can } from '@/features/access/permissions';
import { Formik } from 'formik';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { fieldErrorsOf, messageOf } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import { Button } from '@/features/ui/components/button';
import { Card } from '@/features/ui/components/card';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { TextField } from '@/features/ui/components/text-field';
import { colors, fonts, radius, space } from '@/features/ui/theme';
import { todayIso } from '../age';
import { useConsentsQuery, type PhotoTerms } from '../api/get-consents';
import { plural } from '@/features/ui/plural';
import { useRecordConsentMutation } from '../api/record-consent';
import { useRecordOwnConsentMutation } from '../api/record-own-consent';
import type { Athlete, ConsentView } from '../api/types';
import { CONSENT_FIELDS, CONSENT_KINDS, CONSENT_LABELS, consentSchema, type ConsentInput, type ConsentKind } from '../schemas';
import { Chips } from '@/features/ui/components/chips';
import { formatDate } from '@/features/ui/format-date';

const kindOptions = CONSENT_KINDS.map((k) => ({ value: k, label: CONSENT_LABELS[k].title }));
const answerOptions = [
  { value: 'yes', label: 'Yes' },
  { value: 'no', label: 'No' },
] as const;

/** Each kind as the athlete record names it, its test id, and whether its absence is shown as a warning. */
const CONSENT_ROWS: { kind: ConsentKind; id: string; warn: boolean }[] = [
  { kind: 'screening', id: 'screening', warn: true },
  { kind: 'photos', id: 'photos', warn: true },
  { kind: 'email_summaries', id: 'email', warn: false },
];

function inForce(c: ConsentView, kind: ConsentKind) {
  if (!c) return kind === 'screening' ? 'Not recorded yet: not screened until it is' : 'Not recorded yet';
  return `${c.granted ? CONSENT_LABELS[kind].yes : CONSENT_LABELS[kind].no} (decided ${formatDate(c.decidedOn)})`;
}

/** The decisions in force, their history (newest first), and recording a new decision. */
export function ConsentPanel({ athlete }: { athlete: Athlete }) {
  const { membership } = useActiveClub();
  const history = useConsentsQuery(athlete.id);
  const [recording, setRecording] = useState(false);
  const manage = can(membership.role, 'consent.manage');
  const own = can(membership.role, 'consent.own');
  return (
    <Card testID="consent-panel">
      <Text variant="heading">Consent</Text>
      {own ? (
        <Text variant="small">{`Your decisions about ${athlete.firstName}: each is recorded with today's date and your name, and you can change it here at any time. Answers the club took from a paper form carry the name of the club member who recorded them.`}</Text>
      ) : null}
      <View style={styles.current}>
        {CONSENT_ROWS.map(({ kind, id, warn }) => (
          <View key={kind} style={styles.current}>
            <Current
              label={CONSENT_LABELS[kind].title}
              value={inForce(athlete.consents[CONSENT_FIELDS[kind]], kind)}
              warn={warn && athlete.consents[CONSENT_FIELDS[kind]]?.granted !== true}
              testID={`consent-${id}`}
            />
            {kind === 'photos' && athlete.consents.photos?.granted && history.data?.photoTerms ? (
              <Text variant="small" testID="consent-photo-terms">{`Photos are ${keptFor(history.data.photoTerms)}.`}</Text>
            ) : null}
            {own ? <OwnDecision athlete={athlete} kind={kind} granted={athlete.consents[CONSENT_FIELDS[kind]]?.granted === true} /> : null}
          </View>
        ))}
      </View>
      {manage && !recording ? <Button label="Record a decision" tone="secondary" testID="consent-record" onPress={() => setRecording(true)} /> : null}
      {manage && recording ? <RecordDecision athleteId={athlete.id} name={athlete.firstName} onDone={() => setRecording(false)} /> : null}
      <Text variant="label">History</Text>
      {history.error ? <Notice tone="error">{history.error.message}</Notice> : null}
      {history.data?.consents.length === 0 ? <Text variant="small">No decision recorded yet.</Text> : null}
      <View testID="consent-history">
        {history.data?.consents.map((c) => (
          <View key={c.id} style={styles.entry}>
            <Text>
              {CONSENT_LABELS[c.kind].title}: <Text style={styles.bold}>{c.granted ? 'yes' : 'no'}</Text>, decided {formatDate(c.decidedOn)}
            </Text>
            <Text variant="small">
              Recorded {c.recordedBy ? `by ${c.recordedBy}` : 'at set-up'} on {formatDate(c.recordedAt)}
            </Text>
          </View>
        ))}
      </View>
    </Card>
  );
}

function Current({ label, value, warn = false, testID }: { label: string; value: string; warn?: boolean; testID?: string }) {
  return (
    <View style={styles.fact} testID={testID}>
      <Text variant="small">{label}</Text>
      <Text style={warn ? styles.warn : undefined}>{value}</Text>
    </View>
  );
}

/** What a parent's change means, in plain words, before they confirm it (our wording). */
/** The club's photo periods in words ("30 days later"), or its words for them when not known yet. */
const deletedLater = (terms: PhotoTerms | undefined) =>
  terms ? `deleted ${plural(terms.graceDays, 'day', 'days')} later (the club's waiting period)` : "deleted after the club's waiting period";
const keptFor = (terms: PhotoTerms | undefined) =>
  terms
    ? `deleted ${plural(terms.retentionMonths, 'month', 'months')} after the screen (the club's retention period)`
    : "deleted after the club's retention period";

function ownDecisionWords(kind: ConsentKind, granted: boolean, name: string, terms?: PhotoTerms) {
  if (kind === 'screening') {
    return granted
      ? {
          ask: `Stop screens and exercises for ${name}`,
          explain: `From today ${name} is not screened, and the corrective exercises come off the club's training sheet. The screens already done stay on record for the club's staff (and for you here); ask the club if you want them deleted. Tell ${name}'s coach too.`,
          confirm: 'Yes, stop them',
          keep: 'Keep taking part',
        }
      : {
          ask: `Agree to ${name} taking part`,
          explain: `Coaches may screen how ${name} moves (squats, single-leg squats, landings and an ankle test) a few times a season and give corrective exercises from the results, done at club sessions with a coach watching. You can stop this here at any time.`,
          confirm: `Yes, ${name} takes part`,
          keep: 'Not now',
        };
  }
  if (kind === 'photos') {
    return granted
      ? {
          ask: `Stop photos of ${name}`,
          explain: `From today no photos of ${name} are taken at screens. Photos already taken are hidden at once and ${deletedLater(terms)}. The screens already done and the exercises stay.`,
          confirm: 'Yes, stop photos',
          keep: 'Keep photos',
        }
      : {
          ask: `Agree to photos of ${name}`,
          explain: `Coaches may photograph ${name}'s movements at screens to measure them more precisely. Only the club's screening and care staff see them (and you, if the club shares screen photos with families), and they are ${keptFor(terms)}. Photos hidden after an earlier stop and not deleted yet are shown again to the same people.`,
          confirm: 'Yes, agree to photos',
          keep: 'Not now',
        };
  }
  return granted
    ? {
        ask: 'Stop e-mail summaries',
        explain: `Summaries of ${name}'s screens are no longer e-mailed, to you or to any other parent or guardian linked to ${name}: the choice is one for the family. You can still read them here, and turn e-mails back on here.`,
        confirm: 'Yes, stop e-mails',
        keep: 'Keep e-mails',
      }
    : {
        ask: 'E-mail the summaries',
        explain: `When a summary of ${name}'s screen is sent to the family, it also comes by e-mail to every parent and guardian linked to ${name}: the choice is one for the family.`,
        confirm: 'Yes, e-mail them',
        keep: 'Not now',
      };
}

/** A parent changes their own decision: one button, then what it means and a confirmation. */
function OwnDecision({ athlete, kind, granted }: { athlete: Athlete; kind: ConsentKind; granted: boolean }) {
  const record = useRecordOwnConsentMutation(athlete.id);
  const [confirming, setConfirming] = useState(false);
  const words = ownDecisionWords(kind, granted, athlete.firstName, useConsentsQuery(athlete.id).data?.photoTerms);
  const id = CONSENT_ROWS.find((r) => r.kind === kind)!.id;
  if (!confirming) {
    return (
      <Button
        label={words.ask}
        tone="secondary"
        testID={`own-consent-${id}`}
        style={styles.ownButton}
        onPress={() => {
          record.reset();
          setConfirming(true);
        }}
      />
    );
  }
  return (
    <View style={styles.confirm} testID={`own-consent-${id}-confirm`}>
      <Text>{words.explain}</Text>
      {record.error ? <Notice tone="error">{messageOf(record.error)}</Notice> : null}
      <View style={styles.actions}>
        <Button
          label={words.confirm}
          tone={granted ? 'danger' : 'primary'}
          testID={`own-consent-${id}-yes`}
          busy={record.isPending}
          onPress={() => record.mutate({ kind, granted: !granted }, { onSuccess: () => setConfirming(false) })}
        />
        <Button label={words.keep} tone="quiet" disabled={record.isPending} onPress={() => setConfirming(false)} />
      </View>
    </View>
  );
}

type Values = { kind: ConsentKind | ''; granted: 'yes' | 'no' | ''; decidedOn: string };

/** What a decision recorded by the club does, said before it is saved (our wording; the parent's own buttons say it in theirs). */
function recordedEffect(kind: ConsentKind, granted: boolean, name: string, terms?: PhotoTerms): string {
  if (kind === 'screening') {
    return granted
      ? `${name} may be screened and given corrective exercises at club sessions.`
      : `From when it is saved, ${name} is not screened and comes off the training sheet's corrective exercises. Screens already done stay on record.`;
  }
  if (kind === 'photos') {
    return granted
      ? `Photos of ${name} may be taken at screens, seen by the club's screening and care staff (and the family, if the club shares screen photos).`
      : `No photos of ${name} are taken at screens. Photos already taken are hidden at once and ${deletedLater(terms)}.`;
  }
  return granted
    ? `Released summaries are also e-mailed to the parents linked to ${name}.`
    : `Summaries are no longer e-mailed to ${name}'s parents; they still read them when they sign in.`;
}

function RecordDecision({ athleteId, name, onDone }: { athleteId: string; name: string; onDone: () => void }) {
  const record = useRecordConsentMutation(athleteId);
  const terms = useConsentsQuery(athleteId).data?.photoTerms;
  const [failure, setFailure] = useState<string | null>(null);
  const toInput = (v: Values) => ({ kind: v.kind, granted: v.granted === '' ? undefined : v.granted === 'yes', decidedOn: v.decidedOn });
  return (
    <Formik<Values>
      initialValues={{ kind: '', granted: '', decidedOn: todayIso() }}
      validate={async (values) => {
        try {
          await consentSchema.validate(toInput(values), { abortEarly: false });
          return {};
        } catch (error) {
          const fields: Record<string, string> = {};
          for (const e of (error as { inner?: { path?: string; message: string }[] }).inner ?? []) {
            if (e.path && !fields[e.path]) fields[e.path] = e.message;
          }
          return fields;
        }
      }}
      onSubmit={async (values, helpers) => {
        setFailure(null);
        try {
          await record.mutateAsync(consentSchema.cast(toInput(values)) as ConsentInput);
          onDone();
        } catch (error) {
          const fields = fieldErrorsOf(error);
          if (fields) helpers.setErrors(fields);
          else setFailure(messageOf(error));
        }
      }}
    >
      {({ values, errors, submitCount, touched, setFieldValue, handleChange, handleBlur, handleSubmit, isSubmitting }) => (
        <View style={styles.form}>
          {failure ? <Notice tone="error">{failure}</Notice> : null}
          <Chips
            variant="form"
            label="Decision about"
            testID="consent-kind"
            options={kindOptions}
            value={values.kind}
            onChange={(v) => setFieldValue('kind', v)}
            error={submitCount > 0 && errors.kind}
          />
          <Chips
            variant="form"
            label="Answer"
            testID="consent-answer"
            options={answerOptions}
            value={values.granted}
            onChange={(v) => setFieldValue('granted', v)}
            error={submitCount > 0 && errors.granted}
          />
          {values.kind && values.granted ? (
            <Text variant="small" testID="consent-effect">
              {recordedEffect(values.kind, values.granted === 'yes', name, terms)}
            </Text>
          ) : null}
          <TextField
            label="Decided on"
            testID="consent-date"
            placeholder="YYYY-MM-DD"
            hint="The day the family gave or withdrew consent."
            value={values.decidedOn}
            onChangeText={handleChange('decidedOn')}
            onBlur={handleBlur('decidedOn')}
            error={(touched.decidedOn || submitCount > 0) && errors.decidedOn}
          />
          <View style={styles.actions}>
            <Button label="Save decision" testID="consent-save" busy={isSubmitting} onPress={() => handleSubmit()} />
            <Button label="Cancel" tone="secondary" onPress={onDone} disabled={isSubmitting} />
          </View>
        </View>
      )}
    </Formik>
  );
}

const styles = StyleSheet.create({
  current: { gap: space.md },
  fact: { gap: 2 },
  warn: { color: colors.amber, fontFamily: fonts.bold },
  bold: { fontFamily: fonts.bold },
  entry: { gap: 2, paddingVertical: space.sm, borderBottomWidth: 1, borderBottomColor: colors.line },
  form: { gap: space.md },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  ownButton: { alignSelf: 'flex-start' },
  confirm: { gap: space.sm, padding: space.md, borderRadius: radius.md, backgroundColor: colors.paper },
});

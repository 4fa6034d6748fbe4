import { boolean, object, string, type InferType } from 'yup';
import { ageInYears, todayIso } from './age';

// One schema per input, used by the formik forms on the client and by `validateBody` on the server.
// Pure: no React, no server imports.

export const SEX_VALUES = ['female', 'male'] as const;
export const SIDE_VALUES = ['left', 'right'] as const;
export const CONSENT_KINDS = ['screening', 'photos', 'email_summaries'] as const;
export type Sex = (typeof SEX_VALUES)[number];
export type Side = (typeof SIDE_VALUES)[number];
export type ConsentKind = (typeof CONSENT_KINDS)[number];
/** Where each kind's decision in force sits on an athlete record (`Athlete['consents']`). */
export const CONSENT_FIELDS = { screening: 'screening', photos: 'photos', email_summaries: 'emailSummaries' } as const satisfies Record<ConsentKind, string>;

export const SEX_LABELS: Record<Sex, string> = { female: 'Female', male: 'Male' };
export const SIDE_LABELS: Record<Side, string> = { left: 'Left', right: 'Right' };
export const CONSENT_LABELS: Record<ConsentKind, { title: string; yes: string; no: string }> = {
  // Taking part at all: screens and the corrective exercises that follow them (our wording).
  screening: {
    title: 'Screening and exercises',
    yes: 'Takes part in screens and corrective exercises',
    no: 'Family said no: not screened, no corrective exercises',
  },
  photos: { title: 'Photos', yes: 'Photos may be taken', no: 'No photos' },
  email_summaries: { title: 'E-mail summaries', yes: 'Summaries may be e-mailed', no: 'No e-mails' },
};

/** Squadline is for juniors: a date of birth outside this age range today is almost always a typing error. */
export const JUNIOR_AGE = { min: 6, max: 19 } as const;

const ISO_DATE = /^\d{4}-\d{2}-\d{2}$/;

/**
 * Eight digits typed in a row (a phone's number pad may have no dash) written as YYYY-MM-DD; anything else
 * as it is. Pure.
 */
export function withDateDashes(value: string): string {
  const digits = value.trim();
  return /^\d{8}$/.test(digits) ? `${digits.slice(0, 4)}-${digits.slice(4, 6)}-${digits.slice(6)}` : value;
}

/** A real calendar day written YYYY-MM-DD (Date.parse alone accepts 2014-02-31 in some engines). */
export function isCalendarDate(value: string): boolean {
  if (!ISO_DATE.test(value)) return false;
  const d = new Date(`${value}T00:00:00Z`);
  return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === value;
}

export const isoDate = (what: string) =>
  string()
    .trim()
    .required(`Enter the ${what}.`)
    .matches(ISO_DATE, { message: 'Write the date as YYYY-MM-DD, for example 2014-03-09.', excludeEmptyString: true })
    .test('calendar', 'This day does not exist in the calendar.', (v) => !v || !ISO_DATE.test(v) || isCalendarDate(v))
    // Nobody on a junior roster was born, or decided anything, before 1900: a typing error (our choice).
    .test('since-1900', 'Check the year: dates before 1900 are not accepted.', (v) => !v || !ISO_DATE.test(v) || v >= '1900-01-01');

export const name = (what: string) => string().trim().required(`Enter the ${what}.`).max(60, `Keep the ${what} under 60 characters.`);

export const dateOfBirth = isoDate('date of birth').test('junior-age', function check(value) {
  if (!value || !isCalendarDate(value)) return true;
  const today = todayIso();
  if (value > today) return this.createError({ message: 'The date of birth is in the future.' });
  const age = ageInYears(value, today);
  if (age < JUNIOR_AGE.min || age > JUNIOR_AGE.max) {
    return this.createError({
      message: `This gives an age of ${age} today; athletes here are ${JUNIOR_AGE.min} to ${JUNIOR_AGE.max} years old. Check the year.`,
    });
  }
  return true;
});

const sex = string()
  .oneOf([...SEX_VALUES], 'Choose female or male.')
  .required('Choose female or male.');
const side = (what: string) =>
  string()
    .oneOf([...SIDE_VALUES], `Choose the ${what}.`)
    .required(`Choose the ${what}.`);
const squadId = string().trim().required('Choose a squad.').uuid('Choose a squad.');
export const email = string().trim().lowercase().email('Enter a valid e-mail address.');

// ---------------------------------------------------------------------------------------------------
// Athletes
// ---------------------------------------------------------------------------------------------------

export const athleteSchema = object({
  firstName: name('first name'),
  lastName: name('last name'),
  dateOfBirth,
  sex,
  racketHand: side('racket hand'),
  takeOffLeg: side('take-off leg'),
  squadId,
});
export type AthleteInput = InferType<typeof athleteSchema>;

/** PATCH: any subset of the athlete's fields, each checked as on creation (moving squads sends only squadId). */
export const athletePatchSchema = athleteSchema.partial().test('not-empty', 'Nothing to change.', (v) => !!v && Object.values(v).some((x) => x !== undefined));
export type AthletePatchInput = InferType<typeof athletePatchSchema>;

export const moveSquadSchema = object({ squadId });
export type MoveSquadInput = InferType<typeof moveSquadSchema>;

// ---------------------------------------------------------------------------------------------------
// Consent decisions, guardians, squads
// ---------------------------------------------------------------------------------------------------

const consentKind = string()
  .typeError('Choose what the decision is about.')
  .oneOf([...CONSENT_KINDS], 'Choose what the decision is about.')
  .required('Choose what the decision is about.');
const consentGranted = boolean().typeError('Choose yes or no.').required('Choose yes or no.');

/** The day a family's decision was given: a calendar day, not in the future. */
export const decisionDate = (what: string) =>
  isoDate(what).test('not-future', 'The decision cannot be dated in the future.', (v) => {
    if (!v || !isCalendarDate(v)) return true;
    // One day of slack: the phone's day may already be tomorrow in UTC terms, or not yet.
    const tomorrow = new Date(Date.now() + 24 * 3600 * 1000).toISOString().slice(0, 10);
    return v <= tomorrow;
  });

export const consentSchema = object({
  kind: consentKind,
  granted: consentGranted,
  decidedOn: decisionDate('date of the decision'),
});
export type ConsentInput = InferType<typeof consentSchema>;

/** A parent's own decision, made in the app: dated the day the server records it (a date sent is dropped). */
export const ownConsentSchema = object({ kind: consentKind, granted: consentGranted });
export type OwnConsentInput = InferType<typeof ownConsentSchema>;

export const guardianSchema = object({
  email: email.required('Enter the parent’s e-mail address.'),
});
export type GuardianInput = InferType<typeof guardianSchema>;

export const squadSchema = object({
  name: string().trim().required('Name the squad.').max(60, 'Keep the name under 60 characters.'),
});
export type SquadInput = InferType<typeof squadSchema>;

// ---------------------------------------------------------------------------------------------------
// Roster import: one CSV line. Keys are the CSV's column names; spreadsheet shorthands are accepted.
// ---------------------------------------------------------------------------------------------------

export const ROSTER_COLUMNS = [
  'first_name',
  'last_name',
  'date_of_birth',
  'sex',
  'racket_hand',
  'take_off_leg',
  'squad',
  'photo_consent',
  'email_summaries_consent',
  'guardian_email',
  'screening_consent',
  'consents_decided_on',
] as const;
export type RosterColumn = (typeof ROSTER_COLUMNS)[number];
/** Columns that may be left out of the header altogether. */
export const OPTIONAL_ROSTER_COLUMNS: readonly RosterColumn[] = ['guardian_email', 'screening_consent', 'consents_decided_on'];
export const ROSTER_HEADER_LINE = ROSTER_COLUMNS.join(',');
export const ROSTER_EXAMPLE_LINE = 'Mira,Castellano,2014-03-09,F,R,L,Under-13 mixed,yes,no,,yes,2026-09-05';

/** Plain words for the report: which cell of the line is wrong. */
export const ROSTER_COLUMN_LABELS: Record<RosterColumn | 'row', string> = {
  first_name: 'First name',
  last_name: 'Last name',
  date_of_birth: 'Date of birth',
  sex: 'Sex',
  racket_hand: 'Racket hand',
  take_off_leg: 'Take-off leg',
  squad: 'Squad',
  photo_consent: 'Photo consent',
  email_summaries_consent: 'E-mail summaries consent',
  guardian_email: 'Guardian e-mail',
  screening_consent: 'Screening and exercises consent',
  consents_decided_on: 'Date of the decisions',
  row: 'This line',
};

// One line of the roster CSV, checked as the import form's rules check a typed athlete; spreadsheet
// shorthands are accepted (Squadline's own import format). Server only: the page that uploads the file
// reads the report, not the rules, so they stay out of the browser's bundles.
import { boolean, object, string, type InferType } from 'yup';
import { dateOfBirth, decisionDate, email, isCalendarDate, name, SEX_VALUES, SIDE_VALUES, type Sex, type Side } from '@/features/athletes/schemas';

const SEX_ALIASES: Record<string, Sex> = { f: 'female', female: 'female', m: 'male', male: 'male' };
const SIDE_ALIASES: Record<string, Side> = { l: 'left', left: 'left', r: 'right', right: 'right' };
const YES = new Set(['yes', 'y', 'true']);
const NO = new Set(['no', 'n', 'false']);

const alias =
  <T extends string>(map: Record<string, T>) =>
  (value: unknown) =>
    typeof value === 'string' ? (map[value.trim().toLowerCase()] ?? value.trim()) : value;

const yesNo = (what: string) =>
  boolean()
    .transform((_value, original: unknown) => {
      if (typeof original !== 'string') return original;
      const v = original.trim().toLowerCase();
      return YES.has(v) ? true : NO.has(v) ? false : v === '' ? undefined : original;
    })
    .typeError(`Write yes or no for the ${what}.`)
    .required(`Write yes or no for the ${what}.`);

export const rosterRowSchema = object({
  first_name: name('first name'),
  last_name: name('last name'),
  date_of_birth: dateOfBirth,
  sex: string()
    .transform(alias(SEX_ALIASES))
    .oneOf([...SEX_VALUES], 'Write F or M (or female, male).')
    .required('Write F or M (or female, male).'),
  racket_hand: string()
    .transform(alias(SIDE_ALIASES))
    .oneOf([...SIDE_VALUES], 'Write L or R (or left, right).')
    .required('Write L or R (or left, right).'),
  take_off_leg: string()
    .transform(alias(SIDE_ALIASES))
    .oneOf([...SIDE_VALUES], 'Write L or R (or left, right).')
    .required('Write L or R (or left, right).'),
  squad: string().trim().required('Name one of the club’s squads.'),
  photo_consent: yesNo('photo consent'),
  email_summaries_consent: yesNo('e-mail summaries consent'),
  guardian_email: email.transform((v: unknown) => (v === '' ? undefined : v)).optional(),
  // Left out or left empty: no decision is recorded (the athlete is not screened until one is).
  screening_consent: yesNo('screening and exercises consent').optional(),
  // The day the family gave the line's consent answers (a paper form signed before the import); left out
  // or empty, they are dated the day of the import.
  consents_decided_on: decisionDate('date of the decisions')
    .transform((v: unknown) => (v === '' ? undefined : v))
    .notRequired()
    .test('after-birth', 'The decisions are dated before the date of birth.', function check(v) {
      const born: unknown = this.parent?.date_of_birth;
      return !v || typeof born !== 'string' || !isCalendarDate(v) || !isCalendarDate(born) || v >= born;
    }),
});
export type RosterRow = InferType<typeof rosterRowSchema>;

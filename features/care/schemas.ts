import { array, boolean, number, object, string, type InferType } from 'yup';
import { CLEARANCE_HOLDS, CLEARANCE_STATUSES, NOTE_VISIBILITIES } from './choices';

// One schema per care-team input, used by the forms and by `validateBody` on the server. Pure.
// The choices and their labels live in `choices.ts`, so a screen that only shows a clearance does not
// bring yup and these schemas with it.

export const NOTE_MAX_LENGTH = 4000;

const noteText = string().trim().required('Write the note.').max(NOTE_MAX_LENGTH, `Keep the note under ${NOTE_MAX_LENGTH} characters.`);

export const noteSchema = object({
  text: noteText,
  visibility: string()
    .oneOf([...NOTE_VISIBILITIES], 'Choose "team only" or "shared with family".')
    .required('Choose "team only" or "shared with family".'),
  assessmentId: string().trim().uuid('This is not an assessment of this athlete.').optional(),
});
export type NoteInput = InferType<typeof noteSchema>;

/** A correction within the window: the text, and who may read it (a note shared by mistake is taken back). */
export const noteEditSchema = object({
  text: noteText,
  visibility: string()
    .oneOf([...NOTE_VISIBILITIES], 'Choose "team only" or "shared with family".')
    .optional(),
});
export type NoteEditInput = InferType<typeof noteEditSchema>;

export const clearanceSchema = object({
  status: string()
    .oneOf([...CLEARANCE_STATUSES], 'Choose train as normal, train with changes or refer on.')
    .required('Choose train as normal, train with changes or refer on.'),
  // Only with "train with changes" ("refer on" holds both kinds already; "train as normal" none).
  holds: array(
    string()
      .oneOf([...CLEARANCE_HOLDS], 'Choose loaded strength work or jump and landing work.')
      .required(),
  )
    .default([])
    .when('status', {
      is: (status: unknown) => status !== 'modified',
      then: (s) => s.max(0, 'Only "train with changes" holds back part of the work.'),
    }),
  detail: string()
    .trim()
    .max(1000, 'Keep this under 1000 characters.')
    .default('')
    .when(['status', 'holds'], {
      // A hold chosen says part of the change; the words may then add to it.
      is: (status: unknown, holds: unknown) => status === 'modified' && !(Array.isArray(holds) && holds.length > 0),
      then: (s) => s.required('Choose what waits, or say what to change.'),
    })
    .when('status', {
      is: 'referred',
      then: (s) => s.required('Say to whom the athlete is referred.'),
    }),
});
export type ClearanceInput = InferType<typeof clearanceSchema>;

export const careSettingsSchema = object({
  autoReleaseDays: number()
    .typeError('Enter a whole number of days, or leave it empty.')
    .integer('Whole days only.')
    .min(1, 'At least 1 day, or leave empty to release by hand only.')
    .max(90, 'At most 90 days.')
    .nullable()
    .default(null),
  photoGraceDays: number()
    .typeError('Enter a whole number of days.')
    .integer('Whole days only.')
    .min(0, 'Zero or more days.')
    .max(365, 'At most 365 days.')
    .required('Enter a number of days.'),
  photoRetentionMonths: number()
    .typeError('Enter a whole number of months.')
    .integer('Whole months only.')
    .min(1, 'At least 1 month.')
    .max(120, 'At most 120 months.')
    .required('Enter a number of months.'),
  familyPhotos: boolean().required(),
  testersReadTeamNotes: boolean().required(),
});
export type CareSettingsInput = InferType<typeof careSettingsSchema>;

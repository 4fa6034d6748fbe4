import { isCalendarDate } from '@/features/athletes/schemas';
/**
 * An audit event's details in words for the trail on screen. Record ids (the CSV export keeps the full
 * record) and before/after copies of edited text are left out: an admin scanning the trail reads who did
 * what to whom, not UUIDs. Our choice.
 */
import { CLEARANCE_LABELS, NOTE_VISIBILITY_LABELS } from './choices';
import { ROLE_LABELS } from '@/features/access/permissions';

const LEFT_OUT = /(Id|Ids)$|^(replaces|previousText|before|after)$/;

const LABELS: Record<string, string> = {
  status: 'decision',
  detail: 'note',
  visibility: 'shared with',
  previousVisibility: 'was shared with',
  visibilities: 'shared with',
  count: 'notes read',
  reason: 'reason',
  takenAt: 'taken',
  to: 'to',
  subject: 'subject',
  emailed: 'e-mailed',
  automatic: 'automatic',
  reviewCarried: 'review carried over',
  update: 'changed by',
  field: 'field',
  kind: 'about',
  granted: 'answer',
  via: 'through',
  guardian: 'parent account',
  decidedOn: 'decided on',
  name: 'name',
  email: 'e-mail',
  role: 'role',
  from: 'from',
  holds: 'on hold',
  fields: 'fields',
  children: 'children',
};

/** Stored codes in the words the screens use for them. */
const VALUE_WORDS: Record<string, Record<string, string>> = {
  status: CLEARANCE_LABELS,
  holds: { loaded: 'loaded strength work', landing: 'jump and landing work' },
  visibility: NOTE_VISIBILITY_LABELS,
  previousVisibility: NOTE_VISIBILITY_LABELS,
  visibilities: NOTE_VISIBILITY_LABELS,
  kind: { photos: 'photos', email_summaries: 'e-mail summaries', screening: 'screening and exercises' },
  fields: {
    firstName: 'first name',
    lastName: 'last name',
    dateOfBirth: 'date of birth',
    sex: 'sex',
    racketHand: 'racket hand',
    takeOffLeg: 'take-off leg',
    squadId: 'squad',
  },
  role: ROLE_LABELS,
  from: ROLE_LABELS,
  to: ROLE_LABELS,
};

function valueInWords(v: unknown, words: Record<string, string> = {}): string | null {
  if (v === null || v === undefined || v === '') return null;
  if (typeof v === 'boolean') return v ? 'yes' : 'no';
  if (Array.isArray(v)) {
    const parts = v.map((x) => valueInWords(x, words)).filter((x): x is string => x !== null);
    return parts.length ? parts.join(', ') : null;
  }
  if (typeof v === 'object') return null;
  return words[String(v)] ?? String(v);
}

export function auditDetailsInWords(detail: Record<string, unknown>): string {
  return Object.entries(detail)
    .filter(([k]) => !LEFT_OUT.test(k))
    .flatMap(([k, v]) => {
      const words = valueInWords(v, VALUE_WORDS[k]);
      return words === null ? [] : [`${LABELS[k] ?? k}: ${words}`];
    })
    .join(' · ');
}

/** What was done, as the trail says it (our choice of words); a code not listed shows as stored. */
const ACTION_WORDS: Record<string, string> = {
  create: 'added',
  update: 'changed',
  set: 'recorded',
  view: 'viewed',
  submit: 'submitted',
  release: 'released to the family',
  withdraw: 'withdrew',
  review: 'reviewed',
  reevaluate: 'worked out again',
  'reevaluate.refused': 'asked to work out again (refused)',
  'plan.change': 'adjusted the plan of',
  'email.queued': 'sent',
  'photo.deleted': 'deleted',
  'guardian.link': 'linked a parent account to',
  'guardian.unlink': 'unlinked a parent account from',
  'role.change': 'changed the role of',
  remove: 'removed',
  'invitation.cancel': 'cancelled the invitation of',
  invite: 'invited',
  archive: 'archived',
  restore: 'restored',
};

/** The kind of record, in the words the screens use. */
const SUBJECT_WORDS: Record<string, string> = {
  athlete: 'athlete',
  assessment: 'screen',
  note: 'note',
  clearance: 'clearance',
  consent: 'consent',
  email: 'e-mail',
  photo: 'photo',
  settings: 'settings',
  member: 'club member',
};

export const auditActionInWords = (action: string) => ACTION_WORDS[action] ?? action;
export const auditSubjectInWords = (kind: string) => SUBJECT_WORDS[kind] ?? kind;

/**
 * The audit filter's days as typed: a message per field that cannot be sent yet (not YYYY-MM-DD, no such
 * day, or an end before the start), so the list keeps the last good filters meanwhile. Pure.
 */
export function auditDateErrors(from: string, to: string): { from?: string; to?: string } {
  const out: { from?: string; to?: string } = {};
  const one = (v: string) =>
    !v
      ? undefined
      : !/^\d{4}-\d{2}-\d{2}$/.test(v)
        ? 'Write the date as YYYY-MM-DD.'
        : !isCalendarDate(v)
          ? 'This day does not exist in the calendar.'
          : undefined;
  const f = one(from.trim());
  const t = one(to.trim());
  if (f) out.from = f;
  if (t) out.to = t;
  if (!f && !t && from.trim() && to.trim() && to.trim() < from.trim()) out.to = 'The end is before the start.';
  return out;
}

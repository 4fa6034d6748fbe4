// The care team's fixed choices and the words shown for them. Pure, and without yup: screens that only
// show a clearance or a note's visibility import these, not the schemas (`schemas.ts` re-exports them).

export const NOTE_VISIBILITIES = ['team', 'family'] as const;
export type NoteVisibility = (typeof NOTE_VISIBILITIES)[number];
export const NOTE_VISIBILITY_LABELS: Record<NoteVisibility, string> = { team: 'Team only', family: 'Shared with family' };

export const CLEARANCE_STATUSES = ['cleared', 'modified', 'referred'] as const;
export type ClearanceStatus = (typeof CLEARANCE_STATUSES)[number];
export const CLEARANCE_LABELS: Record<ClearanceStatus, string> = {
  cleared: 'Train as normal',
  modified: 'Train with changes',
  referred: 'Refer on',
};

/** How long an author may still correct a note; afterwards it is kept as written (our choice). */
export const NOTE_EDIT_WINDOW_MINUTES = 15;

export const AUDIT_SUBJECTS = ['athlete', 'assessment', 'note', 'clearance', 'consent', 'email', 'photo', 'settings', 'member'] as const;
export type AuditSubject = (typeof AUDIT_SUBJECTS)[number];

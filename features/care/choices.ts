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

/**
 * What "train with changes" may hold back, the same two kinds "refer on" and unreleased pain hold
 * (`strength-block.ts`): ticked, the plan and the training sheet set that work apart until a new
 * clearance (our choice). Anything else the physiotherapist says in words.
 */
export const CLEARANCE_HOLDS = ['loaded', 'landing'] as const;
export type ClearanceHold = (typeof CLEARANCE_HOLDS)[number];

/** "Loaded strength work", "Jump and landing work", or both, as the subject of a sentence. */
export function holdsWords(holds: readonly ClearanceHold[]): string {
  const loaded = holds.includes('loaded');
  const landing = holds.includes('landing');
  return loaded && landing ? 'Loaded strength work and landing work' : loaded ? 'Loaded strength work' : 'Jump and landing work';
}

/** How long an author may still correct a note; afterwards it is kept as written (our choice). */
export const NOTE_EDIT_WINDOW_MINUTES = 15;

export const AUDIT_SUBJECTS = ['athlete', 'assessment', 'note', 'clearance', 'consent', 'email', 'photo', 'settings', 'member'] as const;
export type AuditSubject = (typeof AUDIT_SUBJECTS)[number];

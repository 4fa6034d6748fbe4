/**
 * Who may do what in Squadline: the one table of roles and actions.
 *
 * Imported by the database schema (the role enum), the server (every route names one action from here
 * through `guard()` in `server/access/guard.ts`) and the client (screens hide what the server would
 * refuse, through `can()`). There is no second list of roles or permissions anywhere.
 *
 * Parents hold their actions for their own children only: a route whose record belongs to an athlete
 * checks the parent's guardian links before anything else (see `OWN_CHILDREN_ONLY`).
 */

export const ROLES = ['admin', 'head_coach', 'tester', 'physio', 'parent'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Club admin',
  head_coach: 'Head coach',
  tester: 'Tester',
  physio: 'Physiotherapist',
  parent: 'Parent or guardian',
};

const STAFF = ['admin', 'head_coach', 'tester', 'physio'] as const satisfies readonly Role[];
const EVERYONE = ROLES;
const ROSTER_MANAGERS = ['admin', 'head_coach'] as const satisfies readonly Role[];
const SCREENERS = ['admin', 'head_coach', 'tester'] as const satisfies readonly Role[];

/** Each action and the roles that hold it. Keep the comment on each line: it is the access model's documentation. */
export const PERMISSIONS = {
  // Club and people
  'members.read': ROSTER_MANAGERS, // the people of the club and pending invitations
  'members.invite': ['admin'], // invite staff and parents
  'members.manage': ['admin'], // change a member's role, remove a member, cancel an invitation
  'mailbox.read': ['admin'], // the local e-mail fake (development only)
  'audit.read': ['admin'], // the audit trail and its CSV export
  'club.settings': ['admin'], // club settings (retention, family photos, automatic release)

  // Roster
  'roster.read': STAFF, // squads and athlete lists
  'roster.manage': ROSTER_MANAGERS, // create, edit, move, archive athletes and squads; CSV import
  'athlete.read': EVERYONE, // one athlete's profile (parents: own children)
  'consent.read': EVERYONE, // consent history (parents: own children)
  'consent.manage': ROSTER_MANAGERS, // record a family's consent decision
  'consent.own': ['parent'], // a parent's own decision about their child, dated the day they make it (own children)
  'guardians.read': STAFF, // the adults linked to an athlete (parents do not see the other adults)
  'guardians.manage': ROSTER_MANAGERS, // link and unlink parents

  // Screening
  'screening.read': STAFF, // rounds, assessments, results, measurements, photos
  'screening.write': SCREENERS, // open rounds, capture, upload photos, submit, adjust plans within the limits
  'round.reopen': ['head_coach'], // reopen a closed round
  'plan.adjust': ['admin', 'head_coach', 'tester', 'physio'], // adjust a plan within the youth loading limits
  'plan.override': ['head_coach', 'physio'], // go past a youth loading limit, with a reason

  // Care team
  'review.read': ['head_coach', 'physio'], // the review list
  'review.mark': ['physio'], // mark a screen reviewed
  'clearance.set': ['physio'], // train as normal / with changes / refer on
  'note.write': ['head_coach', 'tester', 'physio'], // write notes (author edits for a short time)
  'note.read-team': ['admin', 'head_coach', 'tester', 'physio'], // team-only notes (testers only where the club allows)
  'note.read-family': EVERYONE, // notes shared with family (parents: own children)
  'summary.release': ['head_coach', 'physio'], // release the family summary and its e-mail
  'summary.read': EVERYONE, // the family summary of the latest released screen (parents: own children)

  // Progress
  'progress.read': STAFF, // an athlete's screens over time with measurement error
  'trends.read': STAFF, // squad trends and their export

  // Training
  'training.read': STAFF, // a squad's plans in force on one training sheet, and the sessions recorded
  'training.record': STAFF, // record who took part in a squad's corrective session
} as const satisfies Record<string, readonly Role[]>;

export type Action = keyof typeof PERMISSIONS;

/** Whether `role` holds `action` at all (for a parent: for their own children). */
export function can(role: Role | null | undefined, action: Action): boolean {
  if (!role) return false;
  return (PERMISSIONS[action] as readonly Role[]).includes(role);
}

/** The roles holding `action`. */
export function rolesFor(action: Action): readonly Role[] {
  return PERMISSIONS[action];
}

/** Roles whose reach is limited to the athletes linked to them. */
export const OWN_CHILDREN_ONLY: readonly Role[] = ['parent'];

export function isStaff(role: Role | null | undefined): boolean {
  return !!role && !OWN_CHILDREN_ONLY.includes(role);
}

// The demo's sign-ins: an invented club and invented people. They exist only when the demo is loaded.
export const DEMO_PASSWORD = 'squadline-demo';

export const DEMO_USERS = [
  { email: 'admin@squadline.test', displayName: 'Ruth Calloway', role: 'admin', label: 'club admin' },
  { email: 'coach@squadline.test', displayName: 'Dan Mercer', role: 'head_coach', label: 'head coach' },
  { email: 'tester@squadline.test', displayName: 'Lena Fischer', role: 'tester', label: 'tester' },
  { email: 'physio@squadline.test', displayName: 'Sam Adeyemi', role: 'physio', label: 'physiotherapist' },
  { email: 'parent@squadline.test', displayName: 'Grace Okafor', role: 'parent', label: 'parent of Maya and Theo Okafor' },
] as const;

/** A second invented club, so that cross-club isolation can be seen. */
export const OTHER_CLUB_USERS = [
  { email: 'admin@northgate.test', displayName: 'Tomas Lindqvist', role: 'admin' },
  { email: 'tester@northgate.test', displayName: 'Ines Moreau', role: 'tester' },
  { email: 'parent@northgate.test', displayName: 'Kofi Mensah', role: 'parent' },
] as const;

export const DEMO_CLUB_NAME = 'Harbourside Shuttle Club';
export const OTHER_CLUB_NAME = 'Northgate Racket Juniors';

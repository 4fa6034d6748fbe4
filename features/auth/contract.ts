import type { Role } from '@/features/access/permissions';

// Response shapes of the account routes, shared by `server/auth/`, `server/me/` and the client.

export type Membership = { clubId: string; clubName: string; role: Role };
export type SignedInUser = { id: string; email: string; displayName: string };
/** GET /api/me */
export type Me = { user: SignedInUser; memberships: Membership[] };
/** POST /api/auth/sign-in */
export type SignInResponse = { user: SignedInUser };
/** POST /api/auth/invitations/lookup: what an invitation link offers, before the person accepts it. */
/** `children`: whom a parent's invitation links when accepted (names). */
export type InvitationView = { email: string; role: Role; clubName: string; hasAccount: boolean; children: string[] };

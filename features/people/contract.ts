import type { Role } from '@/features/access/permissions';

// Response shapes of the people routes, shared by `server/clubs/` and the client.

/** `children`: for a parent account, the club's children it is linked to (names). */
export type Member = { userId: string; displayName: string; email: string; role: Role; children?: string[] };
/** `children`: whom a parent's invitation links when accepted (names). */
export type PendingInvite = { id: string; email: string; role: Role; expiresAt: string; children: string[] };
/** GET /api/clubs/:clubId/members */
export type MembersResponse = { members: Member[]; pending: PendingInvite[] };
/** POST /api/clubs/:clubId/invitations */
export type InviteResponse = { ok: true; email: string; role: Role; athleteIds?: string[] };
/** PATCH /api/clubs/:clubId/members/:userId */
export type ChangeRoleInput = { role: Role };

import type { Db } from '@/db/client';
import type { Role } from '@/db/schema';
import type { InviteInput } from '@/features/auth/schemas';
import type { InviteResponse, MembersResponse } from '@/features/people/contract';
import type { ClubScope } from '@/server/access/scope';
import type { AuthService } from '@/server/auth/auth.service';
import { clubsRepo } from './clubs.repo';

/** The people of one club (the caller's scope) and invitations to it. */
export function clubsService(db: Db, authService: AuthService, scope: ClubScope) {
  const repo = clubsRepo(db, scope);
  return {
    async members(): Promise<MembersResponse> {
      const [members, pending] = await Promise.all([repo.members(), repo.pendingInvitations()]);
      // The invitation's id stays on the server; the children a parent's invitation links are named.
      const withChildren = await Promise.all(
        pending.map(async ({ id, ...p }) => ({
          ...p,
          expiresAt: p.expiresAt.toISOString(),
          children: (await authService.invitedChildren(id)).map((c) => c.name),
        })),
      );
      return { members, pending: withChildren };
    },

    async invite({ email, role, athleteIds }: InviteInput): Promise<InviteResponse> {
      await authService.invite({ clubId: scope.clubId, email, role: role as Role, invitedBy: scope.userId, athleteIds });
      return { ok: true, email, role: role as Role, athleteIds };
    },
  };
}

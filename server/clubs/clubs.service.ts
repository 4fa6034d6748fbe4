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
      return { members, pending: pending.map((p) => ({ ...p, expiresAt: p.expiresAt.toISOString() })) };
    },

    async invite({ email, role }: InviteInput): Promise<InviteResponse> {
      await authService.invite({ clubId: scope.clubId, email, role: role as Role, invitedBy: scope.userId });
      return { ok: true, email, role: role as Role };
    },
  };
}

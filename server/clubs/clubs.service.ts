import type { Db } from '@/db/client';
import type { Role } from '@/db/schema';
import type { InviteInput } from '@/features/auth/schemas';
import type { InviteResponse, MembersResponse } from '@/features/people/contract';
import type { ClubScope } from '@/server/access/scope';
import type { AuthService } from '@/server/auth/auth.service';
import { recordAudit } from '@/server/care/audit.repo';
import type { Executor } from '@/server/screening/screening.repo';
import { badRequest, notFound } from '@/server/http/errors';
import { clubsRepo } from './clubs.repo';

/** The people of one club (the caller's scope) and invitations to it. */
export function clubsService(db: Db, authService: AuthService, scope: ClubScope) {
  const repo = clubsRepo(db, scope);

  async function mustBeOtherMember(userId: string, what: string) {
    if (userId === scope.userId) throw badRequest(`You cannot ${what}: ask another admin of the club.`);
    const member = await repo.member(userId);
    if (!member) throw notFound('This member');
    return member;
  }

  /** One change to the club's people, in the audit trail (subject `member`), by the caller. */
  const audit = (executor: Executor, action: string, subjectId: string, detail: Record<string, unknown>) =>
    recordAudit(executor, { clubId: scope.clubId, actorId: scope.userId, action, subjectKind: 'member', subjectId, detail });

  return {
    async members(): Promise<MembersResponse> {
      const [members, pending] = await Promise.all([repo.members(), repo.pendingInvitations()]);
      // The children a parent's invitation links are named; the id lets an admin cancel it.
      const withChildren = await Promise.all(
        pending.map(async ({ id, ...p }) => ({
          id,
          ...p,
          expiresAt: p.expiresAt.toISOString(),
          children: (await authService.invitedChildren(id)).map((c) => c.name),
        })),
      );
      return { members, pending: withChildren };
    },

    /**
     * A member's role changed by an admin. Never one's own (another admin does it): so the caller stays an
     * admin and the club always keeps one. Audited with both roles.
     */
    async changeRole(userId: string, role: Role) {
      const member = await mustBeOtherMember(userId, 'change your own role');
      if (member.role === role) return { ok: true as const };
      await repo.setRole(userId, role);
      await audit(db, 'role.change', userId, { name: member.displayName, from: member.role, to: role });
      return { ok: true as const };
    },

    /**
     * A member removed from the club: their membership, and for a parent the links to the club's children,
     * so nothing of the club stays reachable from their account (our choice: the account itself stays,
     * it may belong to other clubs). Never oneself. Audited.
     */
    async remove(userId: string) {
      const member = await mustBeOtherMember(userId, 'remove yourself');
      await db.transaction(async (tx) => {
        await clubsRepo(tx, scope).remove(userId);
        await audit(tx, 'remove', userId, { name: member.displayName, role: member.role });
      });
      return { ok: true as const };
    },

    /** An invitation not yet accepted, ended now: its link stops working. Audited. */
    async cancelInvitation(id: string) {
      const row = await repo.cancelInvitation(id);
      if (!row) throw notFound('This invitation');
      await audit(db, 'invitation.cancel', id, { email: row.email, role: row.role });
      return { ok: true as const };
    },

    async invite({ email, role, athleteIds }: InviteInput): Promise<InviteResponse> {
      const sent = await authService.invite({ clubId: scope.clubId, email, role: role as Role, invitedBy: scope.userId, athleteIds });
      // In the trail with the children it names (the e-mail carries their names to that address), and in
      // each named child's own trail.
      const detail = { email, role, ...(sent.children.length ? { children: sent.children.map((c) => c.name) } : {}) };
      if (sent.children.length === 0) await audit(db, 'invite', sent.id, detail);
      else
        await recordAudit(
          db,
          ...sent.children.map((c) => ({
            clubId: scope.clubId,
            actorId: scope.userId,
            action: 'invite',
            subjectKind: 'member' as const,
            subjectId: sent.id,
            athleteId: c.id,
            detail,
          })),
        );
      return { ok: true, email, role: role as Role, athleteIds };
    },
  };
}

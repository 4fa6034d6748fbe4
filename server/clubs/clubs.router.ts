import { and, asc, eq, gt, isNull } from 'drizzle-orm';
import { Router } from 'express';
import type { Db } from '@/db/client';
import { invitations, memberships, users, type Role } from '@/db/schema';
import { inviteSchema, type InviteInput } from '@/features/auth/schemas';
import { scopeForClub } from '@/server/access/scope';
import type { AuthService } from '@/server/auth/auth.service';
import { validateBody } from '@/server/http/validate';
import { requireUuid } from '@/server/athletes/athletes.router';

export function clubsRouter(db: Db, authService: AuthService) {
  const router = Router();

  router.get('/clubs/:clubId/members', async (req, res) => {
    const clubId = requireUuid(req.params.clubId, 'The club');
    await scopeForClub(db, req, clubId, ['admin', 'head_coach']);
    const members = await db
      .select({ userId: users.id, displayName: users.displayName, email: users.email, role: memberships.role })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(eq(memberships.clubId, clubId))
      .orderBy(asc(users.displayName));
    const open = await db
      .select({ tokenHash: invitations.tokenHash, email: invitations.email, role: invitations.role, expiresAt: invitations.expiresAt })
      .from(invitations)
      .where(and(eq(invitations.clubId, clubId), isNull(invitations.acceptedAt), gt(invitations.expiresAt, new Date())))
      .orderBy(asc(invitations.email));
    // The token hash stays on the server; the children a parent's invitation links are named.
    const pending = await Promise.all(
      open.map(async ({ tokenHash, ...p }) => ({ ...p, children: (await authService.invitedChildren(tokenHash)).map((c) => c.name) })),
    );
    res.json({ members, pending });
  });

  router.post('/clubs/:clubId/invitations', validateBody(inviteSchema), async (req, res) => {
    const clubId = requireUuid(String(req.params.clubId), 'The club');
    const scope = await scopeForClub(db, req, clubId, ['admin']);
    const { email, role, athleteIds } = req.body as InviteInput;
    await authService.invite({ clubId, email, role: role as Role, invitedBy: scope.userId, athleteIds });
    res.status(201).json({ ok: true, email, role, athleteIds });
  });

  return router;
}

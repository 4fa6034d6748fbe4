import { Router, type Request } from 'express';
import type { Logger } from 'pino';
import type { InvitationView, SignInResponse } from '@/features/auth/contract';
import {
  acceptInvitationSchema,
  changePasswordSchema,
  invitationLookupSchema,
  requestResetSchema,
  resetPasswordSchema,
  signInSchema,
  type AcceptInvitationInput,
  type ChangePasswordInput,
  type InvitationLookupInput,
  type RequestResetInput,
  type ResetPasswordInput,
  type SignInInput,
} from '@/features/auth/schemas';
import { publicRoute, signedInRoute } from '@/server/access/guard';
import { signedInUserId } from '@/server/access/scope';
import { validateBody } from '@/server/http/validate';
import type { AuthService } from './auth.service';
import type { Auth } from './lucia';
import { clearSessionCookie, setSessionCookie } from './session-middleware';

/** The caller's address as Express sees it (`trust proxy` is loopback only, so it cannot be forged). */
const address = (req: Request) => req.ip ?? 'unknown';

export function authRouter(service: AuthService, auth: Auth) {
  const router = Router();

  router.post('/sign-in', publicRoute(), validateBody(signInSchema), async (req, res) => {
    const { email, password } = req.body as SignInInput;
    // Fires when the connection closes before the answer is sent (a client that timed out or left).
    const gone = new AbortController();
    res.on('close', () => {
      if (!res.writableFinished) gone.abort();
    });
    const { user, token } = await service.signIn(email, password, { address: address(req), previousSessionId: req.sessionId, signal: gone.signal });
    setSessionCookie(res, auth, token);
    res.json({ user: { id: user.id, email: user.email, displayName: user.displayName } } satisfies SignInResponse);
  });

  router.post('/sign-out', publicRoute(), async (req, res) => {
    if (req.sessionId) await service.signOut(req.sessionId);
    clearSessionCookie(res, auth);
    res.status(204).end();
  });

  // The token travels in the body, never in a URL (URLs end up in logs and proxies).
  router.post('/invitations/lookup', publicRoute(), validateBody(invitationLookupSchema), async (req, res) => {
    await service.limitAddress(address(req));
    res.json((await service.describeInvitation((req.body as InvitationLookupInput).token)) satisfies InvitationView);
  });

  router.post('/invitations/accept', publicRoute(), validateBody(acceptInvitationSchema), async (req, res) => {
    await service.limitAddress(address(req));
    const { token } = await service.acceptInvitation(req.body as AcceptInvitationInput);
    if (req.sessionId) await service.signOut(req.sessionId);
    setSessionCookie(res, auth, token);
    res.status(201).json({ ok: true });
  });

  // Answered before the account is looked up: the same answer, in the same time, for any e-mail.
  router.post('/password-reset', publicRoute(), validateBody(requestResetSchema), async (req, res) => {
    const pending = await service.requestPasswordReset((req.body as RequestResetInput).email, address(req));
    res.status(202).json({ ok: true });
    await pending.send().catch((err: unknown) => (req.log as Logger | undefined)?.error({ err }, 'password reset mail not queued'));
  });

  router.post('/password-reset/complete', publicRoute(), validateBody(resetPasswordSchema), async (req, res) => {
    await service.limitAddress(address(req));
    const { token, password } = req.body as ResetPasswordInput;
    await service.resetPassword(token, password);
    res.status(204).end();
  });

  router.post('/password', signedInRoute(), validateBody(changePasswordSchema), async (req, res) => {
    const { token } = await service.changePassword(signedInUserId(req), req.sessionId!, req.body as ChangePasswordInput);
    setSessionCookie(res, auth, token);
    res.status(204).end();
  });

  return router;
}

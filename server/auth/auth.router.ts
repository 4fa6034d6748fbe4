import { Router } from 'express';
import { ipKeyGenerator, rateLimit, type Store } from 'express-rate-limit';
import {
  acceptInvitationSchema, requestResetSchema, resetPasswordSchema, signInSchema,
  type AcceptInvitationInput, type RequestResetInput, type ResetPasswordInput, type SignInInput,
} from '@/features/auth/schemas';
import { tooManyRequests } from '@/server/http/errors';
import { validateBody } from '@/server/http/validate';
import type { AuthService } from './auth.service';
import type { Auth } from './lucia';
import { clearSessionCookie, setSessionCookie } from './session-middleware';

export type SignInLimits = { windowMs: number; perAccount: number; perAddress: number };
export const DEFAULT_SIGN_IN_LIMITS: SignInLimits = { windowMs: 15 * 60 * 1000, perAccount: 8, perAddress: 40 };

/**
 * `storeFor` gives each limit a store shared by every server process (createApp passes the PostgreSQL
 * store); without it the counters live in this process's memory.
 */
export function authRouter(service: AuthService, auth: Auth, limits: SignInLimits = DEFAULT_SIGN_IN_LIMITS, storeFor?: (prefix: string) => Store) {
  const router = Router();
  const limited = (name: string, limit: number, key: (req: import('express').Request) => string) =>
    rateLimit({
      ...(storeFor ? { store: storeFor(`sign-in-${name}`) } : {}),
      windowMs: limits.windowMs,
      limit,
      standardHeaders: 'draft-8',
      legacyHeaders: false,
      // Only failed attempts count: a club signing in many people from one hall network is not throttled.
      skipSuccessfulRequests: true,
      keyGenerator: key,
      handler: (_req, _res, next) =>
        next(tooManyRequests('Too many attempts. Wait a few minutes, then try again.')),
    });
  const ip = (req: import('express').Request) => ipKeyGenerator(req.ip ?? 'unknown');
  // One limit per e-mail and address (guessing one account), one per address (spraying many).
  const perAccount = limited('account', limits.perAccount, (req) => `${ip(req)}|${String(req.body?.email ?? '').trim().toLowerCase()}`);
  const perAddress = limited('address', limits.perAddress, ip);

  router.post('/sign-in', perAddress, perAccount, validateBody(signInSchema), async (req, res) => {
    const { email, password } = req.body as SignInInput;
    const { user, token } = await service.signIn(email, password);
    setSessionCookie(res, auth, token);
    res.json({ user: { id: user.id, email: user.email, displayName: user.displayName } });
  });

  router.post('/sign-out', async (req, res) => {
    if (req.sessionId) await service.signOut(req.sessionId);
    clearSessionCookie(res, auth);
    res.status(204).end();
  });

  router.get('/invitations/:token', async (req, res) => {
    res.json(await service.describeInvitation(req.params.token));
  });

  router.post('/invitations/accept', perAddress, validateBody(acceptInvitationSchema), async (req, res) => {
    const { token } = await service.acceptInvitation(req.body as AcceptInvitationInput);
    setSessionCookie(res, auth, token);
    res.status(201).json({ ok: true });
  });

  router.post('/password-reset', perAddress, validateBody(requestResetSchema), async (req, res) => {
    await service.requestPasswordReset((req.body as RequestResetInput).email);
    res.status(202).json({ ok: true });
  });

  router.post('/password-reset/complete', perAddress, validateBody(resetPasswordSchema), async (req, res) => {
    const { token, password } = req.body as ResetPasswordInput;
    await service.resetPassword(token, password);
    res.status(204).end();
  });

  return router;
}

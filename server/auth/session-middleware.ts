import { parse as parseCookies } from 'cookie';
import type { RequestHandler, Response } from 'express';
import { forbidden } from '@/server/http/errors';
import type { Auth, CallerAccess } from './lucia';
import { sessionIdFromToken } from './lucia';

export type SignedInUser = { id: string; email: string; displayName: string };

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      /** Set by the session middleware when the cookie carries a valid session. */
      user?: SignedInUser;
      sessionId?: string;
      /** The signed-in caller's clubs, roles and linked athletes, read with the session (see `CallerAccess`). */
      access?: CallerAccess;
    }
  }
}

export function setSessionCookie(res: Response, auth: Auth, token: string): void {
  res.append('Set-Cookie', auth.createSessionCookie(token).serialize());
}

export function clearSessionCookie(res: Response, auth: Auth): void {
  res.append('Set-Cookie', auth.createBlankSessionCookie().serialize());
}

/** Reads the session cookie, validates it, renews it when lucia says it is due, clears it when stale. */
export function sessionMiddleware(auth: Auth): RequestHandler {
  return async (req, res, next) => {
    const token = parseCookies(req.headers.cookie ?? '')[auth.sessionCookieName];
    if (!token) return next();
    const { session, user } = await auth.validateSession(await sessionIdFromToken(token));
    if (!session) {
      clearSessionCookie(res, auth);
      return next();
    }
    if (session.fresh) setSessionCookie(res, auth, token);
    req.user = { id: user.id, email: user.email, displayName: user.displayName };
    req.access = user.access;
    req.sessionId = session.id;
    next();
  };
}

/**
 * Cookies are SameSite=Lax; on top of that, a state-changing request is refused unless its Origin is
 * the configured public origin (`PUBLIC_URL`) or the Expo dev server's (`npm run dev` only). The Host
 * header is not trusted: behind a proxy it may name anything. A request without Origin (not a browser,
 * or an old one) passes unless the browser says it is cross-site (`Sec-Fetch-Site`).
 */
export function sameOriginMiddleware(publicUrl: string, devOrigin?: string): RequestHandler {
  const allowed = new Set([new URL(publicUrl).origin, ...(devOrigin ? [devOrigin] : [])]);
  return (req, _res, next) => {
    if (req.method === 'GET' || req.method === 'HEAD' || req.method === 'OPTIONS') return next();
    const origin = req.headers.origin;
    const refused = origin ? !allowed.has(origin) : req.headers['sec-fetch-site'] === 'cross-site';
    next(refused ? forbidden('This request came from another site and was refused.') : undefined);
  };
}

/** Lets the Expo dev server's origin call the API with cookies (`npm run dev` only). */
export function devCorsMiddleware(origin: string): RequestHandler {
  return (req, res, next) => {
    // Photos are <img> loads from the dev server's page (same site, another port): no Origin header, and
    // helmet's default `same-origin` resource policy would block them.
    res.setHeader('Cross-Origin-Resource-Policy', 'same-site');
    if (req.headers.origin !== origin) return next();
    res.setHeader('Access-Control-Allow-Origin', origin);
    res.setHeader('Access-Control-Allow-Credentials', 'true');
    res.setHeader('Vary', 'Origin');
    if (req.method === 'OPTIONS') {
      res.setHeader('Access-Control-Allow-Methods', 'GET,POST,PUT,PATCH,DELETE');
      res.setHeader('Access-Control-Allow-Headers', 'Content-Type,X-Club-Id,Accept');
      res.status(204).end();
      return;
    }
    next();
  };
}

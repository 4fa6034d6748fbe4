import { parse as parseCookies } from 'cookie';
import type { RequestHandler, Response } from 'express';
import type { Auth } from './lucia';
import { sessionIdFromToken } from './lucia';

export type SignedInUser = { id: string; email: string; displayName: string };

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      /** Set by the session middleware when the cookie carries a valid session. */
      user?: SignedInUser;
      sessionId?: string;
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
    req.sessionId = session.id;
    next();
  };
}

/**
 * Cookies are SameSite=Lax; on top of that, a state-changing request whose Origin names another host
 * is refused, so a form on another site cannot act for a signed-in user. `allowedOrigin` is the Expo
 * dev server's origin under `npm run dev`, and nothing in production.
 */
export function sameOriginMiddleware(allowedOrigin?: string): RequestHandler {
  return (req, _res, next) => {
    if (req.method === 'GET' || req.method === 'HEAD' || req.method === 'OPTIONS') return next();
    const origin = req.headers.origin;
    if (!origin || origin === allowedOrigin) return next();
    let originHost: string;
    try {
      originHost = new URL(origin).host;
    } catch {
      originHost = '';
    }
    if (originHost !== req.headers.host) {
      next(Object.assign(new Error('cross-origin'), { status: 403 }));
      return;
    }
    next();
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

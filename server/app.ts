import compression from 'compression';
import express, { type RequestHandler } from 'express';
import helmet from 'helmet';
import fs from 'node:fs';
import path from 'node:path';
import type { Logger } from 'pino';
import { pinoHttp } from 'pino-http';
import type { Db } from '@/db/client';
import { requireSignedIn } from './access/scope';
import { athletesRouter } from './athletes/athletes.router';
import { authRouter } from './auth/auth.router';
import { createAuthService } from './auth/auth.service';
import type { AuthLimits } from './auth/rate-limits';
import { createLucia } from './auth/lucia';
import { devCorsMiddleware, sameOriginMiddleware, sessionMiddleware } from './auth/session-middleware';
import { clubsRouter } from './clubs/clubs.router';
import { errorMiddleware } from './http/error-middleware';
import { httpLogOptions } from './http/logging';
import { notFound } from './http/errors';
import type { Outbox } from './mail/outbox';
import { meRouter } from './me/me.router';
import { metaRouter, type Mailbox } from './meta/meta.router';
import { screeningRouter } from './screening/screening.router';
import { loggedWrites } from './storage/orphan-sweep';
import type { PhotoStorage } from './storage/storage';
import type { UploadSlots } from './http/upload-slots';

export type AppConfig = {
  /** Base of links in e-mails, e.g. http://127.0.0.1:8080 */
  publicUrl: string;
  secureCookies: boolean;
  /** The web export to serve (dist/); omitted in API tests. */
  webDir?: string;
  /** Rate limits of sign-in and links; the defaults in server/auth/rate-limits.ts. */
  authLimits?: AuthLimits;
  /** `NODE_ENV=production`: development-only routes (the local mailbox) do not exist. */
  production?: boolean;
  /** The Expo dev server's origin under `npm run dev`; unset in production. */
  devWebOrigin?: string;
};

export type AppDeps = {
  db: Db;
  storage: PhotoStorage;
  outbox: Outbox;
  /** The local e-mail fake's inbox, or null when real SMTP is used (and always in production). */
  mailbox: Mailbox | null;
  logger: Logger;
  config: AppConfig;
  /** Bounds the photo uploads read at once; default `uploadSlots()`. Injectable so a test can watch it. */
  uploads?: UploadSlots;
};

export function createApp(deps: AppDeps) {
  const { db, outbox, mailbox, logger, config } = deps;
  const auth = createLucia(db, config.secureCookies);
  const authService = createAuthService({ db, auth, outbox, limits: config.authLimits });

  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  // gzip for JSON, scripts and fonts; JPEG photos are already compressed and are skipped by type.
  app.use(compression());
  app.use(pinoHttp({ logger, ...httpLogOptions() }));
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          'img-src': ["'self'", 'data:', 'blob:'],
          'script-src': ["'self'"],
          'style-src': ["'self'", "'unsafe-inline'"],
          'font-src': ["'self'", 'data:'],
          'upgrade-insecure-requests': config.secureCookies ? [] : null,
        },
      },
      hsts: config.secureCookies,
    }),
  );

  const api = express.Router();
  if (config.devWebOrigin) api.use(devCorsMiddleware(config.devWebOrigin));
  api.use(express.json({ limit: '1mb' }));
  api.use(sameOriginMiddleware(config.publicUrl, config.devWebOrigin));
  api.use(sessionMiddleware(auth));
  api.use(metaRouter(db, config.production ? null : mailbox));
  api.use('/auth', authRouter(authService, auth));
  // Everything below needs a signed-in user: deny by default.
  api.use(requireSignedIn);
  api.use(meRouter(db));
  api.use(clubsRouter(db, authService));
  api.use(athletesRouter(db));
  // Photo files are logged before they are written, so the orphan sweep finds those without a row.
  api.use(screeningRouter({ db, storage: loggedWrites(db, deps.storage), uploads: deps.uploads }));
  api.use((() => {
    throw notFound('This API route');
  }) as RequestHandler);
  app.use('/api', api);

  if (config.webDir && fs.existsSync(path.join(config.webDir, 'index.html'))) {
    const webDir = config.webDir;
    // Hashed bundles never change; everything else is revalidated.
    app.use('/_expo', express.static(path.join(webDir, '_expo'), { immutable: true, maxAge: '365d' }));
    app.use('/assets', express.static(path.join(webDir, 'assets'), { immutable: true, maxAge: '365d' }));
    app.use(express.static(webDir, { index: false }));
    app.get('/{*splat}', (_req, res) => {
      res.setHeader('Cache-Control', 'no-cache');
      // `root` keeps send's dot-folder check off the export's own location (it may live under .tmp/).
      res.sendFile('index.html', { root: webDir });
    });
  }

  app.use(errorMiddleware);
  return app;
}

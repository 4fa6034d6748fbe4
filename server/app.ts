import compression from 'compression';
import express, { type RequestHandler } from 'express';
import helmet from 'helmet';
import type { Logger } from 'pino';
import { pinoHttp } from 'pino-http';
import type { Db } from '@/db/client';
import { requireSignedIn } from './access/scope';
import { athletesRouter } from './athletes/athletes.router';
import { careRouter } from './care/care.router';
import { authRouter } from './auth/auth.router';
import { createAuthService } from './auth/auth.service';
import type { AuthLimits } from './auth/rate-limits';
import { createLucia } from './auth/lucia';
import { devCorsMiddleware, sameOriginMiddleware, sessionMiddleware } from './auth/session-middleware';
import { clubsRouter } from './clubs/clubs.router';
import { errorMiddleware } from './http/error-middleware';
import { httpLogOptions } from './http/logging';
import { notFound } from './http/errors';
import { idempotency } from './http/idempotency';
import type { Outbox } from './mail/outbox';
import { meRouter } from './me/me.router';
import { metaRouter, type Mailbox } from './meta/meta.router';
import { poseModelRouter } from './pose-model/pose-model.router';
import { measuringRouter } from './measuring/measuring.router';
import { progressRouter } from './progress/progress.router';
import { trainingRouter } from './training/training.router';
import { screeningRouter } from './screening/screening.router';
import { loggedWrites } from './storage/orphan-sweep';
import type { PhotoStorage } from './storage/storage';
import { webExport } from './web/serve-export';
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

  const web = config.webDir ? webExport(config.webDir) : null;

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
          // 'wasm-unsafe-eval' lets the pose model's WebAssembly compile (suggested points); it allows no
          // JavaScript eval. The model's files come from our own origin (server/pose-model/).
          'script-src': ["'self'", "'wasm-unsafe-eval'", ...(web?.inlineScriptHashes ?? [])],
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
  // Sign-in and link limits count in PostgreSQL (server/auth/rate-limits.ts), shared by every server process.
  api.use('/auth', authRouter(authService, auth));
  api.use(careRouter({ db, storage: deps.storage, outbox, publicUrl: config.publicUrl }));
  // Everything below needs a signed-in user: deny by default.
  api.use(requireSignedIn);
  // Retried writes (Idempotency-Key) are answered from the first run; see server/http/idempotency.ts.
  api.use(idempotency(db));
  api.use(meRouter(db));
  api.use(clubsRouter(db, authService));
  api.use(athletesRouter(db));
  // Photo files are logged before they are written, so the orphan sweep finds those without a row.
  api.use(screeningRouter({ db, storage: loggedWrites(db, deps.storage), uploads: deps.uploads }));
  api.use(measuringRouter({ db }));
  api.use(progressRouter(db));
  api.use(trainingRouter(db));
  api.use((() => {
    throw notFound('This API route');
  }) as RequestHandler);
  app.use('/api', api);
  app.use(poseModelRouter());

  // The web export: pre-rendered pages by path, hashed bundles cached for a year (server/web/).
  if (web) app.use(web.handler);

  app.use(errorMiddleware);
  return app;
}

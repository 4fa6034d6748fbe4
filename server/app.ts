import compression from 'compression';
import express, { type RequestHandler } from 'express';
import helmet from 'helmet';
import type { Logger } from 'pino';
import { pinoHttp } from 'pino-http';
import type { Db } from '@/db/client';
import { requireSignedIn } from './access/scope';
import { athletesRouter } from './athletes/athletes.router';
import { careRouter } from './care/care.router';
import { authRouter, DEFAULT_SIGN_IN_LIMITS, type SignInLimits } from './auth/auth.router';
import { createAuthService } from './auth/auth.service';
import { createLucia } from './auth/lucia';
import { devCorsMiddleware, sameOriginMiddleware, sessionMiddleware } from './auth/session-middleware';
import { clubsRouter } from './clubs/clubs.router';
import { errorMiddleware } from './http/error-middleware';
import { notFound } from './http/errors';
import { idempotency } from './http/idempotency';
import { postgresRateLimitStore } from './http/rate-limit-store';
import type { Outbox } from './mail/outbox';
import { meRouter } from './me/me.router';
import { metaRouter, type Mailbox } from './meta/meta.router';
import { poseModelRouter } from './pose-model/pose-model.router';
import { measuringRouter } from './measuring/measuring.router';
import { progressRouter } from './progress/progress.router';
import { screeningRouter } from './screening/screening.router';
import type { PhotoStorage } from './storage/storage';
import { webExport } from './web/serve-export';

export type AppConfig = {
  /** Base of links in e-mails, e.g. http://127.0.0.1:8080 */
  publicUrl: string;
  secureCookies: boolean;
  /** The web export to serve (dist/); omitted in API tests. */
  webDir?: string;
  signInLimits?: SignInLimits;
  /** The Expo dev server's origin under `npm run dev`; unset in production. */
  devWebOrigin?: string;
};

export type AppDeps = {
  db: Db;
  storage: PhotoStorage;
  outbox: Outbox;
  /** The local e-mail fake's inbox, or null when real SMTP is used. */
  mailbox: Mailbox | null;
  logger: Logger;
  config: AppConfig;
};

export function createApp(deps: AppDeps) {
  const { db, outbox, mailbox, logger, config } = deps;
  const auth = createLucia(db, config.secureCookies);
  const authService = createAuthService({ db, auth, outbox, publicUrl: config.publicUrl });

  const web = config.webDir ? webExport(config.webDir) : null;

  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  // gzip for JSON, scripts and fonts; JPEG photos are already compressed and are skipped by type.
  app.use(compression());
  app.use(pinoHttp({ logger, autoLogging: { ignore: (req) => !req.url?.startsWith('/api') } }));
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
  api.use(sameOriginMiddleware(config.devWebOrigin));
  api.use(sessionMiddleware(auth));
  api.use(metaRouter(db, mailbox));
  // Sign-in limits count in PostgreSQL, so several server processes share one count.
  api.use('/auth', authRouter(authService, auth, config.signInLimits ?? DEFAULT_SIGN_IN_LIMITS, (prefix) => postgresRateLimitStore(db, prefix)));
  api.use(careRouter({ db, storage: deps.storage, outbox, publicUrl: config.publicUrl }));
  // Everything below needs a signed-in user: deny by default.
  api.use(requireSignedIn);
  // Retried writes (Idempotency-Key) are answered from the first run; see server/http/idempotency.ts.
  api.use(idempotency(db));
  api.use(meRouter(db));
  api.use(clubsRouter(db, authService));
  api.use(athletesRouter(db));
  api.use(screeningRouter({ db, storage: deps.storage }));
  api.use(measuringRouter({ db }));
  api.use(progressRouter(db));
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

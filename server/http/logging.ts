import type { Options } from 'pino-http';
import type { LoggerOptions } from 'pino';

/**
 * What may reach a log line. Requests are logged as method, path (no query string: it can carry
 * tokens, names, dates of birth, e-mails) and id; responses as their status only (no headers, so no
 * `Set-Cookie`); errors without the values a failed query was run with. Tested by
 * test/api/logging.test.ts, which reads the logger's output over a sign-in, an invitation and a
 * failing query.
 */

type SerializedReq = { id?: unknown; method?: string; url?: string };
type SerializedRes = { statusCode?: number };

export const logPath = (url: string | undefined) => (url ?? '').split('?')[0];

/** An error as logged: its kind, code and a message that cannot carry query parameters. */
export function errorForLog(error: unknown): Record<string, unknown> {
  if (!(error instanceof Error)) return { type: typeof error };
  const e = error as Error & { code?: unknown; cause?: unknown; query?: unknown; params?: unknown };
  // Drizzle's failed-query errors spell out every parameter in the message ("params: a@b.c,2013-05-14").
  const fromQuery = 'params' in e || 'query' in e || /^Failed query/.test(e.message);
  const cause = e.cause instanceof Error ? (e.cause as Error & { code?: unknown; constraint?: unknown; table?: unknown }) : null;
  return {
    type: e.name,
    message: fromQuery ? 'A database query failed.' : e.message.split('\n')[0],
    ...(typeof e.code === 'string' ? { code: e.code } : {}),
    ...(cause ? { cause: { type: cause.name, code: cause.code, constraint: cause.constraint, table: cause.table } } : {}),
    // Frames only: the first line of a stack repeats the message.
    stack: e.stack
      ?.split('\n')
      .filter((l) => l.trimStart().startsWith('at '))
      .join('\n'),
  };
}

export const logSerializers = {
  req: (req: SerializedReq) => ({ id: req.id, method: req.method, path: logPath(req.url) }),
  res: (res: SerializedRes) => ({ statusCode: res.statusCode }),
  err: errorForLog,
};

/** For the pino logger the server is started with: the same serializers, and headers redacted besides. */
export const LOGGER_OPTIONS: LoggerOptions = {
  serializers: logSerializers,
  redact: {
    paths: ['req.headers.cookie', 'req.headers.authorization', 'res.headers["set-cookie"]', '*.password', '*.token'],
    censor: '[redacted]',
  },
};

export function httpLogOptions(): Options {
  return {
    serializers: logSerializers,
    // Static files are not worth a line each; the API is.
    autoLogging: { ignore: (req) => !req.url?.startsWith('/api') },
  };
}

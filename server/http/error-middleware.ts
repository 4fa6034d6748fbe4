import type { ErrorRequestHandler } from 'express';
import { MulterError } from 'multer';
import type { ApiErrorBody } from '@/features/api/contract';
import { POOL_WAIT_MESSAGE } from '@/db/client';
import { AppError } from './errors';

const MULTER_MESSAGES: Partial<Record<MulterError['code'], string>> = {
  LIMIT_FILE_SIZE: 'The photo is too large.',
  LIMIT_UNEXPECTED_FILE: 'Unexpected file field: send the photo in the "photo" field.',
  LIMIT_FILE_COUNT: 'Send one file at a time.',
  LIMIT_PART_COUNT: 'The upload has too many parts.',
  LIMIT_FIELD_COUNT: 'The upload has too many fields.',
  LIMIT_FIELD_KEY: 'A field name of the upload is too long.',
  LIMIT_FIELD_VALUE: 'A field of the upload is too long.',
};

/** Socket-level failures reaching PostgreSQL, and PostgreSQL refusing work while it stops or starts. */
const DB_DOWN_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'EPIPE', 'ETIMEDOUT', 'ENOTFOUND', 'EHOSTUNREACH', '57P01', '57P02', '57P03']);
const DB_DOWN_MESSAGES =
  /Connection terminated|connection timeout|timeout expired|Client has encountered a connection error|Connection ended|the database system is (starting up|shutting down)/i;

/** The error and its causes (drizzle wraps the driver's error in `cause`). */
function chain(error: unknown): { code?: unknown; message?: unknown }[] {
  const out: { code?: unknown; message?: unknown }[] = [];
  let e: unknown = error;
  for (let i = 0; i < 5 && e && typeof e === 'object'; i++) {
    out.push(e as { code?: unknown; message?: unknown });
    e = (e as { cause?: unknown }).cause;
  }
  return out;
}

/** True when the database could not be reached (stopped, restarting, network): the request may be retried. */
export function isDatabaseUnavailable(error: unknown): boolean {
  return chain(error).some(
    (e) => (typeof e.code === 'string' && DB_DOWN_CODES.has(e.code)) || (typeof e.message === 'string' && DB_DOWN_MESSAGES.test(e.message)),
  );
}

/**
 * True when every connection of the pool stayed in use by other requests for the whole wait
 * (`POOL_WAIT_MS`): the server is busy, the database is up. Not "database down": opening a connection
 * has its own, shorter timeout, and a stopped database refuses at once (see `db/client.ts`).
 */
export function isPoolBusy(error: unknown): boolean {
  return chain(error).some((e) => e.message === POOL_WAIT_MESSAGE);
}

/**
 * PostgreSQL refusing a value a client can send: text that is not a UUID (22P02), a number out of
 * range (22003), an impossible date (22007, 22008), text too long (22001). The validation should have
 * refused it first; this is the net under it, answered as bad input instead of 500, and logged so
 * the schema that let it through gets fixed. Other data errors (NUL in JSON the server made) stay 500.
 */
const CLIENT_DATA_CODES = new Set(['22P02', '22003', '22007', '22008', '22001']);
function databaseDataError(error: unknown): string | null {
  for (const e of chain(error)) if (typeof e.code === 'string' && CLIENT_DATA_CODES.has(e.code)) return e.code;
  return null;
}

/** Registered last. No stack trace ever leaves the server. */
export const errorMiddleware: ErrorRequestHandler = (error, req, res, _next) => {
  if (res.headersSent) {
    // Nothing more can be said to this client; end the response so the socket is not left open.
    res.end();
    return;
  }
  if (error instanceof AppError) {
    const body: ApiErrorBody & { current?: unknown } = {
      error: { code: error.code, message: error.message, ...(error.fields ? { fields: error.fields } : {}) },
    };
    if (error.current !== undefined) body.current = error.current;
    res.status(error.status).json(body);
    return;
  }
  if (error instanceof MulterError) {
    const status = error.code === 'LIMIT_FILE_SIZE' ? 413 : 400;
    res.status(status).json({
      error: {
        code: error.code === 'LIMIT_FILE_SIZE' ? 'too_large' : 'invalid_upload',
        message: MULTER_MESSAGES[error.code] ?? 'The upload could not be read. Choose the file again.',
        ...(error.field ? { fields: { [error.field]: MULTER_MESSAGES[error.code] ?? error.message } } : {}),
      },
    });
    return;
  }
  if (isPoolBusy(error)) {
    req.log?.warn('database pool busy: no free connection within the wait');
    res.setHeader('Retry-After', '2');
    res.status(503).json({
      error: { code: 'busy', message: 'Squadline is very busy right now. Nothing was saved by this request: try again in a moment.' },
    });
    return;
  }
  if (isDatabaseUnavailable(error)) {
    req.log?.warn({ err: error }, 'database unavailable');
    res.setHeader('Retry-After', '5');
    res.status(503).json({
      error: {
        code: 'unavailable',
        message: 'Squadline cannot reach its database right now. Nothing was saved by this request: try again in a moment.',
      },
    });
    return;
  }
  const dataError = databaseDataError(error);
  if (dataError) {
    req.log?.warn({ err: error }, `database refused a value (${dataError}): a validation gap`);
    res.status(400).json({
      error: {
        code: 'invalid_input',
        message: 'A value in the request is out of range or cannot be stored. Nothing was saved.',
        fields: { _: 'A value is out of range or cannot be stored.' },
      },
    });
    return;
  }
  // express.json() parse failures and oversized bodies carry a status of their own.
  const status = typeof error?.status === 'number' ? error.status : 500;
  if (status === 413) {
    res.status(413).json({ error: { code: 'too_large', message: 'The request is too large.' } });
    return;
  }
  if (status >= 400 && status < 500) {
    res.status(status).json({ error: { code: 'invalid_request', message: 'The request could not be read.' } });
    return;
  }
  req.log?.error({ err: error }, 'unhandled error');
  res.status(500).json({ error: { code: 'server_error', message: 'Something went wrong on our side. Please try again.' } });
};

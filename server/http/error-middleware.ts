import type { ErrorRequestHandler } from 'express';
import { MulterError } from 'multer';
import type { ApiErrorBody } from '@/features/api/contract';
import { AppError } from './errors';

const MULTER_MESSAGES: Partial<Record<MulterError['code'], string>> = {
  LIMIT_FILE_SIZE: 'The photo is too large.',
  LIMIT_UNEXPECTED_FILE: 'Unexpected file field: send the photo in the "photo" field.',
};

/** Registered last. No stack trace ever leaves the server. */
export const errorMiddleware: ErrorRequestHandler = (error, req, res, _next) => {
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
      error: { code: error.code === 'LIMIT_FILE_SIZE' ? 'too_large' : 'invalid_upload', message: MULTER_MESSAGES[error.code] ?? error.message },
    });
    return;
  }
  // express.json() parse failures and oversized bodies carry a status of their own.
  const status = typeof error?.status === 'number' ? error.status : 500;
  if (status >= 400 && status < 500) {
    res.status(status).json({ error: { code: 'invalid_request', message: 'The request could not be read.' } });
    return;
  }
  req.log?.error({ err: error }, 'unhandled error');
  res.status(500).json({ error: { code: 'server_error', message: 'Something went wrong on our side. Please try again.' } });
};

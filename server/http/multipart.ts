import type { RequestHandler } from 'express';
import { MulterError } from 'multer';
import { badRequest } from './errors';

/**
 * Wraps a multer middleware so a body that is not well-formed multipart (no boundary, cut short,
 * malformed part headers: errors busboy raises as plain Errors) is answered 400 instead of 500.
 * Multer's own limit errors pass through to the error middleware unchanged.
 */
export function multipart(upload: RequestHandler): RequestHandler & { multipart: true } {
  const handler: RequestHandler = (req, res, next) => {
    upload(req, res, (error?: unknown) => {
      if (!error || error instanceof MulterError) {
        next(error);
        return;
      }
      next(badRequest('The upload could not be read: it was cut short or is not well-formed. Choose the file and send it again.', {
        _: 'The upload could not be read.',
      }));
    });
  };
  // Marked so the route-table walk in the tests knows this route takes an upload.
  return Object.assign(handler, { multipart: true as const });
}

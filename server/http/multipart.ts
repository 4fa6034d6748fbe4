import type { RequestHandler } from 'express';
import { MulterError } from 'multer';
import { badRequest } from './errors';

/**
 * A client's file name is never used to store anything (keys are made by the server), but a name with
 * folders or control characters is a hostile or broken client: refused rather than passed along to logs.
 */
export function safeFileName(name: string): boolean {
  return name.length <= 255 && !/[/\\\u0000-\u001f\u007f]/.test(name) && name !== '.' && name !== '..';
}

/**
 * Wraps a multer middleware so a body that is not well-formed multipart (no boundary, cut short,
 * malformed part headers: errors busboy raises as plain Errors) is answered 400 instead of 500.
 * Multer's own limit errors pass through to the error middleware unchanged.
 */
export function multipart(upload: RequestHandler): RequestHandler & { multipart: true } {
  const handler: RequestHandler = (req, res, next) => {
    upload(req, res, (error?: unknown) => {
      if (!error && req.file && !safeFileName(req.file.originalname)) {
        next(
          badRequest('Some fields need attention.', {
            [req.file.fieldname]: 'The file name must be a plain name, without folders (/ or \\) or control characters. Rename the file and send it again.',
          }),
        );
        return;
      }
      if (!error || error instanceof MulterError) {
        next(error);
        return;
      }
      next(
        badRequest('The upload could not be read: it was cut short or is not well-formed. Choose the file and send it again.', {
          _: 'The upload could not be read.',
        }),
      );
    });
  };
  // Marked so the route-table walk in the tests knows this route takes an upload.
  return Object.assign(handler, { multipart: true as const });
}

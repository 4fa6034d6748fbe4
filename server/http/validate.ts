import type { RequestHandler } from 'express';
import { ValidationError, type AnyObjectSchema, type InferType } from 'yup';
import { badRequest } from './errors';

/** Turns yup's errors into a `{ field: message }` map, the shape the client shows beside fields. */
export function fieldErrors(error: ValidationError): Record<string, string> {
  const fields: Record<string, string> = {};
  const all = error.inner.length > 0 ? error.inner : [error];
  for (const e of all) {
    const key = e.path ?? '_';
    if (!(key in fields)) fields[key] = e.message;
  }
  return fields;
}

/** Validates and replaces `req.body` with the cast value, using the same schema as the form. */
export function validateBody<S extends AnyObjectSchema>(schema: S): RequestHandler {
  return async (req, _res, next) => {
    try {
      req.body = (await schema.validate(req.body ?? {}, { abortEarly: false, stripUnknown: true })) as InferType<S>;
      next();
    } catch (error) {
      if (error instanceof ValidationError) {
        next(badRequest('Some fields need attention.', fieldErrors(error)));
      } else {
        next(error);
      }
    }
  };
}

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

/**
 * Text PostgreSQL cannot store: the NUL character (refused in `text` and `jsonb` alike). Found before
 * validation so the answer names the field instead of the database failing the whole request.
 */
export function unstorableText(value: unknown, path = '', found: Record<string, string> = {}): Record<string, string> {
  if (typeof value === 'string') {
    if (value.includes('\u0000')) found[path || '_'] = 'Contains a character that cannot be stored (NUL): remove it.';
  } else if (Array.isArray(value)) {
    value.forEach((v, i) => unstorableText(v, `${path}[${i}]`, found));
  } else if (value !== null && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      if (k.includes('\u0000')) found[path ? `${path}.${k.replace(/\u0000/g, '')}` : '_'] = 'Contains a character that cannot be stored (NUL): remove it.';
      else unstorableText(v, path ? `${path}.${k}` : k, found);
    }
  }
  return found;
}

/** A body that is not a JSON object (an array, a number, a string, null) is refused before its fields are read. */
function isPlainObject(value: unknown): value is Record<string, unknown> {
  return value !== null && typeof value === 'object' && !Array.isArray(value);
}

/** The fields whose own validation breaks on the value's type, each with a message (at least one entry). */
async function wrongTypeFields(schema: AnyObjectSchema, body: Record<string, unknown>): Promise<Record<string, string>> {
  const fields: Record<string, string> = {};
  for (const key of Object.keys(schema.fields)) {
    try {
      await schema.validateAt(key, body);
    } catch (error) {
      if (error instanceof ValidationError) fields[key] = error.message;
      else fields[key] = 'This field has the wrong type.';
    }
  }
  if (Object.keys(fields).length === 0) fields._ = 'A field has the wrong type.';
  return fields;
}

/** What the route-table walk reads from a route's validation step: the schema of its body. */
export type BodyValidator = RequestHandler & { bodySchema: AnyObjectSchema };

/** Validates and replaces `req.body` with the cast value, using the same schema as the form. */
export function validateBody<S extends AnyObjectSchema>(schema: S): BodyValidator {
  const handler: RequestHandler = async (req, _res, next) => {
    const body: unknown = req.body ?? {};
    if (!isPlainObject(body)) {
      next(badRequest('The request body must be a JSON object of fields.', { _: 'Send the fields as a JSON object.' }));
      return;
    }
    const nul = unstorableText(body);
    if (Object.keys(nul).length > 0) {
      next(badRequest('Some fields need attention.', nul));
      return;
    }
    try {
      req.body = (await schema.validate(body, { abortEarly: false, stripUnknown: true })) as InferType<S>;
      next();
    } catch (error) {
      if (error instanceof ValidationError) {
        next(badRequest('Some fields need attention.', fieldErrors(error)));
      } else if (error instanceof TypeError) {
        // A transform met a value of the wrong type (yup's trim() on an object): name the field.
        next(badRequest('Some fields need attention.', await wrongTypeFields(schema, body)));
      } else {
        next(error);
      }
    }
  };
  return Object.assign(handler, { bodySchema: schema });
}

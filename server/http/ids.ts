import { notFound } from './errors';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export function isUuid(value: unknown): value is string {
  return typeof value === 'string' && UUID.test(value);
}

/** A malformed id cannot name a record: answered like an unknown one (404). The one id check of the server. */
export function requireUuid(value: string, what: string): string {
  if (!UUID.test(value)) throw notFound(what);
  return value;
}

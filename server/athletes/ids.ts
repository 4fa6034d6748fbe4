import { notFound } from '@/server/http/errors';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** A malformed id cannot name a record: answered like an unknown one. */
export function requireUuid(value: string, what: string): string {
  if (!UUID.test(value)) throw notFound(what);
  return value;
}

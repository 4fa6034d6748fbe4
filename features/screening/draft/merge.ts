// Three-way merge of JSON drafts: what this phone changed since its last confirmed save wins, field by
// field; everything it did not touch takes the server's newer value. Pure, no React.

type Json = null | boolean | number | string | Json[] | { [key: string]: Json };

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/** A landmark point is one value: never take x from one side and y from the other. */
function isPoint(v: unknown): boolean {
  return isObject(v) && typeof v.x === 'number' && typeof v.y === 'number';
}

export function deepEqual(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (Array.isArray(a) && Array.isArray(b)) return a.length === b.length && a.every((v, i) => deepEqual(v, b[i]));
  if (isObject(a) && isObject(b)) {
    const ka = Object.keys(a).filter((k) => a[k] !== undefined);
    const kb = Object.keys(b).filter((k) => b[k] !== undefined);
    return ka.length === kb.length && ka.every((k) => deepEqual(a[k], b[k]));
  }
  return false;
}

function isStringArray(v: unknown): v is string[] {
  return Array.isArray(v) && v.every((x) => typeof x === 'string');
}

/**
 * merge(base, local, server):
 * - a value this phone did not change takes the server's;
 * - a value the server did not change keeps this phone's;
 * - both changed: objects merge key by key, lists of ids (ticked criteria) merge as sets (this phone's
 *   ticks and unticks applied to the server's list), anything else keeps this phone's value.
 */
export function mergeDrafts<T>(base: T, local: T, server: T): T {
  return merge(base as unknown, local as unknown, server as unknown) as T;
}

function merge(base: unknown, local: unknown, server: unknown): unknown {
  if (deepEqual(local, base)) return server;
  if (deepEqual(server, base) || deepEqual(server, local)) return local;
  if (isStringArray(local) && isStringArray(server)) {
    const before = new Set(isStringArray(base) ? base : []);
    const added = local.filter((x) => !before.has(x));
    const removed = new Set([...before].filter((x) => !local.includes(x)));
    const out = server.filter((x) => !removed.has(x));
    for (const x of added) if (!out.includes(x)) out.push(x);
    return out;
  }
  if (isObject(local) && isObject(server) && !isPoint(local) && !isPoint(server)) {
    const b = isObject(base) ? base : {};
    const out: Record<string, unknown> = {};
    for (const key of new Set([...Object.keys(server), ...Object.keys(local)])) {
      const v = merge(b[key], local[key], server[key]);
      if (v !== undefined) out[key] = v;
    }
    return out;
  }
  return local;
}

export type { Json };

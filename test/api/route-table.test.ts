// Every route of the server, called as every kind of caller, against what the access table says.
// The routes are read from createApp's own Express router stack, so a route added later is tested
// without editing this file; a route with neither guard() nor publicRoute()/signedInRoute() fails.
import { randomUUID } from 'node:crypto';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Express } from 'express';
import { sessions, type Role } from '@/db/schema';
import { OWN_CHILDREN_ONLY, rolesFor } from '@/features/access/permissions';
import { accessOf, recordHome, type AccessMeta } from '@/server/access/guard';
import { SESSION_COOKIE, newToken, sessionIdFromToken } from '@/server/auth/lucia';
import { memoryStorage } from '../fixtures/photos';
import { makeAthlete, makeClub, makeSquad, makeTestApp, makeUser } from '../fixtures/builders';
import { createTestDb, type TestDb } from '../fixtures/test-db';
import { RECORD_FIXTURES, type RouteWorld } from './route-table.fixtures';

type Caller =
  | { name: string; kind: 'signed-out' }
  | { name: string; kind: 'member'; role: Role; userId: string; ownChildren: string[] }
  | { name: string; kind: 'other-club'; userId: string };

type RouteEntry = { method: string; path: string; access: AccessMeta | null };

type Layer = {
  route?: { path: string | string[]; methods: Record<string, boolean>; stack: { handle: unknown }[] };
  handle: { stack?: Layer[] };
  rawPath?: unknown;
};

/** The routes of an Express app, from its router stack (mounted routers included). */
function routesOf(app: Express): RouteEntry[] {
  const out: RouteEntry[] = [];
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        const paths = ([] as string[]).concat(layer.route.path);
        for (const method of Object.keys(layer.route.methods)) {
          for (const p of paths) {
            out.push({ method: method.toUpperCase(), path: prefix + p, access: accessOf(layer.route.stack.map((l) => l.handle)) });
          }
        }
      } else if (Array.isArray(layer.handle?.stack)) {
        const mount = typeof layer.rawPath === 'string' && layer.rawPath !== '/' ? layer.rawPath : '';
        walk(layer.handle.stack, prefix + mount);
      }
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, '');
  return out;
}

let testDb: TestDb;
let app: Express;
let world: RouteWorld;
let routes: RouteEntry[];
const callers: Caller[] = [];
const fixtureIds = new Map<string, string>();

beforeAll(async () => {
  testDb = await createTestDb();
  const db = testDb.db;
  const storage = memoryStorage();
  // A mailbox, so the development-only route exists and is tested too.
  ({ app } = makeTestApp(db, { storage, mailbox: { messages: () => [] } }) as { app: Express });
  const club = await makeClub(db, 'Route Club');
  const other = await makeClub(db, 'Elsewhere');
  const squad = await makeSquad(db, club.id);
  const member = async (role: Role) => (await makeUser(db, { clubId: club.id, role })).id;
  const staff: Role[] = ['admin', 'head_coach', 'tester', 'physio'];
  for (const role of staff) callers.push({ name: role, kind: 'member', role, userId: await member(role), ownChildren: [] });
  const parent = await member('parent');
  const otherParent = await member('parent');
  const ownChild = await makeAthlete(db, { clubId: club.id, squadId: squad.id, firstName: 'Own', guardianUserId: parent });
  const otherChild = await makeAthlete(db, { clubId: club.id, squadId: squad.id, firstName: 'Other', guardianUserId: otherParent });
  callers.push({ name: 'parent-own-child', kind: 'member', role: 'parent', userId: parent, ownChildren: [ownChild.id] });
  callers.push({ name: 'parent-of-another-family', kind: 'member', role: 'parent', userId: otherParent, ownChildren: [otherChild.id] });
  // An admin elsewhere holds every admin action, in their own club only.
  callers.push({ name: 'admin-of-another-club', kind: 'other-club', userId: (await makeUser(db, { clubId: other.id, role: 'admin' })).id });
  callers.push({ name: 'signed-out', kind: 'signed-out' });
  world = {
    db,
    storage,
    clubId: club.id,
    squadId: squad.id,
    ownChildId: ownChild.id,
    otherChildId: otherChild.id,
    staffUserId: (callers[0] as { userId: string }).userId,
  };
  routes = routesOf(app);
});

afterAll(async () => {
  await testDb.drop();
});

/** A fresh session for each call: a route that ends sessions (sign-out) must not spoil the next call. */
async function cookieFor(caller: Caller): Promise<string | null> {
  if (caller.kind === 'signed-out') return null;
  const token = newToken();
  await testDb.db.insert(sessions).values({ id: await sessionIdFromToken(token), userId: caller.userId, expiresAt: new Date(Date.now() + 3600_000) });
  return `${SESSION_COOKIE}=${token}`;
}

async function sampleId(kind: string, route: RouteEntry): Promise<string> {
  const fixture = RECORD_FIXTURES[kind];
  if (!fixture) {
    throw new Error(
      `${route.method} ${route.path} guards a "${kind}" record, but test/api/route-table.fixtures.ts has no sample of it: ` +
        `add RECORD_FIXTURES['${kind}'] (a record of world.clubId, belonging to world.ownChildId when it belongs to an athlete).`,
    );
  }
  if (!fixtureIds.has(kind)) fixtureIds.set(kind, await fixture(world));
  return fixtureIds.get(kind)!;
}

/** Whether the access table lets `caller` through this route's guard. */
async function expectedAllowed(access: AccessMeta, caller: Caller, recordId: string | null): Promise<boolean> {
  const { target, action } = access;
  if (target.kind === 'public') return true;
  if (caller.kind === 'signed-out') return false;
  if (target.kind === 'signed-in') return true;
  if (caller.kind === 'other-club' || !action) return false;
  if (!rolesFor(action).includes(caller.role)) return false;
  if (!OWN_CHILDREN_ONLY.includes(caller.role) || target.kind !== 'record') return true;
  const home = await recordHome(testDb.db, target.record, recordId!);
  return !!home?.athleteId && caller.ownChildren.includes(home.athleteId);
}

describe('route table', () => {
  it('finds the routes of createApp', () => {
    // A sanity floor, so a broken walk of the router stack cannot pass by finding nothing.
    expect(routes.length).toBeGreaterThan(30);
    expect(routes.map((r) => `${r.method} ${r.path}`)).toContain('GET /api/athletes/:id');
  });

  it('has a guard, publicRoute() or signedInRoute() on every route', () => {
    const unguarded = routes.filter((r) => !r.access).map((r) => `${r.method} ${r.path}`);
    expect(unguarded, 'routes without guard(action, target), publicRoute() or signedInRoute()').toEqual([]);
  });

  it('answers every caller of every route as the access table says', async () => {
    const failures: string[] = [];
    let calls = 0;
    for (const route of routes) {
      if (!route.access) continue;
      const { target } = route.access;
      const recordId = target.kind === 'record' ? await sampleId(target.record, route) : null;
      const path = route.path.replace(/:(\w+)/g, (_m, name: string) => {
        if (target.kind === 'record' && target.from === 'params' && target.param === name) return recordId!;
        if (target.kind === 'club' && target.param === name) return world.clubId;
        return randomUUID(); // any other id: an unknown record, which must not turn a refusal into a pass
      });
      const body: Record<string, unknown> = {};
      if (target.kind === 'record' && target.from === 'body') body[target.param] = recordId;
      for (const caller of callers) {
        const cookie = await cookieFor(caller);
        let req = supertest(app)[route.method.toLowerCase() as 'get'](path).set('X-Club-Id', world.clubId);
        if (cookie) req = req.set('Cookie', cookie);
        if (route.method !== 'GET' && route.method !== 'DELETE') req = req.send(body);
        // A route that never answers is a failure of its own, not a timeout of the whole table.
        const res = await req.timeout({ response: 10_000 }).catch((error: Error) => ({ status: 0, error }));
        calls++;
        if (res.status === 0) {
          failures.push(`${route.method} ${route.path} as ${caller.name}: no answer (${(res as { error: Error }).error.message})`);
          continue;
        }
        const allowed = await expectedAllowed(route.access, caller, recordId);
        // A 403 with a code of the route's own (e.g. `no_family_photos`: the club shows no photos to families)
        // comes from the handler, after the guard let the caller through; the guard's refusal is `forbidden`.
        const refusedByGuard = res.status === 403 && (res as { body?: { error?: { code?: string } } }).body?.error?.code === 'forbidden';
        const ok = allowed
          ? res.status !== 401 && !refusedByGuard && res.status < 500
          : caller.kind === 'signed-out'
            ? res.status === 401
            : res.status === 403 || res.status === 404;
        if (!ok) {
          const expected = allowed ? 'let through (not 401/403, no 5xx)' : caller.kind === 'signed-out' ? '401' : '403/404';
          failures.push(`${route.method} ${route.path} as ${caller.name}: ${res.status}, expected ${expected} (${route.access.action ?? target.kind})`);
        }
      }
    }
    expect(failures).toEqual([]);
    expect(calls).toBe(routes.filter((r) => r.access).length * callers.length);
  }, 180_000); // several hundred requests; on a busy 2-core machine this takes a while

  it('names the missing sample when a new kind of record has none', async () => {
    await expect(sampleId('no-such-kind', { method: 'GET', path: '/api/x/:id', access: null })).rejects.toThrow(
      /route-table\.fixtures\.ts has no sample of it/,
    );
  });
});

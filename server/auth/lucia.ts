// Every use of lucia stays in this folder, so the session layer can be swapped without touching routes.
import { createHash } from 'node:crypto';
import { DrizzlePostgreSQLAdapter } from '@lucia-auth/adapter-drizzle';
import { Lucia, TimeSpan, generateIdFromEntropySize, type DatabaseSession, type DatabaseUser } from 'lucia';
import { preparedRows, type Db } from '@/db/client';
import { sessions, users, type Role } from '@/db/schema';

export const SESSION_COOKIE = 'squadline_session';

/**
 * What the caller may reach, read with their session: their clubs and roles (ordered by club name, as
 * `/api/me` lists them) and the athletes linked to them as a guardian. `guard()` checks a request against
 * this instead of asking the database again (server/access/scope.ts). Read afresh on every request, never
 * kept between requests, so a role taken away applies to the very next request.
 */
export type CallerAccess = {
  memberships: { clubId: string; clubName: string; role: Role }[];
  athleteIds: string[];
};

/**
 * The session, its user and the user's access in one prepared statement (one round trip, planned once
 * per pooled connection), where the stock adapter built its query with Drizzle on every request and the
 * guard then asked for the membership in a second one. Everything else (renewal, expiry, sign-out)
 * stays lucia's and the stock adapter's.
 */
class SessionAccessAdapter extends DrizzlePostgreSQLAdapter {
  constructor(private readonly database: Db) {
    super(database, sessions, users);
  }

  override async getSessionAndUser(sessionId: string): Promise<[session: DatabaseSession | null, user: DatabaseUser | null]> {
    const [row] = await preparedRows<{
      userId: string;
      expiresAt: Date;
      email: string;
      displayName: string;
      memberships: [clubId: string, clubName: string, role: Role][];
      athleteIds: string[];
    }>(
      this.database,
      'auth_session_access',
      `select s.user_id as "userId", s.expires_at as "expiresAt", u.email, u.display_name as "displayName",
        (select coalesce(json_agg(json_build_array(m.club_id, c.name, m.role) order by c.name), '[]')
          from memberships m join clubs c on c.id = m.club_id where m.user_id = s.user_id) as memberships,
        (select coalesce(json_agg(g.athlete_id), '[]') from guardian_links g where g.user_id = s.user_id) as "athleteIds"
      from sessions s join users u on u.id = s.user_id
      where s.id = $1`,
      [sessionId],
    );
    if (!row) return [null, null];
    const access: CallerAccess = {
      memberships: row.memberships.map(([clubId, clubName, role]) => ({ clubId, clubName, role })),
      athleteIds: row.athleteIds,
    };
    return [
      { id: sessionId, userId: row.userId, expiresAt: row.expiresAt, attributes: {} },
      { id: row.userId, attributes: { email: row.email, displayName: row.displayName, access } },
    ];
  }
}

export function createLucia(db: Db, secureCookies: boolean) {
  return new Lucia(new SessionAccessAdapter(db), {
    sessionExpiresIn: new TimeSpan(30, 'd'),
    sessionCookie: { name: SESSION_COOKIE, attributes: { secure: secureCookies, sameSite: 'lax' } },
    getUserAttributes: (attributes) => ({ email: attributes.email, displayName: attributes.displayName, access: attributes.access }),
  });
}

export type Auth = ReturnType<typeof createLucia>;

declare module 'lucia' {
  interface Register {
    Lucia: Auth;
    UserId: string;
    DatabaseUserAttributes: { email: string; displayName: string; access: CallerAccess };
  }
}

/**
 * The cookie carries a random token; the database keeps only its SHA-256 (hex) as the session id.
 * Node's hash, in the request's own turn: WebCrypto's digest is sent to the thread pool and back, on
 * every request, for 40 bytes.
 */
export async function sessionIdFromToken(token: string): Promise<string> {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

export function newToken(): string {
  return generateIdFromEntropySize(25);
}

// Every use of lucia stays in this folder, so the session layer can be swapped without touching routes.
import { DrizzlePostgreSQLAdapter } from '@lucia-auth/adapter-drizzle';
import { Lucia, TimeSpan, generateIdFromEntropySize } from 'lucia';
import { sha256 } from 'oslo/crypto';
import { encodeHex } from 'oslo/encoding';
import type { Db } from '@/db/client';
import { sessions, users } from '@/db/schema';

export const SESSION_COOKIE = 'squadline_session';

export function createLucia(db: Db, secureCookies: boolean) {
  return new Lucia(new DrizzlePostgreSQLAdapter(db, sessions, users), {
    sessionExpiresIn: new TimeSpan(30, 'd'),
    sessionCookie: { name: SESSION_COOKIE, attributes: { secure: secureCookies, sameSite: 'lax' } },
    getUserAttributes: (attributes) => ({ email: attributes.email, displayName: attributes.displayName }),
  });
}

export type Auth = ReturnType<typeof createLucia>;

declare module 'lucia' {
  interface Register {
    Lucia: Auth;
    UserId: string;
    DatabaseUserAttributes: { email: string; displayName: string };
  }
}

/** The cookie carries a random token; the database keeps only its SHA-256 as the session id. */
export async function sessionIdFromToken(token: string): Promise<string> {
  return encodeHex(await sha256(new TextEncoder().encode(token)));
}

export function newToken(): string {
  return generateIdFromEntropySize(25);
}

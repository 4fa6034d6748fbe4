import { sql } from 'drizzle-orm';
import type { Logger } from 'pino';
import type { Db } from '@/db/client';
import type { MailboxMessage } from '@/features/mailbox/contract';
import type { ClubScope } from '@/server/access/scope';
import { isPoolBusy } from '@/server/http/error-middleware';

/** The local e-mail fake's store (`server/mail/fake-smtp.ts`), as the mailbox route reads it. */
export type Mailbox = { messages(): (MailboxMessage & { kind: string | null; clubId: string | null })[] };

export function metaService(db: Db, mailbox: Mailbox | null) {
  return {
    /**
     * `busy`: every connection of the pool is in use and requests are queued for one. The check does
     * not join that queue (a load balancer would time out and take a working process out); the
     * connections in use are open, so the database is reachable. A stopped database ends them at once
     * and empties the queue, and the next check reports it down.
     */
    async databaseState(log?: Logger): Promise<'up' | 'busy' | 'down'> {
      // drizzle keeps the pool it was made from as `$client` (Db's type does not show it).
      if (((db as { $client?: { waitingCount?: number } }).$client?.waitingCount ?? 0) > 0) return 'busy';
      try {
        await db.execute(sql`select 1`);
        return 'up';
      } catch (err) {
        if (isPoolBusy(err)) return 'busy';
        log?.warn({ err }, 'health check: database down');
        return 'down';
      }
    },

    /**
     * The mail sent for the caller's club, newest first. Password resets never show (they would let an
     * admin take over a member's account), nor does untagged mail or another club's.
     */
    clubMail(scope: ClubScope): MailboxMessage[] {
      return (mailbox?.messages() ?? [])
        .filter((m) => m.clubId === scope.clubId && m.kind !== 'password-reset')
        .map(({ id, from, to, subject, text, receivedAt }) => ({ id, from, to, subject, text, receivedAt }))
        .reverse();
    },
  };
}

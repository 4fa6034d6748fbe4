import { sql } from 'drizzle-orm';
import type { Logger } from 'pino';
import type { Db } from '@/db/client';
import type { MailboxMessage } from '@/features/mailbox/contract';
import type { ClubScope } from '@/server/access/scope';

/** The local e-mail fake's store (`server/mail/fake-smtp.ts`), as the mailbox route reads it. */
export type Mailbox = { messages(): (MailboxMessage & { kind: string | null; clubId: string | null })[] };

export function metaService(db: Db, mailbox: Mailbox | null) {
  return {
    async databaseUp(log?: Logger): Promise<boolean> {
      try {
        await db.execute(sql`select 1`);
        return true;
      } catch (err) {
        log?.warn({ err }, 'health check: database down');
        return false;
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

import { sql } from 'drizzle-orm';
import { Router } from 'express';
import type { Db } from '@/db/client';
import { membershipsOf, signedInUserId } from '@/server/access/scope';
import { forbidden, notFound } from '@/server/http/errors';

export type Mailbox = { messages(): unknown[] };

export function metaRouter(db: Db, mailbox: Mailbox | null) {
  const router = Router();

  router.get('/health', async (req, res) => {
    try {
      await db.execute(sql`select 1`);
      res.json({ ok: true, db: 'up' });
    } catch (err) {
      req.log?.warn({ err }, 'health check: database down');
      res.status(503).json({ ok: false, db: 'down' });
    }
  });

  router.get('/meta', (_req, res) => {
    res.json({ mailbox: mailbox !== null });
  });

  // The local e-mail fake's inbox, for admins; absent when real SMTP is configured.
  router.get('/dev/mailbox', async (req, res) => {
    if (!mailbox) throw notFound('The local mailbox');
    const mine = await membershipsOf(db, signedInUserId(req));
    if (!mine.some((m) => m.role === 'admin')) throw forbidden('Only club admins can read the local mailbox.');
    res.json({ messages: [...mailbox.messages()].reverse() });
  });

  return router;
}

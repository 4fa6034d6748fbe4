import { Router } from 'express';
import type { Db } from '@/db/client';
import type { MailboxResponse, MetaResponse } from '@/features/mailbox/contract';
import { accessGuards, callerClub, publicRoute, scopeOf } from '@/server/access/guard';
import { metaService, type Mailbox } from './meta.service';

export type { Mailbox };

/**
 * Health, what the app offers (`/meta`) and the local mailbox. The mailbox route exists only when
 * `mailbox` is given: the server passes null with a real SMTP server or `NODE_ENV=production`.
 */
export function metaRouter(db: Db, mailbox: Mailbox | null) {
  const router = Router();
  const { guard } = accessGuards(db);
  const service = metaService(db, mailbox);

  router.get('/health', publicRoute(), async (req, res) => {
    const db = await service.databaseState(req.log);
    res.status(db === 'down' ? 503 : 200).json({ ok: db !== 'down', db });
  });

  router.get('/meta', publicRoute(), (_req, res) => {
    res.json({ mailbox: mailbox !== null } satisfies MetaResponse);
  });

  if (mailbox) {
    router.get('/dev/mailbox', guard('mailbox.read', callerClub), (_req, res) => {
      res.json({ messages: service.clubMail(scopeOf(res)) } satisfies MailboxResponse);
    });
  }

  return router;
}

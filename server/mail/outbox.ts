import PgBoss from 'pg-boss';
import type { Logger } from 'pino';

import type { OutgoingMail } from './mailer';

export type { OutgoingMail };
export type MailSender = { send(mail: OutgoingMail): Promise<unknown> };

/**
 * A message whose body carries a single-use link: only this reference is queued, and the message is
 * rendered (with a fresh token) at send time by a `RenderMail`, so no token is ever stored.
 */
export type MailRef = { template: 'invitation' | 'password-reset' | 'family-summary'; id: string };
export type QueuedMail = OutgoingMail | MailRef;
/** Null: nothing to send any more (the link was used or has expired). */
export type RenderMail = (ref: MailRef) => Promise<OutgoingMail | null>;

export const isMailRef = (mail: QueuedMail): mail is MailRef => 'template' in mail;

/** Where routes hand e-mails over. Sending happens later, with retries, so a failed send is not lost. */
export interface Outbox {
  enqueue(mail: QueuedMail): Promise<void>;
  stop(): Promise<void>;
}

export const MAIL_QUEUE = 'mail';

/**
 * pg-boss keeps the queue in PostgreSQL (schema `pgboss`), so queued mail survives a restart.
 * A send that throws is retried with backoff up to `retryLimit` times.
 */
export async function startQueuedOutbox(options: {
  connectionString: string;
  sender: MailSender;
  render: RenderMail;
  logger: Logger;
  pollingIntervalSeconds?: number;
  retryDelaySeconds?: number;
}): Promise<Outbox> {
  const boss = new PgBoss({ connectionString: options.connectionString, max: 3, schedule: false });
  boss.on('error', (err) => options.logger.error({ err }, 'mail queue error'));
  await boss.start();
  await boss.createQueue(MAIL_QUEUE, {
    name: MAIL_QUEUE,
    retryLimit: 6,
    retryDelay: options.retryDelaySeconds ?? 30,
    retryBackoff: true,
  });
  await boss.work<QueuedMail>(MAIL_QUEUE, { pollingIntervalSeconds: options.pollingIntervalSeconds ?? 2 }, async (jobs) => {
    for (const job of jobs) {
      const mail = isMailRef(job.data) ? await options.render(job.data) : job.data;
      if (!mail) continue;
      try {
        await options.sender.send(mail);
        // No address or subject in the log: both can name a child or a family.
        options.logger.info({ job: job.id, kind: mail.tag?.kind ?? 'mail' }, 'mail sent');
      } catch (err) {
        options.logger.warn({ err, job: job.id }, 'mail send failed; will retry');
        throw err;
      }
    }
  });
  return {
    async enqueue(mail) {
      await boss.send(MAIL_QUEUE, mail);
    },
    async stop() {
      await boss.stop({ graceful: true, wait: true, timeout: 5000 });
    },
  };
}

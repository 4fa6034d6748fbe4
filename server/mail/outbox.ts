import PgBoss from 'pg-boss';
import type { Logger } from 'pino';

import type { OutgoingMail } from './mailer';

export type { OutgoingMail };
export type MailSender = { send(mail: OutgoingMail): Promise<unknown> };

/** Where routes hand e-mails over. Sending happens later, with retries, so a failed send is not lost. */
export interface Outbox {
  enqueue(mail: OutgoingMail): Promise<void>;
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
  await boss.work<OutgoingMail>(
    MAIL_QUEUE,
    { pollingIntervalSeconds: options.pollingIntervalSeconds ?? 2 },
    async (jobs) => {
      for (const job of jobs) {
        try {
          await options.sender.send(job.data);
          options.logger.info({ to: job.data.to, subject: job.data.subject }, 'mail sent');
        } catch (err) {
          options.logger.warn({ err, to: job.data.to }, 'mail send failed; will retry');
          throw err;
        }
      }
    },
  );
  return {
    async enqueue(mail) {
      await boss.send(MAIL_QUEUE, mail);
    },
    async stop() {
      await boss.stop({ graceful: true, wait: true, timeout: 5000 });
    },
  };
}

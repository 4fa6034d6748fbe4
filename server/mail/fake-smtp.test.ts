import { createServer } from 'node:net';

import { afterEach, describe, expect, it } from 'vitest';

import { startFakeSmtp, type FakeSmtp } from './fake-smtp';
import { createMailer, type Mailer } from './mailer';

describe('startFakeSmtp', () => {
  const cleanups: (() => Promise<void> | void)[] = [];
  afterEach(async () => {
    while (cleanups.length > 0) await cleanups.pop()?.();
  });

  async function start(): Promise<{ fake: FakeSmtp; mailer: Mailer }> {
    const fake = await startFakeSmtp();
    const mailer = createMailer({ transport: fake.url, from: 'Squadline <no-reply@squadline.test>' });
    cleanups.push(
      () => fake.close(),
      () => mailer.close(),
    );
    return { fake, mailer };
  }

  it('stores a message sent through the mailer', async () => {
    const { fake, mailer } = await start();

    const { messageId } = await mailer.send({
      to: 'parent@example.com',
      subject: 'Screening results for Mia',
      text: 'Mia completed her screening today.',
      html: '<p>Mia completed her screening today.</p>',
    });

    const message = await fake.waitFor((m) => m.subject === 'Screening results for Mia');
    expect(message).toMatchObject({
      to: ['parent@example.com'],
      subject: 'Screening results for Mia',
      text: 'Mia completed her screening today.',
      html: '<p>Mia completed her screening today.</p>',
      messageId,
    });
    expect(message.from).toContain('no-reply@squadline.test');
    expect(new Date(message.receivedAt).toISOString()).toBe(message.receivedAt);
    expect(fake.messages()).toHaveLength(1);
  });

  it.each(['Just text', 'Two lines\nof text'])('stores text-only message %j as sent, with null html', async (text) => {
    const { fake, mailer } = await start();

    await mailer.send({ to: 'coach@example.com', subject: 'Plain', text });

    expect(fake.messages()[0]).toMatchObject({ text, html: null });
  });

  it('keeps only the newest maxMessages', async () => {
    const fake = await startFakeSmtp({ maxMessages: 2 });
    const mailer = createMailer({ transport: fake.url, from: 'no-reply@squadline.test' });
    cleanups.push(
      () => fake.close(),
      () => mailer.close(),
    );

    for (const subject of ['one', 'two', 'three']) {
      await mailer.send({ to: 'a@example.com', subject, text: 'x' });
    }

    expect(fake.messages().map((m) => m.subject)).toEqual(['two', 'three']);
  });

  it('listens on loopback and refuses other hosts', async () => {
    const { fake } = await start();

    expect(fake.host).toBe('127.0.0.1');
    expect(fake.url).toBe(`smtp://127.0.0.1:${fake.port}`);
    await expect(startFakeSmtp({ host: '0.0.0.0' })).rejects.toThrow(/loopback only/);
  });

  it('accepts any login, so an SMTP_URL with credentials works against it', async () => {
    const { fake } = await start();
    const mailer = createMailer({
      transport: { host: fake.host, port: fake.port, secure: false, auth: { user: 'dev', pass: 'dev' } },
      from: 'no-reply@squadline.test',
    });
    cleanups.push(() => mailer.close());

    await mailer.verify();
    await mailer.send({ to: 'a@example.com', subject: 'With auth', text: 'ok' });

    expect(fake.messages().map((m) => m.subject)).toEqual(['With auth']);
  });

  it('resolves waitFor with a message that arrives later', async () => {
    const { fake, mailer } = await start();

    const waiting = fake.waitFor((m) => m.to.includes('late@example.com'), 5_000);
    await mailer.send({ to: 'late@example.com', subject: 'Later', text: 'x' });

    expect((await waiting).subject).toBe('Later');
  });

  it('rejects waitFor with a clear error when nothing matches in time', async () => {
    const { fake } = await start();

    await expect(fake.waitFor((m) => m.subject === 'never', 50)).rejects.toThrow('Fake SMTP: no message matched within 50 ms (0 message(s) stored)');
  });

  it('clears the stored messages', async () => {
    const { fake, mailer } = await start();
    await mailer.send({ to: 'a@example.com', subject: 'One', text: 'x' });

    fake.clear();

    expect(fake.messages()).toEqual([]);
  });

  it('frees the port on close and rejects pending waiters', async () => {
    const fake = await startFakeSmtp();
    const pending = fake.waitFor(() => false, 10_000);

    await fake.close();

    await expect(pending).rejects.toThrow(/closed before a message matched/);
    const probe = createServer();
    await new Promise<void>((resolve, reject) => {
      probe.once('error', reject);
      probe.listen(fake.port, '127.0.0.1', resolve);
    });
    await new Promise<void>((resolve) => probe.close(() => resolve()));
  });
});

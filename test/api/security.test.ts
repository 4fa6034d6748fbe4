// Sessions, secrets and limits: the local mailbox, tokens kept out of storage and queue, rate limits in
// PostgreSQL, session rotation, password change, and the origin check behind a proxy.
import { sql } from 'drizzle-orm';
import pino from 'pino';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { invitations, passwordResets, sessions } from '@/db/schema';
import { linkMail } from '@/server/auth/link-mail';
import { DEFAULT_AUTH_LIMITS, type AuthLimits } from '@/server/auth/rate-limits';
import { startFakeSmtp, type FakeSmtp } from '@/server/mail/fake-smtp';
import { createMailer, type Mailer } from '@/server/mail/mailer';
import { startQueuedOutbox, type Outbox } from '@/server/mail/outbox';
import { makeClub, makeTestApp, makeUser, signedInAgent, TEST_PASSWORD } from '../fixtures/builders';
import { createTestDb, type TestDb } from '../fixtures/test-db';

const PUBLIC_URL = 'https://squadline.example';
const LIMITS: AuthLimits = {
  ...DEFAULT_AUTH_LIMITS,
  signInPerAccount: { windowMs: 60_000, max: 4 },
  signInPerAddress: { windowMs: 60_000, max: 1000 },
  resetPerEmail: { windowMs: 60_000, max: 2 },
};

let testDb: TestDb;
let fake: FakeSmtp;
let mailer: Mailer;
let outbox: Outbox;
let app: ReturnType<typeof makeTestApp>['app'];
const ids: Record<string, string> = {};
const tokenIn = (text: string) => decodeURIComponent(/token=([^\s]+)/.exec(text)![1]!);

beforeAll(async () => {
  testDb = await createTestDb();
  const db = testDb.db;
  fake = await startFakeSmtp();
  mailer = createMailer({ transport: fake.url, from: 'Squadline <no-reply@squadline.test>' });
  // The real queue (pg-boss in this test database), rendering link mail at send time.
  outbox = await startQueuedOutbox({
    connectionString: testDb.url,
    sender: mailer,
    render: linkMail(db, PUBLIC_URL),
    logger: pino({ level: 'silent' }),
    pollingIntervalSeconds: 0.5,
  });
  ({ app } = makeTestApp(db, { outbox, mailbox: fake, config: { publicUrl: PUBLIC_URL, authLimits: LIMITS } }));
  const harbour = await makeClub(db, 'Harbour');
  const ridge = await makeClub(db, 'Ridge');
  ids.harbour = harbour.id;
  ids.ridge = ridge.id;
  await makeUser(db, { email: 'admin@harbour.test', clubId: harbour.id, role: 'admin' });
  await makeUser(db, { email: 'coach@harbour.test', clubId: harbour.id, role: 'head_coach' });
  await makeUser(db, { email: 'admin@ridge.test', clubId: ridge.id, role: 'admin' });
});

afterAll(async () => {
  await outbox.stop();
  mailer.close();
  await fake.close();
  await testDb.drop();
});

describe('the local mailbox', () => {
  it("shows an admin their own club's mail only, never password resets, and no token is stored or queued", async () => {
    const harbourAdmin = await signedInAgent(app, 'admin@harbour.test');
    const ridgeAdmin = await signedInAgent(app, 'admin@ridge.test');
    expect((await harbourAdmin.post(`/api/clubs/${ids.harbour}/invitations`).send({ email: 'new.physio@harbour.test', role: 'physio' })).status).toBe(201);
    const invite = await fake.waitFor((m) => m.to.includes('new.physio@harbour.test'));
    const inviteToken = tokenIn(invite.text);

    // Neither the queue nor any table holds the token: the queue holds a reference, the table a hash.
    const jobs = await testDb.db.execute(sql`select data::text as data from pgboss.job where name = 'mail'`);
    expect(jobs.rows.length).toBeGreaterThan(0);
    for (const job of jobs.rows as { data: string }[]) {
      expect(job.data).not.toContain(inviteToken);
      expect(Object.keys(JSON.parse(job.data)).sort()).toEqual(['id', 'template']);
    }
    const rows = JSON.stringify(await testDb.db.select().from(invitations));
    expect(rows).not.toContain(inviteToken);

    // A password reset for a Harbour member reaches them, but no admin's mailbox.
    expect((await supertest(app).post('/api/auth/password-reset').send({ email: 'coach@harbour.test' })).status).toBe(202);
    const reset = await fake.waitFor((m) => m.to.includes('coach@harbour.test'));
    const resetToken = tokenIn(reset.text);
    expect(JSON.stringify(await testDb.db.select().from(passwordResets))).not.toContain(resetToken);
    const allJobs = await testDb.db.execute(sql`select data::text as data from pgboss.job`);
    expect(JSON.stringify(allJobs.rows)).not.toContain(resetToken);

    const harbourMail = (await harbourAdmin.get('/api/dev/mailbox')).body.messages as { subject: string; text: string }[];
    expect(harbourMail.map((m) => m.subject)).toEqual(['You are invited to Harbour on Squadline']);
    expect(JSON.stringify(harbourMail)).not.toContain(resetToken);

    // The bug this replaces: an admin of another club read every club's mail (and its reset links).
    const ridgeMail = await ridgeAdmin.get('/api/dev/mailbox');
    expect(ridgeMail.status).toBe(200);
    expect(ridgeMail.body.messages).toEqual([]);
    expect((await ridgeAdmin.get('/api/dev/mailbox').set('X-Club-Id', ids.harbour!)).status).toBe(403);
    expect((await (await signedInAgent(app, 'coach@harbour.test', TEST_PASSWORD)).get('/api/dev/mailbox')).status).toBe(403);

    // The invitation link works once, with the token from the e-mail.
    const accept = await supertest(app)
      .post('/api/auth/invitations/accept')
      .send({ token: inviteToken, displayName: 'Pat Physio', password: 'a-long-password' });
    expect(accept.status).toBe(201);
  });

  it('does not exist in production or with a real SMTP server (no mailbox given)', async () => {
    const { app: production } = makeTestApp(testDb.db, { mailbox: fake, config: { production: true } });
    const { app: realSmtp } = makeTestApp(testDb.db, { config: {} });
    for (const a of [production, realSmtp]) {
      const admin = await signedInAgent(a, 'admin@ridge.test');
      expect((await admin.get('/api/dev/mailbox')).status).toBe(404);
      expect((await admin.get('/api/meta')).body).toEqual({ mailbox: false });
    }
  });
});

describe('rate limits held in PostgreSQL', () => {
  it('counts failed sign-ins per account across processes and addresses', async () => {
    await makeUser(testDb.db, { email: 'target@harbour.test', clubId: ids.harbour, role: 'tester' });
    // Two app instances on one database stand for two server processes.
    const { app: other } = makeTestApp(testDb.db, { config: { publicUrl: PUBLIC_URL, authLimits: LIMITS } });
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) {
      const res = await supertest(i % 2 ? app : other)
        .post('/api/auth/sign-in')
        .set('X-Forwarded-For', `203.0.113.${i + 1}`) // a new address each time
        .send({ email: 'target@harbour.test', password: 'wrong-password' });
      statuses.push(res.status);
    }
    expect(statuses).toEqual([401, 401, 401, 401, 429, 429]);
    // Even the right password waits for the window to pass.
    expect((await supertest(app).post('/api/auth/sign-in').send({ email: 'target@harbour.test', password: TEST_PASSWORD })).status).toBe(429);
  });

  it('answers an unknown account exactly like a known one, limit included', async () => {
    const known: number[] = [];
    const unknown: number[] = [];
    for (let i = 0; i < 6; i++) {
      known.push(
        (
          await supertest(app)
            .post('/api/auth/sign-in')
            .send({ email: 'coach@harbour.test', password: `wrong-${i}` })
        ).status,
      );
      unknown.push(
        (
          await supertest(app)
            .post('/api/auth/sign-in')
            .send({ email: 'nobody@harbour.test', password: `wrong-${i}` })
        ).status,
      );
    }
    expect(unknown).toEqual(known);
    const a = await supertest(app).post('/api/auth/sign-in').send({ email: 'coach@harbour.test', password: 'x' });
    const b = await supertest(app).post('/api/auth/sign-in').send({ email: 'nobody@harbour.test', password: 'x' });
    expect(a.body).toEqual(b.body);
  });

  it('counts every reset request, with a cooldown per e-mail whether or not it has an account', async () => {
    const { app: other } = makeTestApp(testDb.db, { config: { publicUrl: PUBLIC_URL, authLimits: LIMITS } });
    for (const email of ['admin@ridge.test', 'nobody-at-all@ridge.test']) {
      const statuses: number[] = [];
      for (let i = 0; i < 3; i++)
        statuses.push(
          (
            await supertest(i % 2 ? app : other)
              .post('/api/auth/password-reset')
              .send({ email })
          ).status,
        );
      expect([email, statuses]).toEqual([email, [202, 202, 429]]);
    }
  });
});

describe('sessions', () => {
  it('rotates the session id at sign-in', async () => {
    const agent = await signedInAgent(app, 'admin@ridge.test');
    const before = await testDb.db.select({ id: sessions.id }).from(sessions);
    await agent.post('/api/auth/sign-in').send({ email: 'admin@ridge.test', password: TEST_PASSWORD });
    const after = await testDb.db.select({ id: sessions.id }).from(sessions);
    // The browser's earlier session is gone; a new one replaced it.
    expect(after.length).toBe(before.length);
    expect(after.map((s) => s.id).sort()).not.toEqual(before.map((s) => s.id).sort());
    expect((await agent.get('/api/me')).status).toBe(200);
  });

  it('ends every other session when the password changes, and renews this one', async () => {
    const user = await makeUser(testDb.db, { email: 'changer@ridge.test', clubId: ids.ridge, role: 'tester' });
    const laptop = await signedInAgent(app, user.email);
    const phone = await signedInAgent(app, user.email);
    const wrong = await phone.post('/api/auth/password').send({ currentPassword: 'not-it', newPassword: 'a-brand-new-one' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields).toHaveProperty('currentPassword');
    const oldCookie = String(
      ([] as string[]).concat(
        (await supertest(app).post('/api/auth/sign-in').send({ email: user.email, password: TEST_PASSWORD })).headers['set-cookie'] ?? [],
      ),
    );
    const changed = await phone.post('/api/auth/password').send({ currentPassword: TEST_PASSWORD, newPassword: 'a-brand-new-one' });
    expect(changed.status).toBe(204);
    expect((await phone.get('/api/me')).status).toBe(200);
    expect((await laptop.get('/api/me')).status).toBe(401);
    expect((await supertest(app).get('/api/me').set('Cookie', oldCookie.split(';')[0]!)).status).toBe(401);
    await signedInAgent(app, user.email, 'a-brand-new-one');
  });
});

describe('cross-origin requests', () => {
  it('refuses a state-changing request from another origin even when it names our Host (proxy)', async () => {
    const spoofed = await supertest(app)
      .post('/api/auth/sign-in')
      .set('Host', 'evil.example')
      .set('Origin', 'https://evil.example')
      .send({ email: 'admin@ridge.test', password: TEST_PASSWORD });
    expect(spoofed.status).toBe(403);
    const ours = await supertest(app).post('/api/auth/sign-in').set('Origin', PUBLIC_URL).send({ email: 'admin@ridge.test', password: TEST_PASSWORD });
    expect(ours.status).toBe(200);
    const crossSite = await supertest(app).post('/api/auth/sign-out').set('Sec-Fetch-Site', 'cross-site');
    expect(crossSite.status).toBe(403);
  });
});

import { and, eq } from 'drizzle-orm';
import pino from 'pino';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEvents, consents, guardianLinks } from '@/db/schema';
import { sql } from 'drizzle-orm';
import { startFakeSmtp, type FakeSmtp } from '@/server/mail/fake-smtp';
import { createMailer, type Mailer } from '@/server/mail/mailer';
import { startQueuedOutbox, type Outbox } from '@/server/mail/outbox';
import { mailRenderer } from '@/server/mail/render';
import { makeAthlete, makeClub, makeSquad, makeTestApp, makeUser, signedInAgent } from '../fixtures/builders';
import { makeSubmittedScreen, recordEmailConsent } from '../fixtures/care';
import { createTestDb, type TestDb } from '../fixtures/test-db';

// The summary e-mail through the real queue (pg-boss in the test database) into the fake SMTP server.
let testDb: TestDb;
let smtp: FakeSmtp;
let mailer: Mailer;
let outbox: Outbox;
let app: ReturnType<typeof makeTestApp>['app'];
const ids: Record<string, string> = {};
let physio: Awaited<ReturnType<typeof signedInAgent>>;

beforeAll(async () => {
  testDb = await createTestDb();
  smtp = await startFakeSmtp();
  mailer = createMailer({ transport: { host: smtp.host, port: smtp.port, secure: false }, from: 'Squadline <no-reply@squadline.test>' });
  outbox = await startQueuedOutbox({
    connectionString: testDb.url,
    sender: mailer,
    render: mailRenderer(testDb.db, 'http://squadline.test'),
    logger: pino({ level: 'silent' }),
    pollingIntervalSeconds: 0.5,
    retryDelaySeconds: 1,
  });
  ({ app } = makeTestApp(testDb.db, { outbox }));
  const db = testDb.db;
  const club = await makeClub(db, 'Riverside');
  ids.club = club.id;
  ids.squad = (await makeSquad(db, club.id, 'Under-13')).id;
  ids.tester = (await makeUser(db, { email: 'tester@riverside.test', clubId: club.id, role: 'tester' })).id;
  await makeUser(db, { email: 'physio@riverside.test', clubId: club.id, role: 'physio', displayName: 'Phil Physio' });
  const mum = await makeUser(db, { email: 'mum@riverside.test', clubId: club.id, role: 'parent', displayName: 'Mo Ames' });
  const dad = await makeUser(db, { email: 'dad@riverside.test', clubId: club.id, role: 'parent', displayName: 'Dee Ames' });
  const other = await makeUser(db, { email: 'no.consent@riverside.test', clubId: club.id, role: 'parent', displayName: 'Nia Berg' });
  ids.mum = mum.id;
  ids.kit = (await makeAthlete(db, { clubId: club.id, squadId: ids.squad, firstName: 'Kit', lastName: 'Ames', guardianUserId: mum.id })).id;
  await makeAthlete(db, { clubId: club.id, squadId: ids.squad, firstName: 'Unused', lastName: 'Link', guardianUserId: dad.id });
  await db.insert(guardianLinks).values({ athleteId: ids.kit, userId: dad.id });
  ids.lou = (await makeAthlete(db, { clubId: club.id, squadId: ids.squad, firstName: 'Lou', lastName: 'Berg', guardianUserId: other.id })).id;
  await recordEmailConsent(db, ids.kit, true);
  // Lou's family said no to e-mails.
  await recordEmailConsent(db, ids.lou, false);
  physio = await signedInAgent(app, 'physio@riverside.test');
});

afterAll(async () => {
  await outbox.stop();
  mailer.close();
  await smtp.close().catch(() => undefined);
  await testDb.drop();
});

async function reviewedScreen(athleteId: string) {
  const { assessmentId } = await makeSubmittedScreen(testDb.db, { clubId: ids.club!, squadId: ids.squad!, athleteId, userId: ids.tester! });
  expect((await physio.post(`/api/assessments/${assessmentId}/review`)).status).toBe(200);
  return assessmentId;
}

describe('the family summary e-mail', () => {
  it('reaches each linked parent with consent, with both parts, no image, and a working unsubscribe', async () => {
    const kitScreen = await reviewedScreen(ids.kit!);
    const louScreen = await reviewedScreen(ids.lou!);
    // A note shared with Kit's family: the e-mail says there is one, without its words.
    const note = await physio.post(`/api/athletes/${ids.kit}/notes`).send({ text: 'Please keep jumps light this month.', visibility: 'family' });
    expect(note.status).toBe(201);
    expect((await physio.post(`/api/assessments/${kitScreen}/release`)).status).toBe(201);
    expect((await physio.post(`/api/assessments/${louScreen}/release`)).status).toBe(201);

    const toMum = await smtp.waitFor((m) => m.to.includes('mum@riverside.test'), 15_000);
    await smtp.waitFor((m) => m.to.includes('dad@riverside.test'), 15_000);
    // Give any stray message for Lou's family time to arrive before counting.
    await new Promise((r) => setTimeout(r, 1500));
    expect(
      smtp
        .messages()
        .flatMap((m) => m.to)
        .sort(),
    ).toEqual(['dad@riverside.test', 'mum@riverside.test']);

    expect(toMum.subject).toBe("Kit's movement screen at Riverside");
    expect(toMum.text).toMatch(/Hello Mo Ames/);
    expect(toMum.text).toMatch(/what kit will work on/i);
    expect(toMum.text).toMatch(/not a diagnosis/);
    expect(toMum.text).toContain("The care team left you a note about Kit: read it on Kit's page.");
    expect(toMum.text).not.toContain('keep jumps light');
    // The cautions come under their own heading before the link and the sign-off, not as small print after them.
    expect(toMum.text.indexOf('PLEASE NOTE') >= 0 ? toMum.text.indexOf('PLEASE NOTE') : toMum.text.indexOf('Please note')).toBeGreaterThan(-1);
    expect(toMum.text.indexOf('not a diagnosis')).toBeLessThan(toMum.text.indexOf(`http://squadline.test/family/${ids.kit}`));
    expect(toMum.html).toContain('<html');
    expect(toMum.html).toMatch(/Hello Mo Ames/);
    expect(toMum.html).not.toMatch(/<img/i);
    expect(toMum.attachments).toEqual([]);
    expect(toMum.text).toContain(`http://squadline.test/family/${ids.kit}`);

    // The one-click header (RFC 8058) and the link in the text carry the same token.
    const header = toMum.headers['list-unsubscribe'];
    expect(toMum.headers['list-unsubscribe-post']).toBe('List-Unsubscribe=One-Click');
    const token = /\/api\/unsubscribe\/([A-Za-z0-9_-]+)>/.exec(header ?? '')?.[1];
    expect(token).toBeTruthy();
    expect(toMum.text).toContain(`http://squadline.test/unsubscribe?token=${token}`);

    // A mail client's one-click POST, signed out, with the form body the RFC prescribes.
    const click = await supertest(app).post(`/api/unsubscribe/${token}`).type('form').send('List-Unsubscribe=One-Click');
    expect(click.status).toBe(200);
    expect(click.body).toEqual({ athleteFirstName: 'Kit', already: false });
    expect((await supertest(app).post(`/api/unsubscribe/${token}`)).body.already).toBe(true);
    expect((await supertest(app).post('/api/unsubscribe/not-a-real-token-at-all-123')).status).toBe(404);

    const [withdrawn] = await testDb.db
      .select()
      .from(consents)
      .where(and(eq(consents.athleteId, ids.kit!), eq(consents.kind, 'email_summaries'), eq(consents.granted, false)));
    expect(withdrawn?.recordedBy).toBe(ids.mum);
    const audit = await testDb.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.subjectKind, 'consent'), eq(auditEvents.action, 'withdraw')));
    expect(audit).toHaveLength(1);

    // The next release for Kit e-mails nobody: the family's choice is recorded for the child.
    smtp.clear();
    const next = await reviewedScreen(ids.kit!);
    const again = await physio.post(`/api/assessments/${next}/release`);
    expect(again.body.release.recipients).toBe(0);
  });

  it("is delivered exactly once through the queue's retry when the SMTP server was down", async () => {
    await recordEmailConsent(testDb.db, ids.kit!, true);
    const port = smtp.port;
    await smtp.close();
    const screen = await reviewedScreen(ids.kit!);
    expect((await physio.post(`/api/assessments/${screen}/release`)).status).toBe(201);
    // Let the first attempts fail against the closed port.
    await new Promise((r) => setTimeout(r, 2500));
    smtp = await startFakeSmtp({ port });
    await smtp.waitFor((m) => m.to.includes('mum@riverside.test'), 30_000);
    await smtp.waitFor((m) => m.to.includes('dad@riverside.test'), 30_000);
    await new Promise((r) => setTimeout(r, 3000));
    expect(
      smtp
        .messages()
        .map((m) => m.to[0])
        .sort(),
    ).toEqual(['dad@riverside.test', 'mum@riverside.test']);
    // They came through a retry: the queue counted failed attempts for both jobs.
    const jobs = await testDb.db.execute(sql`select retry_count from pgboss.job where name = 'mail' order by created_on desc limit 2`);
    expect(jobs.rows.map((r) => Number((r as { retry_count: number }).retry_count) > 0)).toEqual([true, true]);
  }, 60_000);

  it('is not sent when the family withdrew e-mail consent in the app while it waited for a retry', async () => {
    await recordEmailConsent(testDb.db, ids.kit!, true);
    const port = smtp.port;
    await smtp.close();
    const screen = await reviewedScreen(ids.kit!);
    expect((await physio.post(`/api/assessments/${screen}/release`)).body.release.recipients).toBe(2);
    await new Promise((r) => setTimeout(r, 1500));
    // Kit's mother stops the e-mails from Kit's page while the SMTP server is down.
    const mum = await signedInAgent(app, 'mum@riverside.test');
    expect((await mum.post(`/api/athletes/${ids.kit}/consents/own`).send({ kind: 'email_summaries', granted: false })).body.changed).toBe(true);
    smtp = await startFakeSmtp({ port });
    // The queued jobs retry and end without a message: wait until no mail job is left to do.
    await expect
      .poll(
        async () =>
          Number(
            (await testDb.db.execute(sql`select count(*)::int as n from pgboss.job where name = 'mail' and state in ('created', 'retry', 'active')`)).rows[0]!
              .n,
          ),
        { timeout: 30_000, interval: 500 },
      )
      .toBe(0);
    expect(smtp.messages()).toEqual([]);
  }, 60_000);
});

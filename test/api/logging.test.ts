// What reaches the logs: the logger's whole output over a sign-in, an invitation and a failing query
// holds no session cookie, no Set-Cookie, no token, no query string and no query parameter.
import { Writable } from 'node:stream';
import { sql } from 'drizzle-orm';
import pino from 'pino';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { LOGGER_OPTIONS } from '@/server/http/logging';
import { makeClub, makeSquad, makeTestApp, makeUser, recordingOutbox, TEST_PASSWORD } from '../fixtures/builders';
import { createTestDb, type TestDb } from '../fixtures/test-db';

let testDb: TestDb;
const lines: string[] = [];
const logger = pino(
  { level: 'debug', ...LOGGER_OPTIONS },
  new Writable({
    write(chunk, _enc, done) {
      lines.push(String(chunk));
      done();
    },
  }),
);

beforeAll(async () => {
  testDb = await createTestDb();
});

afterAll(async () => {
  await testDb.drop();
});

describe('logs', () => {
  it('carry no cookie, token, query string or query parameter', async () => {
    const db = testDb.db;
    const outbox = recordingOutbox();
    const { app } = makeTestApp(db, { outbox, logger });
    const club = await makeClub(db, 'Logged Club');
    const squad = await makeSquad(db, club.id);
    await makeUser(db, { email: 'admin@logged.test', clubId: club.id, role: 'admin' });
    const agent = supertest.agent(app);

    // A sign-in: its Set-Cookie carries the session token.
    const signIn = await agent.post('/api/auth/sign-in').send({ email: 'admin@logged.test', password: TEST_PASSWORD });
    expect(signIn.status).toBe(200);
    const sessionToken = /squadline_session=([^;]+)/.exec(String(signIn.headers['set-cookie']))![1]!;

    // An invitation, then its link looked up and accepted.
    expect((await agent.post(`/api/clubs/${club.id}/invitations`).send({ email: 'invitee.secret@logged.test', role: 'parent' })).status).toBe(201);
    const inviteToken = decodeURIComponent(/token=([^\s]+)/.exec(outbox.sent.at(-1)!.text)![1]!);
    expect((await supertest(app).post('/api/auth/invitations/lookup').send({ token: inviteToken })).status).toBe(200);
    expect(
      (await supertest(app).post('/api/auth/invitations/accept').send({ token: inviteToken, displayName: 'Ivy Invitee', password: 'invitee-password' })).status,
    ).toBe(201);

    // A query string with personal data.
    expect((await agent.get('/api/athletes?archived=include&search=Quentin-Querystring')).status).toBe(200);

    // A failing query whose parameters are a child's name and date of birth: the column it writes is gone.
    await db.execute(sql`alter table athletes rename column last_name to last_name_gone`);
    const failing = await agent.post('/api/athletes').send({
      firstName: 'Philippa',
      lastName: 'Paramvalue',
      dateOfBirth: '2013-07-21',
      sex: 'female',
      racketHand: 'right',
      takeOffLeg: 'left',
      squadId: squad.id,
    });
    expect(failing.status).toBe(500);
    await db.execute(sql`alter table athletes rename column last_name_gone to last_name`);

    const log = lines.join('');
    // The failing query was logged (as an error without its values), so the checks below are not vacuous.
    expect(log).toMatch(/"level":50.*unhandled error/);
    expect(log).toMatch(/"path":"\/api\/auth\/sign-in"/);
    for (const secret of [sessionToken, inviteToken, 'squadline_session', 'set-cookie', 'Set-Cookie', TEST_PASSWORD, 'invitee-password']) {
      expect(log, secret).not.toContain(secret);
    }
    for (const personal of [
      'Quentin-Querystring',
      'archived=include',
      'Paramvalue',
      'Philippa',
      '2013-07-21',
      'invitee.secret@logged.test',
      'admin@logged.test',
    ]) {
      expect(log, personal).not.toContain(personal);
    }
  });
});

import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeAthlete, makeClub, makeSquad, makeTestApp, makeUser, recordingOutbox, signedInAgent } from '../fixtures/builders';
import { createTestDb, type TestDb } from '../fixtures/test-db';

// People of a club, managed by its admins: one open invitation per address, cancelled at will; a member's
// role changed or the member removed (with a parent's links to the club's children), never one's own;
// each step in the audit trail.

let testDb: TestDb;
let app: ReturnType<typeof makeTestApp>['app'];
const outbox = recordingOutbox();
const ids: Record<string, string> = {};
type Agent = Awaited<ReturnType<typeof signedInAgent>>;
let admin: Agent;

const tokenOf = (text: string) => decodeURIComponent(/token=([^\s]+)/.exec(text)![1]!);
const lookup = (token: string) => supertest(app).post('/api/auth/invitations/lookup').send({ token });

beforeAll(async () => {
  testDb = await createTestDb();
  ({ app } = makeTestApp(testDb.db, { outbox }));
  const db = testDb.db;
  const club = await makeClub(db, 'Riverside');
  const other = await makeClub(db, 'Hillside');
  ids.club = club.id;
  const squad = await makeSquad(db, club.id);
  ids.admin = (await makeUser(db, { email: 'admin@riverside.test', clubId: club.id, role: 'admin', displayName: 'Ada Admin' })).id;
  ids.tester = (await makeUser(db, { email: 'tester@riverside.test', clubId: club.id, role: 'tester', displayName: 'Tess Tester' })).id;
  ids.parent = (await makeUser(db, { email: 'parent@riverside.test', clubId: club.id, role: 'parent', displayName: 'Pia Parent' })).id;
  ids.child = (await makeAthlete(db, { clubId: club.id, squadId: squad.id, firstName: 'Kit', guardianUserId: ids.parent })).id;
  await makeUser(db, { email: 'admin@hillside.test', clubId: other.id, role: 'admin' });
  admin = await signedInAgent(app, 'admin@riverside.test');
});

afterAll(async () => {
  await testDb.drop();
});

const members = async () =>
  (await admin.get(`/api/clubs/${ids.club}/members`)).body as {
    members: { userId: string; role: string }[];
    pending: { id: string; email: string; role: string }[];
  };

describe('invitations', () => {
  it('a second invitation to the same address replaces the first; the e-mail says who invites and as what', async () => {
    expect((await admin.post(`/api/clubs/${ids.club}/invitations`).send({ email: 'new@riverside.test', role: 'tester' })).status).toBe(201);
    const first = tokenOf(outbox.sent.at(-1)!.text);
    expect((await admin.post(`/api/clubs/${ids.club}/invitations`).send({ email: 'new@riverside.test', role: 'head_coach' })).status).toBe(201);
    const mail = outbox.sent.at(-1)!;
    expect(mail.text).toContain('Ada Admin has invited you to join Riverside on Squadline as a head coach.');

    const pending = (await members()).pending.filter((p) => p.email === 'new@riverside.test');
    expect(pending.map((p) => p.role)).toEqual(['head_coach']);
    expect((await lookup(first)).status).toBe(404);
    expect((await lookup(tokenOf(mail.text))).body).toMatchObject({ role: 'head_coach' });
    ids.invitation = pending[0]!.id;
  });

  it('an admin cancels an open invitation: its link stops working; others may not', async () => {
    const tester = await signedInAgent(app, 'tester@riverside.test');
    expect((await tester.delete(`/api/clubs/${ids.club}/invitations/${ids.invitation}`)).status).toBe(403);
    const otherAdmin = await signedInAgent(app, 'admin@hillside.test');
    expect((await otherAdmin.delete(`/api/clubs/${ids.club}/invitations/${ids.invitation}`)).status).toBe(403);

    const token = tokenOf(outbox.sent.at(-1)!.text);
    const res = await admin.delete(`/api/clubs/${ids.club}/invitations/${ids.invitation}`);
    expect(res.status).toBe(200);
    expect((await members()).pending.some((p) => p.email === 'new@riverside.test')).toBe(false);
    expect((await lookup(token)).status).toBe(404);
    // Already ended, unknown or not an id at all: 404, nothing else changes.
    expect((await admin.delete(`/api/clubs/${ids.club}/invitations/${ids.invitation}`)).status).toBe(404);
    expect((await admin.delete(`/api/clubs/${ids.club}/invitations/not-an-id`)).status).toBe(404);
  });
});

describe('members', () => {
  it("changes another member's role, never one's own, and refuses a role that does not exist", async () => {
    const res = await admin.patch(`/api/clubs/${ids.club}/members/${ids.tester}`).send({ role: 'physio' });
    expect(res.status).toBe(200);
    expect((await members()).members.find((m) => m.userId === ids.tester)?.role).toBe('physio');
    const tester = await signedInAgent(app, 'tester@riverside.test');
    expect((await tester.get('/api/me')).body.memberships[0].role).toBe('physio');

    const own = await admin.patch(`/api/clubs/${ids.club}/members/${ids.admin}`).send({ role: 'tester' });
    expect(own.status).toBe(400);
    expect(own.body.error.message).toMatch(/ask another admin/);
    const bad = await admin.patch(`/api/clubs/${ids.club}/members/${ids.tester}`).send({ role: 'captain' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(['role']);
    expect((await admin.patch(`/api/clubs/${ids.club}/members/${crypto.randomUUID()}`).send({ role: 'tester' })).status).toBe(404);
    expect((await members()).members.find((m) => m.userId === ids.admin)?.role).toBe('admin');
  });

  it('removes a parent: the membership and the links to the club’s children go, so the child is out of reach', async () => {
    const parent = await signedInAgent(app, 'parent@riverside.test');
    expect((await parent.get(`/api/athletes/${ids.child}`)).status).toBe(200);
    expect((await admin.delete(`/api/clubs/${ids.club}/members/${ids.admin}`)).status).toBe(400);

    const res = await admin.delete(`/api/clubs/${ids.club}/members/${ids.parent}`);
    expect(res.status).toBe(200);
    expect((await members()).members.some((m) => m.userId === ids.parent)).toBe(false);
    expect([401, 403, 404]).toContain((await parent.get(`/api/athletes/${ids.child}`)).status);
    const child = await admin.get(`/api/athletes/${ids.child}`);
    expect(child.body.athlete.guardians).toEqual([]);
    expect((await admin.delete(`/api/clubs/${ids.club}/members/${ids.parent}`)).status).toBe(404);
  });

  it('puts every step in the audit trail, with names and roles, and each invitation with the children it names', async () => {
    // The e-mail of a parent's invitation names the children: the trail keeps to whom they went.
    expect(
      (await admin.post(`/api/clubs/${ids.club}/invitations`).send({ email: 'gran@riverside.test', role: 'parent', athleteIds: [ids.child] })).status,
    ).toBe(201);
    const trail = await admin.get('/api/audit?subject=member');
    const rows = (trail.body.events as { action: string; actorName: string; detail: Record<string, unknown> }[]).map((e) => [e.action, e.actorName, e.detail]);
    expect(rows).toEqual([
      ['invite', 'Ada Admin', { email: 'gran@riverside.test', role: 'parent', children: [expect.stringMatching(/^Kit \S/)] }],
      ['remove', 'Ada Admin', { name: 'Pia Parent', role: 'parent' }],
      ['role.change', 'Ada Admin', { name: 'Tess Tester', from: 'tester', to: 'physio' }],
      ['invitation.cancel', 'Ada Admin', { email: 'new@riverside.test', role: 'head_coach' }],
      ['invite', 'Ada Admin', { email: 'new@riverside.test', role: 'head_coach' }],
      ['invite', 'Ada Admin', { email: 'new@riverside.test', role: 'tester' }],
    ]);
    // And in the named child's own trail.
    const childTrail = (await admin.get(`/api/audit?athleteId=${ids.child}&subject=member`)).body.events as { action: string; detail: { email: string } }[];
    expect(childTrail.map((e) => [e.action, e.detail.email])).toEqual([['invite', 'gran@riverside.test']]);
  });
});

// our choice: an invitation not accepted yet is shown where parents are linked, and named when someone
// tries to link that address, so that nobody invites a parent twice or is told to invite them.
describe('a parent invited and not joined yet', () => {
  it("is shown on the child's page, and named when someone tries to link the address", async () => {
    const child = (await admin.get(`/api/athletes/${ids.child}`)).body.athlete;
    expect(child.invitedGuardians).toEqual([{ email: 'gran@riverside.test', sentAt: expect.stringMatching(/^\d{4}-\d{2}-\d{2}T/) }]);
    const named = await admin.post(`/api/athletes/${ids.child}/guardians`).send({ email: 'gran@riverside.test' });
    expect(named.status).toBe(400);
    expect(named.body.error.fields.email).toMatch(
      /^gran@riverside\.test was invited on \d{1,2} \w+ \d{4} as a parent of this child and has not accepted yet: they are linked as soon as they accept\.$/,
    );
    expect((await admin.post(`/api/clubs/${ids.club}/invitations`).send({ email: 'uncle@riverside.test', role: 'parent' })).status).toBe(201);
    const other = await admin.post(`/api/athletes/${ids.child}/guardians`).send({ email: 'uncle@riverside.test' });
    expect(other.status).toBe(400);
    expect(other.body.error.fields.email).toMatch(
      /has not accepted yet\. Link them here once they have, or cancel that invitation in People and send one that names this child\.$/,
    );
    // Not invited at all: asked to invite them first.
    const stranger = await admin.post(`/api/athletes/${ids.child}/guardians`).send({ email: 'nobody@riverside.test' });
    expect(stranger.body.error.fields.email).toMatch(/^No one with this e-mail is in the club yet/);
    // Nothing was linked on the way.
    expect((await admin.get(`/api/athletes/${ids.child}`)).body.athlete.guardians).toEqual([]);
  });
});

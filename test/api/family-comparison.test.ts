// The family view's comparison of a child's last two released screens: the engine comparison the staff
// see (features/progress/compare.ts), in family wording, for the child's own parents only.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { trainingAttendance, trainingSessions } from '@/db/schema';
import { makeAthlete, makeClub, makeSquad, makeTestApp, makeUser, recordingOutbox, signedInAgent } from '../fixtures/builders';
import { makeSubmittedScreen } from '../fixtures/care';
import { makeDraft, valgusSquat } from '../fixtures/screening';
import { createTestDb, type TestDb } from '../fixtures/test-db';

let testDb: TestDb;
let app: ReturnType<typeof makeTestApp>['app'];
const ids: Record<string, string> = {};
type Agent = Awaited<ReturnType<typeof signedInAgent>>;
const as: Record<'coach' | 'physio' | 'parentA' | 'parentB', Agent> = {} as never;

/**
 * The same squat with the right knee on the hip-ankle line (hip x 400, ankle x 410, knee x 405): a knee
 * angle from the front of 0°, no knee moving inward.
 */
const straightSquat = () =>
  valgusSquat({
    criteria: [],
    notes: '',
    landmarks: {
      front: {
        'right-hip': { x: 400, y: 700 },
        'right-knee': { x: 405, y: 910 },
        'right-ankle': { x: 410, y: 1120 },
        'left-hip': { x: 560, y: 700 },
        'left-knee': { x: 560, y: 900 },
        'left-ankle': { x: 560, y: 1120 },
      },
    },
  });

async function screenReviewedAndReleased(athleteId: string, screenedOn: string, draft = makeDraft()) {
  const s = await makeSubmittedScreen(testDb.db, { clubId: ids.club!, squadId: ids.squad!, athleteId, userId: ids.tester!, screenedOn, draft });
  expect((await as.physio.post(`/api/assessments/${s.assessmentId}/review`)).status).toBe(200);
  expect((await as.coach.post(`/api/assessments/${s.assessmentId}/release`)).status).toBe(201);
  return s;
}

beforeAll(async () => {
  testDb = await createTestDb();
  ({ app } = makeTestApp(testDb.db, { outbox: recordingOutbox() }));
  const db = testDb.db;
  const club = await makeClub(db, 'Quayside');
  ids.club = club.id;
  ids.squad = (await makeSquad(db, club.id, 'Under-15')).id;
  await makeUser(db, { email: 'coach@quayside.test', clubId: club.id, role: 'head_coach', displayName: 'Cass Coach' });
  ids.tester = (await makeUser(db, { email: 'tester@quayside.test', clubId: club.id, role: 'tester' })).id;
  await makeUser(db, { email: 'physio@quayside.test', clubId: club.id, role: 'physio', displayName: 'Pia Physio' });
  const parentA = await makeUser(db, { email: 'parent.a@quayside.test', clubId: club.id, role: 'parent' });
  const parentB = await makeUser(db, { email: 'parent.b@quayside.test', clubId: club.id, role: 'parent' });
  ids.max = (await makeAthlete(db, { clubId: club.id, squadId: ids.squad, firstName: 'Max', lastName: 'Reed', guardianUserId: parentA.id })).id;
  ids.ida = (await makeAthlete(db, { clubId: club.id, squadId: ids.squad, firstName: 'Ida', lastName: 'Shaw', guardianUserId: parentB.id })).id;
  as.coach = await signedInAgent(app, 'coach@quayside.test');
  as.physio = await signedInAgent(app, 'physio@quayside.test');
  as.parentA = await signedInAgent(app, 'parent.a@quayside.test');
  as.parentB = await signedInAgent(app, 'parent.b@quayside.test');
});

afterAll(async () => {
  await testDb.drop();
});

describe('the family comparison of the last two released screens', () => {
  it('is absent while only one screen has been released', async () => {
    await screenReviewedAndReleased(ids.max!, '2026-03-02');
    const res = await as.parentA.get(`/api/athletes/${ids.max}/summary`);
    expect(res.status).toBe(200);
    expect(res.body.comparison).toBeNull();
  });

  it('ignores a later screen that was not released to the family', async () => {
    await makeSubmittedScreen(testDb.db, {
      clubId: ids.club!,
      squadId: ids.squad!,
      athleteId: ids.max!,
      userId: ids.tester!,
      screenedOn: '2026-04-06',
      draft: makeDraft({ tasks: { ...makeDraft().tasks, 'two-leg-squat': straightSquat() } }),
    });
    expect((await as.parentA.get(`/api/athletes/${ids.max}/summary`)).body.comparison).toBeNull();
  });

  it('tells the parent, in plain words and without any angle, what changed between the two released screens', async () => {
    // Second released screen, 10 weeks (70 days) after the first: the right knee no longer moves inward
    // (knee angle from the front about 29.5° before, 0° now); knee-to-wall 11 cm and 7.5 cm both times.
    await screenReviewedAndReleased(ids.max!, '2026-05-11', makeDraft({ tasks: { ...makeDraft().tasks, 'two-leg-squat': straightSquat() } }));

    const staff = await as.coach.get(`/api/athletes/${ids.max}/progress`);
    expect(staff.status).toBe(200);

    const res = await as.parentA.get(`/api/athletes/${ids.max}/summary`);
    expect(res.status).toBe(200);
    const c = res.body.comparison;
    expect(c).toMatchObject({ earlierScreenedOn: '2026-03-02', laterScreenedOn: '2026-05-11' });
    // By hand: at the first screen the right knee moved inward (about 29.5°) and the left did not (0°), so
    // both the knee-inward flag and the left-right difference were raised; at the second both knees are at
    // 0°, so both are cleared.
    expect(c.lines[0]).toBe(
      'Good news: at the latest check we no longer saw knees turning inward when bending or landing; a difference between the left and right side.',
    );
    // By hand: 70 days = 10 whole weeks, at least the plan's 6-week re-screen interval (the engine default).
    expect(c.lines).toContain('The exercises had about 10 weeks between the two checks, which is usually enough time to see a difference.');
    // By hand: knee-to-wall is 11 cm and 7.5 cm at both screens, a change of 0 cm, inside its published
    // measurement error, so the parent reads that small differences mean nothing, with no figure.
    expect(c.lines).toContain('Small differences between two checks are normal when measuring by eye and photo, so we do not read anything into them.');
    expect(c.lines.at(-1)).toBe('Screening is not a medical diagnosis. If your child has pain, please see a physiotherapist or doctor.');
    // Nowhere an angle, a degree, a distance or the trade term; the only number is the weeks.
    const text = c.lines.join(' ');
    expect(text).not.toMatch(/°|degree|angle|fppa|valgus|\bcm\b|%|29\.5|\b11\b|7\.5/i);
    expect(text.match(/\d+/g)).toEqual(['10']);

    // The staff compare the last two submitted screens (the unreleased one of 6 April included); the
    // family only the released ones, so the knee-inward flag the family hears about as cleared is one the
    // staff already saw gone at the unreleased screen.
    expect(staff.body.comparison.flags.cleared).toEqual([]);
    expect(staff.body.screens.map((x: { screenedOn: string }) => x.screenedOn)).toEqual(['2026-03-02', '2026-04-06', '2026-05-11']);
  });

  it('is given to the child own parents only', async () => {
    expect((await as.parentB.get(`/api/athletes/${ids.max}/summary`)).status).toBe(403);
    const other = await as.parentB.get(`/api/athletes/${ids.ida}/summary`);
    expect(other.status).toBe(200);
    expect(other.body.comparison).toBeNull();
    expect((await as.parentA.get(`/api/athletes/${ids.ida}/summary`)).status).toBe(403);
  });

  it("says how many of the squad's sessions the child took part in between the two released screens", async () => {
    // Written straight into the tables: the API records only the last season, and these screens are fixed
    // dates. Between 2 March and 11 May: three sessions of Max's squad, two with him; one on a screen's own
    // day and one after it count for neither.
    const session = async (heldOn: string, athleteIds: string[]) => {
      const [row] = await testDb.db.insert(trainingSessions).values({ clubId: ids.club!, squadId: ids.squad!, heldOn }).returning();
      if (athleteIds.length)
        await testDb.db.insert(trainingAttendance).values(athleteIds.map((athleteId) => ({ sessionId: row!.id, athleteId, clubId: ids.club! })));
    };
    await session('2026-03-02', [ids.max!]);
    await session('2026-03-10', [ids.max!, ids.ida!]);
    await session('2026-03-17', [ids.ida!]);
    await session('2026-04-14', [ids.max!]);
    await session('2026-05-20', [ids.max!]);
    const view = (await as.parentA.get(`/api/athletes/${ids.max}/summary`)).body;
    const c = view.comparison;
    expect(c.lines).toContain('Your child took part in 2 of the 3 exercise sessions the squad held between the two checks.');
    // Since the latest released screen (11 May), up to today: the session of 20 May, with Max.
    expect(view.latest.summary.screenedOn).toBe('2026-05-11');
    expect(view.sessionsSinceLatest).toEqual({ attended: 1, held: 1 });
    // The staff compare the last two submitted screens (6 April and 11 May): one session between, with Max.
    expect((await as.coach.get(`/api/athletes/${ids.max}/progress`)).body.sessionsBetween).toEqual({ attended: 1, held: 1 });
  });
});

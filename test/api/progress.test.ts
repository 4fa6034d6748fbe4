// Progress and squad trends against a real database, with rounds seeded directly (engine results made
// from landmarks and distances chosen so every expected number below can be worked out by hand).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { assessmentResults, assessments, rounds } from '@/db/schema';
import { addDays, athleteKneeSeries, roundKneeAngles } from '@/features/progress/trends';
import { evaluateAssessment, type AssessmentInput } from '@/features/screening/engine';
import { makeAthlete, makeClub, makeSquad, makeTestApp, makeUser, signedInAgent } from '../fixtures/builders';
import { createTestDb, type TestDb } from '../fixtures/test-db';

const MUNRO2012 =
  'Munro A, Herrington L, Carolan M. Reliability of 2-dimensional video assessment of frontal-plane dynamic knee valgus during common athletic screening tasks. J Sport Rehabil. 2012;21(1):7-11';
const POWDEN2015 =
  'Powden CJ, Hoch JM, Hoch MC. Reliability and minimal detectable change of the weight-bearing lunge test: a systematic review. Man Ther. 2015;20(4):524-532';

let testDb: TestDb;
let app: ReturnType<typeof makeTestApp>['app'];
type Agent = Awaited<ReturnType<typeof signedInAgent>>;
const as = {} as Record<'coach' | 'tester' | 'physio' | 'parent' | 'otherCoach', Agent>;
const ids: Record<string, string> = {};

const today = new Date().toISOString().slice(0, 10);
const round1On = addDays(today, -100);
const round2On = addDays(today, -20);

/**
 * A single-leg squat on the right leg seen from the front: hip (400,700), ankle (400,1100), knee pushed
 * `dx` px towards the midline at y=900. Each half of the leg leans atan(dx/200) off the hip-ankle line,
 * so FPPA = 2 x atan(dx/200):
 *   dx=40: 2 x atan(0.2)   = 2 x 11.3099 = 22.6199 deg
 *   dx=30: 2 x atan(0.15)  = 2 x 8.5308  = 17.0615 deg
 *   dx=25: 2 x atan(0.125) = 2 x 7.1250  = 14.2500 deg
 *   dx=20: 2 x atan(0.1)   = 2 x 5.7106  = 11.4212 deg
 *   dx=0:  0 deg
 * Female single-leg norms (Herrington & Munro 2010, upper end 12 deg): 22.62 and 17.06 and 14.25 are
 * flagged, 11.42 and 0 are not.
 */
function screen(dx: number, ktwLeft: number, ktwRight: number, on: string): AssessmentInput {
  const tasks: AssessmentInput['tasks'] = {
    'single-leg-squat-right': {
      criteria: [],
      photos: { front: { landmarks: { 'right-hip': { x: 400, y: 700 }, 'right-knee': { x: 400 + dx, y: 900 }, 'right-ankle': { x: 400, y: 1100 } } } },
    },
    'knee-to-wall-left': { criteria: [], distanceCm: ktwLeft },
    'knee-to-wall-right': { criteria: [], distanceCm: ktwRight },
  };
  return { athlete: { sex: 'female', ageYears: 12 }, tasks, options: { today: on, maturityMethod: 'none' } };
}

async function seedScreen(roundId: string, athleteId: string, input: AssessmentInput, older?: AssessmentInput) {
  const db = testDb.db;
  const [a] = await db.insert(assessments).values({ clubId: ids.club!, roundId, athleteId, status: 'submitted', submittedAt: new Date() }).returning();
  const versions = older ? [older, input] : [input];
  for (const [i, v] of versions.entries()) {
    const result = evaluateAssessment(v);
    await db.insert(assessmentResults).values({
      clubId: ids.club!,
      assessmentId: a!.id,
      athleteId,
      version: i + 1,
      isCurrent: i === versions.length - 1,
      engineVersion: result.engineVersion,
      input: v,
      result,
    });
  }
  return a!.id;
}

beforeAll(async () => {
  testDb = await createTestDb();
  ({ app } = makeTestApp(testDb.db));
  const db = testDb.db;
  const club = await makeClub(db, 'Lakeside');
  const other = await makeClub(db, 'Farside');
  ids.club = club.id;
  ids.squad = (await makeSquad(db, club.id, 'Under 13 Girls')).id;
  ids.otherSquad = (await makeSquad(db, other.id, 'Juniors')).id;
  await makeUser(db, { email: 'coach@lakeside.test', clubId: club.id, role: 'head_coach' });
  await makeUser(db, { email: 'tester@lakeside.test', clubId: club.id, role: 'tester' });
  await makeUser(db, { email: 'physio@lakeside.test', clubId: club.id, role: 'physio' });
  const parent = await makeUser(db, { email: 'parent@lakeside.test', clubId: club.id, role: 'parent' });
  await makeUser(db, { email: 'coach@farside.test', clubId: other.id, role: 'head_coach' });
  // Born 12 years and a bit before today: under-13.
  const dob = addDays(today, -(12 * 365 + 100));
  ids.ana = (
    await makeAthlete(db, { clubId: club.id, squadId: ids.squad, firstName: 'Ana', lastName: 'Abbott', dateOfBirth: dob, guardianUserId: parent.id })
  ).id;
  ids.bea = (await makeAthlete(db, { clubId: club.id, squadId: ids.squad, firstName: 'Bea', lastName: 'Brook', dateOfBirth: dob })).id;
  ids.cai = (await makeAthlete(db, { clubId: club.id, squadId: ids.squad, firstName: 'Cai', lastName: 'Cole', dateOfBirth: dob })).id;
  ids.lone = (await makeAthlete(db, { clubId: club.id, squadId: null, firstName: 'Lone', lastName: 'Single', dateOfBirth: dob })).id;

  const [r1] = await db.insert(rounds).values({ clubId: club.id, squadId: ids.squad, name: 'Pre-season', screenedOn: round1On }).returning();
  const [r2] = await db.insert(rounds).values({ clubId: club.id, squadId: ids.squad, name: 'Mid-season', screenedOn: round2On }).returning();
  ids.r1 = r1!.id;
  ids.r2 = r2!.id;
  // Ana: knee 22.62 -> 11.42 deg; left ankle 8.0 -> 10.5 cm, right 11.0 -> 11.5 cm.
  ids.ana1 = await seedScreen(ids.r1, ids.ana, screen(40, 8.0, 11.0, round1On));
  ids.ana2 = await seedScreen(ids.r2, ids.ana, screen(20, 10.5, 11.5, round2On));
  // Bea: knee 17.06 -> 14.25 deg (both flagged); ankles 12/12 both times. Her round-2 screen was
  // re-submitted: the older version (knee 22.62) must not count.
  await seedScreen(ids.r1, ids.bea, screen(30, 12, 12, round1On));
  await seedScreen(ids.r2, ids.bea, screen(25, 12, 12, round2On), screen(40, 12, 12, round2On));
  // Cai: nothing flagged in round 1, absent from round 2.
  await seedScreen(ids.r1, ids.cai, screen(0, 12, 12, round1On));

  as.coach = await signedInAgent(app, 'coach@lakeside.test');
  as.tester = await signedInAgent(app, 'tester@lakeside.test');
  as.physio = await signedInAgent(app, 'physio@lakeside.test');
  as.parent = await signedInAgent(app, 'parent@lakeside.test');
  as.otherCoach = await signedInAgent(app, 'coach@farside.test');
});

afterAll(async () => {
  await testDb?.drop();
});

describe('GET /api/athletes/:id/progress', () => {
  it('compares the last two screens measurement by measurement against the published error', async () => {
    const res = await as.coach.get(`/api/athletes/${ids.ana}/progress`).expect(200);
    expect(res.body.screens.map((s: { screenedOn: string }) => s.screenedOn)).toEqual([round1On, round2On]);
    const c = res.body.comparison;
    expect(c.earlierAssessmentId).toBe(ids.ana1);
    expect(c.laterAssessmentId).toBe(ids.ana2);
    const byId = Object.fromEntries(c.measurements.map((m: { measurementId: string }) => [m.measurementId, m]));
    const cases: [id: string, earlier: number, later: number, change: number, margin: number | null, verdict: string, why: string][] = [
      // 11.4212 - 22.6199 = -11.1987 -> -11.20; |11.20| > 8.93
      ['single-leg-squat-right/fppa/right', 22.6199, 11.4212, -11.2, 8.93, 'real-change', `${MUNRO2012}: SDD 8.93 deg (upper end)`],
      // 10.5 - 8.0 = +2.5 > 1.9
      ['knee-to-wall-left/knee-to-wall/left', 8.0, 10.5, 2.5, 1.9, 'real-change', `${POWDEN2015}: MDC 1.9 cm`],
      // 11.5 - 11.0 = +0.5 <= 1.9
      ['knee-to-wall-right/knee-to-wall/right', 11.0, 11.5, 0.5, 1.9, 'within-error', `${POWDEN2015}: MDC 1.9 cm`],
      // |8.0 - 11.0| = 3.0 -> |10.5 - 11.5| = 1.0: no published figure for a side difference
      ['knee-to-wall/knee-to-wall-difference/left', 3.0, 1.0, -2.0, null, 'no-published-figure', 'none found'],
      // 8/11 x 100 = 72.7273 -> 10.5/11.5 x 100 = 91.3043; change 18.577 -> 18.58
      ['knee-to-wall/knee-to-wall-lsi/left', 72.7273, 91.3043, 18.58, null, 'no-published-figure', 'none found'],
    ];
    for (const [id, earlier, later, change, margin, verdict] of cases) {
      const m = byId[id];
      expect(m, id).toBeDefined();
      expect(m.earlier).toBeCloseTo(earlier, 3);
      expect(m.later).toBeCloseTo(later, 3);
      expect(m.change).toBeCloseTo(change, 2);
      expect(m.errorMargin).toBe(margin);
      expect(m.verdict).toBe(verdict);
    }
    expect(c.measurements).toHaveLength(cases.length);
    // Round 1: knee concern (22.62 > 19.54), left ankle short (8 < 10 cm), side difference (3 >= 2 cm); round 2: none.
    expect(c.flags.cleared.map((f: { id: string }) => f.id).sort()).toEqual([
      'dynamic-knee-valgus/single-leg-squat-right/right',
      'left-right-asymmetry/knee-to-wall/left',
      'limited-ankle-dorsiflexion/knee-to-wall-left/left',
    ]);
    expect(c.flags.new).toEqual([]);
    expect(c.flags.persisting).toEqual([]);
    // 80 days between the screens >= 6 weeks (42 days).
    expect(c.planTime).toMatchObject({ days: 80, neededWeeks: 6, longEnough: true });
  });

  it('reads the current version of a re-submitted screen and keeps a persisting flag', async () => {
    const res = await as.physio.get(`/api/athletes/${ids.bea}/progress`).expect(200);
    const knee = res.body.comparison.measurements.find((m: { measurementId: string }) => m.measurementId === 'single-leg-squat-right/fppa/right');
    // 14.2500 - 17.0615 = -2.81: within 8.93
    expect(knee.later).toBeCloseTo(14.25, 3);
    expect(knee.change).toBeCloseTo(-2.81, 2);
    expect(knee.verdict).toBe('within-error');
    expect(res.body.comparison.flags.persisting.map((f: { id: string }) => f.id)).toEqual(['dynamic-knee-valgus/single-leg-squat-right/right']);
  });

  it('has no comparison with one screen, and empty screens with none', async () => {
    const one = await as.tester.get(`/api/athletes/${ids.cai}/progress`).expect(200);
    expect(one.body.screens).toHaveLength(1);
    expect(one.body.comparison).toBeNull();
    const none = await as.coach.get(`/api/athletes/${ids.lone}/progress`).expect(200);
    expect(none.body).toMatchObject({ screens: [], comparison: null });
  });

  it('refuses parents, other clubs and unknown ids in the usual error shape', async () => {
    expect((await as.parent.get(`/api/athletes/${ids.ana}/progress`)).status).toBe(403);
    const other = await as.otherCoach.get(`/api/athletes/${ids.ana}/progress`);
    expect(other.status).toBe(403);
    expect(other.body.error.code).toBe('forbidden');
    expect((await as.coach.get('/api/athletes/00000000-0000-4000-8000-000000000000/progress')).status).toBe(404);
    expect((await as.coach.get('/api/athletes/not-an-id/progress')).status).toBe(404);
  });
});

describe('GET /api/squads/:id/trends', () => {
  it('counts flagged athletes per round (shares worked out by hand)', async () => {
    const res = await as.coach.get(`/api/squads/${ids.squad}/trends`).expect(200);
    const [r1, r2] = res.body.rounds;
    expect(r1).toMatchObject({ id: ids.r1, name: 'Pre-season', screenedOn: round1On, screened: 3 });
    // Round 1: Ana (knee, ankle, side difference), Bea (knee), Cai (none).
    expect(r1.flagged).toEqual({ 'dynamic-knee-valgus': 2, 'limited-ankle-dorsiflexion': 1, 'left-right-asymmetry': 1 });
    expect(r1.flagged['dynamic-knee-valgus'] / r1.screened).toBeCloseTo(2 / 3, 10); // 66.7 %
    // Round 2: Ana (none), Bea (knee, current version only); Cai absent.
    expect(r2).toMatchObject({ screened: 2, flagged: { 'dynamic-knee-valgus': 1 } });
    expect(r2.flagged['dynamic-knee-valgus'] / r2.screened).toBe(0.5);
    // Knee angle distribution of round 2: 11.42 (Ana) and 14.25 (Bea), sorted.
    expect(roundKneeAngles(res.body.kneeAngles, 'single-leg-squat-right/fppa/right', 1)).toEqual([11.4, 14.3]); // 11.4212 and 14.2500 at 0.1 deg
    // Each angle is sent once: everyone screened in the season, each round's values in that order.
    expect([...res.body.kneeAngles.athleteIds].sort()).toEqual([ids.ana, ids.bea, ids.cai].sort());
    const sent = Object.values(res.body.kneeAngles.values as Record<string, (number | null)[][]>)
      .flat(2)
      .filter((v) => v !== null);
    expect(sent).toHaveLength(5); // round 1: Ana, Bea, Cai; round 2: Ana, Bea (one knee-angle measurement each)
  });

  it('gives one row per current athlete with latest flags per side, days since and re-screen due', async () => {
    const res = await as.coach.get(`/api/squads/${ids.squad}/trends`).expect(200);
    const rows = Object.fromEntries(res.body.athletes.map((a: { firstName: string }) => [a.firstName, a]));
    expect(Object.keys(rows).sort()).toEqual(['Ana', 'Bea', 'Cai']);
    expect(rows.Ana).toMatchObject({
      ageGroup: 'U13',
      lastScreenedOn: round2On,
      daysSinceLastScreen: 20,
      // The plan's re-screen date: 6 weeks after the screen, 22 days from today: not yet due.
      rescreenDate: addDays(round2On, 42),
      rescreenDue: false,
      latestFlags: { left: [], right: [], both: [], unsided: [] },
      latestAssessmentId: ids.ana2,
      clearance: null,
    });
    expect(rows.Bea.latestFlags.right).toEqual(['dynamic-knee-valgus']);
    // Cai: last screened 100 days ago; re-screen was due 58 days ago.
    expect(rows.Cai).toMatchObject({ daysSinceLastScreen: 100, rescreenDate: addDays(round1On, 42), rescreenDue: true });
    // Change per athlete between the two rounds, at 0.1 deg: Ana 11.4 - 22.6 = -11.2 deg; Cai 0 then absent.
    const k = 'single-leg-squat-right/fppa/right';
    const series = (name: string) => athleteKneeSeries(res.body.kneeAngles, rows[name].id, k, 2);
    expect(series('Ana')).toEqual([22.6, 11.4]);
    expect(series('Ana')[1]! - series('Ana')[0]!).toBeCloseTo(-11.2, 10);
    expect(series('Cai')[0]).toBeCloseTo(0, 10);
    expect(series('Cai')[1]).toBeNull();
  });

  it("shows the clearance in force: the physiotherapist's newest decision for the athlete", async () => {
    expect((await as.physio.put(`/api/athletes/${ids.bea}/clearance`).send({ status: 'referred', detail: 'See the club doctor first' })).status).toBe(200);
    expect((await as.physio.put(`/api/athletes/${ids.bea}/clearance`).send({ status: 'modified', detail: 'No jumps for two weeks' })).status).toBe(200);
    const res = await as.coach.get(`/api/squads/${ids.squad}/trends`).expect(200);
    const byName = Object.fromEntries(res.body.athletes.map((a: { firstName: string; clearance: string | null }) => [a.firstName, a.clearance]));
    expect(byName).toEqual({ Ana: null, Bea: 'modified', Cai: null });
    const csv = await as.coach.get(`/api/squads/${ids.squad}/trends?format=csv&flag=dynamic-knee-valgus`).expect(200);
    // In the screen's words.
    expect(csv.text.trim().split('\n').slice(1)).toEqual([expect.stringMatching(/^Brook,Bea,female,U13,[^,]*,Train with changes,,Knee valgus,/)]);
  });

  it('filters, and exports the filtered table as CSV', async () => {
    const flagged = await as.coach.get(`/api/squads/${ids.squad}/trends?flag=dynamic-knee-valgus`).expect(200);
    expect(flagged.body.athletes.map((a: { firstName: string }) => a.firstName)).toEqual(['Bea']);
    const csv = await as.coach.get(`/api/squads/${ids.squad}/trends?format=csv&flag=none`).expect(200);
    expect(csv.headers['content-type']).toMatch(/^text\/csv/);
    // The filter in the file's name (our choice): it does not replace the whole squad's file.
    expect(csv.headers['content-disposition']).toMatch(/attachment; filename="Under-13-Girls-trends-\d{4}-\d{2}-\d{2}-only-no-movement-flag\.csv"/);
    const whole = await as.coach.get(`/api/squads/${ids.squad}/trends?format=csv`).expect(200);
    expect(whole.headers['content-disposition']).toMatch(/attachment; filename="Under-13-Girls-trends-\d{4}-\d{2}-\d{2}\.csv"/);
    const lines = csv.text.trim().split('\n');
    expect(lines[0]).toBe(
      'last_name,first_name,sex,age_group,maturity_band,clearance,flags_left,flags_right,flags_both_or_unsided,last_screened_on,days_since_last_screen,rescreen_date,rescreen_due,sessions_since_screen_taken_part,sessions_since_screen_held,knee_angles_from_round,knee_angle_deg_single_leg_squat_right_right_knee',
    );
    expect(lines.slice(1)).toEqual([
      // No session recorded for this squad: none since either screen. Knee angles worked out above
      // (dx=20: 11.4212 deg; dx=0: 0 deg), at 0.1 deg, from the athlete's newest round.
      `Abbott,Ana,female,U13,,,,,,${round2On},20,${addDays(round2On, 42)},no,0,0,Mid-season (${round2On}),11.4`,
      `Cole,Cai,female,U13,,,,,,${round1On},100,${addDays(round1On, 42)},yes,0,0,Pre-season (${round1On}),0.0`,
    ]);
  });

  // our choice: the home's numbers are the trends table summed (features/progress/watch.ts).
  it("sums each squad's trends for the head coach's home, and refuses families", async () => {
    const trends = (await as.coach.get(`/api/squads/${ids.squad}/trends`).expect(200)).body as {
      athletes: { firstName: string; clearance: string | null; rescreenDue: boolean }[];
    };
    // Worked from the table above: Bea trains with changes; Cai's re-screen is due, Ana's is not; nobody
    // waits for a clearance, is referred or in the growth-spurt window; no open round plans a re-screen.
    expect(trends.athletes.map((a) => [a.firstName, a.clearance, a.rescreenDue])).toEqual([
      ['Ana', null, false],
      ['Bea', 'modified', expect.any(Boolean)],
      ['Cai', null, true],
    ]);
    const watch = await as.coach.get('/api/trends/watch').expect(200);
    const mine = watch.body.squads.find((w: { squadId: string }) => w.squadId === ids.squad);
    expect(mine).toEqual({
      squadId: ids.squad,
      name: 'Under 13 Girls',
      painWaiting: 0,
      referred: 0,
      withChanges: 1,
      growthSpurt: 0,
      rescreenDue: trends.athletes.filter((a) => a.rescreenDue).length,
      rescreenPlanned: 0,
    });
    await as.parent.get('/api/trends/watch').expect(403);
  });

  it('refuses unknown filters and formats with a 400 naming the field', async () => {
    const bad = await as.coach.get(`/api/squads/${ids.squad}/trends?sex=other&flag=x`).expect(400);
    expect(bad.body.error.code).toBe('invalid_input');
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['flag', 'sex']);
    await as.coach.get(`/api/squads/${ids.squad}/trends?format=xml`).expect(400);
  });

  // our choice: a re-screen due for an athlete already waiting in an open round is planned, not forgotten.
  it('names the open round a member waits in, until their screen there is submitted or the round closes', async () => {
    const before = await as.coach.get(`/api/squads/${ids.squad}/trends`).expect(200);
    // Both rounds of the seed are open, and every screen in them is submitted.
    expect(before.body.athletes.map((a: { openRound: string | null }) => a.openRound)).toEqual([null, null, null]);
    const round = await as.tester.post('/api/rounds').send({ squadId: ids.squad, name: 'Winter check', screenedOn: today }).expect(201);
    const during = await as.coach.get(`/api/squads/${ids.squad}/trends`).expect(200);
    const rows = Object.fromEntries(during.body.athletes.map((a: { firstName: string }) => [a.firstName, a]));
    expect(rows.Cai).toMatchObject({ rescreenDue: true, openRound: 'Winter check' });
    expect(rows.Ana).toMatchObject({ rescreenDue: false, openRound: 'Winter check' });
    await as.tester.post(`/api/rounds/${round.body.round.id}/close`).expect(200);
    const after = await as.coach.get(`/api/squads/${ids.squad}/trends`).expect(200);
    expect(after.body.athletes.map((a: { openRound: string | null }) => a.openRound)).toEqual([null, null, null]);
  });

  it('is for club staff of the squad club only', async () => {
    await as.physio.get(`/api/squads/${ids.squad}/trends`).expect(200);
    await as.tester.get(`/api/squads/${ids.squad}/trends`).expect(200);
    expect((await as.parent.get(`/api/squads/${ids.squad}/trends`)).status).toBe(403);
    expect((await as.otherCoach.get(`/api/squads/${ids.squad}/trends`)).status).toBe(403);
    expect((await as.coach.get(`/api/squads/${ids.otherSquad}/trends`)).status).toBe(403);
    expect((await as.coach.get('/api/squads/00000000-0000-4000-8000-000000000000/trends')).status).toBe(404);
  });
});

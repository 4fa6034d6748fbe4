// Trends' summaries (`round_summaries`, `athlete_latest_screens`) are kept by database triggers. Each
// check compares the stored rows with the same summaries worked out here from the current results,
// after every kind of write that changes them: a submit, a new result version, a screen leaving
// 'submitted', a deletion, a round's date, and two submits in the same round from two connections at once.
import { and, desc, eq } from 'drizzle-orm';
import type { PoolClient } from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { athleteLatestScreens, assessmentResults, assessments, roundSummaries, rounds } from '@/db/schema';
import { patternOfFlag } from '@/features/progress/trends';
import { evaluateAssessment, type AssessmentInput, type AssessmentResult } from '@/features/screening/engine';
import { makeAthlete, makeClub, makeSquad } from '../fixtures/builders';
import { createTestDb, type TestDb } from '../fixtures/test-db';

let testDb: TestDb;
const ids: Record<string, string> = {};

/** A right single-leg squat seen from the front with the knee `dx` px towards the midline (FPPA = 2 x atan(dx/200)). */
function input(dx: number): AssessmentInput {
  return {
    athlete: { sex: 'female', ageYears: 12 },
    tasks: {
      'single-leg-squat-right': {
        criteria: [],
        photos: { front: { landmarks: { 'right-hip': { x: 400, y: 700 }, 'right-knee': { x: 400 + dx, y: 900 }, 'right-ankle': { x: 400, y: 1100 } } } },
      },
      'knee-to-wall-left': { criteria: [], distanceCm: 6 },
      'knee-to-wall-right': { criteria: [], distanceCm: 11 },
    },
    options: { today: '2026-10-01', maturityMethod: 'none' },
  };
}

/** The summary worked out from the results the round's submitted screens hold now. */
async function expectedSummary(roundId: string) {
  const rows = await testDb.db
    .select({ athleteId: assessments.athleteId, status: assessments.status, result: assessmentResults.result, isCurrent: assessmentResults.isCurrent })
    .from(assessments)
    .innerJoin(assessmentResults, eq(assessmentResults.assessmentId, assessments.id))
    .where(eq(assessments.roundId, roundId));
  const current = rows.filter((r) => r.status === 'submitted' && r.isCurrent);
  const flagged: Record<string, number> = {};
  const byAthlete: Record<string, Record<string, number>> = {};
  for (const { athleteId, result } of current) {
    for (const p of new Set((result as AssessmentResult).flags.map((f) => patternOfFlag(f.id)))) flagged[p] = (flagged[p] ?? 0) + 1;
    for (const m of (result as AssessmentResult).measurements) {
      if (m.metric === 'fppa' && typeof m.value === 'number') (byAthlete[athleteId] ??= {})[m.id] = Math.round(m.value * 10) / 10;
    }
  }
  // Parallel arrays: athletes sorted by id, per measurement one value each (null where not measured).
  const athletes = Object.keys(byAthlete).sort();
  const angles: Record<string, (number | null)[]> = {};
  for (const id of new Set(athletes.flatMap((a) => Object.keys(byAthlete[a]!)))) angles[id] = athletes.map((a) => byAthlete[a]![id] ?? null);
  return { screened: current.length, flagged, kneeAngles: { athletes, angles } };
}

/** Each athlete's newest submitted screen by its round's date, worked out here, and the stored one. */
async function latestScreens() {
  const out: Record<string, { want: unknown; got: unknown }> = {};
  for (const name of ['ana', 'bea', 'cleo', 'dana']) {
    const athleteId = ids[name]!;
    const [newest] = await testDb.db
      .select({ id: assessments.id, screenedOn: rounds.screenedOn })
      .from(assessments)
      .innerJoin(rounds, eq(rounds.id, assessments.roundId))
      .where(and(eq(assessments.athleteId, athleteId), eq(assessments.status, 'submitted')))
      .orderBy(desc(rounds.screenedOn), desc(rounds.createdAt), desc(assessments.id))
      .limit(1);
    const [current] = newest
      ? await testDb.db
          .select({ result: assessmentResults.result })
          .from(assessmentResults)
          .where(and(eq(assessmentResults.assessmentId, newest.id), eq(assessmentResults.isCurrent, true)))
      : [];
    const result = current?.result as AssessmentResult | undefined;
    const [row] = await testDb.db
      .select({
        assessmentId: athleteLatestScreens.assessmentId,
        screenedOn: athleteLatestScreens.screenedOn,
        flagIds: athleteLatestScreens.flagIds,
        flagSides: athleteLatestScreens.flagSides,
        maturityBand: athleteLatestScreens.maturityBand,
        rescreenDate: athleteLatestScreens.rescreenDate,
      })
      .from(athleteLatestScreens)
      .where(eq(athleteLatestScreens.athleteId, athleteId));
    const none = { assessmentId: null, screenedOn: null, flagIds: null, flagSides: null, maturityBand: null, rescreenDate: null };
    out[name] = {
      want: newest
        ? {
            assessmentId: newest.id,
            screenedOn: newest.screenedOn,
            flagIds: result ? result.flags.map((f) => f.id) : null,
            flagSides: result ? result.flags.map((f) => f.side ?? null) : null,
            maturityBand: result?.maturity?.band ?? null,
            rescreenDate: result?.plan.rescreenDate ?? null,
          }
        : none,
      got: row ?? none,
    };
  }
  return out;
}

async function expectLatestRight() {
  for (const { want, got } of Object.values(await latestScreens())) expect(got).toEqual(want);
}

async function stored(roundId: string) {
  const [row] = await testDb.db
    .select({ screened: roundSummaries.screened, flagged: roundSummaries.flagged, kneeAngles: roundSummaries.kneeAngles })
    .from(roundSummaries)
    .where(eq(roundSummaries.roundId, roundId));
  return row ?? { screened: 0, flagged: {}, kneeAngles: { athletes: [], angles: {} } };
}

async function newAssessment(athleteId: string, status: 'submitted' | 'in_progress' = 'submitted') {
  const [a] = await testDb.db.insert(assessments).values({ clubId: ids.club!, roundId: ids.round!, athleteId, status }).returning();
  return a!.id;
}

/**
 * What the submit transaction does (`addResult` of the screening repository): the previous current
 * version stops being current, then the new one is added, two statements. On the pool, or on one
 * connection inside its own transaction.
 */
async function addResult(assessmentId: string, athleteId: string, dx: number, on: Pick<PoolClient, 'query'> = testDb.pool) {
  const result = evaluateAssessment(input(dx));
  await on.query('update assessment_results set is_current = false where assessment_id = $1 and is_current', [assessmentId]);
  await on.query(
    `insert into assessment_results (club_id, assessment_id, athlete_id, version, is_current, engine_version, input, result)
      values ($2, $1, $3, (select coalesce(max(version), 0) + 1 from assessment_results where assessment_id = $1), true, $4, $5, $6)`,
    [assessmentId, ids.club, athleteId, result.engineVersion, input(dx), result],
  );
}

beforeAll(async () => {
  testDb = await createTestDb();
  const club = await makeClub(testDb.db, 'Summary Club');
  ids.club = club.id;
  const squad = await makeSquad(testDb.db, club.id, 'Under 13');
  ids.squad = squad.id;
  const [round] = await testDb.db.insert(rounds).values({ clubId: club.id, squadId: squad.id, name: 'Autumn', screenedOn: '2026-10-01' }).returning();
  ids.round = round!.id;
  for (const name of ['ana', 'bea', 'cleo', 'dana']) ids[name] = (await makeAthlete(testDb.db, { clubId: club.id, squadId: squad.id, firstName: name })).id;
});

afterAll(async () => {
  await testDb?.drop();
});

describe('round summaries kept by the database', () => {
  it('PostgreSQL rounds knee angles to 0.1 degree exactly as Math.round(v * 10) / 10 does in the browser', async () => {
    // Ties and near-ties on both sides of zero, where half-up and half-away-from-zero differ (-22.25),
    // and where v * 10 is not exact in binary (1.15 * 10 = 11.499999999999998), plus random doubles.
    const values = [22.25, -22.25, 1.15, -1.15, 1.05, -1.05, 0.05, -0.05, 0.04, -0.04, 12.35, -12.35, 0, 179.95, -179.95];
    let seed = 7;
    const random = () => ((seed = (seed * 16807) % 2147483647) / 2147483647) * 360 - 180; // Park-Miller, our choice
    for (let i = 0; i < 2000; i++) values.push(random());
    const { rows } = await testDb.pool.query<{ r: number[] }>(
      `select array_agg(floor((j ->> 0)::float8 * 10 + 0.5) / 10 order by o) as r from jsonb_array_elements($1::jsonb) with ordinality t(j, o)`,
      [JSON.stringify(values.map((v) => [v]))],
    );
    // +0 and -0 both print as 0 in JSON.
    expect(rows[0]!.r.map((v) => v + 0)).toEqual(values.map((v) => Math.round(v * 10) / 10 + 0));
  });

  it('a submitted screen with its result is counted, with its flags once per pattern and its knee angles', async () => {
    ids.anaScreen = await newAssessment(ids.ana!);
    await addResult(ids.anaScreen, ids.ana!, 40); // 22.6 deg: flagged (female single-leg norm 12 deg)
    ids.beaScreen = await newAssessment(ids.bea!);
    await addResult(ids.beaScreen, ids.bea!, 0); // 0 deg: no knee flag
    const want = await expectedSummary(ids.round!);
    expect(want.screened).toBe(2);
    expect(want.kneeAngles.athletes).toEqual([ids.ana, ids.bea].sort());
    expect(Object.values(want.flagged).some((n) => n > 0)).toBe(true);
    expect(await stored(ids.round!)).toEqual(want);
    const latest = await latestScreens();
    expect((latest.ana!.want as { assessmentId: string }).assessmentId).toBe(ids.anaScreen);
    expect((latest.ana!.want as { flagIds: string[] }).flagIds.length).toBeGreaterThan(0);
    await expectLatestRight();
  });

  it('a screen in progress (no result yet) is not counted', async () => {
    ids.cleoScreen = await newAssessment(ids.cleo!, 'in_progress');
    expect((await stored(ids.round!)).screened).toBe(2);
  });

  it('a new result version replaces the earlier one', async () => {
    const before = await stored(ids.round!);
    await addResult(ids.anaScreen!, ids.ana!, 0);
    const after = await stored(ids.round!);
    expect(after).toEqual(await expectedSummary(ids.round!));
    const ana = (k: typeof after.kneeAngles) => Object.values(k.angles).map((vs) => vs[k.athletes.indexOf(ids.ana!)]);
    expect(ana(before.kneeAngles)).toEqual([22.6]); // 2 x atan(40/200) = 22.62 deg
    expect(ana(after.kneeAngles)).toEqual([0]);
    await expectLatestRight();
  });

  it('a screen taken back out of "submitted" leaves the summary, and comes back when submitted again', async () => {
    await testDb.db.update(assessments).set({ status: 'in_progress' }).where(eq(assessments.id, ids.beaScreen!));
    expect((await stored(ids.round!)).screened).toBe(1);
    expect(await stored(ids.round!)).toEqual(await expectedSummary(ids.round!));
    expect((await latestScreens()).bea!.got).toMatchObject({ assessmentId: null });
    await expectLatestRight();
    await testDb.db.update(assessments).set({ status: 'submitted' }).where(eq(assessments.id, ids.beaScreen!));
    expect((await stored(ids.round!)).screened).toBe(2);
  });

  it('a draft save (same row, status unchanged) does not need the summary and leaves it right', async () => {
    await testDb.db.update(assessments).set({ draftVersion: 5 }).where(eq(assessments.id, ids.beaScreen!));
    expect(await stored(ids.round!)).toEqual(await expectedSummary(ids.round!));
  });

  it('a deleted screen leaves the summary', async () => {
    await testDb.db.delete(assessments).where(eq(assessments.id, ids.beaScreen!));
    const after = await stored(ids.round!);
    expect(after.screened).toBe(1);
    expect(after.kneeAngles.athletes).not.toContain(ids.bea);
    expect(after).toEqual(await expectedSummary(ids.round!));
    await expectLatestRight();
  });

  it("an athlete's newest screen follows the rounds' dates", async () => {
    const [spring] = await testDb.db.insert(rounds).values({ clubId: ids.club!, squadId: ids.squad!, name: 'Spring', screenedOn: '2027-03-01' }).returning();
    const [springScreen] = await testDb.db
      .insert(assessments)
      .values({ clubId: ids.club!, roundId: spring!.id, athleteId: ids.ana!, status: 'submitted' })
      .returning();
    await addResult(springScreen!.id, ids.ana!, 25);
    expect((await latestScreens()).ana!.got).toMatchObject({ assessmentId: springScreen!.id, screenedOn: '2027-03-01' });
    // Moved before the autumn round: the autumn screen is the newest again.
    await testDb.db.update(rounds).set({ screenedOn: '2026-09-01' }).where(eq(rounds.id, spring!.id));
    expect((await latestScreens()).ana!.got).toMatchObject({ assessmentId: ids.anaScreen, screenedOn: '2026-10-01' });
    await expectLatestRight();
    await testDb.db.delete(rounds).where(eq(rounds.id, spring!.id));
    await expectLatestRight();
  });

  it('two submits in the same round from two connections at once are both counted', async () => {
    ids.danaScreen = await newAssessment(ids.dana!, 'in_progress');
    await testDb.db.update(assessments).set({ status: 'submitted' }).where(eq(assessments.id, ids.cleoScreen!));
    await testDb.db.update(assessments).set({ status: 'submitted' }).where(eq(assessments.id, ids.danaScreen));
    const first = await testDb.pool.connect();
    const second = await testDb.pool.connect();
    try {
      await first.query('begin');
      await second.query('begin');
      await addResult(ids.cleoScreen!, ids.cleo!, 30, first);
      // The second waits for the first's lock on the round's summary, then sums what the first committed.
      const waiting = addResult(ids.danaScreen, ids.dana!, 20, second);
      await new Promise((resolve) => setTimeout(resolve, 100));
      await first.query('commit');
      await waiting;
      await second.query('commit');
    } finally {
      first.release();
      second.release();
    }
    const after = await stored(ids.round!);
    expect(after.screened).toBe(3);
    expect(after).toEqual(await expectedSummary(ids.round!));
    await expectLatestRight();
  });

  it('a round nobody has been screened in has no summary, and a deleted round takes its summary with it', async () => {
    const [empty] = await testDb.db
      .insert(rounds)
      .values({ clubId: ids.club!, squadId: (await makeSquad(testDb.db, ids.club!, 'Spare')).id, name: 'Later', screenedOn: '2026-11-01' })
      .returning();
    expect(await testDb.db.$count(roundSummaries, eq(roundSummaries.roundId, empty!.id))).toBe(0);
    await testDb.db.delete(assessments).where(eq(assessments.roundId, ids.round!));
    expect((await stored(ids.round!)).screened).toBe(0);
    await expectLatestRight();
    await testDb.db.delete(rounds).where(eq(rounds.id, ids.round!));
    expect(await testDb.db.$count(roundSummaries, eq(roundSummaries.roundId, ids.round!))).toBe(0);
  });
});

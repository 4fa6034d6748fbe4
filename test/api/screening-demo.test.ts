import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { and, asc, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { assessmentResults, assessments, athletes, clubs, rounds, squads } from '@/db/schema';
import { DEMO_CLUB_NAME, DEMO_PASSWORD } from '@/server/dev/seed/demo-accounts';
import { DEMO_OPEN_ROUND } from '@/server/dev/seed/demo-screening';
import { DEMO_AUTUMN_SESSION_SPAN, DEMO_SESSION_SPAN } from '@/server/dev/seed/demo-training';
import type { AthleteAssessmentItem, RoundDetail, RoundSummary } from '@/features/screening/contract';
import { makeTestApp, signedInAgent } from '../fixtures/builders';
import { createTestDb, type TestDb } from '../fixtures/test-db';

// The demo is loaded the way `npm run db:reset` loads it: `tsx server/dev/db-cli.ts reset` in its own process
// (CommonJS under tsx), against a throw-away database.
let testDb: TestDb;

beforeAll(async () => {
  testDb = await createTestDb();
  const root = path.resolve(__dirname, '..', '..');
  const run = spawnSync(path.join(root, 'node_modules', '.bin', 'tsx'), ['server/dev/db-cli.ts', 'reset'], {
    cwd: root,
    env: { ...process.env, DATABASE_URL: testDb.url },
    encoding: 'utf8',
  });
  // How long this takes is printed by the bootstrap, not asserted: speed is measured by benchmarks.
  if (run.status !== 0) throw new Error(`server/dev/db-cli.ts reset failed: ${run.stderr}`);
}, 60_000);

afterAll(async () => {
  await testDb.drop();
});

async function demoRounds() {
  const [club] = await testDb.db.select().from(clubs).where(eq(clubs.name, DEMO_CLUB_NAME));
  return testDb.db
    .select({ id: rounds.id, name: rounds.name, screenedOn: rounds.screenedOn, squad: squads.name })
    .from(rounds)
    .innerJoin(squads, eq(squads.id, rounds.squadId))
    .where(eq(rounds.clubId, club!.id))
    .orderBy(asc(squads.name), asc(rounds.screenedOn));
}

describe('demo screening data', () => {
  it('has three past rounds per squad and an open winter round for the under-13s', async () => {
    const all = await demoRounds();
    expect(all.map((r) => [r.squad, r.name, r.screenedOn])).toEqual([
      ['Under-13 mixed', 'Pre-season', '2026-03-09'],
      ['Under-13 mixed', 'Mid-season', '2026-06-08'],
      ['Under-13 mixed', 'Autumn check', '2026-09-14'],
      ['Under-13 mixed', DEMO_OPEN_ROUND.name, DEMO_OPEN_ROUND.screenedOn],
      ['Under-15 mixed', 'Pre-season', '2026-03-11'],
      ['Under-15 mixed', 'Mid-season', '2026-06-10'],
      ['Under-15 mixed', 'Autumn check', '2026-09-16'],
    ]);
  });

  it('leaves work to do: the newest past rounds are partly done, the winter round not started', async () => {
    const { app } = makeTestApp(testDb.db);
    const tester = await signedInAgent(app, 'tester@squadline.test', DEMO_PASSWORD);
    const list = (await tester.get('/api/rounds')).body.rounds as RoundSummary[];
    expect(list[0]).toMatchObject({ name: DEMO_OPEN_ROUND.name, counts: { not_started: 12, in_progress: 0, submitted: 0 } });
    const autumn = list.filter((r) => r.name === 'Autumn check');
    expect(autumn.map((r) => r.counts)).toEqual([
      { not_started: 3, in_progress: 1, submitted: 8 },
      { not_started: 3, in_progress: 1, submitted: 8 },
    ]);
    for (const r of list.filter((x) => x.name !== 'Autumn check' && x.name !== DEMO_OPEN_ROUND.name)) {
      expect(r.counts).toEqual({ not_started: 0, in_progress: 0, submitted: 12 });
    }
    const detail = (await tester.get(`/api/rounds/${autumn[0]!.id}`)).body as RoundDetail;
    const submitted = detail.athletes.filter((a) => a.status === 'submitted');
    expect(submitted.every((a) => typeof a.flagCount === 'number')).toBe(true);
    // Not everyone is flagged, not everyone is clean.
    expect(submitted.some((a) => a.flagCount! >= 2)).toBe(true);
  });

  it('shows patterns that clear and patterns that persist across the season', async () => {
    const { app } = makeTestApp(testDb.db);
    const coach = await signedInAgent(app, 'coach@squadline.test', DEMO_PASSWORD);
    const roster = await testDb.db
      .select({ id: athletes.id, firstName: athletes.firstName })
      .from(athletes)
      .innerJoin(squads, eq(squads.id, athletes.squadId))
      .where(eq(squads.name, 'Under-13 mixed'));
    const valgusByRound = new Map<string, boolean[]>();
    const patternsSeen = new Set<string>();
    for (const a of roster) {
      const res = await coach.get(`/api/athletes/${a.id}/assessments`);
      expect(res.status).toBe(200);
      const done = (res.body.assessments as AthleteAssessmentItem[]).filter((x) => x.result).reverse(); // oldest first
      for (const item of done) for (const f of item.result!.flags) patternsSeen.add(f.pattern);
      valgusByRound.set(
        a.firstName,
        done.map((x) => x.result!.flags.some((f) => f.pattern === 'dynamic-knee-valgus')),
      );
    }
    const histories = [...valgusByRound.values()].filter((h) => h.length === 3);
    expect(histories).toContainEqual([true, true, false]); // improved by the autumn
    expect(histories).toContainEqual([true, true, true]); // persisting
    expect(histories).toContainEqual([false, false, false]); // never flagged
    for (const pattern of ['dynamic-knee-valgus', 'contralateral-pelvic-drop', 'limited-ankle-dorsiflexion', 'left-right-asymmetry', 'excessive-trunk-lean']) {
      expect(patternsSeen).toContain(pattern);
    }
  });

  it('stores results made by the real engine, with plans and the round date', async () => {
    const rows = await testDb.db
      .select({ result: assessmentResults.result, input: assessmentResults.input, submittedAt: assessments.submittedAt, screenedOn: rounds.screenedOn })
      .from(assessmentResults)
      .innerJoin(assessments, eq(assessments.id, assessmentResults.assessmentId))
      .innerJoin(rounds, eq(rounds.id, assessments.roundId))
      .where(and(eq(assessmentResults.isCurrent, true)));
    expect(rows.length).toBe(2 * (12 + 12 + 8));
    for (const r of rows) {
      expect(r.input.options?.today).toBe(r.screenedOn);
      expect(r.submittedAt!.toISOString().slice(0, 10)).toBe(r.screenedOn);
      expect(r.result.plan.rescreenDate).not.toBeNull();
    }
    expect(rows.some((r) => r.result.plan.exercises.length > 0)).toBe(true);
    // Athletes without photo consent have no landmarks: nobody placed points on a photo never taken.
    expect(rows.some((r) => Object.values(r.input.tasks).every((t) => !t?.photos))).toBe(true);
  });

  it("has a summer of recorded sessions, so an athlete's comparison says how many they took part in", async () => {
    const { app } = makeTestApp(testDb.db);
    const coach = await signedInAgent(app, 'coach@squadline.test', DEMO_PASSWORD);
    const squads_ = (await coach.get('/api/squads')).body.squads as { id: string; name: string }[];
    const squadId = squads_.find((s) => s.name === 'Under-13 mixed')!.id;
    const sessions = (await coach.get(`/api/squads/${squadId}/training-sessions`)).body.sessions as { heldOn: string; athleteIds: string[] }[];
    expect(sessions.length).toBeGreaterThan(0);
    const inSpan = (d: string) => [DEMO_SESSION_SPAN, DEMO_AUTUMN_SESSION_SPAN].some((span) => d >= span.from && d <= span.to);
    for (const s of sessions) expect(inSpan(s.heldOn), s.heldOn).toBe(true);
    // An athlete screened in the mid-season and autumn rounds: the sessions between them are counted.
    const members = (await testDb.db.select({ id: athletes.id }).from(athletes).where(eq(athletes.squadId, squadId))).map((a) => a.id);
    const seen: { attended: number; held: number }[] = [];
    for (const id of members) {
      const body = (await coach.get(`/api/athletes/${id}/progress`)).body;
      if (body.sessionsBetween) seen.push(body.sessionsBetween);
    }
    // Those not screened in the autumn compare the spring rounds, before any session.
    const counted = seen.filter((x) => x.held > 0);
    expect(counted.length).toBeGreaterThan(0);
    for (const x of seen) expect(x.attended).toBeLessThanOrEqual(x.held);
    expect(counted.some((x) => x.attended < x.held)).toBe(true);

    // The autumn block comes after the autumn round: the squad's table counts it since each newest screen.
    const trends = (await coach.get(`/api/squads/${squadId}/trends`)).body.athletes as { sessionsSinceScreen: { attended: number; held: number } | null }[];
    const since = trends.map((a) => a.sessionsSinceScreen).filter((x): x is { attended: number; held: number } => !!x && x.held > 0);
    expect(since.length).toBeGreaterThan(0);
    for (const x of since) expect(x.attended).toBeLessThanOrEqual(x.held);
  });
});

import { and, asc, eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { assessmentResults, auditEvents } from '@/db/schema';
import { isLoadedStrength } from '@/features/care/strength-block';
import type { FamilySummary } from '@/features/care/types';
import type { PlannedExercise } from '@/features/screening/engine';
import { formatDateInWords } from '@/features/ui/format-date';
import { makeAthlete, makeClub, makeSquad, makeTestApp, makeUser, recordingOutbox, signedInAgent } from '../fixtures/builders';
import { makeSubmittedScreen, painDraft, recordEmailConsent } from '../fixtures/care';
import { createTestDb, type TestDb } from '../fixtures/test-db';

// A physiotherapist's clearance feeds back into the plan: "clearance needed" (pain reported) and "refer on"
// hold loaded strength and landing work until cleared (a referral after a clearance works a screen with
// reported pain out again with the pain not cleared); a clearance given after the screen brings the held-back work
// back in a new result version with the reason, and the staff's plan, the family view and the summary
// e-mail say the same thing.

let testDb: TestDb;
let app: ReturnType<typeof makeTestApp>['app'];
const outbox = recordingOutbox();
const ids: Record<string, string> = {};
type Agent = Awaited<ReturnType<typeof signedInAgent>>;
const as: Record<'coach' | 'tester' | 'physio' | 'parent', Agent> = {} as never;

const loadedNames = (exercises: readonly PlannedExercise[]) => exercises.filter(isLoadedStrength).map((e) => e.name);

beforeAll(async () => {
  testDb = await createTestDb();
  ({ app } = makeTestApp(testDb.db, { outbox }));
  const db = testDb.db;
  const club = await makeClub(db, 'Quayside');
  ids.club = club.id;
  ids.squad = (await makeSquad(db, club.id, 'Under-14')).id;
  await makeUser(db, { email: 'coach@quayside.test', clubId: club.id, role: 'head_coach', displayName: 'Cole Coach' });
  ids.tester = (await makeUser(db, { email: 'tester@quayside.test', clubId: club.id, role: 'tester', displayName: 'Tess Tester' })).id;
  await makeUser(db, { email: 'physio@quayside.test', clubId: club.id, role: 'physio', displayName: 'Phil Physio' });
  const parent = await makeUser(db, { email: 'parent@quayside.test', clubId: club.id, role: 'parent', displayName: 'Ana Parent' });
  ids.kit = (await makeAthlete(db, { clubId: club.id, squadId: ids.squad, firstName: 'Kit', lastName: 'Ames', guardianUserId: parent.id })).id;
  ids.lou = (await makeAthlete(db, { clubId: club.id, squadId: ids.squad, firstName: 'Lou', lastName: 'Berg', guardianUserId: parent.id })).id;
  await recordEmailConsent(db, ids.kit, true);
  await recordEmailConsent(db, ids.lou, true);
  as.coach = await signedInAgent(app, 'coach@quayside.test');
  as.tester = await signedInAgent(app, 'tester@quayside.test');
  as.physio = await signedInAgent(app, 'physio@quayside.test');
  as.parent = await signedInAgent(app, 'parent@quayside.test');
});

afterAll(async () => {
  await testDb.drop();
});

describe('pain reported, then cleared by a physiotherapist', () => {
  it('holds loaded work back in the engine plan, the staff view and the released family summary', async () => {
    const kit = await makeSubmittedScreen(testDb.db, { clubId: ids.club!, squadId: ids.squad!, athleteId: ids.kit!, userId: ids.tester!, draft: painDraft() });
    ids.kitScreen = kit.assessmentId;
    const plan = kit.result.result.plan;
    expect(plan.status).toBe('clearance-needed');
    expect(loadedNames(plan.exercises)).toEqual([]);
    expect(plan.withheld!.length).toBeGreaterThan(0);

    const care = await as.coach.get(`/api/assessments/${ids.kitScreen}/care`);
    expect(care.body.care.block).toMatchObject({ blocked: true, reason: 'clearance-needed' });

    expect((await as.physio.post(`/api/assessments/${ids.kitScreen}/review`)).status).toBe(200);
    expect((await as.coach.post(`/api/assessments/${ids.kitScreen}/release`)).status).toBe(201);
    expect(outbox.sent).toHaveLength(1);
    expect(outbox.sent[0]!.text).toMatch(/on hold until a physiotherapist clears Kit/);
    const family = await as.parent.get(`/api/athletes/${ids.kit}/summary`);
    expect(family.body.latest.summary.onHold).toMatch(/on hold/);
  });

  it('refuses a clearance from anyone but a physiotherapist and changes nothing', async () => {
    expect((await as.coach.put(`/api/athletes/${ids.kit}/clearance`).send({ status: 'cleared' })).status).toBe(403);
    expect((await as.tester.put(`/api/athletes/${ids.kit}/clearance`).send({ status: 'cleared' })).status).toBe(403);
    expect((await as.parent.put(`/api/athletes/${ids.kit}/clearance`).send({ status: 'cleared' })).status).toBe(403);
    const detail = await as.coach.get(`/api/assessments/${ids.kitScreen}`);
    expect(detail.body.result).toMatchObject({ version: 1, reason: null });
  });

  it('"train as normal" after the screen makes a new result version with the held-back work, keeping version 1 as it was', async () => {
    const set = await as.physio.put(`/api/athletes/${ids.kit}/clearance`).send({ status: 'cleared' });
    expect(set.status).toBe(200);
    const day = set.body.clearance.setAt.slice(0, 10);
    const dayInWords = formatDateInWords(day);
    expect(dayInWords).toMatch(/^\d{1,2} [A-Z][a-z]+ \d{4}$/); // "3 December 2026": the same for every reader of the e-mail

    const detail = await as.coach.get(`/api/assessments/${ids.kitScreen}`);
    const result = detail.body.result;
    expect(result.version).toBe(2);
    expect(result.reason).toContain('Phil Physio');
    expect(result.reason).toContain('“Train as normal”');
    expect(result.reason).toContain(dayInWords);
    expect(result.result.plan.status).toBe('ready');
    expect(result.result.plan.loading.painUncleared).toBe(false);
    expect(result.result.plan.withheld).toEqual([]);
    const loaded = loadedNames(result.result.plan.exercises);
    expect(loaded.length).toBeGreaterThan(0);
    expect(result.history).toEqual([expect.objectContaining({ version: 1, reason: null })]);
    // The engine's caution now says the athlete was cleared.
    expect(result.result.plan.cautions.map((c: { text: string }) => c.text).join(' ')).toMatch(/A physiotherapist has since decided how the athlete trains/);

    // Version 1 is stored exactly as it was made.
    const rows = await testDb.db
      .select()
      .from(assessmentResults)
      .where(eq(assessmentResults.assessmentId, ids.kitScreen!))
      .orderBy(asc(assessmentResults.version));
    expect(rows.map((r) => [r.version, r.isCurrent, r.result.plan.status])).toEqual([
      [1, false, 'clearance-needed'],
      [2, true, 'ready'],
    ]);
    expect(rows[0]!.input.options?.painCleared).toBeUndefined();
    expect(rows[1]!.input.options?.painCleared).toBe(true);

    // The review mark is carried to the new version; the hold is lifted.
    const care = await as.coach.get(`/api/assessments/${ids.kitScreen}/care`);
    expect(care.body.care).toMatchObject({
      block: { blocked: false },
      reviewedByName: 'Phil Physio',
      clearance: { status: 'cleared', setByName: 'Phil Physio' },
    });
    expect(care.body.care.releasedAt).not.toBeNull();

    // The family view follows: the loaded work is back, with who cleared and when; nothing e-mailed again.
    const family = await as.parent.get(`/api/athletes/${ids.kit}/summary`);
    const latest = family.body.latest.summary as FamilySummary;
    expect(latest.onHold).toBeNull();
    expect(latest.exercises.map((e) => e.name)).toEqual(expect.arrayContaining(loaded));
    expect(latest.clearance).toBe(`Phil Physio (physiotherapist) cleared Kit on ${dayInWords} to take part as planned, with nothing changed.`);
    expect(family.body.earlier[0].summary.onHold).toMatch(/on hold/);
    expect(outbox.sent).toHaveLength(1);

    // Both steps are in the audit trail.
    const audit = await testDb.db
      .select({ action: auditEvents.action, detail: auditEvents.detail })
      .from(auditEvents)
      .where(and(eq(auditEvents.subjectId, ids.kitScreen!), eq(auditEvents.subjectKind, 'assessment')));
    expect(audit.map((a) => a.action)).toEqual(expect.arrayContaining(['reevaluate', 'release']));
    expect(audit.find((a) => a.action === 'reevaluate')!.detail).toMatchObject({ reviewCarried: true });
  });

  it('a second clearance does not work the screen out again', async () => {
    expect((await as.physio.put(`/api/athletes/${ids.kit}/clearance`).send({ status: 'cleared' })).status).toBe(200);
    const detail = await as.coach.get(`/api/assessments/${ids.kitScreen}`);
    expect(detail.body.result.version).toBe(2);
  });

  it('submitting the screen again after the clearance keeps the pain cleared', async () => {
    const current = await as.tester.get(`/api/assessments/${ids.kitScreen}`);
    const saved = await as.tester.put(`/api/assessments/${ids.kitScreen}`).send({ draftVersion: current.body.draftVersion, draft: current.body.draft });
    expect(saved.status).toBe(200);
    const again = await as.tester.post(`/api/assessments/${ids.kitScreen}/submit`).send({ draftVersion: saved.body.draftVersion });
    expect(again.status).toBe(200);
    expect(again.body).toMatchObject({ version: 3, reason: null });
    expect(again.body.result.plan.status).toBe('ready');
    expect(loadedNames(again.body.result.plan.exercises).length).toBeGreaterThan(0);
  });
});

describe('refer on', () => {
  it('holds loaded strength and landing work in the plan shown to staff and to the family until a physiotherapist clears it again', async () => {
    const before = await as.coach.get(`/api/assessments/${ids.kitScreen}`);
    const loaded = loadedNames(before.body.result.result.plan.exercises);
    expect(loaded.length).toBeGreaterThan(0);
    const landing = (before.body.result.result.plan.exercises as PlannedExercise[]).filter((e) => e.isJump).map((e) => e.name);
    expect(landing.length).toBeGreaterThan(0);
    // Version 3 (the tester's re-submission) needs its own review before the family's summary follows it.
    expect((await as.physio.post(`/api/assessments/${ids.kitScreen}/review`)).status).toBe(200);
    expect((await as.coach.post(`/api/assessments/${ids.kitScreen}/release`)).status).toBe(201);
    expect(outbox.sent).toHaveLength(2);

    const referred = await as.physio.put(`/api/athletes/${ids.kit}/clearance`).send({ status: 'referred', detail: 'Sports doctor at the county clinic' });
    expect(referred.status).toBe(200);
    // The pain reported at this screen holds the work back again: a new version worked out with the
    // pain not cleared, saying why, so no text of the plan still says the athlete was cleared.
    const detail = await as.coach.get(`/api/assessments/${ids.kitScreen}`);
    const result = detail.body.result;
    expect(result.version).toBe(4);
    expect(result.reason).toContain('“Refer on”');
    expect(result.reason).toContain('holds back loaded strength and landing work again');
    expect(result.result.plan.status).toBe('clearance-needed');
    expect(loadedNames(result.result.plan.exercises)).toEqual([]);
    expect((result.result.plan.exercises as PlannedExercise[]).filter((e) => e.isJump)).toEqual([]);
    expect(result.result.plan.withheld.map((w: { name: string }) => w.name)).toEqual(expect.arrayContaining([...loaded, ...landing]));
    const cautions = result.result.plan.cautions.map((c: { text: string }) => c.text).join(' ');
    expect(cautions).not.toMatch(/A physiotherapist has since decided how the athlete trains/);
    expect(cautions).toMatch(/Until a physiotherapist clears the athlete, no loaded strength work and no landing work/);
    const care = await as.tester.get(`/api/assessments/${ids.kitScreen}/care`);
    expect(care.body.care.block).toMatchObject({ blocked: true, reason: 'referred' });
    // Squad trends say "Refer on", not "waiting for clearance", though version 4 (worked out after the
    // referral) needs one: the referral is the decision in force.
    const trends = await as.coach.get(`/api/squads/${ids.squad}/trends`);
    expect(trends.body.athletes.find((a: { id: string }) => a.id === ids.kit)).toMatchObject({ clearance: 'referred', awaitingClearance: false });
    expect(care.body.care.reviewedByName).toBe('Phil Physio');

    const family = await as.parent.get(`/api/athletes/${ids.kit}/summary`);
    const held = family.body.latest.summary as FamilySummary;
    expect(held.exercises.map((e) => e.name)).not.toEqual(expect.arrayContaining([loaded[0]]));
    expect(held.exercises.map((e) => e.name)).not.toEqual(expect.arrayContaining([landing[0]]));
    // Named: what the engine now holds back for the pain reported at this screen.
    const withheldNames = (result.result.plan.withheld as { name: string }[]).map((w) => w.name);
    expect(held.onHold).toBe(`${withheldNames.join(', ')}: on hold until a physiotherapist clears Kit for loaded strength and landing work.`);
    expect(held.onHold).toContain(landing[0]);
    expect(held.clearance).toMatch(/^Phil Physio \(physiotherapist\) asked on .* to be seen by another health professional/);
    // The team's free-text detail never reaches the family.
    expect(JSON.stringify(family.body)).not.toContain('county clinic');
    const preview = await as.coach.get(`/api/assessments/${ids.kitScreen}/release-preview`);
    expect(preview.body.preview.text).toContain(held.onHold);
    expect(preview.body.preview.html).not.toContain('county clinic');

    const cleared = await as.physio.put(`/api/athletes/${ids.kit}/clearance`).send({ status: 'modified', detail: 'No drop landings for two weeks' });
    expect(cleared.status).toBe(200);
    expect((await as.tester.get(`/api/assessments/${ids.kitScreen}/care`)).body.care.block).toEqual({ blocked: false });
    const back = (await as.parent.get(`/api/athletes/${ids.kit}/summary`)).body.latest.summary as FamilySummary;
    expect(back.onHold).toBeNull();
    expect(back.exercises.map((e) => e.name)).toEqual(expect.arrayContaining([...loaded, ...landing]));
    expect(back.clearance).toMatch(/that Kit can keep training, with some changes/);
    expect(JSON.stringify(back)).not.toContain('drop landings for two weeks');
    const after = (await as.coach.get(`/api/assessments/${ids.kitScreen}`)).body.result;
    expect(after.version).toBe(5);
    expect(after.result.plan.status).toBe('ready');
    expect(after.history.map((h: { version: number }) => h.version)).toEqual([4, 3, 2, 1]);
    // Updates of the family view are not e-mailed.
    expect(outbox.sent).toHaveLength(2);
  });
});

// our choice: "train with changes" sets apart only the kinds of work the physiotherapist ticks, in the
// plan, the training sheet and the family's view alike, until a new clearance; the rest is said in words.
describe('train with changes, holding jump and landing work', () => {
  it('sets landing work apart everywhere, keeps the rest, and tells the family what waits without the team’s words', async () => {
    const before = (await as.coach.get(`/api/assessments/${ids.kitScreen}`)).body.result.result.plan.exercises as PlannedExercise[];
    const landing = before.filter((e) => e.isJump).map((e) => e.name);
    const loaded = loadedNames(before);
    expect(landing.length).toBeGreaterThan(0);
    expect(loaded.length).toBeGreaterThan(0);

    // Refused, nothing recorded: holds with another decision, an unknown hold, changes said in no way.
    const inForce = (await as.physio.get(`/api/athletes/${ids.kit}/clearance`)).body.clearance;
    const refused = [
      { status: 'cleared', holds: ['landing'] },
      { status: 'referred', detail: 'Clinic', holds: ['loaded'] },
      { status: 'modified', holds: ['sprinting'] },
      { status: 'modified', holds: [], detail: ' ' },
    ];
    for (const body of refused) {
      const res = await as.physio.put(`/api/athletes/${ids.kit}/clearance`).send(body);
      expect(res.status, JSON.stringify(body)).toBe(400);
    }
    const silent = await as.physio.put(`/api/athletes/${ids.kit}/clearance`).send({ status: 'modified', holds: [] });
    expect(silent.body.error.fields.detail).toBe('Choose what waits, or say what to change.');
    expect((await as.physio.get(`/api/athletes/${ids.kit}/clearance`)).body.clearance).toEqual(inForce);

    const set = await as.physio
      .put(`/api/athletes/${ids.kit}/clearance`)
      .send({ status: 'modified', holds: ['landing'], detail: 'Patellar tendon: see notes' });
    expect(set.status).toBe(200);
    expect(set.body.clearance).toMatchObject({ status: 'modified', holds: ['landing'] });

    const care = (await as.tester.get(`/api/assessments/${ids.kitScreen}/care`)).body.care;
    expect(care.block).toMatchObject({ blocked: true, reason: 'changes', holds: ['landing'] });
    expect(care.block.words).toBe("Jump and landing work is on hold on the physiotherapist's advice, until a new clearance.");

    const sheet = (await as.coach.get(`/api/squads/${ids.squad}/training-sheet`)).body as {
      athletes: { id: string; hold: string | null; physioChanges: string | null }[];
      exercises: { name: string; entries: { athleteId: string; held: boolean }[] }[];
    };
    expect(sheet.athletes.find((a) => a.id === ids.kit)).toMatchObject({ hold: care.block.words, physioChanges: 'Patellar tendon: see notes' });
    const kitHeld = sheet.exercises.flatMap((e) => e.entries.filter((x) => x.athleteId === ids.kit).map((x) => [e.name, x.held] as const));
    expect(
      kitHeld
        .filter(([, held]) => held)
        .map(([name]) => name)
        .sort(),
    ).toEqual([...landing].sort());
    expect(kitHeld.filter(([name]) => loaded.includes(name)).every(([, held]) => !held)).toBe(true);

    const family = (await as.parent.get(`/api/athletes/${ids.kit}/summary`)).body.latest.summary as FamilySummary;
    expect(family.exercises.map((e) => e.name)).not.toEqual(expect.arrayContaining([landing[0]]));
    expect(family.exercises.map((e) => e.name)).toEqual(expect.arrayContaining(loaded));
    expect(family.onHold).toBe(`${landing.join(', ')}: on hold on the physiotherapist's advice, until they say Kit can start again.`);
    expect(family.clearance).toMatch(
      /decided on .* that Kit can keep training, with some changes: jump and landing work waits for now, and the coaches will explain any other change\.$/,
    );
    expect(JSON.stringify(family)).not.toContain('Patellar');

    const [entry] = await testDb.db
      .select({ detail: auditEvents.detail })
      .from(auditEvents)
      .where(and(eq(auditEvents.athleteId, ids.kit!), eq(auditEvents.subjectKind, 'clearance'), eq(auditEvents.action, 'set')))
      .orderBy(sql`${auditEvents.createdAt} desc`)
      .limit(1);
    expect(entry!.detail).toEqual({ status: 'modified', detail: 'Patellar tendon: see notes', holds: ['landing'] });

    // A new clearance lifts it.
    expect((await as.physio.put(`/api/athletes/${ids.kit}/clearance`).send({ status: 'cleared' })).status).toBe(200);
    expect((await as.tester.get(`/api/assessments/${ids.kitScreen}/care`)).body.care.block).toEqual({ blocked: false });
    const lifted = (await as.parent.get(`/api/athletes/${ids.kit}/summary`)).body.latest.summary as FamilySummary;
    expect(lifted.onHold).toBeNull();
    expect(lifted.exercises.map((e) => e.name)).toEqual(expect.arrayContaining(landing));
  });
});

describe('a clearance given before the screen', () => {
  it('does not clear pain reported at a later screen; the summary e-mail sent after the clearance has the loaded work back', async () => {
    expect((await as.physio.put(`/api/athletes/${ids.lou}/clearance`).send({ status: 'cleared' })).status).toBe(200);
    const lou = await makeSubmittedScreen(testDb.db, {
      clubId: ids.club!,
      squadId: ids.squad!,
      athleteId: ids.lou!,
      userId: ids.tester!,
      draft: painDraft(),
      at: new Date(Date.now() + 1000),
    });
    expect(lou.result.result.plan.status).toBe('clearance-needed');
    expect((await as.coach.get(`/api/assessments/${lou.assessmentId}/care`)).body.care.block).toMatchObject({ blocked: true, reason: 'clearance-needed' });

    // Cleared after this screen: a new version; then reviewed and released, the e-mail says the same as the plan.
    await new Promise((r) => setTimeout(r, 1100));
    const set = await as.physio.put(`/api/athletes/${ids.lou}/clearance`).send({ status: 'cleared' });
    const dayInWords = formatDateInWords(set.body.clearance.setAt.slice(0, 10));
    const detail = await as.coach.get(`/api/assessments/${lou.assessmentId}`);
    expect(detail.body.result.version).toBe(2);
    const loaded = loadedNames(detail.body.result.result.plan.exercises);
    expect(loaded.length).toBeGreaterThan(0);
    expect((await as.physio.post(`/api/assessments/${lou.assessmentId}/review`)).status).toBe(200);
    expect((await as.physio.post(`/api/assessments/${lou.assessmentId}/release`)).status).toBe(201);
    const mail = outbox.sent.at(-1)!;
    expect(mail.to).toBe('parent@quayside.test');
    for (const name of loaded) expect(mail.text).toContain(name);
    expect(mail.text).toContain(`Phil Physio (physiotherapist) cleared Lou on ${dayInWords} to take part as planned, with nothing changed.`);
    expect(mail.text).not.toMatch(/on hold/);
    expect(mail.html).toContain('cleared Lou on');
    expect(mail.html).toContain('to take part as planned, with nothing changed');
  });
});

describe('a stored input the engine refuses today', () => {
  it('still records the clearance, keeps the hold and says why in the audit trail', async () => {
    const rae = await makeAthlete(testDb.db, { clubId: ids.club!, squadId: ids.squad!, firstName: 'Rae', lastName: 'Cole' });
    const screen = await makeSubmittedScreen(testDb.db, { clubId: ids.club!, squadId: ids.squad!, athleteId: rae.id, userId: ids.tester!, draft: painDraft() });
    // As if an older engine had accepted a stature today's engine refuses (80-230 cm).
    await testDb.db.execute(
      sql`update assessment_results set input = jsonb_set(input, '{athlete,statureCm}', '60'::jsonb) where assessment_id = ${screen.assessmentId}`,
    );
    const set = await as.physio.put(`/api/athletes/${rae.id}/clearance`).send({ status: 'cleared' });
    expect(set.status).toBe(200);
    expect(set.body.clearance).toMatchObject({ status: 'cleared' });
    expect((await as.coach.get(`/api/assessments/${screen.assessmentId}`)).body.result).toMatchObject({ version: 1, reason: null });
    const [event] = await testDb.db
      .select({ detail: auditEvents.detail })
      .from(auditEvents)
      .where(and(eq(auditEvents.subjectId, screen.assessmentId), eq(auditEvents.action, 'reevaluate.refused')));
    expect(event!.detail).toMatchObject({ field: 'athlete.statureCm' });
  });
});

describe('a plan adjusted before the clearance', () => {
  it('is not carried to the version the clearance makes, and that version says so', async () => {
    const sol = await makeAthlete(testDb.db, { clubId: ids.club!, squadId: ids.squad!, firstName: 'Sol', lastName: 'Dunn' });
    const screen = await makeSubmittedScreen(testDb.db, { clubId: ids.club!, squadId: ids.squad!, athleteId: sol.id, userId: ids.tester!, draft: painDraft() });
    const before = (await as.tester.get(`/api/assessments/${screen.assessmentId}`)).body.result;
    expect(before.earlierAdjustment).toBeNull();
    // The tester keeps only the first of the exercises the athlete may do meanwhile.
    const [first] = before.result.plan.exercises as PlannedExercise[];
    const adjusted = await as.tester.put(`/api/assessments/${screen.assessmentId}/plan`).send({
      exercises: [{ id: first!.id, prescription: first!.prescription }],
      note: 'One drill while sore',
      basedOn: { resultVersion: 1, adjustedAt: null },
    });
    expect(adjusted.status).toBe(200);
    expect(adjusted.body.earlierAdjustment).toBeNull();

    expect((await as.physio.put(`/api/athletes/${sol.id}/clearance`).send({ status: 'cleared' })).status).toBe(200);
    const after = (await as.coach.get(`/api/assessments/${screen.assessmentId}`)).body.result;
    expect(after.version).toBe(2);
    expect(after.adjustment).toBeNull();
    expect(after.earlierAdjustment).toMatchObject({ version: 1, createdByName: 'Tess Tester' });
    expect(after.earlierAdjustment.createdAt).toBe(adjusted.body.adjustment.createdAt);
    // A new adjustment on version 2 is the plan in force, and the note about version 1 goes.
    const again = await as.tester
      .put(`/api/assessments/${screen.assessmentId}/plan`)
      .send({ exercises: [{ id: first!.id, prescription: first!.prescription }], basedOn: { resultVersion: 2, adjustedAt: null } });
    expect(again.status).toBe(200);
    expect(again.body.earlierAdjustment).toBeNull();
  });
});

import { describe, expect, it } from 'vitest';
import { evaluateAssessment, type AssessmentInput, type TaskId } from '@/features/screening/engine';
import { EXERCISES } from '@/features/screening/engine/exercises';
import { buildFamilySummary, clearanceWords, EXERCISE_FAMILY_WHY, PATTERN_FAMILY_WORDS } from './family-summary';
import { strengthBlock } from './strength-block';

// A girl of 12 whose right knee caves in during the two-leg squat (frontal-plane projection angle about
// 29.5 deg on these landmarks) and who reported pain in it.
const input: AssessmentInput = {
  athlete: { sex: 'female', ageYears: 12.4, statureCm: 152, sittingHeightCm: 79, massKg: 41, racketHand: 'right' },
  tasks: {
    'two-leg-squat': {
      criteria: ['squat-right-knee-in'],
      painReported: true,
      photos: {
        front: {
          landmarks: {
            'right-hip': { x: 400, y: 700 },
            'right-knee': { x: 460, y: 900 },
            'right-ankle': { x: 410, y: 1120 },
            'left-hip': { x: 560, y: 700 },
            'left-knee': { x: 560, y: 900 },
            'left-ankle': { x: 560, y: 1120 },
          },
        },
      },
    },
  },
  oneRepMaxKg: 30,
  options: { today: '2026-09-14' },
};

describe('buildFamilySummary', () => {
  const result = evaluateAssessment(input);
  const build = (extra: Partial<Parameters<typeof buildFamilySummary>[0]> = {}) =>
    buildFamilySummary({
      firstName: 'Kit',
      clubName: 'Riverside',
      screenedOn: '2026-09-14',
      result,
      exercises: result.plan.exercises,
      taskIds: Object.keys(input.tasks),
      block: strengthBlock(result.plan, null, '2026-09-14T17:00:00.000Z'),
      contactName: 'Phil Physio',
      ...extra,
    });
  const summary = build();

  it('says what was checked and seen in plain words, without numbers of angles or trade terms', () => {
    expect(summary.checked).toEqual(['Two-leg full squat']);
    expect(summary.seen).toContain('The knee moved inward during the movement (right side).');
    const all = JSON.stringify(summary);
    expect(all).not.toMatch(/°|valgus|fppa|diagnos(?!is\.)/i);
  });

  it('says each pattern once, with every side it was seen on', () => {
    // The same pattern on the left in one task and on the right in another (flags as the engine writes
    // them; only pattern and side matter here).
    const flag = result.flags.find((f) => f.side === 'right')!;
    const sided = (side: 'left' | 'right', taskId: TaskId) => ({ ...flag, id: `${flag.pattern}/${taskId}/${side}`, taskId, side });
    const seenWith = (flags: (typeof result.flags)[number][]) =>
      buildFamilySummary({
        firstName: 'Kit',
        clubName: 'Riverside',
        screenedOn: '2026-09-14',
        result: { ...result, flags },
        exercises: result.plan.exercises,
        taskIds: Object.keys(input.tasks),
        block: { blocked: false },
        contactName: null,
      }).seen;
    const words = `${PATTERN_FAMILY_WORDS[flag.pattern].charAt(0).toUpperCase()}${PATTERN_FAMILY_WORDS[flag.pattern].slice(1)}`;
    expect(seenWith([sided('right', 'two-leg-squat'), sided('left', 'drop-landing')])).toEqual([`${words} (both sides).`]);
    expect(seenWith([sided('left', 'two-leg-squat'), sided('left', 'drop-landing')])).toEqual([`${words} (left side).`]);
    expect(seenWith([])).toEqual(['Nothing that needs extra work was seen on the day.']);
  });

  it('lists what was checked in the order the screen runs it, whatever order the tasks are stored in', () => {
    const stored = ['single-leg-stance-right', 'two-leg-squat', 'knee-to-wall-left', 'single-leg-squat-left', 'drop-landing', 'not-a-task'];
    const checked = buildFamilySummary({
      firstName: 'Kit',
      clubName: 'Riverside',
      screenedOn: '2026-09-14',
      result,
      exercises: result.plan.exercises,
      taskIds: stored,
      block: strengthBlock(result.plan, null, '2026-09-14T17:00:00.000Z'),
      contactName: null,
    }).checked;
    // The battery's order (our choice): squats, landing, stances, knee-to-wall, lunge; an unknown id is left out.
    expect(checked).toEqual([
      'Two-leg full squat',
      'Single-leg squat, left leg',
      'Drop landing from a low box',
      'Single-leg stance, right leg',
      'Knee-to-wall lunge, left ankle',
    ]);
  });

  it('holds back loaded strength and landing work while clearance is needed, and names it', () => {
    expect(result.plan.status).toBe('clearance-needed');
    expect(summary.exercises.every((e) => !/1RM/.test(e.howMuch))).toBe(true);
    const withheld = (result.plan.withheld ?? []).map((w) => w.name);
    expect(withheld.length).toBeGreaterThan(0);
    expect(summary.onHold).toBe(`${withheld.join(', ')}: on hold until a physiotherapist clears Kit for loaded strength and landing work.`);
  });

  it('says loaded strength and landing work is for club sessions with a coach, and only then adds the caution (our choice)', () => {
    // The same girl with no pain: her plan keeps its loaded and landing work.
    const noPain = { ...input, tasks: { 'two-leg-squat': { ...input.tasks['two-leg-squat']!, painReported: false } } };
    const r = evaluateAssessment(noPain);
    const s = buildFamilySummary({
      firstName: 'Kit',
      clubName: 'Riverside',
      screenedOn: '2026-09-14',
      result: r,
      exercises: r.plan.exercises,
      taskIds: Object.keys(noPain.tasks),
      block: strengthBlock(r.plan, null, '2026-09-14T17:00:00.000Z'),
      contactName: null,
    });
    const loaded = r.plan.exercises.filter((e) => e.phase === 'strength' || e.prescription.load.kind === 'percent-1rm' || e.isJump).map((e) => e.name);
    expect(loaded.length).toBeGreaterThan(0);
    expect(s.exercises.filter((e) => e.clubOnly).map((e) => e.name)).toEqual(loaded);
    expect(s.cautions).toContain('Exercises with weights or landings are done at the club with a qualified coach watching, never alone at home.');
    // With that work on hold, nothing listed is club-only and the caution is not said.
    expect(summary.exercises.some((e) => e.clubOnly)).toBe(false);
    expect(summary.cautions.some((c) => /weights or landings/.test(c))).toBe(false);
  });

  it('carries the re-check date, a contact and the usual cautions', () => {
    expect(summary.recheckDate).toBe(result.plan.rescreenDate);
    expect(summary.contact).toBe('Questions? Speak to Phil Physio or the coaches at Riverside.');
    expect(summary.cautions[0]).toMatch(/not a diagnosis/);
  });

  // our choice: a family should not read "3 times a week" as homework for the child alone.
  it('says where the exercises are done, and to ask the coach before doing any at home', () => {
    expect(summary.exercises.length).toBeGreaterThan(0);
    expect(summary.howOften).toMatch(
      /^Each exercise says how often \(up to \d times a week\)\. The coaches fit them into club sessions; ask them before doing any at home\.$/,
    );
  });

  // our choice: the family learns that their child said something hurt, and in which movement; while no
  // physiotherapist has cleared the athlete, what remains is done only where it causes no pain.
  it('says that something hurt, in which movement, and that the rest is done pain-free until a physiotherapist has seen them', () => {
    expect(build({ painTaskIds: ['two-leg-squat'] }).pain).toBe(
      'At the screen, Kit said something hurt during: Two-leg full squat. Until a physiotherapist has seen Kit, the exercises of this plan are done only where they cause no pain.',
    );
    const cleared = { status: 'cleared' as const, detail: '', holds: [], setAt: '2026-09-20T10:00:00.000Z', setByName: 'Phil Physio' };
    const afterClearance = build({ painTaskIds: ['two-leg-squat'], block: strengthBlock(result.plan, cleared, '2026-09-14T17:00:00.000Z') });
    expect(afterClearance.pain).toBe('At the screen, Kit said something hurt during: Two-leg full squat.');
    expect(summary.pain).toBeNull();
  });

  it('has family words for every pattern the engine can flag', () => {
    for (const words of Object.values(PATTERN_FAMILY_WORDS)) expect(words).not.toMatch(/valgus|dorsiflexion|pelvic drop/i);
  });

  // Our wording: each exercise says why in everyday words, and which of the things seen it was chosen for.
  it('says why each exercise is there in family words, for every exercise of the library and no other', () => {
    expect(Object.keys(EXERCISE_FAMILY_WHY).sort()).toEqual(EXERCISES.map((e) => e.id).sort());
    for (const why of Object.values(EXERCISE_FAMILY_WHY)) expect(why).not.toMatch(/valgus|dorsiflexion|pelvi|glute|abduct|trunk|groove/i);
    for (const e of summary.exercises) {
      const planned = result.plan.exercises.find((p) => p.name === e.name)!;
      expect(e.purpose).toBe(EXERCISE_FAMILY_WHY[planned.id]);
    }
  });

  it('links each exercise to what was seen, in the words of "what we saw", never to the growth phase', () => {
    const forKnee = summary.exercises.filter((e) => result.plan.exercises.find((p) => p.name === e.name)!.patterns.includes('dynamic-knee-valgus'));
    expect(forKnee.length).toBeGreaterThan(0);
    for (const e of forKnee) expect(e.forWhat).toContain('Chosen for what we saw: the knee moved inward during the movement');
    for (const e of summary.exercises) expect(e.forWhat ?? '').not.toContain('fast-growing');
  });
});

describe("clearanceWords (our wording: who decided and when, never the team's free-text detail)", () => {
  const setAt = '2026-10-02T09:15:00.000Z';
  it.each([
    ['cleared', 'Pat Lee (physiotherapist) cleared Ana on 2 October 2026 to take part as planned, with nothing changed.'],
    ['modified', 'Pat Lee (physiotherapist) decided on 2 October 2026 that Ana can keep training, with some changes; the coaches will explain them.'],
    [
      'referred',
      'Pat Lee (physiotherapist) asked on 2 October 2026 for Ana to be seen by another health professional; loaded strength and landing work wait until then.',
    ],
  ] as const)('%s', (status, words) => {
    expect(clearanceWords({ status, detail: 'Knee clinic, Dr X', holds: [], setByName: 'Pat Lee', setAt }, 'Ana')).toBe(words);
  });

  it('says what "train with changes" holds back, never the detail', () => {
    const modified = (holds: ('loaded' | 'landing')[]) =>
      clearanceWords({ status: 'modified', detail: 'Patellar tendon, clinic X', holds, setByName: 'Pat Lee', setAt }, 'Ana');
    expect(modified(['landing'])).toBe(
      'Pat Lee (physiotherapist) decided on 2 October 2026 that Ana can keep training, with some changes: jump and landing work waits for now, and the coaches will explain any other change.',
    );
    expect(modified(['loaded', 'landing'])).toBe(
      'Pat Lee (physiotherapist) decided on 2 October 2026 that Ana can keep training, with some changes: loaded strength work and landing work wait for now, and the coaches will explain any other change.',
    );
  });

  it('says nothing without a decision, and names no one when the author left', () => {
    expect(clearanceWords(null, 'Ana')).toBeNull();
    expect(clearanceWords({ status: 'cleared', detail: '', holds: [], setByName: null, setAt }, 'Ana')).toBe(
      'A physiotherapist cleared Ana on 2 October 2026 to take part as planned, with nothing changed.',
    );
  });
});

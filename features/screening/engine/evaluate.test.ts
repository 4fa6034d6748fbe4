import { describe, expect, it } from 'vitest';
import { rateSingleLegSquat } from './measurements';
import { EngineInputError, ENGINE_VERSION, evaluateAssessment, getTask, swappedFrontPair } from './index';
import type { AssessmentInput, AthleteInput, Point, TaskResultInput } from './types';

const COMMON = 'common practice, no source';
const p = (x: number, y: number): Point => ({ x, y });

/** A boy outside no range, without maturity inputs unless asked. */
function makeAssessment(overrides: Partial<AssessmentInput> = {}): AssessmentInput {
  return { athlete: { sex: 'male', ageYears: 13 }, tasks: {}, ...overrides };
}

const postPhvBoy: AthleteInput = { sex: 'male', ageYears: 15.5, statureCm: 172, sittingHeightCm: 89, massKg: 60 };
// Moore 2015 girls: -7.709133 + 0.0042232 * 12 * 150 = -0.107 y -> circa.
const circaGirl: AthleteInput = { sex: 'female', ageYears: 12, statureCm: 150, sittingHeightCm: 78, massKg: 40 };

/** Right leg on the image's left; knee `medialPx` towards the midline (+x). */
function rightLeg(medialPx: number): Partial<Record<'right-hip' | 'right-knee' | 'right-ankle', Point>> {
  return { 'right-hip': p(400, 600), 'right-knee': p(400 + medialPx, 800), 'right-ankle': p(400, 1000) };
}
/** Left leg on the image's right; knee `medialPx` towards the midline (-x). */
function leftLeg(medialPx: number): Partial<Record<'left-hip' | 'left-knee' | 'left-ankle', Point>> {
  return { 'left-hip': p(600, 600), 'left-knee': p(600 - medialPx, 800), 'left-ankle': p(600, 1000) };
}

describe('evaluateAssessment: shape', () => {
  it('carries a semver engine version', () => {
    const r = evaluateAssessment(makeAssessment());
    expect(r.engineVersion).toBe(ENGINE_VERSION);
    expect(r.engineVersion).toMatch(/^\d+\.\d+\.\d+$/);
  });

  it('an empty screen gives no measurements, no flags, no exercises, and the standing cautions', () => {
    const r = evaluateAssessment(makeAssessment());
    expect(r.measurements).toEqual([]);
    expect(r.flags).toEqual([]);
    expect(r.plan.exercises).toEqual([]);
    expect(r.plan.status).toBe('ready');
    // No body measures: the growth stage is unknown and the plan says so.
    expect(r.plan.cautions.map((c) => c.id)).toEqual(['stop-on-pain', 'not-a-diagnosis', 'youth-resistance-training', 'growth-stage-unknown']);
    expect(r.plan.rescreenWeeks).toBe(6);
    expect(r.plan.rescreenDate).toBeNull();
  });

  it.each<[string, number | undefined, string]>([
    ['2025-03-14', undefined, '2025-04-25'],
    ['2024-02-20', 2, '2024-03-05'],
    ['2025-12-20T09:30:00Z', 3, '2026-01-10'],
  ])('re-screen date: from %s after %s weeks -> %s', (today, weeks, expected) => {
    const options = weeks === undefined ? { today } : { today, rescreenWeeks: weeks };
    expect(evaluateAssessment(makeAssessment({ options })).plan.rescreenDate).toBe(expected);
  });
});

describe('evaluateAssessment: progressive capture', () => {
  it('a task with missing landmarks measures only what it can', () => {
    const r = evaluateAssessment(
      makeAssessment({
        tasks: {
          'two-leg-squat': {
            criteria: [],
            photos: { front: { landmarks: { ...rightLeg(0), 'left-hip': p(600, 600), 'left-knee': p(600, 800) } } },
          },
        },
      }),
    );
    expect(r.measurements.map((m) => m.id)).toEqual(['two-leg-squat/fppa/right']);
    expect(r.measurements[0]?.value).toBe(0);
  });

  it('the two-leg squat measures both legs, pelvis, trunk and the side view', () => {
    const r = evaluateAssessment(
      makeAssessment({
        tasks: {
          'two-leg-squat': {
            criteria: [],
            photos: {
              front: {
                landmarks: {
                  ...rightLeg(10),
                  ...leftLeg(10),
                  'right-asis': p(440, 560),
                  'left-asis': p(560, 560),
                  'mid-shoulder': p(500, 250),
                  'mid-hip': p(500, 650),
                },
              },
              side: {
                landmarks: {
                  'near-shoulder': p(600, 400),
                  'near-hip': p(400, 800),
                  'near-knee': p(600, 780),
                  'near-ankle': p(500, 1000),
                },
              },
            },
          },
        },
      }),
    );
    expect(r.measurements.map((m) => m.id).sort()).toEqual(
      [
        'two-leg-squat/fppa/right',
        'two-leg-squat/fppa/left',
        'two-leg-squat/fppa-difference/both',
        'two-leg-squat/pelvic-tilt/both',
        'two-leg-squat/trunk-lean-lateral',
        'two-leg-squat/knee-flexion',
        'two-leg-squat/tibial-inclination',
        'two-leg-squat/trunk-lean-forward',
        'two-leg-squat/thigh-angle/both',
        'two-leg-squat/trunk-tibia-difference',
      ].sort(),
    );
  });
});

describe('evaluateAssessment: knee valgus sign on both legs', () => {
  // 2 x atan(20/200) = 11.42 deg; male drop-jump upper end 8 deg (Herrington & Munro 2010, adult norms).
  it.each<['right' | 'left', number, boolean]>([
    ['right', 20, true],
    ['left', 20, true],
    ['right', -20, false],
    ['left', -20, false],
  ])('%s knee %i px towards the midline in the drop landing -> valgus flag %s', (side, medial, flagged) => {
    const landmarks = side === 'right' ? rightLeg(medial) : leftLeg(medial);
    const r = evaluateAssessment(makeAssessment({ tasks: { 'drop-landing': { criteria: [], photos: { front: { landmarks } } } } }));
    const m = r.measurements.find((x) => x.id === `drop-landing/fppa/${side}`);
    expect(m?.value).toBeCloseTo(Math.sign(medial) * 11.4212, 4);
    const flag = r.flags.find((f) => f.id === `dynamic-knee-valgus/drop-landing/${side}`);
    expect(flag !== undefined).toBe(flagged);
    if (flag) {
      expect(flag.side).toBe(side);
      expect(flag.severity).toBe('watch');
      expect(flag.threshold).toMatchObject({ rowId: 'fppa-bilateral-male-watch', value: 8, unit: 'deg' });
      expect(flag.source).toMatch(/^Herrington L, Munro A\./);
    }
  });

  it('a knee-angle flag carries the adult-norms caution with the same error figure the progress view judges changes by', () => {
    // Munro, Herrington and Carolan 2012, J Sport Rehabil 21(1):7-11: smallest detectable difference
    // 7.54-8.93 deg; the upper end is the progress view's margin (features/progress/compare.ts).
    const r = evaluateAssessment(makeAssessment({ tasks: { 'drop-landing': { criteria: [], photos: { front: { landmarks: rightLeg(20) } } } } }));
    const caution = r.plan.cautions.find((c) => c.id === 'adult-knee-norms');
    expect(caution?.text).toContain('8.93 degrees or less may be measurement error');
    expect(caution?.text).not.toMatch(/7\.5 degrees/);
  });

  it('a mirrored landing gives the same angles on both legs and no asymmetry', () => {
    const r = evaluateAssessment(
      makeAssessment({
        tasks: { 'drop-landing': { criteria: [], photos: { front: { landmarks: { ...rightLeg(25), ...leftLeg(25) } } } } },
      }),
    );
    const right = r.measurements.find((m) => m.id === 'drop-landing/fppa/right')?.value;
    const left = r.measurements.find((m) => m.id === 'drop-landing/fppa/left')?.value;
    expect(right).toBeDefined();
    expect(left).toBeCloseTo(right ?? Number.NaN, 12);
    expect(r.flags.some((f) => f.pattern === 'left-right-asymmetry')).toBe(false);
  });
});

describe('evaluateAssessment: knee-to-wall (common practice, no source)', () => {
  const ktw = (left: number, right: number): AssessmentInput =>
    makeAssessment({
      tasks: {
        'knee-to-wall-left': { criteria: [], distanceCm: left },
        'knee-to-wall-right': { criteria: [], distanceCm: right },
      },
    });

  it.each<[number, boolean, string]>([
    [10, false, `${COMMON}: under about 10 cm is restricted`],
    [9.99, true, COMMON],
    [10.01, false, COMMON],
  ])('left %f cm -> limited dorsiflexion %s (%s)', (cm, flagged) => {
    const r = evaluateAssessment(ktw(cm, cm));
    expect(r.flags.some((f) => f.id === 'limited-ankle-dorsiflexion/knee-to-wall-left/left')).toBe(flagged);
  });

  it.each<[number, number, boolean, string]>([
    [12, 14, true, `${COMMON}: a side difference of 2 cm or more`],
    [12, 13.99, false, COMMON],
    [12, 14.01, true, COMMON],
  ])('left %f, right %f -> asymmetry %s (%s)', (l, r, flagged) => {
    const res = evaluateAssessment(ktw(l, r));
    const flag = res.flags.find((f) => f.pattern === 'left-right-asymmetry');
    expect(flag !== undefined).toBe(flagged);
    if (flag) {
      expect(flag.side).toBe('left');
      expect(flag.comparesTasks).toEqual(['knee-to-wall-left', 'knee-to-wall-right']);
    }
  });

  it('reports the limb symmetry index, shorter over longer', () => {
    const r = evaluateAssessment(ktw(8, 10));
    expect(r.measurements.find((m) => m.metric === 'knee-to-wall-lsi')?.value).toBeCloseTo(80, 12);
  });

  it('a shin angle under 36.5 deg on the optional side photo raises a concern (Backman LJ, Danielson P. Am J Sports Med. 2011;39(12):2626-2633)', () => {
    // atan(200/300) = 33.7 deg
    const r = evaluateAssessment(
      makeAssessment({
        tasks: {
          'knee-to-wall-right': {
            criteria: [],
            distanceCm: 9,
            photos: { side: { landmarks: { 'near-knee': p(700, 700), 'near-ankle': p(500, 1000) } } },
          },
        },
      }),
    );
    const flag = r.flags.find((f) => f.pattern === 'limited-ankle-dorsiflexion');
    expect(flag?.severity).toBe('concern');
    expect(flag?.thresholdsMet.map((t) => t.rowId)).toEqual(['lunge-angle-low', 'knee-to-wall-short']);
  });
});

describe('evaluateAssessment: observed criteria', () => {
  it.each<[string, string, string]>([
    ['squat-heels-lift', 'heels-lifting/two-leg-squat/both', 'heels-lifting-observed'],
    ['squat-not-deep', 'squat-depth-not-reached/two-leg-squat/both', 'squat-depth-observed'],
    ['squat-chest-drops', 'excessive-trunk-lean/two-leg-squat', 'trunk-lean-observed'],
    ['squat-left-knee-in', 'dynamic-knee-valgus/two-leg-squat/left', 'knee-valgus-observed'],
    ['squat-weight-shift', 'left-right-asymmetry/two-leg-squat/both', 'asymmetry-observed'],
  ])('ticking %s raises %s (row %s, common practice, no source)', (criterion, flagId, rowId) => {
    const r = evaluateAssessment(makeAssessment({ tasks: { 'two-leg-squat': { criteria: [criterion] } } }));
    expect(r.flags.map((f) => f.id)).toEqual([flagId]);
    expect(r.flags[0]?.threshold.rowId).toBe(rowId);
    expect(r.flags[0]?.evidence).toEqual([expect.objectContaining({ kind: 'criterion', criterionId: criterion, taskId: 'two-leg-squat' })]);
  });

  it('a measured and an observed sign of the same pattern make one flag with both as evidence', () => {
    const r = evaluateAssessment(
      makeAssessment({
        tasks: {
          'single-leg-squat-right': { criteria: ['sls-knee-in'], photos: { front: { landmarks: rightLeg(30) } } },
        },
      }),
    );
    const valgus = r.flags.filter((f) => f.pattern === 'dynamic-knee-valgus');
    expect(valgus.length).toBe(1);
    expect(valgus[0]?.evidence.map((e) => e.kind).sort()).toEqual(['criterion', 'measurement']);
    // 2 x atan(30/200) = 17.06 deg: above the male step-landing end (9) and 9 + 7.54 = 16.54 -> concern.
    expect(valgus[0]?.severity).toBe('concern');
  });
});

describe('single-leg squat rating (our design, areas after Crossley et al. 2011)', () => {
  it.each<[string[], 'good' | 'fair' | 'poor']>([
    [[], 'good'],
    [['sls-knee-in'], 'fair'],
    [['sls-knee-in', 'sls-knee-wobble'], 'fair'],
    [['sls-knee-in', 'sls-pelvis-drop'], 'fair'],
    [['sls-knee-in', 'sls-pelvis-drop', 'sls-trunk-side'], 'poor'],
    [['sls-balance', 'sls-trunk-twist', 'sls-pelvis-shift', 'sls-hip-in', 'sls-knee-wobble'], 'poor'],
  ])('ticked %j -> %s', (ticked, rating) => {
    expect(rateSingleLegSquat(getTask('single-leg-squat-left'), ticked).rating).toBe(rating);
  });

  it('good on one side and poor on the other is an asymmetry on the poor side', () => {
    const r = evaluateAssessment(
      makeAssessment({
        tasks: {
          'single-leg-squat-left': { criteria: [] },
          'single-leg-squat-right': { criteria: ['sls-balance', 'sls-pelvis-shift', 'sls-knee-wobble'] },
        },
      }),
    );
    expect(r.ratings.map((x) => x.rating)).toEqual(['good', 'poor']);
    const flag = r.flags.find((f) => f.pattern === 'left-right-asymmetry');
    expect(flag?.side).toBe('right');
    expect(flag?.threshold.rowId).toBe('single-leg-squat-rating-gap');
  });
});

describe('evaluateAssessment: racket-side lunge', () => {
  const lunge = (racketHand?: 'left' | 'right'): AssessmentInput => {
    const athlete: AthleteInput = { sex: 'female', ageYears: 17 };
    if (racketHand) athlete.racketHand = racketHand;
    return {
      athlete,
      tasks: {
        'racket-side-lunge': {
          criteria: [],
          photos: { front: { landmarks: { 'lead-hip': p(500, 600), 'lead-knee': p(530, 800), 'lead-ankle': p(500, 1000) } } },
        },
      },
    };
  };

  it('without the racket hand the front knee angle cannot be signed, so it is not measured', () => {
    expect(evaluateAssessment(lunge()).measurements).toEqual([]);
  });

  it.each<['left' | 'right', number]>([
    ['right', 1],
    ['left', -1],
  ])('racket hand %s: the knee 30 px towards +x gives sign %i', (hand, sign) => {
    const m = evaluateAssessment(lunge(hand)).measurements.find((x) => x.metric === 'fppa');
    expect(m?.side).toBe(hand);
    expect(Math.sign(m?.value ?? 0)).toBe(sign);
  });
});

describe('evaluateAssessment: maturity and the growth-spurt window', () => {
  it('computes maturity only when the method has its inputs', () => {
    expect(evaluateAssessment(makeAssessment()).maturity).toBeNull();
    expect(evaluateAssessment(makeAssessment({ athlete: { sex: 'male', ageYears: 13, statureCm: 155 } })).maturity).toBeNull();
    const r = evaluateAssessment(makeAssessment({ athlete: { sex: 'male', ageYears: 13, sittingHeightCm: 80 } }));
    // Moore 2015 boys: -8.128741 + 0.0070346 * 13 * 80 = -0.812757
    expect(r.maturity?.offsetYears).toBeCloseTo(-0.812757, 6);
  });

  it('honours the chosen method', () => {
    const r = evaluateAssessment(makeAssessment({ athlete: circaGirl, options: { maturityMethod: 'mirwald2002' } }));
    // Mirwald 2002 girls, worked in maturity.test.ts: -0.1754661
    expect(r.maturity?.offsetYears).toBeCloseTo(-0.1754661, 6);
    expect(evaluateAssessment(makeAssessment({ athlete: circaGirl, options: { maturityMethod: 'none' } })).maturity).toBeNull();
  });

  it('refuses an age outside the equation range when maturity is requested', () => {
    const girl17: AthleteInput = { sex: 'female', ageYears: 17, statureCm: 165 };
    expect(() => evaluateAssessment(makeAssessment({ athlete: girl17 }))).toThrow(
      expect.objectContaining({ name: 'EngineInputError', field: 'athlete.ageYears' }),
    );
    expect(() => evaluateAssessment(makeAssessment({ athlete: girl17, options: { maturityMethod: 'none' } }))).not.toThrow();
  });

  const asymmetricAnkles: AssessmentInput['tasks'] = {
    'knee-to-wall-left': { criteria: [], distanceCm: 8 },
    'knee-to-wall-right': { criteria: [], distanceCm: 11 },
  };

  it('circa PHV raises the growth-spurt flag and lowers loading and jump volume (our design)', () => {
    const circa = evaluateAssessment({ athlete: circaGirl, tasks: asymmetricAnkles, oneRepMaxKg: 80 });
    const post = evaluateAssessment({ athlete: postPhvBoy, tasks: asymmetricAnkles, oneRepMaxKg: 80 });

    expect(circa.maturity?.band).toBe('circa');
    expect(post.maturity?.band).toBe('post');
    expect(circa.flags.some((f) => f.id === 'growth-spurt-window')).toBe(true);
    expect(post.flags.some((f) => f.pattern === 'growth-spurt-window')).toBe(false);
    expect(circa.plan.growthSpurtAdjusted).toBe(true);
    expect(circa.plan.cautions.map((c) => c.id)).toContain('growth-spurt-window');

    const split = circa.plan.exercises.find((e) => e.id === 'split-squat-endurance');
    expect(split?.prescription.load).toMatchObject({ kind: 'percent-1rm', minPercent: 50, maxPercent: 55 });
    // 40 kg and 44 kg -> 44 / 2.5 = 17.6 -> rounded down to 17 steps -> 42.5 kg (45 kg would be 56.25%)
    expect(split?.prescription.load.kind === 'percent-1rm' && split.prescription.load.kg).toEqual({ min: 40, max: 42.5, incrementKg: 2.5 });
    expect(split?.prescription.sets).toEqual({ min: 3, max: 3 });

    const snap = circa.plan.exercises.find((e) => e.id === 'snap-down-and-stick');
    expect(snap?.prescription.dose).toMatchObject({ min: 3, max: 3 });
    expect(snap?.prescription.sets.max).toBeLessThanOrEqual(2);
  });

  it('outside the window the split squat keeps 50-65% of 1RM and 3-4 sets (common practice, no source)', () => {
    const post = evaluateAssessment({ athlete: postPhvBoy, tasks: asymmetricAnkles, oneRepMaxKg: 80 });
    const split = post.plan.exercises.find((e) => e.id === 'split-squat-endurance');
    // 52 kg rounded down to 50 kg: 52.5 kg would be 65.6% of 1RM.
    expect(split?.prescription.load).toMatchObject({ kind: 'percent-1rm', minPercent: 50, maxPercent: 65, kg: { min: 40, max: 50 } });
    expect(split?.prescription.sets).toEqual({ min: 3, max: 4 });
    // The only change: the volume beyond youth guidance is labelled.
    expect(split?.adjustments).toHaveLength(1);
    expect(split?.adjustments[0]).toMatch(/beyond the youth position statement/);
  });

  it('without a 1RM the loaded exercise says to start with bodyweight', () => {
    const r = evaluateAssessment({ athlete: postPhvBoy, tasks: asymmetricAnkles });
    const split = r.plan.exercises.find((e) => e.id === 'split-squat-endurance');
    expect(split?.prescription.load).toMatchObject({ kind: 'percent-1rm', kg: null });
    expect(split?.prescription.load.kind === 'percent-1rm' && split.prescription.load.note).toMatch(/bodyweight/);
  });

  it('uses the load increment from the options', () => {
    const r = evaluateAssessment({ athlete: postPhvBoy, tasks: asymmetricAnkles, oneRepMaxKg: 37, options: { loadIncrementKg: 2 } });
    const split = r.plan.exercises.find((e) => e.id === 'split-squat-endurance');
    // 18.5 kg rounded up to 20 kg, 24.05 kg down to 24 kg.
    expect(split?.prescription.load.kind === 'percent-1rm' && split.prescription.load.kg).toEqual({ min: 20, max: 24, incrementKg: 2 });
  });
});

describe('evaluateAssessment: plan', () => {
  const everything: AssessmentInput = {
    athlete: circaGirl,
    tasks: {
      'two-leg-squat': { criteria: ['squat-right-knee-in', 'squat-heels-lift', 'squat-not-deep', 'squat-chest-drops', 'squat-weight-shift'] },
      'single-leg-squat-left': { criteria: ['sls-pelvis-drop', 'sls-knee-in'] },
      'single-leg-squat-right': { criteria: ['sls-pelvis-drop', 'sls-knee-in', 'sls-trunk-side'] },
      'knee-to-wall-left': { criteria: [], distanceCm: 6 },
      'knee-to-wall-right': { criteria: [], distanceCm: 9 },
      'drop-landing': { criteria: ['landing-left-knee-in', 'landing-right-knee-in'] },
    },
  };

  it('covers every flagged pattern in at most 6 exercises, without duplicates, in session order', () => {
    const r = evaluateAssessment(everything);
    const patterns = new Set(r.flags.map((f) => f.pattern));
    expect(patterns.size).toBe(8);
    expect(r.plan.exercises.length).toBe(6);
    expect(new Set(r.plan.exercises.map((e) => e.id)).size).toBe(6);
    for (const f of r.flags) expect(r.plan.exercises.some((e) => e.flagIds.includes(f.id))).toBe(true);
    const phases = ['mobility', 'activation', 'control', 'landing', 'strength'];
    const order = r.plan.exercises.map((e) => phases.indexOf(e.phase));
    expect(order).toEqual([...order].sort((a, b) => a - b));
    expect(r.plan.exercises.map((e) => e.order)).toEqual([1, 2, 3, 4, 5, 6]);
  });

  it('orders flags concern first', () => {
    const r = evaluateAssessment({
      athlete: postPhvBoy,
      tasks: {
        'two-leg-squat': { criteria: ['squat-heels-lift'] },
        'single-leg-stance-left': { criteria: [], photos: { front: { landmarks: { 'left-asis': p(560, 500), 'right-asis': p(440, 530) } } } },
      },
    });
    // atan(30/120) = 14 deg > 10 -> concern (common practice, no source)
    expect(r.flags.map((f) => f.severity)).toEqual(['concern', 'watch']);
  });

  it('pain anywhere needs clearance and names the task', () => {
    const r = evaluateAssessment(makeAssessment({ tasks: { 'drop-landing': { criteria: [], painReported: true } } }));
    expect(r.plan.status).toBe('clearance-needed');
    const pain = r.plan.cautions.find((c) => c.id === 'pain-reported');
    expect(pain?.text).toMatch(/Drop landing from a low box/);
    expect(pain?.text).toMatch(/physiotherapist or doctor/);
  });

  // our choice: a later screen with no pain reported is not a clearance.
  it('pain at an earlier screen that nobody has cleared holds the plan too, naming the task and its day, until cleared', () => {
    const clean = makeAssessment({ tasks: { 'two-leg-squat': { criteria: [] } } });
    expect(evaluateAssessment(clean).plan.status).toBe('ready');
    const carried = evaluateAssessment({ ...clean, options: { earlierPain: { day: '2026-09-16', taskIds: ['drop-landing'] } } });
    expect(carried.plan.status).toBe('clearance-needed');
    expect(carried.plan.cautions.find((c) => c.id === 'pain-reported')?.text).toMatch(
      /^Pain was reported during: Drop landing from a low box \(at the screen of 2026-09-16\)\./,
    );
    const cleared = evaluateAssessment({ ...clean, options: { earlierPain: { day: '2026-09-16', taskIds: ['drop-landing'] }, painCleared: true } });
    expect(cleared.plan.status).toBe('ready');
  });

  it('always carries the youth resistance-training caution with its sources (Faigenbaum 2009; Lloyd 2014)', () => {
    const r = evaluateAssessment(everything);
    const c = r.plan.cautions.find((x) => x.id === 'youth-resistance-training');
    expect(c?.text).toMatch(/Technique before load/);
    expect(c?.text).toMatch(/qualified/);
    expect(c?.source).toMatch(/Faigenbaum AD/);
    expect(c?.source).toMatch(/Lloyd RS/);
    expect(r.plan.cautions.some((x) => x.id === 'not-a-diagnosis')).toBe(true);
  });
});

describe('evaluateAssessment: impossible input', () => {
  const withTask = (id: keyof AssessmentInput['tasks'], task: unknown): AssessmentInput => makeAssessment({ tasks: { [id]: task as TaskResultInput } });

  it.each<[string, AssessmentInput, string]>([
    [
      'coincident hip and knee',
      withTask('drop-landing', { criteria: [], photos: { front: { landmarks: { 'right-hip': p(1, 1), 'right-knee': p(1, 1), 'right-ankle': p(1, 9) } } } }),
      'tasks.drop-landing.photos.front.landmarks.right-knee',
    ],
    [
      'shoulders below the hips in the side view',
      withTask('two-leg-squat', { criteria: [], photos: { side: { landmarks: { 'near-shoulder': p(500, 900), 'near-hip': p(500, 800) } } } }),
      'tasks.two-leg-squat.photos.side.landmarks.near-shoulder',
    ],
    [
      'knee below the ankle in the knee-to-wall side photo',
      withTask('knee-to-wall-left', { criteria: [], photos: { side: { landmarks: { 'near-knee': p(500, 1100), 'near-ankle': p(500, 1000) } } } }),
      'tasks.knee-to-wall-left.photos.side.landmarks.near-knee',
    ],
    [
      'right and left hips swapped',
      withTask('two-leg-squat', { criteria: [], photos: { front: { landmarks: { 'right-hip': p(600, 600), 'left-hip': p(400, 600) } } } }),
      'tasks.two-leg-squat.photos.front.landmarks.right-hip',
    ],
    [
      'a NaN coordinate',
      withTask('drop-landing', { criteria: [], photos: { front: { landmarks: { 'right-hip': p(Number.NaN, 1) } } } }),
      'tasks.drop-landing.photos.front.landmarks.right-hip.x',
    ],
    [
      'an unknown landmark',
      withTask('drop-landing', { criteria: [], photos: { front: { landmarks: { 'left-elbow': p(1, 1) } } } }),
      'tasks.drop-landing.photos.front.landmarks.left-elbow',
    ],
    ['a side photo for a front-only task', withTask('drop-landing', { criteria: [], photos: { side: { landmarks: {} } } }), 'tasks.drop-landing.photos.side'],
    ['negative distance', withTask('knee-to-wall-left', { criteria: [], distanceCm: -1 }), 'tasks.knee-to-wall-left.distanceCm'],
    ['distance in mm', withTask('knee-to-wall-left', { criteria: [], distanceCm: 95 }), 'tasks.knee-to-wall-left.distanceCm'],
    ['a distance on a task without one', withTask('two-leg-squat', { criteria: [], distanceCm: 5 }), 'tasks.two-leg-squat.distanceCm'],
    ['an unknown criterion', withTask('two-leg-squat', { criteria: ['sls-knee-in'] }), 'tasks.two-leg-squat.criteria'],
    ['criteria missing', withTask('two-leg-squat', {}), 'tasks.two-leg-squat.criteria'],
    ['an unknown task', withTask('star-jump' as 'two-leg-squat', { criteria: [] }), 'tasks.star-jump'],
    ['age 0', makeAssessment({ athlete: { sex: 'male', ageYears: 0 } }), 'athlete.ageYears'],
    ['unknown sex', makeAssessment({ athlete: { sex: 'x' as 'male', ageYears: 12 } }), 'athlete.sex'],
    [
      'sitting height above stature',
      makeAssessment({ athlete: { sex: 'male', ageYears: 12, statureCm: 120, sittingHeightCm: 125 } }),
      'athlete.sittingHeightCm',
    ],
    ['zero 1RM', makeAssessment({ oneRepMaxKg: 0 }), 'oneRepMaxKg'],
    ['pain clearance not a yes/no', makeAssessment({ options: { painCleared: 'yes' as unknown as boolean } }), 'options.painCleared'],
    ['impossible date', makeAssessment({ options: { today: '2025-02-30' } }), 'options.today'],
    ['earlier pain without a day', makeAssessment({ options: { earlierPain: { day: 'soon', taskIds: ['drop-landing'] } } }), 'options.earlierPain.day'],
    [
      'earlier pain in an unknown task',
      makeAssessment({ options: { earlierPain: { day: '2026-09-16', taskIds: ['star-jump' as 'drop-landing'] } } }),
      'options.earlierPain.taskIds',
    ],
    ['zero re-screen weeks', makeAssessment({ options: { rescreenWeeks: 0 } }), 'options.rescreenWeeks'],
  ])('%s', (_n, input, field) => {
    expect(() => evaluateAssessment(input)).toThrow(EngineInputError);
    try {
      evaluateAssessment(input);
    } catch (e) {
      expect((e as EngineInputError).field).toBe(field);
      expect((e as EngineInputError).message.startsWith(field)).toBe(true);
    }
  });
});

// Our rule (camera facing the athlete: their right on the image's left; common practice, no source for the
// convention): the same check the engine refuses on is offered to screens, so they can say it first.
describe('swappedFrontPair', () => {
  it('names the first front pair placed the wrong way round or on top of each other, and nothing otherwise', () => {
    expect(swappedFrontPair({ 'right-hip': p(400, 700), 'left-hip': p(560, 700) })).toBeNull();
    expect(swappedFrontPair({ 'right-hip': p(560, 700), 'left-hip': p(400, 700) })).toEqual(['right-hip', 'left-hip']);
    expect(swappedFrontPair({ 'right-asis': p(480, 650), 'left-asis': p(480, 652) })).toEqual(['right-asis', 'left-asis']);
    // One of a pair alone cannot be the wrong way round.
    expect(swappedFrontPair({ 'right-asis': p(900, 650) })).toBeNull();
  });

  it('is what the engine refuses: a swapped pair is an input error on the right-side point', () => {
    const input = makeAssessment({
      tasks: { 'two-leg-squat': { criteria: [], photos: { front: { landmarks: { 'right-asis': p(560, 650), 'left-asis': p(400, 650) } } } } },
    });
    expect(() => evaluateAssessment(input)).toThrow(/right-asis must be on the image's left of left-asis/);
  });
});

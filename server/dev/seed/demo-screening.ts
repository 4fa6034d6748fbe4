// Demo screening history: three past rounds per squad of the demo club and one open round, with
// invented but plausible drafts (body measurements, ticked criteria, landmarks on a 900x1600 photo),
// submitted through the real service and engine so results, flags and plans are what the app would
// have made. Each athlete has a tendency (knee valgus that improves or persists, pelvic drop, stiff
// ankles, trunk lean, or nothing much) so that histories and squad trends show something.
// Deterministic: every fresh demo looks the same. No photos: the landmarks stand on their own.
import { and, eq, inArray } from 'drizzle-orm';
import type { Db } from '@/db/client';
import { athletes, memberships, users } from '@/db/schema';
import { decimalAge } from '@/features/athletes/age';
import type { AssessmentDraft, LandmarkSet, TaskDraft } from '@/features/screening/contract';
import type { LandmarkId, Point, Side, TaskId } from '@/features/screening/engine';
import type { ClubScope } from '@/server/access/scope';
import { validateDraft } from '@/server/screening/draft-validation';
import { screeningRepo, type Executor } from '@/server/screening/screening.repo';
import { submitAssessment } from '@/server/screening/screening.service';
import type { DemoIds } from './demo';
import { DEMO_USERS } from './demo-accounts';
import { seededRandom } from './random';

const PAST_ROUNDS = [
  { name: 'Pre-season', dates: ['2026-03-09', '2026-03-11'] },
  { name: 'Mid-season', dates: ['2026-06-08', '2026-06-10'] },
  { name: 'Autumn check', dates: ['2026-09-14', '2026-09-16'] },
] as const;
/** The open round a tester finds on first start: every athlete still to screen. */
export const DEMO_OPEN_ROUND = { name: 'Winter check', screenedOn: '2026-12-01' } as const;
/** In each squad's newest past round, these athletes (by roster position) are not finished yet. */
const NEWEST_IN_PROGRESS = [8];
const NEWEST_NOT_STARTED = [9, 10, 11];
/**
 * In the second squad's newest past round, the athlete at this roster position said the drop landing hurt,
 * and no physiotherapist has seen them since: the demo's one screen waiting for a clearance.
 */
const NEWEST_PAIN = 5;

type Tendency = 'valgus-improving' | 'valgus-persisting' | 'pelvic-drop-persisting' | 'pelvic-drop-cleared' | 'stiff-ankles' | 'trunk-lean' | 'clean';

/** By roster position; the demo parent's children are 0 (Maya, under-13) and 1 (Theo, under-15). */
const TENDENCIES: readonly Tendency[] = [
  'valgus-improving',
  'pelvic-drop-persisting',
  'clean',
  'stiff-ankles',
  'valgus-persisting',
  'clean',
  'pelvic-drop-cleared',
  'trunk-lean',
  'valgus-improving',
  'clean',
  'stiff-ankles',
  'clean',
];

type Rand = () => number;

const DEG = Math.PI / 180;
const r1 = (n: number) => Math.round(n * 10) / 10;
const pt = (x: number, y: number): Point => ({ x: r1(x), y: r1(y) });
const jitter = (rand: Rand, size: number) => (rand() * 2 - 1) * size;

// --- Landmarks on a 900x1600 front photo (camera facing the athlete: their right on the image's left)

const CENTRE_X = 450;
const HIP_Y = 820;

/** Hip, knee and ankle of one leg whose knee angle from the front (FPPA) is `fppa` degrees (+ = valgus). */
function frontLeg(side: Side, hip: Point, fppa: number, ids: readonly [LandmarkId, LandmarkId, LandmarkId], out: LandmarkSet) {
  const half = (fppa / 2) * DEG;
  // The athlete's midline is towards +x for the right leg and -x for the left.
  const medial = side === 'right' ? 1 : -1;
  const knee = { x: hip.x + medial * 240 * Math.sin(half), y: hip.y + 240 * Math.cos(half) };
  const ankle = { x: knee.x - medial * 260 * Math.sin(half), y: knee.y + 260 * Math.cos(half) };
  out[ids[0]] = pt(hip.x, hip.y);
  out[ids[1]] = pt(knee.x, knee.y);
  out[ids[2]] = pt(ankle.x, ankle.y);
}

/** Front pelvic points with the pelvis `drop` degrees lower on the side opposite `stance`. */
function pelvis(stance: Side, drop: number, out: LandmarkSet) {
  const dy = Math.tan(drop * DEG) * 120;
  out['right-asis'] = pt(CENTRE_X - 60, HIP_Y - 40 + (stance === 'left' ? dy : 0));
  out['left-asis'] = pt(CENTRE_X + 60, HIP_Y - 40 + (stance === 'right' ? dy : 0));
}

function trunkFront(lean: number, out: LandmarkSet) {
  out['mid-hip'] = pt(CENTRE_X, HIP_Y);
  out['mid-shoulder'] = pt(CENTRE_X + Math.tan(lean * DEG) * 340, HIP_Y - 340);
}

/** Side photo, athlete facing the image's right: shin `shin` deg forward, thigh `thigh` deg above level, trunk `trunk` deg forward. */
function sideBody(shin: number, thigh: number, trunk: number, out: LandmarkSet) {
  const ankle = { x: 380, y: 1420 };
  const knee = { x: ankle.x + 330 * Math.sin(shin * DEG), y: ankle.y - 330 * Math.cos(shin * DEG) };
  const hip = { x: knee.x - 300 * Math.cos(thigh * DEG), y: knee.y - 300 * Math.sin(thigh * DEG) };
  const shoulder = { x: hip.x + 380 * Math.sin(trunk * DEG), y: hip.y - 380 * Math.cos(trunk * DEG) };
  out['near-ankle'] = pt(ankle.x, ankle.y);
  out['near-knee'] = pt(knee.x, knee.y);
  out['near-hip'] = pt(hip.x, hip.y);
  out['near-shoulder'] = pt(shoulder.x, shoulder.y);
}

// --- One athlete's screen in one round -------------------------------------------------------------

type Athlete = { id: string; sex: 'female' | 'male'; racketHand: Side; photoConsent: boolean };
/** What stays the same for an athlete from round to round. */
type Profile = { tendency: Tendency; worse: Side; heightOffsetCm: number; sittingRatio: number; bmi: number };

function profileOf(tendency: Tendency, rand: Rand): Profile {
  return {
    tendency,
    worse: rand() < 0.5 ? 'left' : 'right',
    heightOffsetCm: jitter(rand, 6),
    sittingRatio: 0.515 + jitter(rand, 0.012),
    bmi: 17.5 + rand() * 3.5,
  };
}

/** How marked the tendency is in round 0, 1, 2: 1 = clearly there, 0 = gone. */
function strength(tendency: Tendency, round: number): number {
  switch (tendency) {
    case 'valgus-improving':
    case 'pelvic-drop-cleared':
      return [1, 0.6, 0.1][round]!;
    case 'clean':
      return 0;
    default:
      return [1, 0.95, 1][round]!;
  }
}

function demoDraft(a: Athlete, p: Profile, round: number, rand: Rand, ageYears: number): AssessmentDraft {
  const { tendency, worse } = p;
  const k = strength(tendency, round);
  const valgus = tendency.startsWith('valgus') ? k : 0;
  const drop = tendency.startsWith('pelvic-drop') ? k : 0;
  const stiff = tendency === 'stiff-ankles' ? k : 0;
  const lean = tendency === 'trunk-lean' ? k : 0;
  const landmarks = a.photoConsent;

  // Juniors grow about 6 cm a year; each athlete keeps their own size, give or take the tape.
  const statureCm = r1(80 + 6 * ageYears + p.heightOffsetCm + jitter(rand, 0.3));
  const body = {
    statureCm,
    sittingHeightCm: r1(statureCm * p.sittingRatio + jitter(rand, 0.3)),
    massKg: r1((statureCm / 100) ** 2 * p.bmi + jitter(rand, 0.4)),
  };

  const tasks: Partial<Record<TaskId, TaskDraft>> = {};
  const task = (id: TaskId, criteria: (string | false)[], extra: Partial<TaskDraft> = {}) => {
    tasks[id] = { criteria: criteria.filter((c): c is string => c !== false), ...extra };
  };
  const front = (fill: (out: LandmarkSet) => void): Partial<TaskDraft> => {
    if (!landmarks) return {};
    const out: LandmarkSet = {};
    fill(out);
    return { landmarks: { front: out } };
  };
  const both = (fillFront: (out: LandmarkSet) => void, fillSide: (out: LandmarkSet) => void): Partial<TaskDraft> => {
    if (!landmarks) return {};
    const f: LandmarkSet = {};
    const s: LandmarkSet = {};
    fillFront(f);
    fillSide(s);
    return { landmarks: { front: f, side: s } };
  };
  const fppaFor = (side: Side, base: number) => base + (side === worse ? 4 : 0) * valgus + jitter(rand, 1.5);

  // Two-leg squat: valgus shows less than on one leg; stiff ankles lift the heels and cut the depth.
  const squatValgus = 4 + 14 * valgus;
  const depth = -6 + 16 * stiff + jitter(rand, 3);
  task(
    'two-leg-squat',
    [valgus > 0.5 && `squat-${worse}-knee-in`, stiff > 0.5 && 'squat-heels-lift', depth > 0 && 'squat-not-deep', lean > 0.5 && 'squat-chest-drops'],
    both(
      (out) => {
        frontLeg('right', pt(CENTRE_X - 70, HIP_Y), fppaFor('right', squatValgus), ['right-hip', 'right-knee', 'right-ankle'], out);
        frontLeg('left', pt(CENTRE_X + 70, HIP_Y), fppaFor('left', squatValgus), ['left-hip', 'left-knee', 'left-ankle'], out);
        pelvis('left', jitter(rand, 2), out);
        trunkFront(jitter(rand, 3), out);
      },
      (out) => sideBody(34 - 8 * stiff + jitter(rand, 2), depth, 38 - 8 * stiff + 22 * lean + jitter(rand, 3), out),
    ),
  );

  for (const side of ['left', 'right'] as const) {
    const v = (a.sex === 'female' ? 6 : 4) + 16 * valgus;
    const d = 2 + 9 * drop * (side === worse ? 1 : 0.6);
    const fppa = fppaFor(side, v);
    task(
      `single-leg-squat-${side}`,
      [
        fppa > 14 && 'sls-knee-in',
        fppa > 18 && 'sls-hip-in',
        d > 6 && 'sls-pelvis-drop',
        lean > 0.5 && 'sls-trunk-side',
        (valgus > 0.5 || drop > 0.5) && rand() < 0.5 && 'sls-control',
        rand() < 0.08 && 'sls-balance',
      ],
      front((out) => {
        const hip = pt(side === 'right' ? CENTRE_X - 70 : CENTRE_X + 70, HIP_Y);
        frontLeg(side, hip, fppa, [`${side}-hip`, `${side}-knee`, `${side}-ankle`], out);
        pelvis(side, d + jitter(rand, 1), out);
        trunkFront((side === 'right' ? -1 : 1) * (3 + 9 * lean + jitter(rand, 2)), out);
      }),
    );
    task(
      `single-leg-stance-${side}`,
      [d > 6 && 'stance-pelvis-drop', lean > 0.5 && 'stance-trunk-shift', rand() < 0.1 && 'stance-touch-down'],
      front((out) => {
        pelvis(side, d - 1 + jitter(rand, 1), out);
        trunkFront((side === 'right' ? -1 : 1) * (2 + 6 * lean + jitter(rand, 1.5)), out);
      }),
    );

    // Knee-to-wall: about 12 cm is usual; stiff ankles sit under the 10 cm line, one side worse.
    const distance = r1(Math.max(2, 12.5 - 5 * stiff * (side === worse ? 1.2 : 0.7) + jitter(rand, 1.2)));
    const ktw: Partial<TaskDraft> = { distanceCm: distance };
    if (landmarks && rand() < 0.6) {
      // About 3.6 degrees of shin angle per cm (the engine's notes), from a 4 degree start.
      const shin = 4 + 3.6 * distance + jitter(rand, 2);
      const ankle = { x: 300, y: 1400 };
      ktw.landmarks = {
        side: { 'near-ankle': pt(ankle.x, ankle.y), 'near-knee': pt(ankle.x + 400 * Math.sin(shin * DEG), ankle.y - 400 * Math.cos(shin * DEG)) },
      };
    }
    task(`knee-to-wall-${side}`, [stiff > 0.5 && 'ktw-pinch-front', stiff > 0.5 && rand() < 0.4 && 'ktw-heel-lifts'], ktw);
  }

  // Drop landing: the two-leg norms are higher for girls. One athlete in ten skips it (a sore ankle).
  if (rand() < 0.1) {
    task('drop-landing', [], { skipped: true, skipReason: 'Sore ankle from the weekend tournament: no landing today.' });
  } else {
    const landing = (a.sex === 'female' ? 7 : 3) + 16 * valgus;
    task(
      'drop-landing',
      [
        valgus > 0.5 && 'landing-right-knee-in',
        valgus > 0.5 && 'landing-left-knee-in',
        stiff > 0.5 && 'landing-stiff',
        rand() < 0.1 && 'landing-one-foot-first',
      ],
      front((out) => {
        frontLeg('right', pt(CENTRE_X - 70, HIP_Y), fppaFor('right', landing), ['right-hip', 'right-knee', 'right-ankle'], out);
        frontLeg('left', pt(CENTRE_X + 70, HIP_Y), fppaFor('left', landing), ['left-hip', 'left-knee', 'left-ankle'], out);
      }),
    );
  }

  const lungeFppa = (a.sex === 'female' ? 5 : 3) + 14 * valgus + jitter(rand, 1.5);
  task(
    'racket-side-lunge',
    [lungeFppa > 12 && 'lunge-knee-in', lean > 0.5 && 'lunge-chest-drops', rand() < 0.15 && 'lunge-wobble'],
    both(
      (out) => {
        frontLeg(a.racketHand, pt(a.racketHand === 'right' ? CENTRE_X - 70 : CENTRE_X + 70, HIP_Y), lungeFppa, ['lead-hip', 'lead-knee', 'lead-ankle'], out);
        trunkFront(jitter(rand, 3), out);
      },
      (out) => sideBody(18 + jitter(rand, 3), 4 + jitter(rand, 3), 14 + 22 * lean + jitter(rand, 3), out),
    ),
  );

  return { body, tasks, step: 'racket-side-lunge' };
}

/** The first screens of an unfinished assessment: body and the first task or two. */
function partOf(draft: AssessmentDraft): AssessmentDraft {
  const first: Partial<Record<TaskId, TaskDraft>> = {};
  if (draft.tasks['two-leg-squat']) first['two-leg-squat'] = draft.tasks['two-leg-squat'];
  if (draft.tasks['single-leg-squat-left']) first['single-leg-squat-left'] = draft.tasks['single-leg-squat-left'];
  return { body: draft.body, tasks: first, step: 'single-leg-squat-right' };
}

/**
 * Adds the screening history to a freshly seeded demo club, all in one transaction. Rounds, drafts and
 * submissions go through the screening repository and service, so they follow the same rules as the API.
 */
export async function seedDemoScreening(db: Db, ids: Pick<DemoIds, 'clubId' | 'squadIds' | 'athleteIds'>): Promise<void> {
  const rand = seededRandom(20260309);
  await db.transaction(async (tx) => {
    const staff = await tx
      .select({ id: users.id, email: users.email })
      .from(users)
      .innerJoin(memberships, and(eq(memberships.userId, users.id), eq(memberships.clubId, ids.clubId)))
      .where(
        inArray(
          users.email,
          DEMO_USERS.map((u) => u.email),
        ),
      );
    const userId = (role: string) => staff.find((s) => s.email === DEMO_USERS.find((u) => u.role === role)!.email)!.id;
    const scopeOf = (role: 'head_coach' | 'tester'): ClubScope => ({ userId: userId(role), clubId: ids.clubId, role, athleteIds: null });
    const coach = screeningRepo(tx as Executor, scopeOf('head_coach'));
    const testerScope = scopeOf('tester');
    const tester = screeningRepo(tx as Executor, testerScope);

    for (const [s, squadId] of ids.squadIds.entries()) {
      const rows = await tx
        .select({ id: athletes.id, sex: athletes.sex, racketHand: athletes.racketHand, dateOfBirth: athletes.dateOfBirth })
        .from(athletes)
        .where(eq(athletes.squadId, squadId));
      // Roster order as seeded, so tendencies land on the same athletes every time.
      const roster = ids.athleteIds.map((id) => rows.find((r) => r.id === id)).filter((r) => r !== undefined);
      const consent = new Map<string, boolean>();
      for (const r of roster) consent.set(r.id, await tester.photoConsent(r.id));
      const profiles = roster.map((_, i) => profileOf(TENDENCIES[i % TENDENCIES.length]!, rand));

      for (const [round, spec] of PAST_ROUNDS.entries()) {
        const screenedOn = spec.dates[s % spec.dates.length]!;
        const roundId = await coach.createRound({ squadId, name: spec.name, screenedOn });
        const assessmentsByAthlete = new Map((await tester.roundAthletes(roundId)).map((a) => [a.athleteId, a.assessmentId]));
        const newest = round === PAST_ROUNDS.length - 1;
        for (const [i, athlete] of roster.entries()) {
          const assessmentId = assessmentsByAthlete.get(athlete.id)!;
          const ageYears = decimalAge(athlete.dateOfBirth, screenedOn);
          const a: Athlete = { id: athlete.id, sex: athlete.sex, racketHand: athlete.racketHand, photoConsent: consent.get(athlete.id) ?? false };
          // Drawn for everyone, so an athlete's numbers do not depend on who else was screened.
          const draft = demoDraft(a, profiles[i]!, round, rand, ageYears);
          if (newest && NEWEST_NOT_STARTED.includes(i)) continue;
          if (newest && s === 1 && i === NEWEST_PAIN) {
            const { skipped: _skipped, skipReason: _reason, ...landing } = draft.tasks['drop-landing'] ?? { criteria: [] };
            draft.tasks['drop-landing'] = { ...landing, painReported: true };
          }
          if (newest && NEWEST_IN_PROGRESS.includes(i)) {
            await tester.saveDraft(assessmentId, 0, validateDraft(partOf(draft)));
            continue;
          }
          await tester.saveDraft(assessmentId, 0, validateDraft(draft));
          const at = new Date(`${screenedOn}T16:30:00Z`);
          at.setUTCMinutes(at.getUTCMinutes() + 12 * i);
          await submitAssessment(tx as Executor, testerScope, assessmentId, { at });
        }
      }
      if (s === 0) await coach.createRound({ squadId, name: DEMO_OPEN_ROUND.name, screenedOn: DEMO_OPEN_ROUND.screenedOn });
    }
  });
}

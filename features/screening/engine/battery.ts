/**
 * The Squadline screening battery, as data. Capture screens render from this
 * file; nothing else hard-codes a task, a criterion or a landmark list.
 *
 * Ticking a criterion means "seen": every criterion describes something the
 * tester observed, never something done well. Ids are stable; texts are our
 * own wording and may be reworded without changing the id.
 */
import type { FlagSide, LandmarkId, PairId, PatternId, Side, SingleLegSquatArea, TaskId, View } from './types';

export interface CriterionSpec {
  id: string;
  /** What the tester ticks, in plain words. */
  text: string;
  /** The pattern this observation raises, if any. */
  indicates?: PatternId;
  /** For a two-leg task, the side the observation is about. */
  side?: Side;
  /** Single-leg squat only: the area used by the rating. */
  area?: SingleLegSquatArea;
}

export interface ViewSpec {
  view: View;
  /** false: the photo adds a measurement but the task stands without it. */
  required: boolean;
  /** When to take the photo. */
  capture: string;
  landmarks: readonly LandmarkId[];
}

export interface TaskSpec {
  id: TaskId;
  title: string;
  /** The working leg of a single-leg task (stance or tested leg); null for two-leg tasks. */
  side: Side | null;
  /** The left/right pair this task belongs to. */
  pair: PairId | null;
  /** The lunge's front leg is the racket side, known only from athlete.racketHand. */
  leadLegIsRacketSide: boolean;
  instructions: string;
  /** What the tester should watch for. */
  lookFor: string;
  criteria: readonly CriterionSpec[];
  views: readonly ViewSpec[];
  /** A distance the tester measures with a tape, or null. */
  distance: { label: string; hint: string; minCm: number; maxCm: number } | null;
  safety: readonly string[];
  /** Whether ticked criteria are turned into a good / fair / poor rating. */
  rated: boolean;
}

const STOP_ON_PAIN = 'Stop at once if the athlete reports pain, record it with the pain box, and do not repeat the task.';

const FRONT_LEGS: readonly LandmarkId[] = ['right-hip', 'right-knee', 'right-ankle', 'left-hip', 'left-knee', 'left-ankle'];
const SIDE_BODY: readonly LandmarkId[] = ['near-shoulder', 'near-hip', 'near-knee', 'near-ankle'];

/**
 * Single-leg squat criteria. The five areas (overall impression, trunk,
 * pelvis, hip, knee) follow the clinician rating of Crossley KM, Zhang WJ,
 * Schache AG, Bryant A, Cowan SM. Performance on the single-leg squat task
 * indicates hip abductor muscle function. Am J Sports Med.
 * 2011;39(4):866-873. The wording of each criterion is ours.
 */
function singleLegSquatCriteria(side: Side): CriterionSpec[] {
  const free = side === 'left' ? 'right' : 'left';
  return [
    { id: 'sls-balance', area: 'overall', text: `Loses balance: the ${free} foot touches down or a hand grabs for support.` },
    { id: 'sls-control', area: 'overall', text: 'Moves jerkily, or drops quickly into the squat instead of lowering smoothly.' },
    { id: 'sls-trunk-side', area: 'trunk', indicates: 'excessive-trunk-lean', text: 'Upper body tips sideways.' },
    { id: 'sls-trunk-twist', area: 'trunk', indicates: 'excessive-trunk-lean', text: 'Upper body twists or pitches well forward.' },
    { id: 'sls-pelvis-drop', area: 'pelvis', indicates: 'contralateral-pelvic-drop', text: `Pelvis sinks on the ${free} (lifted-leg) side.` },
    { id: 'sls-pelvis-shift', area: 'pelvis', text: 'Pelvis slides sideways or turns.' },
    { id: 'sls-hip-in', area: 'hip', indicates: 'dynamic-knee-valgus', text: 'Thigh swings in towards the other leg.' },
    { id: 'sls-knee-in', area: 'knee', indicates: 'dynamic-knee-valgus', text: 'Knee travels inside the line of the second toe.' },
    { id: 'sls-knee-wobble', area: 'knee', text: 'Knee wobbles from side to side.' },
  ];
}

function singleLegSquat(side: Side): TaskSpec {
  return {
    id: side === 'left' ? 'single-leg-squat-left' : 'single-leg-squat-right',
    title: `Single-leg squat, ${side} leg`,
    side,
    pair: 'single-leg-squat',
    leadLegIsRacketSide: false,
    instructions: `Stand on the ${side} leg, arms crossed on the chest, the other foot just off the floor. Squat slowly to a comfortable depth (about a quarter to half squat) and back up, five times.`,
    lookFor:
      'Over the five squats: balance and smoothness, whether the upper body stays upright, whether the pelvis stays level, and where the knee travels relative to the foot.',
    criteria: singleLegSquatCriteria(side),
    views: [
      {
        view: 'front',
        required: true,
        capture: 'Camera at hip height, 3 m in front. Take the photo at the lowest point of a typical repetition.',
        landmarks: [`${side}-hip`, `${side}-knee`, `${side}-ankle`, 'right-asis', 'left-asis', 'mid-shoulder', 'mid-hip'],
      },
    ],
    distance: null,
    safety: [STOP_ON_PAIN, 'Stand beside a wall or rail the athlete can touch if they lose balance.'],
    rated: true,
  };
}

function singleLegStance(side: Side): TaskSpec {
  const free = side === 'left' ? 'right' : 'left';
  return {
    id: side === 'left' ? 'single-leg-stance-left' : 'single-leg-stance-right',
    title: `Single-leg stance, ${side} leg`,
    side,
    pair: 'single-leg-stance',
    leadLegIsRacketSide: false,
    instructions: `Stand on the ${side} leg, hands on hips, the ${free} knee lifted to hip height. Hold for up to 30 seconds.`,
    lookFor: 'Whether the pelvis stays level and the upper body stays over the standing leg without shifting.',
    criteria: [
      { id: 'stance-pelvis-drop', indicates: 'contralateral-pelvic-drop', text: `Pelvis sinks on the ${free} (lifted-leg) side.` },
      { id: 'stance-trunk-shift', indicates: 'excessive-trunk-lean', text: 'Upper body leans over the standing leg to keep balance.' },
      { id: 'stance-touch-down', text: 'The lifted foot touches down before 30 seconds.' },
      { id: 'stance-hands-off', text: 'Hands leave the hips to keep balance.' },
    ],
    views: [
      {
        view: 'front',
        required: true,
        capture: 'Camera at hip height, 3 m in front. Take the photo after about 10 seconds of steady standing.',
        landmarks: ['right-asis', 'left-asis', 'mid-shoulder', 'mid-hip'],
      },
    ],
    distance: null,
    safety: [STOP_ON_PAIN, 'Stand beside a wall or rail the athlete can touch if they lose balance.'],
    rated: false,
  };
}

function kneeToWall(side: Side): TaskSpec {
  return {
    id: side === 'left' ? 'knee-to-wall-left' : 'knee-to-wall-right',
    title: `Knee-to-wall lunge, ${side} ankle`,
    side,
    pair: 'knee-to-wall',
    leadLegIsRacketSide: false,
    instructions: `Barefoot, ${side} foot pointing straight at the wall, the other foot behind. Bend the ${side} knee to touch the wall with the heel kept down. Move the foot back a little at a time until the knee only just touches. Three tries; record the best.`,
    lookFor: 'The heel must stay flat and the knee must travel straight over the second toe. A try where the heel lifts does not count.',
    criteria: [
      { id: 'ktw-pinch-front', text: 'Feels a block or pinch at the front of the ankle rather than a stretch in the calf.' },
      { id: 'ktw-knee-drifts', text: 'Knee drifts inwards to reach the wall.' },
      { id: 'ktw-heel-lifts', text: 'Heel keeps lifting: the distance may be over-estimated.' },
    ],
    views: [
      {
        view: 'side',
        required: false,
        capture: 'Optional. Camera at knee height, side-on to the working leg, at the best try with the knee on the wall.',
        landmarks: ['near-knee', 'near-ankle'],
      },
    ],
    distance: {
      label: 'Big toe to wall (cm)',
      hint: 'Measure from the tip of the big toe to the wall at the best try.',
      minCm: 0,
      maxCm: 30,
    },
    safety: [STOP_ON_PAIN],
    rated: false,
  };
}

export const BATTERY: readonly TaskSpec[] = [
  {
    id: 'two-leg-squat',
    title: 'Two-leg full squat',
    side: null,
    pair: null,
    leadLegIsRacketSide: false,
    instructions:
      'Feet about shoulder width, toes slightly out, arms straight out in front. Squat as deep as possible with the heels down, pause, and stand up. Three repetitions, bodyweight only.',
    lookFor: 'Depth, whether the heels stay down, where the knees travel, whether the weight stays even, and how far the chest tips forward.',
    criteria: [
      { id: 'squat-right-knee-in', side: 'right', indicates: 'dynamic-knee-valgus', text: 'Right knee travels inside the line of the foot.' },
      { id: 'squat-left-knee-in', side: 'left', indicates: 'dynamic-knee-valgus', text: 'Left knee travels inside the line of the foot.' },
      { id: 'squat-heels-lift', indicates: 'heels-lifting', text: 'Heels come off the floor.' },
      { id: 'squat-not-deep', indicates: 'squat-depth-not-reached', text: 'Hip crease stays above the top of the knee at the lowest point.' },
      { id: 'squat-chest-drops', indicates: 'excessive-trunk-lean', text: 'Chest drops well forward of the shins.' },
      { id: 'squat-weight-shift', indicates: 'left-right-asymmetry', text: 'Weight shifts towards one side.' },
    ],
    views: [
      {
        view: 'front',
        required: true,
        capture: 'Camera at hip height, 3 m in front. Take the photo at the lowest point.',
        landmarks: [...FRONT_LEGS, 'right-asis', 'left-asis', 'mid-shoulder', 'mid-hip'],
      },
      {
        view: 'side',
        required: true,
        capture: 'Camera at hip height, 3 m to the side. Take the photo at the lowest point.',
        landmarks: SIDE_BODY,
      },
    ],
    distance: null,
    safety: [STOP_ON_PAIN, 'Bodyweight only; no added load during the screen.'],
    rated: false,
  },
  singleLegSquat('left'),
  singleLegSquat('right'),
  {
    id: 'drop-landing',
    title: 'Drop landing from a low box',
    side: null,
    pair: null,
    leadLegIsRacketSide: false,
    instructions: 'Stand on a box 20-30 cm high. Step off (do not jump up) and land on both feet, then hold the landing for two seconds. Three tries.',
    lookFor: 'Where each knee travels at the deepest point of the landing, whether both feet land together, and how softly the athlete lands.',
    criteria: [
      { id: 'landing-right-knee-in', side: 'right', indicates: 'dynamic-knee-valgus', text: 'Right knee moves inside the line of the foot on landing.' },
      { id: 'landing-left-knee-in', side: 'left', indicates: 'dynamic-knee-valgus', text: 'Left knee moves inside the line of the foot on landing.' },
      { id: 'landing-one-foot-first', indicates: 'left-right-asymmetry', text: 'One foot lands clearly before the other, or takes more weight.' },
      { id: 'landing-stiff', text: 'Lands stiff and loud, with little bend at the hips and knees.' },
    ],
    views: [
      {
        view: 'front',
        required: true,
        capture: 'Camera at knee height, 3 m in front of the landing spot. Take the photo at the deepest point of the landing (burst or video frame).',
        landmarks: FRONT_LEGS,
      },
    ],
    distance: null,
    safety: [
      STOP_ON_PAIN,
      'Box height about 20-30 cm, stable and non-slip; never higher for a screen.',
      'A spotter stands beside the landing spot.',
      'Land on a non-slip floor or firm mat, clear of obstacles.',
    ],
    rated: false,
  },
  singleLegStance('left'),
  singleLegStance('right'),
  kneeToWall('left'),
  kneeToWall('right'),
  {
    id: 'racket-side-lunge',
    title: 'Racket-side forward lunge',
    side: null,
    pair: null,
    leadLegIsRacketSide: true,
    instructions:
      'From a ready stance, lunge forward onto the racket-side leg as if reaching for a net shot, hold the lowest point for a second, and push back. Three repetitions.',
    lookFor: 'Where the front knee travels relative to the foot, and how upright the upper body stays.',
    criteria: [
      { id: 'lunge-knee-in', indicates: 'dynamic-knee-valgus', text: 'Front knee travels inside the line of the foot.' },
      { id: 'lunge-chest-drops', indicates: 'excessive-trunk-lean', text: 'Upper body folds well forward over the front thigh.' },
      { id: 'lunge-wobble', text: 'Wobbles or needs a second step to stop.' },
      { id: 'lunge-slow-return', text: 'Struggles to push back to the start.' },
    ],
    views: [
      {
        view: 'front',
        required: true,
        capture: 'Camera at hip height, 3 m in front of the lunge landing spot. Take the photo at the lowest point.',
        landmarks: ['lead-hip', 'lead-knee', 'lead-ankle', 'mid-shoulder', 'mid-hip'],
      },
      {
        view: 'side',
        required: true,
        capture: 'Camera at hip height, 3 m to the side of the front leg. Take the photo at the lowest point.',
        landmarks: SIDE_BODY,
      },
    ],
    distance: null,
    safety: [STOP_ON_PAIN, 'Non-slip court or floor; warm up first.'],
    rated: false,
  },
];

export const TASK_IDS: readonly TaskId[] = BATTERY.map((t) => t.id);

const BY_ID = new Map<string, TaskSpec>(BATTERY.map((t) => [t.id, t]));

export function isTaskId(id: string): id is TaskId {
  return BY_ID.has(id);
}

export function getTask(id: TaskId): TaskSpec {
  const task = BY_ID.get(id);
  if (!task) throw new Error(`unknown task ${id}`);
  return task;
}

/** The two tasks of a pair, left first. */
export function pairTasks(pair: PairId): readonly [TaskSpec, TaskSpec] {
  const left = BATTERY.find((t) => t.pair === pair && t.side === 'left');
  const right = BATTERY.find((t) => t.pair === pair && t.side === 'right');
  if (!left || !right) throw new Error(`pair ${pair} is incomplete`);
  return [left, right];
}

/**
 * The side a ticked criterion is about: its own side in a two-leg task, the
 * working leg in a single-leg task, 'both' otherwise; null for the trunk in a
 * two-leg task (the trunk has no side).
 */
export function criterionSide(task: TaskSpec, criterion: CriterionSpec, racketHand: Side | undefined): FlagSide {
  if (criterion.side) return criterion.side;
  if (task.side) return task.side;
  if (task.leadLegIsRacketSide && criterion.indicates !== 'excessive-trunk-lean') return racketHand ?? 'both';
  return criterion.indicates === 'excessive-trunk-lean' ? null : 'both';
}

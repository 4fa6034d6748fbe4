/**
 * Turns validated task results into measurements and single-leg squat
 * ratings. A task not done or a landmark not placed produces nothing.
 */
import { pairTasks, type TaskSpec } from './battery';
import { EngineInputError } from './errors';
import { frontalPlaneProjectionAngle, kneeFlexion, pelvicObliquity, thighAngle, tibialInclination, trunkLean } from './geometry';
import { asymmetry, limbSymmetryIndex } from './symmetry';
import type { FlagSide, LandmarkId, Measurement, MetricId, PairId, Point, Rating, Side, SingleLegSquatArea, TaskId, TaskRating } from './types';
import type { NormalizedAssessment, NormalizedTask } from './validate';

const SIDES: readonly Side[] = ['right', 'left'];
const AREA_ORDER: readonly SingleLegSquatArea[] = ['overall', 'trunk', 'pelvis', 'hip', 'knee'];
const RATING_GRADE: Record<Rating, number> = { good: 0, fair: 1, poor: 2 };

export const RATING_BASIS = 'Our design: 0 areas with a ticked criterion = good, 1-2 areas = fair, 3-5 areas = poor. Areas after Crossley et al. 2011.';

type Scope = TaskId | PairId;

interface Draft {
  scope: Scope;
  metric: MetricId;
  taskId: TaskId | null;
  comparesTasks?: readonly [TaskId, TaskId];
  side: FlagSide;
  value: number;
  unit: Measurement['unit'];
  label: string;
}

function toMeasurement(d: Draft): Measurement {
  if (!Number.isFinite(d.value)) {
    // Every geometry function returns a finite angle for validated points; this guards the promise.
    throw new EngineInputError(`${d.scope}.${d.metric}`, 'could not be computed from these landmarks');
  }
  const id = d.side === null ? `${d.scope}/${d.metric}` : `${d.scope}/${d.metric}/${d.side}`;
  const m: Measurement = { id, metric: d.metric, taskId: d.taskId, side: d.side, value: d.value, unit: d.unit, label: d.label };
  if (d.comparesTasks) m.comparesTasks = d.comparesTasks;
  return m;
}

function points<K extends LandmarkId>(marks: Partial<Record<LandmarkId, Point>>, ids: readonly K[]): Record<K, Point> | null {
  const out = {} as Record<K, Point>;
  for (const id of ids) {
    const p = marks[id];
    if (!p) return null;
    out[id] = p;
  }
  return out;
}

/**
 * Run a geometry function and, if it refuses its points, re-throw with the
 * landmark's id and the photo's path, so a screen can highlight the point.
 */
function onLandmarks<T>(path: string, names: Readonly<Record<string, LandmarkId>>, run: () => T): T {
  try {
    return run();
  } catch (error) {
    if (error instanceof EngineInputError) {
      const [head = '', ...rest] = error.field.split('.');
      const landmark = names[head];
      const field = landmark ? [landmark, ...rest].join('.') : error.field;
      throw new EngineInputError(`${path}.${field}`, error.reason);
    }
    throw error;
  }
}

function largerSide(left: number, right: number): FlagSide {
  if (left === right) return 'both';
  return left > right ? 'left' : 'right';
}

function smallerSide(left: number, right: number): FlagSide {
  if (left === right) return 'both';
  return left < right ? 'left' : 'right';
}

/** FPPA of one leg from front landmarks named by the athlete's side. */
function fppaOf(task: NormalizedTask, side: Side, path: string): number | null {
  const p = points(task.front, [`${side}-hip`, `${side}-knee`, `${side}-ankle`] as const);
  if (!p) return null;
  return onLandmarks(path, { hip: `${side}-hip`, knee: `${side}-knee`, ankle: `${side}-ankle` }, () =>
    frontalPlaneProjectionAngle(p[`${side}-hip`], p[`${side}-knee`], p[`${side}-ankle`], side),
  );
}

function trunkLateral(task: NormalizedTask, path: string): number | null {
  const p = points(task.front, ['mid-shoulder', 'mid-hip'] as const);
  if (!p) return null;
  return onLandmarks(path, { shoulderMid: 'mid-shoulder', hipMid: 'mid-hip' }, () => trunkLean(p['mid-shoulder'], p['mid-hip'], 'front'));
}

function obliquity(task: NormalizedTask, stance: Side, path: string): number | null {
  const p = points(task.front, ['left-asis', 'right-asis'] as const);
  if (!p) return null;
  return onLandmarks(path, { leftPelvis: 'left-asis', rightPelvis: 'right-asis' }, () => pelvicObliquity(p['left-asis'], p['right-asis'], stance));
}

interface SideView {
  kneeFlexion: number | null;
  tibia: number | null;
  trunk: number | null;
  thigh: number | null;
}

function sideView(task: NormalizedTask, path: string): SideView {
  const s = task.side;
  const leg = points(s, ['near-hip', 'near-knee', 'near-ankle'] as const);
  const shin = points(s, ['near-knee', 'near-ankle'] as const);
  const body = points(s, ['near-shoulder', 'near-hip'] as const);
  const thighPts = points(s, ['near-hip', 'near-knee'] as const);
  const legNames = { hip: 'near-hip', knee: 'near-knee', ankle: 'near-ankle' } as const;
  return {
    kneeFlexion: leg ? onLandmarks(path, legNames, () => kneeFlexion(leg['near-hip'], leg['near-knee'], leg['near-ankle'])) : null,
    tibia: shin ? onLandmarks(path, legNames, () => tibialInclination(shin['near-knee'], shin['near-ankle'])) : null,
    trunk: body
      ? onLandmarks(path, { shoulderMid: 'near-shoulder', hipMid: 'near-hip' }, () => trunkLean(body['near-shoulder'], body['near-hip'], 'side'))
      : null,
    thigh: thighPts ? onLandmarks(path, legNames, () => thighAngle(thighPts['near-hip'], thighPts['near-knee'])) : null,
  };
}

function measureTwoLegSquat(t: NormalizedTask, out: Draft[]): void {
  const id = t.spec.id;
  const front = `tasks.${id}.photos.front.landmarks`;
  const fppa: Partial<Record<Side, number>> = {};
  for (const side of SIDES) {
    const v = fppaOf(t, side, front);
    if (v === null) continue;
    fppa[side] = v;
    out.push({
      scope: id,
      metric: 'fppa',
      taskId: id,
      side,
      value: v,
      unit: 'deg',
      label: `Knee angle from the front (FPPA), ${side} leg, lowest point of the squat`,
    });
  }
  if (fppa.left !== undefined && fppa.right !== undefined) {
    out.push({
      scope: id,
      metric: 'fppa-difference',
      taskId: id,
      side: largerSide(fppa.left, fppa.right),
      value: asymmetry(fppa.left, fppa.right),
      unit: 'deg',
      label: 'Left-right difference in knee angle from the front (FPPA), squat',
    });
  }
  const tilt = obliquity(t, 'left', front);
  if (tilt !== null) {
    // With stance 'left', a positive obliquity means the right side is lower.
    const lower: FlagSide = tilt > 0 ? 'right' : tilt < 0 ? 'left' : 'both';
    out.push({
      scope: id,
      metric: 'pelvic-tilt',
      taskId: id,
      side: lower,
      value: Math.abs(tilt),
      unit: 'deg',
      label: 'Pelvis out of level at the lowest point of the squat (side = lower side)',
    });
  }
  const lateral = trunkLateral(t, front);
  if (lateral !== null) {
    out.push({ scope: id, metric: 'trunk-lean-lateral', taskId: id, side: null, value: lateral, unit: 'deg', label: 'Sideways trunk lean, squat' });
  }
  const sv = sideView(t, `tasks.${id}.photos.side.landmarks`);
  if (sv.kneeFlexion !== null) {
    out.push({
      scope: id,
      metric: 'knee-flexion',
      taskId: id,
      side: null,
      value: sv.kneeFlexion,
      unit: 'deg',
      label: 'Knee bend at the lowest point of the squat',
    });
  }
  if (sv.tibia !== null) {
    out.push({ scope: id, metric: 'tibial-inclination', taskId: id, side: null, value: sv.tibia, unit: 'deg', label: 'Shin angle from vertical, squat' });
  }
  if (sv.trunk !== null) {
    out.push({ scope: id, metric: 'trunk-lean-forward', taskId: id, side: null, value: sv.trunk, unit: 'deg', label: 'Forward trunk lean, squat' });
  }
  if (sv.thigh !== null) {
    out.push({
      scope: id,
      metric: 'thigh-angle',
      taskId: id,
      side: 'both',
      value: sv.thigh,
      unit: 'deg',
      label: 'Thigh angle above horizontal at the lowest point (0 = level, below 0 = deeper)',
    });
  }
  if (sv.trunk !== null && sv.tibia !== null) {
    out.push({
      scope: id,
      metric: 'trunk-tibia-difference',
      taskId: id,
      side: null,
      value: sv.trunk - sv.tibia,
      unit: 'deg',
      label: 'Trunk lean minus shin angle, squat (0 = trunk parallel to shin)',
    });
  }
}

function measureSingleLegSquat(t: NormalizedTask, side: Side, out: Draft[]): void {
  const id = t.spec.id;
  const front = `tasks.${id}.photos.front.landmarks`;
  const fppa = fppaOf(t, side, front);
  if (fppa !== null) {
    out.push({
      scope: id,
      metric: 'fppa',
      taskId: id,
      side,
      value: fppa,
      unit: 'deg',
      label: `Knee angle from the front (FPPA), single-leg squat, ${side} leg`,
    });
  }
  const drop = obliquity(t, side, front);
  if (drop !== null) {
    out.push({
      scope: id,
      metric: 'pelvic-obliquity',
      taskId: id,
      side,
      value: drop,
      unit: 'deg',
      label: `Pelvic drop on the free-leg side, single-leg squat on the ${side} leg`,
    });
  }
  const lateral = trunkLateral(t, front);
  if (lateral !== null) {
    out.push({
      scope: id,
      metric: 'trunk-lean-lateral',
      taskId: id,
      side,
      value: lateral,
      unit: 'deg',
      label: `Sideways trunk lean, single-leg squat on the ${side} leg`,
    });
  }
}

function measureDropLanding(t: NormalizedTask, out: Draft[]): void {
  const id = t.spec.id;
  const front = `tasks.${id}.photos.front.landmarks`;
  const fppa: Partial<Record<Side, number>> = {};
  for (const side of SIDES) {
    const v = fppaOf(t, side, front);
    if (v === null) continue;
    fppa[side] = v;
    out.push({
      scope: id,
      metric: 'fppa',
      taskId: id,
      side,
      value: v,
      unit: 'deg',
      label: `Knee angle from the front (FPPA), ${side} leg, deepest point of the landing`,
    });
  }
  if (fppa.left !== undefined && fppa.right !== undefined) {
    out.push({
      scope: id,
      metric: 'fppa-difference',
      taskId: id,
      side: largerSide(fppa.left, fppa.right),
      value: asymmetry(fppa.left, fppa.right),
      unit: 'deg',
      label: 'Left-right difference in knee angle from the front (FPPA), landing',
    });
  }
}

function measureStance(t: NormalizedTask, side: Side, out: Draft[]): void {
  const id = t.spec.id;
  const front = `tasks.${id}.photos.front.landmarks`;
  const drop = obliquity(t, side, front);
  if (drop !== null) {
    out.push({
      scope: id,
      metric: 'pelvic-obliquity',
      taskId: id,
      side,
      value: drop,
      unit: 'deg',
      label: `Pelvic drop on the free-leg side, standing on the ${side} leg`,
    });
  }
  const lateral = trunkLateral(t, front);
  if (lateral !== null) {
    out.push({
      scope: id,
      metric: 'trunk-lean-lateral',
      taskId: id,
      side,
      value: lateral,
      unit: 'deg',
      label: `Sideways trunk lean, standing on the ${side} leg`,
    });
  }
}

function measureKneeToWall(t: NormalizedTask, side: Side, out: Draft[]): void {
  const id = t.spec.id;
  if (t.distanceCm !== undefined) {
    out.push({ scope: id, metric: 'knee-to-wall', taskId: id, side, value: t.distanceCm, unit: 'cm', label: `Knee-to-wall distance, ${side} ankle` });
  }
  const shin = points(t.side, ['near-knee', 'near-ankle'] as const);
  if (shin) {
    const v = onLandmarks(`tasks.${id}.photos.side.landmarks`, { knee: 'near-knee', ankle: 'near-ankle' }, () =>
      tibialInclination(shin['near-knee'], shin['near-ankle']),
    );
    out.push({
      scope: id,
      metric: 'tibial-inclination',
      taskId: id,
      side,
      value: v,
      unit: 'deg',
      label: `Shin angle from vertical in the knee-to-wall lunge (lunge angle), ${side} ankle`,
    });
  }
}

function measureLunge(t: NormalizedTask, racketHand: Side | undefined, out: Draft[]): void {
  const id = t.spec.id;
  const front = `tasks.${id}.photos.front.landmarks`;
  const lead: FlagSide = racketHand ?? null;
  if (racketHand) {
    // The FPPA sign depends on which leg this is; without the racket hand it cannot be signed.
    const p = points(t.front, ['lead-hip', 'lead-knee', 'lead-ankle'] as const);
    if (p) {
      const v = onLandmarks(front, { hip: 'lead-hip', knee: 'lead-knee', ankle: 'lead-ankle' }, () =>
        frontalPlaneProjectionAngle(p['lead-hip'], p['lead-knee'], p['lead-ankle'], racketHand),
      );
      out.push({
        scope: id,
        metric: 'fppa',
        taskId: id,
        side: racketHand,
        value: v,
        unit: 'deg',
        label: `Knee angle from the front (FPPA), front (${racketHand}) leg of the lunge`,
      });
    }
  }
  const lateral = trunkLateral(t, front);
  if (lateral !== null) {
    out.push({ scope: id, metric: 'trunk-lean-lateral', taskId: id, side: null, value: lateral, unit: 'deg', label: 'Sideways trunk lean, lunge' });
  }
  const sv = sideView(t, `tasks.${id}.photos.side.landmarks`);
  if (sv.kneeFlexion !== null) {
    out.push({
      scope: id,
      metric: 'knee-flexion',
      taskId: id,
      side: lead,
      value: sv.kneeFlexion,
      unit: 'deg',
      label: 'Front-knee bend at the lowest point of the lunge',
    });
  }
  if (sv.tibia !== null) {
    out.push({ scope: id, metric: 'tibial-inclination', taskId: id, side: lead, value: sv.tibia, unit: 'deg', label: 'Front-shin angle from vertical, lunge' });
  }
  if (sv.trunk !== null) {
    out.push({ scope: id, metric: 'trunk-lean-forward', taskId: id, side: null, value: sv.trunk, unit: 'deg', label: 'Forward trunk lean, lunge' });
  }
}

function valueOf(out: readonly Draft[], taskId: TaskId, metric: MetricId): number | undefined {
  return out.find((d) => d.taskId === taskId && d.metric === metric)?.value;
}

function measurePairs(out: Draft[], ratings: readonly TaskRating[]): void {
  const [slsL, slsR] = pairTasks('single-leg-squat');
  const fl = valueOf(out, slsL.id, 'fppa');
  const fr = valueOf(out, slsR.id, 'fppa');
  if (fl !== undefined && fr !== undefined) {
    out.push({
      scope: 'single-leg-squat',
      metric: 'fppa-difference',
      taskId: null,
      comparesTasks: [slsL.id, slsR.id],
      side: largerSide(fl, fr),
      value: asymmetry(fl, fr),
      unit: 'deg',
      label: 'Left-right difference in knee angle from the front (FPPA), single-leg squats',
    });
  }
  const rl = ratings.find((r) => r.taskId === slsL.id);
  const rr = ratings.find((r) => r.taskId === slsR.id);
  if (rl && rr) {
    const gl = RATING_GRADE[rl.rating];
    const gr = RATING_GRADE[rr.rating];
    out.push({
      scope: 'single-leg-squat',
      metric: 'rating-gap',
      taskId: null,
      comparesTasks: [slsL.id, slsR.id],
      side: largerSide(gl, gr),
      value: asymmetry(gl, gr),
      unit: 'grades',
      label: `Single-leg squat rating gap (left ${rl.rating}, right ${rr.rating})`,
    });
  }

  const [ktwL, ktwR] = pairTasks('knee-to-wall');
  const dl = valueOf(out, ktwL.id, 'knee-to-wall');
  const dr = valueOf(out, ktwR.id, 'knee-to-wall');
  if (dl !== undefined && dr !== undefined) {
    const weaker = smallerSide(dl, dr);
    out.push({
      scope: 'knee-to-wall',
      metric: 'knee-to-wall-difference',
      taskId: null,
      comparesTasks: [ktwL.id, ktwR.id],
      side: weaker,
      value: asymmetry(dl, dr),
      unit: 'cm',
      label: 'Left-right difference in knee-to-wall distance (side = shorter)',
    });
    out.push({
      scope: 'knee-to-wall',
      metric: 'knee-to-wall-lsi',
      taskId: null,
      comparesTasks: [ktwL.id, ktwR.id],
      side: weaker,
      value: limbSymmetryIndex(dl, dr),
      unit: 'percent',
      label: 'Knee-to-wall limb symmetry index (shorter over longer x 100)',
    });
  }
}

/** Single-leg squat rating from the areas with a ticked criterion. The mapping is our design. */
export function rateSingleLegSquat(task: TaskSpec, ticked: readonly string[]): TaskRating {
  if (!task.rated || !task.side) throw new Error(`task ${task.id} is not rated`);
  const areas = new Set<SingleLegSquatArea>();
  for (const c of task.criteria) {
    if (c.area && ticked.includes(c.id)) areas.add(c.area);
  }
  const areasWithFaults = AREA_ORDER.filter((a) => areas.has(a));
  const n = areasWithFaults.length;
  const rating: Rating = n === 0 ? 'good' : n <= 2 ? 'fair' : 'poor';
  return { taskId: task.id, side: task.side, rating, areasWithFaults, basis: RATING_BASIS };
}

export function rateTasks(n: NormalizedAssessment): TaskRating[] {
  const out: TaskRating[] = [];
  for (const t of n.tasks.values()) {
    if (t.spec.rated) out.push(rateSingleLegSquat(t.spec, t.criteria));
  }
  return out;
}

export function measureTasks(n: NormalizedAssessment, ratings: readonly TaskRating[]): Measurement[] {
  const out: Draft[] = [];
  for (const t of n.tasks.values()) {
    const side = t.spec.side;
    switch (t.spec.id) {
      case 'two-leg-squat':
        measureTwoLegSquat(t, out);
        break;
      case 'single-leg-squat-left':
      case 'single-leg-squat-right':
        if (side) measureSingleLegSquat(t, side, out);
        break;
      case 'drop-landing':
        measureDropLanding(t, out);
        break;
      case 'single-leg-stance-left':
      case 'single-leg-stance-right':
        if (side) measureStance(t, side, out);
        break;
      case 'knee-to-wall-left':
      case 'knee-to-wall-right':
        if (side) measureKneeToWall(t, side, out);
        break;
      case 'racket-side-lunge':
        measureLunge(t, n.athlete.racketHand, out);
        break;
    }
  }
  measurePairs(out, ratings);
  return out.map(toMeasurement);
}

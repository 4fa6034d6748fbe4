/**
 * 2D angles from landmarks placed on photos. Image pixel coordinates: x to the
 * right, y downwards. Every function validates its points and returns degrees.
 */
import { EngineInputError, requireFinite } from './errors';
import type { Point, Side, View } from './types';

const RAD_TO_DEG = 180 / Math.PI;
/** Points closer than this are the same point (works for pixel and normalised coordinates). */
const MIN_SEPARATION = 1e-9;
/** Keeps differences and products far from overflow. */
export const MAX_COORDINATE = 1e6;

/** Fast path for validation loops: true when checkPoint would accept `p`. */
export function isValidPoint(p: unknown): p is Point {
  if (typeof p !== 'object' || p === null) return false;
  const { x, y } = p as { x?: unknown; y?: unknown };
  return (
    typeof x === 'number' && typeof y === 'number' && Number.isFinite(x) && Number.isFinite(y) && Math.abs(x) <= MAX_COORDINATE && Math.abs(y) <= MAX_COORDINATE
  );
}

export function checkPoint(field: string, p: unknown): Point {
  if (typeof p !== 'object' || p === null) {
    throw new EngineInputError(field, 'is missing: expected a point {x, y}');
  }
  const { x, y } = p as { x?: unknown; y?: unknown };
  requireFinite(`${field}.x`, x);
  requireFinite(`${field}.y`, y);
  const px = x as number;
  const py = y as number;
  if (Math.abs(px) > MAX_COORDINATE || Math.abs(py) > MAX_COORDINATE) {
    throw new EngineInputError(field, `coordinates must lie within ±${MAX_COORDINATE} px`);
  }
  return { x: px, y: py };
}

export function checkSide(field: string, side: unknown): Side {
  if (side !== 'left' && side !== 'right') {
    throw new EngineInputError(field, `must be 'left' or 'right', got ${String(side)}`);
  }
  return side;
}

function checkDistinct(nameA: string, a: Point, nameB: string, b: Point): void {
  if (Math.hypot(a.x - b.x, a.y - b.y) < MIN_SEPARATION) {
    throw new EngineInputError(nameB, `${nameA} and ${nameB} are the same point`);
  }
}

function sub(a: Point, b: Point): Point {
  return { x: a.x - b.x, y: a.y - b.y };
}

/** Unsigned angle between two vectors, 0 to 180 degrees. atan2 stays accurate near 0 and 180, unlike acos. */
function angleBetween(u: Point, v: Point): number {
  const cross = u.x * v.y - u.y * v.x;
  const dot = u.x * v.x + u.y * v.y;
  return Math.atan2(Math.abs(cross), dot) * RAD_TO_DEG;
}

/**
 * Knee frontal plane projection angle (FPPA) from a FRONT view (camera facing
 * the athlete): the angle between the thigh line (hip to knee) and the shank
 * line (knee to ankle), i.e. 180 degrees minus the angle at the knee.
 * Positive when the knee lies medial to the hip-ankle line (valgus), negative
 * when lateral (varus), 0 for a straight leg.
 *
 * `side` is the athlete's side. Because the camera faces the athlete, the
 * athlete's right leg is on the image's left and its midline (medial side) is
 * towards +x; for the left leg medial is towards -x.
 */
export function frontalPlaneProjectionAngle(hip: Point, knee: Point, ankle: Point, side: Side): number {
  const h = checkPoint('hip', hip);
  const k = checkPoint('knee', knee);
  const a = checkPoint('ankle', ankle);
  const s = checkSide('side', side);
  checkDistinct('hip', h, 'knee', k);
  checkDistinct('knee', k, 'ankle', a);
  checkDistinct('hip', h, 'ankle', a);
  if (!(a.y > h.y)) {
    throw new EngineInputError('ankle', 'the ankle must be lower in the image than the hip (y grows downwards): check the landmarks or the photo orientation');
  }
  const thigh = sub(k, h);
  const magnitude = angleBetween(thigh, sub(a, k));
  // Which side of the hip-ankle line is the knee on? With the line pointing
  // down the image, a negative cross product puts the knee towards +x.
  const line = sub(a, h);
  const cross = line.x * thigh.y - line.y * thigh.x;
  if (cross === 0) {
    if (magnitude > 90) {
      throw new EngineInputError('knee', 'the knee lies on the hip-ankle line but outside the hip-ankle segment');
    }
    return 0;
  }
  const kneeTowardsImageRight = cross < 0;
  const medial = s === 'right' ? kneeTowardsImageRight : !kneeTowardsImageRight;
  return medial ? magnitude : -magnitude;
}

/**
 * Pelvic obliquity in degrees from horizontal, from the two front pelvic
 * points (ASIS) in a FRONT view. Positive when the pelvis is lower on the side
 * opposite the stance leg (contralateral pelvic drop), negative when it is
 * higher (hip hike).
 *
 * The formula uses only the vertical difference and the absolute horizontal
 * distance, so it works unchanged with the two rear pelvic points (PSIS) in a
 * back view; what matters is that each point is passed as the athlete's own
 * left or right.
 */
export function pelvicObliquity(leftPelvis: Point, rightPelvis: Point, stanceSide: Side): number {
  const left = checkPoint('leftPelvis', leftPelvis);
  const right = checkPoint('rightPelvis', rightPelvis);
  const stance = checkSide('stanceSide', stanceSide);
  checkDistinct('leftPelvis', left, 'rightPelvis', right);
  const dx = Math.abs(left.x - right.x);
  if (dx < MIN_SEPARATION) {
    throw new EngineInputError('rightPelvis', 'the two pelvic points are vertically aligned; in a front view they sit side by side');
  }
  const stancePoint = stance === 'left' ? left : right;
  const freePoint = stance === 'left' ? right : left;
  // y grows downwards: a larger y on the free side means that side has dropped.
  return Math.atan2(freePoint.y - stancePoint.y, dx) * RAD_TO_DEG;
}

/**
 * Trunk lean in degrees from vertical, from the mid-shoulder and mid-hip
 * points: sideways lean in a front view, forward lean in a side view. The
 * calculation is the same for both views; `view` states which one is meant.
 * Returns a magnitude (0 upright), not a direction.
 */
export function trunkLean(shoulderMid: Point, hipMid: Point, view: View): number {
  const s = checkPoint('shoulderMid', shoulderMid);
  const h = checkPoint('hipMid', hipMid);
  if (view !== 'front' && view !== 'side') {
    throw new EngineInputError('view', `must be 'front' or 'side', got ${String(view)}`);
  }
  checkDistinct('shoulderMid', s, 'hipMid', h);
  if (!(s.y < h.y)) {
    throw new EngineInputError('shoulderMid', 'the shoulders must be higher in the image than the hips');
  }
  return Math.atan2(Math.abs(s.x - h.x), h.y - s.y) * RAD_TO_DEG;
}

/**
 * Knee flexion in degrees from a SIDE view: 0 for a straight leg, about 90
 * with the thigh horizontal and the shin vertical.
 */
export function kneeFlexion(hip: Point, knee: Point, ankle: Point): number {
  const h = checkPoint('hip', hip);
  const k = checkPoint('knee', knee);
  const a = checkPoint('ankle', ankle);
  checkDistinct('hip', h, 'knee', k);
  checkDistinct('knee', k, 'ankle', a);
  checkDistinct('hip', h, 'ankle', a);
  return angleBetween(sub(k, h), sub(a, k));
}

/**
 * Shin angle from vertical in degrees from a SIDE view (knee centre to ankle
 * centre), a magnitude. In a knee-to-wall lunge this is the weight-bearing
 * lunge angle of ankle dorsiflexion.
 */
export function tibialInclination(knee: Point, ankle: Point): number {
  const k = checkPoint('knee', knee);
  const a = checkPoint('ankle', ankle);
  checkDistinct('knee', k, 'ankle', a);
  if (!(k.y < a.y)) {
    throw new EngineInputError('knee', 'the knee must be higher in the image than the ankle');
  }
  return Math.atan2(Math.abs(k.x - a.x), a.y - k.y) * RAD_TO_DEG;
}

/**
 * Thigh angle from horizontal in degrees from a SIDE view: positive while the
 * hip is above the knee, 0 with the thigh level, negative below (a squat
 * deeper than parallel).
 */
export function thighAngle(hip: Point, knee: Point): number {
  const h = checkPoint('hip', hip);
  const k = checkPoint('knee', knee);
  checkDistinct('hip', h, 'knee', k);
  return Math.atan2(k.y - h.y, Math.abs(k.x - h.x)) * RAD_TO_DEG;
}

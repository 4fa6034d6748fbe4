// From a pose model's body points to Squadline's landmarks. Pure: no React, no browser.
import type { LandmarkId, Point, Side, View } from '@/features/screening/engine';

/** One body point as the pose model returns it: x and y from 0 to 1 across the image, z smaller = nearer the camera. */
export type ModelPoint = { x: number; y: number; z?: number; visibility?: number };

/**
 * The 33-point body layout of the pose model (BlazePose topology; its README lists them). Left and right are
 * the PERSON's sides, like Squadline's front-view names: a person facing the camera has their right hip on
 * the image's left.
 */
export const MODEL_POINT = {
  leftShoulder: 11,
  rightShoulder: 12,
  leftHip: 23,
  rightHip: 24,
  leftKnee: 25,
  rightKnee: 26,
  leftAnkle: 27,
  rightAnkle: 28,
} as const;

/**
 * Below this visibility the model itself is unsure the point is in view: no suggestion for it (our choice;
 * the model's own examples draw points from 0.5).
 */
export const MIN_VISIBILITY = 0.5;

type Recipe = readonly number[];

const sideRecipes = (side: Side): Partial<Record<LandmarkId, Recipe>> => {
  const s = side === 'right' ? 'right' : 'left';
  return {
    [`${s}-hip`]: [side === 'right' ? MODEL_POINT.rightHip : MODEL_POINT.leftHip],
    [`${s}-knee`]: [side === 'right' ? MODEL_POINT.rightKnee : MODEL_POINT.leftKnee],
    [`${s}-ankle`]: [side === 'right' ? MODEL_POINT.rightAnkle : MODEL_POINT.leftAnkle],
  } as Partial<Record<LandmarkId, Recipe>>;
};

/**
 * Which model points make each Squadline landmark: one point, or the middle of two. The front hip bones
 * (ASIS) have no counterpart in the model and are never suggested: the tester places them.
 */
function recipes(view: View, racketHand: Side | undefined, nearSide: Side): Partial<Record<LandmarkId, Recipe>> {
  if (view === 'side') {
    const n = nearSide === 'right';
    return {
      'near-shoulder': [n ? MODEL_POINT.rightShoulder : MODEL_POINT.leftShoulder],
      'near-hip': [n ? MODEL_POINT.rightHip : MODEL_POINT.leftHip],
      'near-knee': [n ? MODEL_POINT.rightKnee : MODEL_POINT.leftKnee],
      'near-ankle': [n ? MODEL_POINT.rightAnkle : MODEL_POINT.leftAnkle],
    };
  }
  const lead = racketHand ? sideRecipes(racketHand) : {};
  return {
    ...sideRecipes('right'),
    ...sideRecipes('left'),
    'mid-shoulder': [MODEL_POINT.leftShoulder, MODEL_POINT.rightShoulder],
    'mid-hip': [MODEL_POINT.leftHip, MODEL_POINT.rightHip],
    // The lunge's front leg is the racket side.
    ...(racketHand
      ? {
          'lead-hip': lead[`${racketHand}-hip` as LandmarkId],
          'lead-knee': lead[`${racketHand}-knee` as LandmarkId],
          'lead-ankle': lead[`${racketHand}-ankle` as LandmarkId],
        }
      : {}),
  };
}

/** In a side photo, the side whose hip, knee and ankle the model puts nearer the camera (smaller z). */
export function nearerSide(points: readonly ModelPoint[]): Side {
  const depth = (ids: number[]) => ids.reduce((sum, i) => sum + (points[i]?.z ?? 0), 0);
  const right = depth([MODEL_POINT.rightHip, MODEL_POINT.rightKnee, MODEL_POINT.rightAnkle]);
  const left = depth([MODEL_POINT.leftHip, MODEL_POINT.leftKnee, MODEL_POINT.leftAnkle]);
  return right <= left ? 'right' : 'left';
}

/**
 * Suggested positions, in the photo's pixels, for the landmarks `needed` on this photo. A landmark is left
 * out when a point it needs is missing, unsure (visibility below MIN_VISIBILITY) or outside the photo.
 */
export function suggestLandmarks(
  points: readonly ModelPoint[],
  opts: { view: View; needed: readonly LandmarkId[]; width: number; height: number; racketHand?: Side },
): Partial<Record<LandmarkId, Point>> {
  const out: Partial<Record<LandmarkId, Point>> = {};
  if (points.length < 33) return out;
  const table = recipes(opts.view, opts.racketHand, nearerSide(points));
  for (const id of opts.needed) {
    const recipe = table[id];
    if (!recipe) continue;
    const used = recipe.map((i) => points[i]);
    if (used.some((p) => !p || (p.visibility ?? 0) < MIN_VISIBILITY)) continue;
    const x = (used.reduce((s, p) => s + p!.x, 0) / used.length) * opts.width;
    const y = (used.reduce((s, p) => s + p!.y, 0) / used.length) * opts.height;
    if (!(x >= 0 && y >= 0 && x <= opts.width && y <= opts.height)) continue;
    out[id] = { x: Math.round(x * 10) / 10, y: Math.round(y * 10) / 10 };
  }
  return out;
}

/** The landmarks among `needed` the model can suggest on this photo (never the front hip bones). */
export function suggestibleIds(view: View, needed: readonly LandmarkId[], racketHand?: Side): LandmarkId[] {
  const table = recipes(view, racketHand, 'right');
  return needed.filter((id) => table[id] !== undefined);
}

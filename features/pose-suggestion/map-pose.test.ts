import { describe, expect, it } from 'vitest';
import { getTask, type LandmarkId } from '@/features/screening/engine';
import { MIN_VISIBILITY, MODEL_POINT, nearerSide, suggestLandmarks, suggestibleIds, type ModelPoint } from './map-pose';

// The model's layout (33 points, person's own left and right) mapped onto Squadline's landmarks. The body
// below is invented: a person facing the camera, their right side on the image's left (our choice).
function body(overrides: Record<number, Partial<ModelPoint>> = {}): ModelPoint[] {
  const pts: ModelPoint[] = Array.from({ length: 33 }, () => ({ x: 0.5, y: 0.5, z: 0, visibility: 0.99 }));
  const at = (i: number, x: number, y: number, z = 0) => (pts[i] = { x, y, z, visibility: 0.99 });
  at(MODEL_POINT.rightShoulder, 0.4, 0.2);
  at(MODEL_POINT.leftShoulder, 0.6, 0.2);
  at(MODEL_POINT.rightHip, 0.45, 0.5);
  at(MODEL_POINT.leftHip, 0.55, 0.5);
  at(MODEL_POINT.rightKnee, 0.44, 0.7);
  at(MODEL_POINT.leftKnee, 0.56, 0.7);
  at(MODEL_POINT.rightAnkle, 0.45, 0.9);
  at(MODEL_POINT.leftAnkle, 0.55, 0.9);
  for (const [i, o] of Object.entries(overrides)) pts[Number(i)] = { ...pts[Number(i)]!, ...o };
  return pts;
}

const size = { width: 1000, height: 2000 };
const front = (taskId: Parameters<typeof getTask>[0]) => getTask(taskId).views.find((v) => v.view === 'front')!.landmarks;

describe('suggestLandmarks', () => {
  it.each<[string, LandmarkId, { x: number; y: number }]>([
    // Person's right hip (model point 24) is Squadline's right-hip, on the image's left.
    ['right hip from point 24', 'right-hip', { x: 450, y: 1000 }],
    ['left knee from point 25', 'left-knee', { x: 560, y: 1400 }],
    ['right ankle from point 28', 'right-ankle', { x: 450, y: 1800 }],
    ['middle of the shoulders from 11 and 12', 'mid-shoulder', { x: 500, y: 400 }],
    ['middle of the hips from 23 and 24', 'mid-hip', { x: 500, y: 1000 }],
  ])('front photo: %s', (_what, id, expected) => {
    const out = suggestLandmarks(body(), { view: 'front', needed: front('two-leg-squat'), ...size });
    expect(out[id]).toEqual(expected);
  });

  it('never suggests the front hip bones (ASIS): the model has no such point', () => {
    const out = suggestLandmarks(body(), { view: 'front', needed: ['right-asis', 'left-asis', 'right-hip'], ...size });
    expect(Object.keys(out)).toEqual(['right-hip']);
  });

  it.each([
    ['right', { x: 440, y: 1400 }],
    ['left', { x: 560, y: 1400 }],
  ] as const)('lunge front leg on the racket side (%s hand)', (hand, knee) => {
    const out = suggestLandmarks(body(), { view: 'front', needed: ['lead-hip', 'lead-knee', 'lead-ankle'], racketHand: hand, ...size });
    expect(out['lead-knee']).toEqual(knee);
    expect(Object.keys(out)).toHaveLength(3);
  });

  it('without a racket hand, no front-leg points are suggested', () => {
    expect(suggestLandmarks(body(), { view: 'front', needed: ['lead-knee'], ...size })).toEqual({});
  });

  it('side photo: the points of the side the model puts nearer the camera (smaller z)', () => {
    const leftNear = body({ [MODEL_POINT.leftHip]: { z: -0.2 }, [MODEL_POINT.leftKnee]: { z: -0.2 }, [MODEL_POINT.leftAnkle]: { z: -0.1 } });
    expect(nearerSide(leftNear)).toBe('left');
    const out = suggestLandmarks(leftNear, { view: 'side', needed: ['near-shoulder', 'near-hip', 'near-knee', 'near-ankle'], ...size });
    expect(out['near-knee']).toEqual({ x: 560, y: 1400 });
    expect(out['near-shoulder']).toEqual({ x: 600, y: 400 });
    expect(nearerSide(body({ [MODEL_POINT.rightKnee]: { z: -0.3 } }))).toBe('right');
  });

  it('leaves out a point the model is unsure of, one outside the photo, and everything when no person was found', () => {
    const unsure = body({ [MODEL_POINT.rightKnee]: { visibility: MIN_VISIBILITY - 0.01 }, [MODEL_POINT.leftAnkle]: { y: 1.2 } });
    const out = suggestLandmarks(unsure, { view: 'front', needed: front('drop-landing'), ...size });
    expect(Object.keys(out).sort()).toEqual(['left-hip', 'left-knee', 'right-ankle', 'right-hip']);
    // The middle of the hips needs both hips.
    const oneHip = suggestLandmarks(body({ [MODEL_POINT.leftHip]: { visibility: 0.1 } }), { view: 'front', needed: ['mid-hip'], ...size });
    expect(oneHip).toEqual({});
    expect(suggestLandmarks([], { view: 'front', needed: front('drop-landing'), ...size })).toEqual({});
  });
});

describe('suggestibleIds', () => {
  it('lists what the model can suggest among the points a photo needs', () => {
    expect(suggestibleIds('front', ['right-asis', 'mid-hip', 'right-knee'])).toEqual(['mid-hip', 'right-knee']);
    expect(suggestibleIds('front', ['lead-knee'])).toEqual([]);
    expect(suggestibleIds('front', ['lead-knee'], 'left')).toEqual(['lead-knee']);
    expect(suggestibleIds('side', ['near-knee', 'near-ankle'])).toEqual(['near-knee', 'near-ankle']);
  });
});

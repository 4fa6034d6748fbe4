import { describe, expect, it } from 'vitest';
import { EngineInputError, frontalPlaneProjectionAngle, kneeFlexion, pelvicObliquity, thighAngle, tibialInclination, trunkLean } from './index';
import type { Point, Side } from './types';

const DEG = 180 / Math.PI;
const CONSTRUCTED = 'constructed case: exact trigonometry, no published source needed';
const FPPA_DEFINITION =
  'definition: 180 deg minus the knee angle, positive for valgus (secondary; usually credited to Willson JD, Davis IS, 2008, Clin Biomech)';

const p = (x: number, y: number): Point => ({ x, y });

/** Mirror a front-view point about a vertical line at x = 500 (a 1000 px wide image). */
const mirror = (q: Point): Point => ({ x: 1000 - q.x, y: q.y });

describe('frontalPlaneProjectionAngle', () => {
  // Front view, camera facing the athlete: the right leg is on the image's left,
  // so its medial side is +x; the left leg is on the image's right, medial is -x.
  it.each<[string, Point, Point, Point, Side, number, string]>([
    ['straight right leg', p(400, 100), p(400, 200), p(400, 300), 'right', 0, CONSTRUCTED],
    ['straight left leg', p(600, 100), p(600, 200), p(600, 300), 'left', 0, CONSTRUCTED],
    [
      'right knee 10 px medial at mid-height',
      p(400, 100),
      p(410, 200),
      p(400, 300),
      'right',
      2 * Math.atan(10 / 100) * DEG,
      `${CONSTRUCTED}; ${FPPA_DEFINITION}`,
    ],
    [
      'right knee 10 px lateral at mid-height',
      p(400, 100),
      p(390, 200),
      p(400, 300),
      'right',
      -2 * Math.atan(10 / 100) * DEG,
      `${CONSTRUCTED}; ${FPPA_DEFINITION}`,
    ],
    [
      'left knee 10 px medial at mid-height',
      p(600, 100),
      p(590, 200),
      p(600, 300),
      'left',
      2 * Math.atan(10 / 100) * DEG,
      `${CONSTRUCTED}; ${FPPA_DEFINITION}`,
    ],
    [
      'left knee 10 px lateral at mid-height',
      p(600, 100),
      p(610, 200),
      p(600, 300),
      'left',
      -2 * Math.atan(10 / 100) * DEG,
      `${CONSTRUCTED}; ${FPPA_DEFINITION}`,
    ],
    // Thigh vertical, ankle 10 px towards the midline: the knee sits lateral to the hip-ankle line.
    ['right shank angled medially, thigh vertical', p(400, 100), p(400, 200), p(410, 300), 'right', -Math.atan(10 / 100) * DEG, CONSTRUCTED],
    [
      'right knee 30 px medial, unequal segments',
      p(400, 100),
      p(430, 250),
      p(400, 300),
      'right',
      (Math.atan(30 / 150) + Math.atan(30 / 50)) * DEG,
      CONSTRUCTED,
    ],
  ])('%s -> %f deg (%s)', (_name, hip, knee, ankle, side, expected, _source) => {
    expect(frontalPlaneProjectionAngle(hip, knee, ankle, side)).toBeCloseTo(expected, 9);
  });

  it('2 x atan(0.1) is 11.42 deg (constructed case: exact trigonometry)', () => {
    expect(frontalPlaneProjectionAngle(p(400, 100), p(410, 200), p(400, 300), 'right')).toBeCloseTo(11.4212, 4);
  });

  it.each<[string, Point, Point, Point]>([
    ['medial knee', p(400, 100), p(412, 210), p(403, 320)],
    ['lateral knee', p(400, 100), p(388, 190), p(398, 310)],
    ['tilted leg', p(420, 90), p(380, 230), p(470, 360)],
  ])('a mirror image gives the same angle for the other side (%s; constructed case)', (_n, hip, knee, ankle) => {
    const right = frontalPlaneProjectionAngle(hip, knee, ankle, 'right');
    const left = frontalPlaneProjectionAngle(mirror(hip), mirror(knee), mirror(ankle), 'left');
    expect(left).toBeCloseTo(right, 9);
    expect(right).not.toBe(0);
  });

  it('the same points give opposite signs for right and left (constructed case)', () => {
    const right = frontalPlaneProjectionAngle(p(400, 100), p(415, 200), p(400, 300), 'right');
    const left = frontalPlaneProjectionAngle(p(400, 100), p(415, 200), p(400, 300), 'left');
    expect(right).toBeGreaterThan(0);
    expect(left).toBeCloseTo(-right, 9);
  });

  it.each<[string, () => unknown, string]>([
    ['hip = knee', () => frontalPlaneProjectionAngle(p(1, 1), p(1, 1), p(1, 5), 'right'), 'knee'],
    ['knee = ankle', () => frontalPlaneProjectionAngle(p(1, 1), p(1, 5), p(1, 5), 'right'), 'ankle'],
    ['ankle above hip', () => frontalPlaneProjectionAngle(p(1, 10), p(1, 5), p(1, 1), 'right'), 'ankle'],
    ['knee on the line beyond the ankle', () => frontalPlaneProjectionAngle(p(1, 1), p(1, 9), p(1, 5), 'right'), 'knee'],
    ['NaN coordinate', () => frontalPlaneProjectionAngle(p(Number.NaN, 1), p(1, 5), p(1, 9), 'right'), 'hip.x'],
    ['missing point', () => frontalPlaneProjectionAngle(undefined as unknown as Point, p(1, 5), p(1, 9), 'right'), 'hip'],
    ['bad side', () => frontalPlaneProjectionAngle(p(1, 1), p(1, 5), p(1, 9), 'middle' as Side), 'side'],
  ])('throws EngineInputError naming the field: %s', (_n, run, field) => {
    expect(run).toThrow(EngineInputError);
    try {
      run();
    } catch (e) {
      expect((e as EngineInputError).field).toBe(field);
    }
  });
});

describe('pelvicObliquity (front view, ASIS points)', () => {
  // Athlete's left ASIS on the image's right.
  it.each<[string, Point, Point, Side, number, string]>([
    ['level pelvis', p(560, 400), p(440, 400), 'left', 0, CONSTRUCTED],
    ['standing on left, right side 10 px lower', p(560, 400), p(440, 410), 'left', Math.atan(10 / 120) * DEG, CONSTRUCTED],
    ['standing on right, right side 10 px lower (hip hike of the free side)', p(560, 400), p(440, 410), 'right', -Math.atan(10 / 120) * DEG, CONSTRUCTED],
    ['standing on right, left side 12 px lower', p(560, 412), p(440, 400), 'right', Math.atan(12 / 120) * DEG, CONSTRUCTED],
    ['45 deg drop', p(560, 400), p(460, 500), 'left', 45, CONSTRUCTED],
  ])('%s -> %f deg (%s)', (_n, left, right, stance, expected, _source) => {
    expect(pelvicObliquity(left, right, stance)).toBeCloseTo(expected, 9);
  });

  it('atan(10/120) is 4.76 deg (constructed case)', () => {
    expect(pelvicObliquity(p(560, 400), p(440, 410), 'left')).toBeCloseTo(4.7636, 4);
  });

  it("works unchanged from a back view, where the athlete's left is on the image's left (constructed case)", () => {
    const front = pelvicObliquity(p(560, 400), p(440, 410), 'left');
    const back = pelvicObliquity(p(440, 400), p(560, 410), 'left');
    expect(back).toBeCloseTo(front, 12);
  });

  it.each<[string, () => unknown, string]>([
    ['coincident points', () => pelvicObliquity(p(5, 5), p(5, 5), 'left'), 'rightPelvis'],
    ['vertically aligned points', () => pelvicObliquity(p(5, 5), p(5, 9), 'left'), 'rightPelvis'],
    ['bad stance side', () => pelvicObliquity(p(9, 5), p(5, 5), 'both' as Side), 'stanceSide'],
  ])('throws: %s', (_n, run, field) => {
    expect(run).toThrow(expect.objectContaining({ name: 'EngineInputError', field }));
  });
});

describe('trunkLean', () => {
  it.each<[string, Point, Point, 'front' | 'side', number, string]>([
    ['upright', p(500, 200), p(500, 600), 'front', 0, CONSTRUCTED],
    ['45 deg sideways', p(600, 500), p(500, 600), 'front', 45, CONSTRUCTED],
    ['45 deg the other way is the same magnitude', p(400, 500), p(500, 600), 'front', 45, CONSTRUCTED],
    ['forward lean atan(100/400)', p(600, 200), p(500, 600), 'side', Math.atan(100 / 400) * DEG, CONSTRUCTED],
  ])('%s -> %f deg (%s)', (_n, shoulder, hip, view, expected, _source) => {
    expect(trunkLean(shoulder, hip, view)).toBeCloseTo(expected, 9);
  });

  it('refuses shoulders below the hips', () => {
    expect(() => trunkLean(p(500, 700), p(500, 600), 'side')).toThrow(EngineInputError);
  });

  it('refuses an unknown view', () => {
    expect(() => trunkLean(p(500, 200), p(500, 600), 'top' as 'side')).toThrow(/view/);
  });
});

describe('kneeFlexion (side view)', () => {
  it.each<[string, Point, Point, Point, number, string]>([
    ['straight leg', p(500, 100), p(500, 300), p(500, 500), 0, CONSTRUCTED],
    ['thigh horizontal, shin vertical', p(300, 300), p(500, 300), p(500, 500), 90, CONSTRUCTED],
    [
      'thigh horizontal, shin 30 deg forward',
      p(300, 300),
      p(500, 300),
      p(500 - 200 * Math.sin(Math.PI / 6), 300 + 200 * Math.cos(Math.PI / 6)),
      120,
      CONSTRUCTED,
    ],
    ['slight bend atan(50/200)', p(500, 100), p(550, 300), p(550, 500), Math.atan(50 / 200) * DEG, CONSTRUCTED],
  ])('%s -> %f deg (%s)', (_n, hip, knee, ankle, expected, _source) => {
    expect(kneeFlexion(hip, knee, ankle)).toBeCloseTo(expected, 9);
  });

  it('refuses coincident points', () => {
    expect(() => kneeFlexion(p(1, 1), p(1, 1), p(1, 9))).toThrow(EngineInputError);
  });
});

describe('tibialInclination (side view)', () => {
  it.each<[string, Point, Point, number, string]>([
    ['vertical shin', p(500, 300), p(500, 500), 0, CONSTRUCTED],
    ['knee 100 px ahead over 200 px', p(600, 300), p(500, 500), Math.atan(100 / 200) * DEG, CONSTRUCTED],
    ['knee 100 px behind over 200 px (same magnitude)', p(400, 300), p(500, 500), Math.atan(100 / 200) * DEG, CONSTRUCTED],
    ['45 deg', p(700, 300), p(500, 500), 45, CONSTRUCTED],
  ])('%s -> %f deg (%s)', (_n, knee, ankle, expected, _source) => {
    expect(tibialInclination(knee, ankle)).toBeCloseTo(expected, 9);
  });

  it('refuses a knee below the ankle', () => {
    expect(() => tibialInclination(p(500, 600), p(500, 500))).toThrow(EngineInputError);
  });
});

describe('thighAngle (side view, squat depth)', () => {
  it.each<[string, Point, Point, number, string]>([
    ['thigh level', p(400, 500), p(600, 500), 0, CONSTRUCTED],
    ['hip 100 px above the knee over 200 px', p(400, 400), p(600, 500), Math.atan(100 / 200) * DEG, CONSTRUCTED],
    ['hip below the knee (deep squat)', p(400, 550), p(600, 500), -Math.atan(50 / 200) * DEG, CONSTRUCTED],
    ['standing: hip straight above the knee', p(500, 300), p(500, 500), 90, CONSTRUCTED],
  ])('%s -> %f deg (%s)', (_n, hip, knee, expected, _source) => {
    expect(thighAngle(hip, knee)).toBeCloseTo(expected, 9);
  });
});

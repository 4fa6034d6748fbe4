/**
 * Deterministic generator of plausible, valid assessments, for the benchmark
 * and the property tests. Not part of the public API.
 */
import { BATTERY } from './battery';
import { MATURITY_AGE_RANGE } from './maturity';
import type { AssessmentInput, LandmarkId, Point, Side, TaskId, TaskResultInput } from './types';

/** mulberry32: tiny, fast, good enough for test data. Returns [0, 1). */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

type Rand = () => number;

const between = (r: Rand, min: number, max: number): number => min + r() * (max - min);
const round1 = (n: number): number => Math.round(n * 10) / 10;

/** Leave out about one landmark in ten, as a capture in progress would. */
function place(r: Rand, out: Partial<Record<LandmarkId, Point>>, id: LandmarkId, p: Point, keep = 0.9): void {
  if (r() < keep) out[id] = { x: round1(p.x), y: round1(p.y) };
}

function leg(r: Rand, out: Partial<Record<LandmarkId, Point>>, ids: readonly [LandmarkId, LandmarkId, LandmarkId], hipX: number): void {
  const hip = { x: hipX, y: between(r, 650, 720) };
  const knee = { x: hip.x + between(r, -70, 70), y: hip.y + between(r, 150, 260) };
  const ankle = { x: hip.x + between(r, -50, 50), y: knee.y + between(r, 180, 260) };
  place(r, out, ids[0], hip);
  place(r, out, ids[1], knee);
  place(r, out, ids[2], ankle);
}

function pelvis(r: Rand, out: Partial<Record<LandmarkId, Point>>): void {
  const y = between(r, 560, 620);
  place(r, out, 'right-asis', { x: between(r, 420, 450), y: y + between(r, -25, 25) });
  place(r, out, 'left-asis', { x: between(r, 550, 580), y: y + between(r, -25, 25) });
}

function trunk(r: Rand, out: Partial<Record<LandmarkId, Point>>): void {
  place(r, out, 'mid-hip', { x: between(r, 480, 520), y: between(r, 640, 700) });
  place(r, out, 'mid-shoulder', { x: between(r, 400, 600), y: between(r, 250, 330) });
}

function sideBody(r: Rand, out: Partial<Record<LandmarkId, Point>>): void {
  const hip = { x: between(r, 400, 450), y: between(r, 700, 820) };
  const knee = { x: hip.x + between(r, 120, 260), y: hip.y + between(r, -60, 120) };
  const ankle = { x: knee.x - between(r, 0, 160), y: knee.y + between(r, 220, 320) };
  const shoulder = { x: hip.x + between(r, 20, 260), y: hip.y - between(r, 260, 420) };
  place(r, out, 'near-hip', hip);
  place(r, out, 'near-knee', knee);
  place(r, out, 'near-ankle', ankle);
  place(r, out, 'near-shoulder', shoulder);
}

function photos(r: Rand, taskId: TaskId): TaskResultInput['photos'] {
  const front: Partial<Record<LandmarkId, Point>> = {};
  const side: Partial<Record<LandmarkId, Point>> = {};
  switch (taskId) {
    case 'two-leg-squat':
      leg(r, front, ['right-hip', 'right-knee', 'right-ankle'], between(r, 410, 450));
      leg(r, front, ['left-hip', 'left-knee', 'left-ankle'], between(r, 550, 590));
      pelvis(r, front);
      trunk(r, front);
      sideBody(r, side);
      return { front: { landmarks: front }, side: { landmarks: side } };
    case 'drop-landing':
      leg(r, front, ['right-hip', 'right-knee', 'right-ankle'], between(r, 410, 450));
      leg(r, front, ['left-hip', 'left-knee', 'left-ankle'], between(r, 550, 590));
      return { front: { landmarks: front } };
    case 'single-leg-squat-left':
      leg(r, front, ['left-hip', 'left-knee', 'left-ankle'], between(r, 550, 590));
      pelvis(r, front);
      trunk(r, front);
      return { front: { landmarks: front } };
    case 'single-leg-squat-right':
      leg(r, front, ['right-hip', 'right-knee', 'right-ankle'], between(r, 410, 450));
      pelvis(r, front);
      trunk(r, front);
      return { front: { landmarks: front } };
    case 'single-leg-stance-left':
    case 'single-leg-stance-right':
      pelvis(r, front);
      trunk(r, front);
      return { front: { landmarks: front } };
    case 'knee-to-wall-left':
    case 'knee-to-wall-right': {
      if (r() < 0.5) return undefined;
      const ankle = { x: between(r, 450, 550), y: between(r, 1000, 1100) };
      place(r, side, 'near-ankle', ankle);
      place(r, side, 'near-knee', { x: ankle.x + between(r, 60, 300), y: ankle.y - between(r, 280, 380) });
      return { side: { landmarks: side } };
    }
    case 'racket-side-lunge':
      leg(r, front, ['lead-hip', 'lead-knee', 'lead-ankle'], between(r, 450, 550));
      trunk(r, front);
      sideBody(r, side);
      return { front: { landmarks: front }, side: { landmarks: side } };
  }
}

export function randomAssessment(r: Rand): AssessmentInput {
  const sex = r() < 0.5 ? 'female' : 'male';
  const range = MATURITY_AGE_RANGE[sex];
  const outsideRange = r() < 0.1;
  const ageYears = round1(outsideRange ? between(r, range.max + 0.5, range.max + 3) : between(r, range.min, range.max));
  const statureCm = round1(Math.min(200, 120 + (ageYears - 7) * 5.5 + between(r, -8, 8)));
  const sittingHeightCm = round1(statureCm * between(r, 0.5, 0.54));
  const massKg = round1(Math.max(20, (statureCm * statureCm * between(r, 16, 24)) / 10000));
  const racketHand: Side | undefined = r() < 0.85 ? (r() < 0.85 ? 'right' : 'left') : undefined;

  const athlete: AssessmentInput['athlete'] = { sex, ageYears };
  if (r() < 0.9) athlete.statureCm = statureCm;
  if (r() < 0.8) athlete.sittingHeightCm = sittingHeightCm;
  if (r() < 0.8) athlete.massKg = massKg;
  if (racketHand) athlete.racketHand = racketHand;

  const tasks: AssessmentInput['tasks'] = {};
  for (const spec of BATTERY) {
    if (r() < 0.15) continue;
    const result: TaskResultInput = {
      criteria: spec.criteria.filter(() => r() < 0.25).map((c) => c.id),
    };
    const ph = photos(r, spec.id);
    if (ph) result.photos = ph;
    if (spec.distance) result.distanceCm = round1(between(r, 0, 18));
    if (r() < 0.03) result.painReported = true;
    tasks[spec.id] = result;
  }

  const input: AssessmentInput = {
    athlete,
    tasks,
    options: {
      rescreenWeeks: 1 + Math.floor(r() * 12),
      today: new Date(Date.UTC(2025, 0, 1) + Math.floor(r() * 730) * 86_400_000).toISOString().slice(0, 10),
      maturityMethod: outsideRange ? 'none' : r() < 0.5 ? 'moore2015' : 'mirwald2002',
      loadIncrementKg: [0.5, 1, 1.25, 2, 2.5][Math.floor(r() * 5)] ?? 2.5,
    },
  };
  if (r() < 0.5) input.oneRepMaxKg = round1(between(r, 10, 120));
  return input;
}

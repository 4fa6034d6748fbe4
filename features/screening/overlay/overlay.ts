// What to draw over a photo for a task and view: the limb and trunk lines between placed landmarks and
// the live angles from the engine's own geometry. Pure: the editor and the result screen both draw it.
import type { LandmarkSet } from '@/features/screening/contract';
import { frontalPlaneProjectionAngle, kneeFlexion, pelvicObliquity, tibialInclination, trunkLean } from '@/features/screening/engine/geometry';
import type { LandmarkId, Point, Side, TaskSpec, View } from '@/features/screening/engine';

export type OverlayLine = { id: string; from: Point; to: Point; style: 'limb' | 'reference' };
export type OverlayAngle = {
  id: string;
  /** Where the value is written on the photo. */
  anchor: Point;
  /** Written on the photo, e.g. "R 12°". */
  short: string;
  /** Which side of the anchor the value is written on: the outer side, so the two knees' values never overlap. */
  placement: 'left' | 'right';
  /** Written under the photo, e.g. "Right knee angle from the front (FPPA)". */
  label: string;
  value: number;
  /** e.g. "12.4°, knee inside the hip-ankle line (valgus)". */
  text: string;
};
export type Overlay = { lines: OverlayLine[]; angles: OverlayAngle[]; problems: string[] };

const SIDE_WORD: Record<Side, string> = { left: 'Left', right: 'Right' };
const LETTER: Record<Side, string> = { left: 'L', right: 'R' };
const deg = (v: number) => `${v.toFixed(1)}°`;
const round = (v: number) => `${Math.round(v)}°`;

function attempt<T>(problems: string[], what: string, fn: () => T): T | null {
  try {
    return fn();
  } catch (e) {
    problems.push(`${what}: ${e instanceof Error ? e.message : String(e)}`);
    return null;
  }
}

function leg(out: Overlay, marks: LandmarkSet, ids: readonly [LandmarkId, LandmarkId, LandmarkId], side: Side | null, name: string) {
  const [hip, knee, ankle] = ids.map((id) => marks[id]);
  if (hip && knee) out.lines.push({ id: `${ids[0]}-${ids[1]}`, from: hip, to: knee, style: 'limb' });
  if (knee && ankle) out.lines.push({ id: `${ids[1]}-${ids[2]}`, from: knee, to: ankle, style: 'limb' });
  if (!hip || !knee || !ankle) return;
  out.lines.push({ id: `${ids[0]}-${ids[2]}`, from: hip, to: ankle, style: 'reference' });
  if (!side) return;
  const v = attempt(out.problems, `${name} knee`, () => frontalPlaneProjectionAngle(hip, knee, ankle, side));
  if (v === null) return;
  out.angles.push({
    id: `fppa-${ids[1]}`,
    anchor: knee,
    placement: side === 'right' && ids[1] === 'right-knee' ? 'left' : 'right',
    // One decimal, as the value below the photo: rounded, 12.8° read "13°" beside a "flagged above 13°".
    short: `${LETTER[side]} ${deg(v)}`,
    label: `${name} knee angle from the front (FPPA)`,
    value: v,
    text: `${deg(v)}${v > 0 ? ', knee inside the hip-ankle line (valgus)' : v < 0 ? ', knee outside the hip-ankle line (varus)' : ', straight'}`,
  });
}

function verticalAbove(p: Point, length: number): Point {
  return { x: p.x, y: p.y - length };
}

function trunk(out: Overlay, shoulder: Point | undefined, hip: Point | undefined, view: View, idPrefix: string) {
  if (!shoulder || !hip) return;
  const length = Math.hypot(shoulder.x - hip.x, shoulder.y - hip.y);
  out.lines.push({ id: `${idPrefix}-trunk`, from: hip, to: shoulder, style: 'limb' });
  out.lines.push({ id: `${idPrefix}-trunk-vertical`, from: hip, to: verticalAbove(hip, length), style: 'reference' });
  const v = attempt(out.problems, 'Trunk', () => trunkLean(shoulder, hip, view));
  if (v === null) return;
  out.angles.push({
    id: `${idPrefix}-trunk-lean`,
    anchor: { x: (shoulder.x + hip.x) / 2, y: (shoulder.y + hip.y) / 2 },
    short: `trunk ${round(v)}`,
    placement: 'right',
    label: view === 'front' ? 'Sideways trunk lean' : 'Forward trunk lean',
    value: v,
    text: `${deg(v)} from vertical`,
  });
}

export function overlayFor(task: TaskSpec, view: View, marks: LandmarkSet, racketHand?: Side): Overlay {
  const out: Overlay = { lines: [], angles: [], problems: [] };
  const needed = task.views.find((v) => v.view === view)?.landmarks ?? [];
  if (view === 'front') {
    for (const side of ['right', 'left'] as const) {
      if (needed.includes(`${side}-knee`)) leg(out, marks, [`${side}-hip`, `${side}-knee`, `${side}-ankle`], side, SIDE_WORD[side]);
    }
    if (needed.includes('lead-knee')) {
      leg(out, marks, ['lead-hip', 'lead-knee', 'lead-ankle'], racketHand ?? null, racketHand ? `Front (${racketHand})` : 'Front');
    }
    const l = marks['left-asis'];
    const r = marks['right-asis'];
    if (l && r && needed.includes('left-asis')) {
      out.lines.push({ id: 'pelvis', from: r, to: l, style: 'limb' });
      const anchor = { x: (l.x + r.x) / 2, y: (l.y + r.y) / 2 };
      if (task.side) {
        const stance = task.side;
        const v = attempt(out.problems, 'Pelvis', () => pelvicObliquity(l, r, stance));
        if (v !== null) {
          const free = stance === 'left' ? 'right' : 'left';
          out.angles.push({
            id: 'pelvic-obliquity',
            anchor,
            short: `pelvis ${round(v)}`,
            placement: 'right',
            label: `Pelvic drop on the ${free} (lifted-leg) side`,
            value: v,
            text: `${deg(v)}${v > 0 ? `: the ${free} side is lower` : v < 0 ? `: the ${free} side is higher` : ': level'}`,
          });
        }
      } else {
        // Two-leg task: no stance leg, so say which side is lower.
        const v = attempt(out.problems, 'Pelvis', () => pelvicObliquity(l, r, 'left'));
        if (v !== null) {
          const lower = v > 0 ? 'right' : v < 0 ? 'left' : null;
          out.angles.push({
            id: 'pelvic-tilt',
            anchor,
            short: `pelvis ${round(Math.abs(v))}`,
            placement: 'right',
            label: 'Pelvis out of level',
            value: Math.abs(v),
            text: `${deg(Math.abs(v))}${lower ? `: lower on the ${lower}` : ': level'}`,
          });
        }
      }
    }
    if (needed.includes('mid-shoulder')) trunk(out, marks['mid-shoulder'], marks['mid-hip'], 'front', 'front');
    return out;
  }

  if (needed.includes('near-shoulder')) trunk(out, marks['near-shoulder'], marks['near-hip'], 'side', 'side');
  const hip = needed.includes('near-hip') ? marks['near-hip'] : undefined;
  const knee = marks['near-knee'];
  const ankle = marks['near-ankle'];
  if (hip && knee) out.lines.push({ id: 'near-thigh', from: hip, to: knee, style: 'limb' });
  if (knee && ankle) out.lines.push({ id: 'near-shin', from: knee, to: ankle, style: 'limb' });
  if (hip && knee && ankle) {
    const v = attempt(out.problems, 'Knee', () => kneeFlexion(hip, knee, ankle));
    if (v !== null) {
      out.angles.push({
        id: 'knee-flexion',
        anchor: knee,
        short: `knee ${round(v)}`,
        placement: 'right',
        label: 'Knee bend (flexion)',
        value: v,
        text: `${deg(v)} (0° = straight leg)`,
      });
    }
  }
  if (knee && ankle) {
    out.lines.push({ id: 'shin-vertical', from: ankle, to: verticalAbove(ankle, Math.hypot(knee.x - ankle.x, knee.y - ankle.y)), style: 'reference' });
    const v = attempt(out.problems, 'Shin', () => tibialInclination(knee, ankle));
    if (v !== null) {
      out.angles.push({
        id: 'tibial-inclination',
        anchor: { x: (knee.x + ankle.x) / 2, y: (knee.y + ankle.y) / 2 },
        short: `shin ${round(v)}`,
        placement: 'right',
        label: 'Shin angle from vertical (tibial inclination)',
        value: v,
        text: `${deg(v)} from vertical`,
      });
    }
  }
  return out;
}

/**
 * Landmark catalogue: every point a tester may be asked to place, with plain
 * words for the prompt. Front-view points are named by the ATHLETE's side; the
 * hint says where that side appears on the image (camera facing the athlete,
 * so the athlete's right is on the image's left).
 */
import type { LandmarkId, View } from './types';

export interface LandmarkSpec {
  id: LandmarkId;
  view: View;
  label: string;
  hint: string;
}

export const LANDMARKS: readonly LandmarkSpec[] = [
  {
    id: 'right-hip',
    view: 'front',
    label: 'Right hip centre',
    hint: "On the image's left: middle of the right thigh where it meets the pelvis, level with the bony bump at the side of the hip.",
  },
  {
    id: 'left-hip',
    view: 'front',
    label: 'Left hip centre',
    hint: "On the image's right: middle of the left thigh where it meets the pelvis, level with the bony bump at the side of the hip.",
  },
  {
    id: 'right-knee',
    view: 'front',
    label: 'Right knee centre',
    hint: "On the image's left: middle of the right kneecap.",
  },
  {
    id: 'left-knee',
    view: 'front',
    label: 'Left knee centre',
    hint: "On the image's right: middle of the left kneecap.",
  },
  {
    id: 'right-ankle',
    view: 'front',
    label: 'Right ankle centre',
    hint: "On the image's left: halfway between the two ankle bones of the right leg.",
  },
  {
    id: 'left-ankle',
    view: 'front',
    label: 'Left ankle centre',
    hint: "On the image's right: halfway between the two ankle bones of the left leg.",
  },
  {
    id: 'right-asis',
    view: 'front',
    label: 'Right front hip bone (ASIS)',
    hint: "On the image's left: the bony point at the front of the pelvis, just below the waistband. Ask the athlete to point to it.",
  },
  {
    id: 'left-asis',
    view: 'front',
    label: 'Left front hip bone (ASIS)',
    hint: "On the image's right: the bony point at the front of the pelvis, just below the waistband.",
  },
  {
    id: 'mid-shoulder',
    view: 'front',
    label: 'Middle of the shoulders',
    hint: 'Halfway between the two shoulder tips, at the base of the neck.',
  },
  {
    id: 'mid-hip',
    view: 'front',
    label: 'Middle of the hips',
    hint: 'Halfway between the two hip centres, at the centre of the pelvis.',
  },
  {
    id: 'lead-hip',
    view: 'front',
    label: 'Front-leg hip centre',
    hint: 'Hip centre of the leg stepping forward in the lunge (the racket side).',
  },
  {
    id: 'lead-knee',
    view: 'front',
    label: 'Front-leg knee centre',
    hint: 'Middle of the kneecap of the leg stepping forward.',
  },
  {
    id: 'lead-ankle',
    view: 'front',
    label: 'Front-leg ankle centre',
    hint: 'Halfway between the two ankle bones of the leg stepping forward.',
  },
  {
    id: 'near-shoulder',
    view: 'side',
    label: 'Shoulder (camera side)',
    hint: 'Tip of the shoulder nearest the camera.',
  },
  {
    id: 'near-hip',
    view: 'side',
    label: 'Hip (camera side)',
    hint: 'The bony bump at the side of the hip nearest the camera.',
  },
  {
    id: 'near-knee',
    view: 'side',
    label: 'Knee (camera side)',
    hint: 'Centre of the side of the knee nearest the camera, at the joint line.',
  },
  {
    id: 'near-ankle',
    view: 'side',
    label: 'Ankle (camera side)',
    hint: 'The outer ankle bone nearest the camera.',
  },
];

const BY_ID = new Map<string, LandmarkSpec>(LANDMARKS.map((l) => [l.id, l]));

export function isLandmarkId(id: string): id is LandmarkId {
  return BY_ID.has(id);
}

export function getLandmark(id: LandmarkId): LandmarkSpec {
  const spec = BY_ID.get(id);
  if (!spec) throw new Error(`unknown landmark ${id}`);
  return spec;
}

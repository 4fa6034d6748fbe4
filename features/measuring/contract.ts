// The "to measure" list: photos taken courtside whose landmarks are placed later, at a desk. Request
// schema (yup, shared by the client and the server's validation middleware) and response shapes.
import { mixed, object } from 'yup';
import { POINT_SOURCES, type AssessmentStatus, type LandmarkSet, type PhotoView } from '@/features/screening/contract';
import type { Side, TaskId, View } from '@/features/screening/engine';

export type MeasureItem = {
  photo: PhotoView;
  assessmentId: string;
  assessmentStatus: AssessmentStatus;
  athlete: { id: string; firstName: string; lastName: string; racketHand: Side };
  round: { id: string; name: string; screenedOn: string; squadName: string };
  taskId: TaskId;
  view: View;
  /** The points already placed on this photo (none for a photo fresh from courtside). */
  landmarks: LandmarkSet;
  placed: number;
  needed: number;
};

export type MeasureQueue = { items: MeasureItem[] };

export type SavedLandmarks = {
  draftVersion: number;
  status: AssessmentStatus;
  /** The new result version when the assessment was already submitted and was worked out again. */
  resultVersion: number | null;
};

function validPoints(value: unknown): boolean {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) return false;
  return Object.values(value as Record<string, unknown>).every((p) => {
    if (typeof p !== 'object' || p === null) return false;
    const { x, y, source } = p as { x?: unknown; y?: unknown; source?: unknown };
    return (
      typeof x === 'number' &&
      typeof y === 'number' &&
      Number.isFinite(x) &&
      Number.isFinite(y) &&
      x >= 0 &&
      y >= 0 &&
      (source === undefined || (POINT_SOURCES as readonly unknown[]).includes(source))
    );
  });
}

export const saveLandmarksSchema = object({
  landmarks: mixed<LandmarkSet>()
    .required('Send the landmarks of the photo.')
    .test('points', 'Each landmark must be a point {x, y} inside the photo, with an optional source: placed, suggested or moved.', (v) => validPoints(v)),
});

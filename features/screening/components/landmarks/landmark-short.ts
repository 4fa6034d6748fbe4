import type { LandmarkId } from '@/features/screening/engine';

/** Short names written beside the points on the photo (the list under it gives the full label). */
export const LANDMARK_SHORT: Record<LandmarkId, string> = {
  'right-hip': 'R hip',
  'left-hip': 'L hip',
  'right-knee': 'R knee',
  'left-knee': 'L knee',
  'right-ankle': 'R ankle',
  'left-ankle': 'L ankle',
  'right-asis': 'R ASIS',
  'left-asis': 'L ASIS',
  'mid-shoulder': 'shoulders',
  'mid-hip': 'mid-hips',
  'lead-hip': 'hip',
  'lead-knee': 'knee',
  'lead-ankle': 'ankle',
  'near-shoulder': 'shoulder',
  'near-hip': 'hip',
  'near-knee': 'knee',
  'near-ankle': 'ankle',
};

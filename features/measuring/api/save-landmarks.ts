import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import type { SavedLandmarks } from '@/features/measuring/contract';
import type { LandmarkSet } from '@/features/screening/contract';
import { screeningKeys } from '@/features/screening/api/keys';
import { useActiveClub } from '@/features/session/active-club';
import { measuringKeys } from './keys';

export const saveLandmarks = (photoId: string, landmarks: LandmarkSet) =>
  api<SavedLandmarks>(`/measuring/photos/${encodeURIComponent(photoId)}/landmarks`, { method: 'PUT', json: { landmarks } });

export function useSaveLandmarksMutation() {
  const qc = useQueryClient();
  const { membership } = useActiveClub();
  return useMutation({
    mutationFn: (v: { photoId: string; landmarks: LandmarkSet }) => saveLandmarks(v.photoId, v.landmarks),
    // The list shrinks; the assessment's draft and possibly its result (a new version) changed.
    onSuccess: () =>
      Promise.all([
        qc.invalidateQueries({ queryKey: measuringKeys.club(membership.clubId) }),
        qc.invalidateQueries({ queryKey: screeningKeys.club(membership.clubId) }),
      ]),
  });
}

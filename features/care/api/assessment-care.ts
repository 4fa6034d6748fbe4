import { queryOptions, useMutation, useQuery } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import type { StrengthBlock } from '../strength-block';
import type { ClearanceView, ReleasePreview, ReviewState } from '../types';
import { useCareChanged } from './invalidate';
import { CARE_STALE_MS, careKeys } from './keys';

export type AssessmentCare = ReviewState & { clearance: ClearanceView; block: StrengthBlock; athleteId: string };

const path = (id: string) => `/assessments/${encodeURIComponent(id)}`;
export const getAssessmentCare = (id: string) => api<{ care: AssessmentCare }>(`${path(id)}/care`);
export const markReviewed = (id: string) => api<{ care: AssessmentCare }>(`${path(id)}/review`, { method: 'POST' });
export const getReleasePreview = (id: string) => api<{ preview: ReleasePreview }>(`${path(id)}/release-preview`);
export const releaseSummary = (id: string) =>
  api<{ release: { id: string; releasedAt: string; recipients: number } }>(`${path(id)}/release`, { method: 'POST' });

export const assessmentCareQueryOptions = (clubId: string, id: string) =>
  queryOptions({ queryKey: careKeys.assessment(clubId, id), queryFn: () => getAssessmentCare(id), staleTime: CARE_STALE_MS });

export function useAssessmentCareQuery(id: string) {
  const { membership } = useActiveClub();
  return useQuery(assessmentCareQueryOptions(membership.clubId, id));
}

export function useReleasePreviewQuery(id: string, enabled: boolean) {
  const { membership } = useActiveClub();
  return useQuery({ queryKey: careKeys.preview(membership.clubId, id), queryFn: () => getReleasePreview(id), enabled, staleTime: 0 });
}

export function useMarkReviewedMutation(id: string) {
  const changed = useCareChanged();
  return useMutation({ mutationFn: () => markReviewed(id), onSuccess: changed });
}

export function useReleaseMutation(id: string) {
  const changed = useCareChanged();
  return useMutation({ mutationFn: () => releaseSummary(id), onSuccess: changed });
}

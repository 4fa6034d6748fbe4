import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import type { ReviewItem } from '../types';
import { CARE_STALE_MS, careKeys } from './keys';

export const getReviews = () => api<{ reviews: ReviewItem[]; awaitingRelease: ReviewItem[] }>('/reviews');

export const reviewsQueryOptions = (clubId: string) => queryOptions({ queryKey: careKeys.reviews(clubId), queryFn: getReviews, staleTime: CARE_STALE_MS });

export function useReviewsQuery() {
  const { membership } = useActiveClub();
  return useQuery(reviewsQueryOptions(membership.clubId));
}

import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import type { MeasureQueue } from '@/features/measuring/contract';
import { useActiveClub } from '@/features/session/active-club';
import { measuringKeys, QUEUE_STALE_MS } from './keys';

export const getQueue = (filter: { roundId?: string }) =>
  api<MeasureQueue>(`/measuring/queue${filter.roundId ? `?roundId=${encodeURIComponent(filter.roundId)}` : ''}`);

export const queueQueryOptions = (clubId: string, filter: { roundId?: string }) =>
  queryOptions({ queryKey: measuringKeys.queue(clubId, filter), queryFn: () => getQueue(filter), staleTime: QUEUE_STALE_MS });

export function useMeasureQueueQuery(filter: { roundId?: string }) {
  const { membership } = useActiveClub();
  return useQuery(queueQueryOptions(membership.clubId, filter));
}

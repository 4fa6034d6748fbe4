import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import { FILTER_KEYS, type TrendFilters, type TrendsResponse } from '../trends';
import { PROGRESS_STALE_MS, progressKeys } from './keys';

/** The whole squad; the table filters on the device (40 rows), and the CSV link asks the server to. */
export const getSquadTrends = (squadId: string) => api<TrendsResponse>(`/squads/${encodeURIComponent(squadId)}/trends`);

/** The CSV export of the filtered table (a plain link: the browser downloads it with the session cookie). */
export function squadTrendsCsvUrl(squadId: string, filters: TrendFilters): string {
  const params = new URLSearchParams({ format: 'csv' });
  for (const key of FILTER_KEYS) {
    const value = filters[key];
    if (value) params.set(key, value);
  }
  return `/api/squads/${encodeURIComponent(squadId)}/trends?${params.toString()}`;
}

export const squadTrendsQueryOptions = (clubId: string, squadId: string) =>
  queryOptions({ queryKey: progressKeys.trends(clubId, squadId), queryFn: () => getSquadTrends(squadId), staleTime: PROGRESS_STALE_MS });

export function useSquadTrendsQuery(squadId: string | null) {
  const { membership } = useActiveClub();
  return useQuery({ ...squadTrendsQueryOptions(membership.clubId, squadId ?? ''), enabled: !!squadId });
}

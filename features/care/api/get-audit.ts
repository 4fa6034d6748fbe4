import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import type { AuditRow } from '../types';
import { CARE_STALE_MS, careKeys } from './keys';

export type AuditFilters = { subject?: string; from?: string; to?: string; athleteId?: string; actorId?: string; changes?: 'true' };

export const auditSearch = (filters: AuditFilters, format?: 'csv') => {
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries(filters)) if (v) params.set(k, v);
  if (format) params.set('format', format);
  const s = params.toString();
  return s ? `?${s}` : '';
};

export const getAudit = (filters: AuditFilters) => api<{ events: AuditRow[] }>(`/audit${auditSearch(filters)}`);

export const auditQueryOptions = (clubId: string, filters: AuditFilters) =>
  queryOptions({ queryKey: careKeys.audit(clubId, filters), queryFn: () => getAudit(filters), staleTime: CARE_STALE_MS, placeholderData: keepPreviousData });

export function useAuditQuery(filters: AuditFilters) {
  const { membership } = useActiveClub();
  return useQuery(auditQueryOptions(membership.clubId, filters));
}

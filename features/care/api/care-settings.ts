import { queryOptions, useMutation, useQuery } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import type { CareSettingsInput } from '../schemas';
import type { CareSettingsView, RetentionCandidate } from '../types';
import { useCareChanged } from './invalidate';
import { CARE_STALE_MS, careKeys } from './keys';

export const getCareSettings = () => api<{ settings: CareSettingsView }>('/care-settings');
export const saveCareSettings = (input: CareSettingsInput) => api<{ settings: CareSettingsView }>('/care-settings', { method: 'PUT', json: input });
export const getRetentionDryRun = () => api<{ dryRun: true; candidates: RetentionCandidate[] }>('/retention/dry-run');

export const careSettingsQueryOptions = (clubId: string) =>
  queryOptions({ queryKey: careKeys.settings(clubId), queryFn: getCareSettings, staleTime: CARE_STALE_MS });

export function useCareSettingsQuery() {
  const { membership } = useActiveClub();
  return useQuery(careSettingsQueryOptions(membership.clubId));
}

export function useSaveCareSettingsMutation() {
  const changed = useCareChanged();
  return useMutation({ mutationFn: saveCareSettings, onSuccess: changed });
}

export function useRetentionDryRunQuery(enabled: boolean) {
  const { membership } = useActiveClub();
  return useQuery({ queryKey: [...careKeys.settings(membership.clubId), 'dry-run'], queryFn: getRetentionDryRun, enabled, staleTime: 0 });
}

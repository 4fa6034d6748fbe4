import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import type { MetaResponse } from '@/features/mailbox/contract';

export const metaKeys = { root: ['meta'] as const };
export const META_STALE_MS = Infinity;

export const metaQueryOptions = () => queryOptions({ queryKey: metaKeys.root, queryFn: () => api<MetaResponse>('/meta'), staleTime: META_STALE_MS });
export const useMetaQuery = () => useQuery(metaQueryOptions());

import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/features/api/client';

export const metaKeys = { root: ['meta'] as const };
export const META_STALE_MS = Infinity;

export const metaQueryOptions = () =>
  queryOptions({ queryKey: metaKeys.root, queryFn: () => api<{ mailbox: boolean }>('/meta'), staleTime: META_STALE_MS });
export const useMetaQuery = () => useQuery(metaQueryOptions());

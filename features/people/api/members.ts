import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import type { InviteInput } from '@/features/auth/schemas';
import type { InviteResponse, MembersResponse } from '@/features/people/contract';

export const peopleKeys = { members: (clubId: string) => ['people', clubId, 'members'] as const };
export const MEMBERS_STALE_MS = 30 * 1000;

export const membersQueryOptions = (clubId: string) =>
  queryOptions({
    queryKey: peopleKeys.members(clubId),
    queryFn: () => api<MembersResponse>(`/clubs/${clubId}/members`),
    staleTime: MEMBERS_STALE_MS,
  });

export const useMembersQuery = (clubId: string) => useQuery(membersQueryOptions(clubId));

export function useInviteMutation(clubId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: InviteInput) => api<InviteResponse>(`/clubs/${clubId}/invitations`, { method: 'POST', json: input }),
    onSuccess: () => qc.invalidateQueries({ queryKey: membersQueryOptions(clubId).queryKey }),
  });
}

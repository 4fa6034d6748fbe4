import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import type { InviteInput } from '@/features/auth/schemas';
import type { ChangeRoleInput, InviteResponse, MembersResponse } from '@/features/people/contract';

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

function useMembersChange<T>(clubId: string, send: (input: T) => Promise<unknown>) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: send, onSuccess: () => qc.invalidateQueries({ queryKey: membersQueryOptions(clubId).queryKey }) });
}

export const useChangeRoleMutation = (clubId: string) =>
  useMembersChange(clubId, ({ userId, role }: { userId: string } & ChangeRoleInput) =>
    api<{ ok: true }>(`/clubs/${clubId}/members/${userId}`, { method: 'PATCH', json: { role } }),
  );

export const useRemoveMemberMutation = (clubId: string) =>
  useMembersChange(clubId, (userId: string) => api<{ ok: true }>(`/clubs/${clubId}/members/${userId}`, { method: 'DELETE' }));

export const useCancelInvitationMutation = (clubId: string) =>
  useMembersChange(clubId, (invitationId: string) => api<{ ok: true }>(`/clubs/${clubId}/invitations/${invitationId}`, { method: 'DELETE' }));

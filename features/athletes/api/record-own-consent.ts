import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { careKeys } from '@/features/care/api/keys';
import { useActiveClub } from '@/features/session/active-club';
import type { OwnConsentInput } from '../schemas';
import { useRosterChanged } from './invalidate';
import type { Athlete, ConsentRecord } from './types';

/** A parent's own decision about their child, dated today by the server; `changed` is false when it was already in force. */
export const recordOwnConsent = (id: string, input: OwnConsentInput) =>
  api<{ changed: boolean; athlete: Athlete; consents: ConsentRecord[] }>(`/athletes/${encodeURIComponent(id)}/consents/own`, {
    method: 'POST',
    json: input,
  });

export function useRecordOwnConsentMutation(id: string) {
  const changed = useRosterChanged();
  const qc = useQueryClient();
  const { membership } = useActiveClub();
  return useMutation({
    mutationFn: (input: OwnConsentInput) => recordOwnConsent(id, input),
    onSuccess: async ({ athlete }) => {
      // The family page shows the screen's photos only while photos are agreed to.
      await Promise.all([changed(athlete), qc.invalidateQueries({ queryKey: careKeys.family(membership.clubId, id) })]);
    },
  });
}

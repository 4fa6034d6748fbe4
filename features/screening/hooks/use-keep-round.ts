import { useQueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import { connectivity } from '@/features/offline/device-handle';
import { assessmentQueryOptions } from '@/features/screening/api/get-assessment';
import type { RoundDetail } from '@/features/screening/contract';
import { can } from '@/features/access/permissions';
import { useActiveClub } from '@/features/session/active-club';

/**
 * When a tester opens a round online, its open drafts are read once and kept on the device with the
 * round (integration point with features/offline), so every athlete of it can be screened with no
 * connection. Submitted assessments and other rounds are not kept.
 */
export function useKeepRoundOnDevice(round: RoundDetail | undefined) {
  const qc = useQueryClient();
  const { membership } = useActiveClub();
  const keep = can(membership.role, 'screening.write');
  const ids =
    round?.athletes
      .filter((a) => a.status !== 'submitted')
      .map((a) => a.assessmentId)
      .join(',') ?? '';
  useEffect(() => {
    if (!keep || !ids || !connectivity.isOnline()) return;
    for (const id of ids.split(',')) void qc.prefetchQuery(assessmentQueryOptions(membership.clubId, id, true));
  }, [qc, keep, ids, membership.clubId]);
}

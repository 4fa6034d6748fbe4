import { useQueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import { connectivity } from '@/features/offline/device-handle';
import { assessmentQueryOptions } from '@/features/screening/api/get-assessment';
import type { RoundDetail } from '@/features/screening/contract';
import { can } from '@/features/access/permissions';
import { useActiveClub } from '@/features/session/active-club';
import { afterLoadWhenIdle } from '@/features/ui/after-load-idle';

// Web: once the page has loaded and is idle. Elsewhere (native: no document) in the next task.
const whenIdle = (fn: () => void) => (typeof document === 'undefined' ? setTimeout(fn, 0) : afterLoadWhenIdle(fn));

/**
 * When a tester opens a round online, its open drafts are read once and kept on the device with the
 * round (integration point with features/offline), so every athlete of it can be screened with no
 * connection. Submitted assessments and other rounds are not kept. No screen waits for them, so they
 * are read once the page is idle and one after another: asked all at once on the round's first render,
 * the requests and the writes to the device made one long task while the page started (Lighthouse, a
 * round of 12: 0.6 s of blocking on a 4x slower CPU, our measurement).
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
    // Not stopped when the tester leaves the round: the athletes not opened yet are the ones to keep.
    whenIdle(() => {
      void (async () => {
        for (const id of ids.split(',')) await qc.prefetchQuery(assessmentQueryOptions(membership.clubId, id, true));
      })();
    });
  }, [qc, keep, ids, membership.clubId]);
}

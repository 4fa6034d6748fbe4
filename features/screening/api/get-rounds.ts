import { queryOptions, useQuery } from '@tanstack/react-query';
import { useMemo } from 'react';
import { api } from '@/features/api/client';
import { useSquadsQuery } from '@/features/athletes/api/get-squads';
import type { SquadSummary } from '@/features/athletes/api/types';
import { useActiveClub } from '@/features/session/active-club';
import type { RoundSummary } from '@/features/screening/contract';
import { ROUNDS_STALE_MS, screeningKeys } from './keys';

/** Every round of the active club (GET /api/rounds without a squad). */
export const getRounds = () => api<{ rounds: RoundSummary[] }>('/rounds');

export const roundsQueryOptions = (clubId: string) => queryOptions({ queryKey: screeningKeys.rounds(clubId), queryFn: getRounds, staleTime: ROUNDS_STALE_MS });

export function useRoundsQuery() {
  const { membership } = useActiveClub();
  return useQuery(roundsQueryOptions(membership.clubId));
}

export type SquadWithRounds = { squad: SquadSummary; rounds: RoundSummary[] };

/** Every squad of the club with its rounds, newest first. */
export function useClubRoundsQuery() {
  const squads = useSquadsQuery();
  const rounds = useRoundsQuery();
  // Kept while neither answer changes, so that a screen can defer it (React's useDeferredValue).
  const bySquad: SquadWithRounds[] = useMemo(() => {
    const all = rounds.data?.rounds ?? [];
    return (squads.data?.squads ?? []).map((squad) => ({
      squad,
      rounds: all.filter((r) => r.squadId === squad.id).sort((a, b) => b.screenedOn.localeCompare(a.screenedOn)),
    }));
  }, [squads.data, rounds.data]);
  return { squads, rounds, bySquad, isPending: squads.isPending || rounds.isPending, error: squads.error ?? rounds.error };
}

/** A round is open while it is not closed and some of its athletes are not submitted yet. */
export function isOpenRound(round: RoundSummary): boolean {
  return !round.closedAt && round.counts.not_started + round.counts.in_progress > 0;
}

/** Nothing done yet in the round: the home page offers to start it rather than to continue. */
export function isUntouchedRound(round: RoundSummary): boolean {
  return round.counts.in_progress + round.counts.submitted === 0;
}

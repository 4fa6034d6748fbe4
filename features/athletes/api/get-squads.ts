import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import { athleteKeys, ROSTER_STALE_MS } from './keys';
import type { SquadSummary } from './types';

export const getSquads = () => api<{ squads: SquadSummary[] }>('/squads');

export const squadsQueryOptions = (clubId: string) => queryOptions({ queryKey: athleteKeys.squads(clubId), queryFn: getSquads, staleTime: ROSTER_STALE_MS });

export function useSquadsQuery() {
  const { membership } = useActiveClub();
  return useQuery(squadsQueryOptions(membership.clubId));
}

/**
 * The squad a squad-wide screen (trends, training sheet) opens on when the address names none: the one
 * with the most athletes, the club's main squad rather than whichever sorts first by name (the first
 * listed among equals). Our choice. The screens then keep the choice in the address.
 */
export const biggestSquadId = (squads: readonly Pick<SquadSummary, 'id' | 'athleteCount'>[]): string | null =>
  squads.reduce<Pick<SquadSummary, 'id' | 'athleteCount'> | null>((best, s) => (!best || s.athleteCount > best.athleteCount ? s : best), null)?.id ?? null;

import { queryOptions, useQuery } from '@tanstack/react-query';
import type { RoundView } from '../../../../shared/schemas/allocation';
import { api } from '../../../lib/api-client';
import { roundKeys } from './keys';

/** The solver is at work: a stage is reported, or the round is a draft that has not failed. */
export function isSolving(round: Pick<RoundView, 'running' | 'status' | 'error'>): boolean {
  return round.running !== null || (round.status === 'draft' && !round.error);
}

export function getRound(roundId: string, signal?: AbortSignal) {
  return api.get<RoundView>(`/api/rounds/${encodeURIComponent(roundId)}`, { signal });
}

export const roundQueryOptions = (roundId: string) =>
  queryOptions({
    queryKey: roundKeys.detail(roundId),
    queryFn: ({ signal }) => getRound(roundId, signal),
    // Ask every second while the server is solving, so the stage and the timer move on.
    refetchInterval: (query) => (query.state.data && isSolving(query.state.data) ? 1000 : false),
  });

export function useRound(roundId: string) {
  return useQuery(roundQueryOptions(roundId));
}

import { queryOptions, useQuery } from '@tanstack/react-query';
import type { RoundSummary } from '../../../../shared/schemas/allocation';
import { api } from '../../../lib/api-client';
import { roundKeys } from './keys';

export function getRounds(seasonId: string, signal?: AbortSignal) {
  return api.get<{ items: RoundSummary[]; total: number }>(`/api/seasons/${encodeURIComponent(seasonId)}/rounds`, { signal });
}

export const roundsQueryOptions = (seasonId: string) =>
  queryOptions({
    queryKey: roundKeys.list(seasonId),
    queryFn: ({ signal }) => getRounds(seasonId, signal),
  });

export function useRounds(seasonId: string) {
  return useQuery(roundsQueryOptions(seasonId));
}

import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Season } from '../../../../shared/schemas/seasons';
import { api } from '../../../lib/api-client';
import { seasonKeys } from './keys';

export function getSeasons(signal?: AbortSignal) {
  return api.get<{ items: Season[]; total: number }>('/api/seasons', { signal });
}

export const seasonsQueryOptions = () =>
  queryOptions({
    queryKey: seasonKeys.list(),
    queryFn: ({ signal }) => getSeasons(signal),
  });

export function useSeasons() {
  return useQuery(seasonsQueryOptions());
}

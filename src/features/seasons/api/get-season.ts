import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Season } from '../../../../shared/schemas/seasons';
import { api } from '../../../lib/api-client';
import { seasonKeys } from './keys';

export function getSeason(id: string, signal?: AbortSignal) {
  return api.get<Season>(`/api/seasons/${encodeURIComponent(id)}`, { signal });
}

export const seasonQueryOptions = (id: string) =>
  queryOptions({
    queryKey: seasonKeys.detail(id),
    queryFn: ({ signal }) => getSeason(id, signal),
  });

export function useSeason(id: string) {
  return useQuery(seasonQueryOptions(id));
}

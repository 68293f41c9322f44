import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Species } from '../../../../shared/schemas/register';
import { api } from '../../../lib/api-client';
import { speciesKeys } from './keys';

export function getSpecies(signal?: AbortSignal) {
  return api.get<{ items: Species[]; total: number }>('/api/species', { signal });
}

export const speciesQueryOptions = () =>
  queryOptions({
    queryKey: speciesKeys.lists(),
    queryFn: ({ signal }) => getSpecies(signal),
    // The lists change when a coordinator edits them, which invalidates this entry.
    staleTime: 5 * 60_000,
  });

export function useSpecies() {
  return useQuery(speciesQueryOptions());
}

import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Pest } from '../../../../shared/schemas/health';
import { api } from '../../../lib/api-client';
import { pestKeys } from './keys';

export function getPests(signal?: AbortSignal) {
  return api.get<{ items: Pest[] }>('/api/pests', { signal });
}

export const pestsQueryOptions = () =>
  queryOptions({
    queryKey: pestKeys.all,
    queryFn: ({ signal }) => getPests(signal),
    staleTime: 10 * 60_000,
  });

export function usePests() {
  return useQuery(pestsQueryOptions());
}

/** Pests that can occur on this genus: those naming it, and those naming no genus at all. */
export function pestsForGenus(pests: Pest[], genus: string | null | undefined): Pest[] {
  if (!genus) return pests;
  const g = genus.toLowerCase();
  return pests.filter((p) => p.genera.length === 0 || p.genera.some((x) => x.toLowerCase() === g));
}

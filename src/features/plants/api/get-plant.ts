import { queryOptions, useQueries, useQuery } from '@tanstack/react-query';
import type { PlantDetail } from '../../../../shared/schemas/register';
import { api } from '../../../lib/api-client';
import { plantKeys } from './keys';

export function getPlant(id: string, signal?: AbortSignal) {
  return api.get<PlantDetail>(`/api/mother-plants/${encodeURIComponent(id)}`, { signal });
}

export const plantQueryOptions = (id: string) =>
  queryOptions({
    queryKey: plantKeys.detail(id),
    queryFn: ({ signal }) => getPlant(id, signal),
  });

export function usePlant(id: string) {
  return useQuery(plantQueryOptions(id));
}

/** Several plants at once (labels for a hand-picked selection). */
export function usePlantsById(ids: string[]) {
  return useQueries({ queries: ids.map((id) => plantQueryOptions(id)) });
}

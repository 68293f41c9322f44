import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OfferRow } from '../../../../shared/schemas/seasons';
import { api } from '../../../lib/api-client';
import { collectionKeys } from './keys';

/** The farm's plants with their offers this season; the labels use it to find each plant's id. */
export function getFarmPlants(seasonId: string, farmId: string, signal?: AbortSignal) {
  return api.get<{ items: OfferRow[]; total: number }>(
    `/api/seasons/${encodeURIComponent(seasonId)}/farms/${encodeURIComponent(farmId)}/offers`,
    { signal },
  );
}

export const farmPlantsQueryOptions = (seasonId: string, farmId: string) =>
  queryOptions({
    queryKey: collectionKeys.plants(seasonId, farmId),
    queryFn: ({ signal }) => getFarmPlants(seasonId, farmId, signal),
    staleTime: 60_000,
  });

export function useFarmPlants(seasonId: string, farmId: string | null) {
  return useQuery({ ...farmPlantsQueryOptions(seasonId, farmId ?? ''), enabled: !!farmId });
}

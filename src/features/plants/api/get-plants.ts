import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { Page } from '../../../../shared/schemas/common';
import type { PlantListItem } from '../../../../shared/schemas/register';
import { api } from '../../../lib/api-client';
import { plantKeys, type PlantListParams } from './keys';
import { toApiQuery } from './plant-params';

export function getPlants(params: PlantListParams, signal?: AbortSignal) {
  return api.get<Page<PlantListItem>>('/api/mother-plants', { query: toApiQuery(params), signal });
}

export const plantsQueryOptions = (params: PlantListParams) =>
  queryOptions({
    queryKey: plantKeys.list(params),
    queryFn: ({ signal }) => getPlants(params, signal),
    // Keep the current page on screen while the next one loads, so the table does not jump.
    placeholderData: keepPreviousData,
  });

export function usePlants(params: PlantListParams, options: { enabled?: boolean } = {}) {
  return useQuery({ ...plantsQueryOptions(params), enabled: options.enabled ?? true });
}

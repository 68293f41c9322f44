import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Page } from '../../../../shared/schemas/common';
import type { FarmSummary } from '../../../../shared/schemas/farms';
import { api } from '../../../lib/api-client';
import { farmKeys, type FarmListFilters } from './keys';

// The member admin needs every farm in one list to pick from; 200 is the API's page limit.
export const ALL_FARMS: FarmListFilters = { page: 1, pageSize: 200 };

export function getFarms(filters: FarmListFilters, signal?: AbortSignal) {
  return api.get<Page<FarmSummary>>('/api/farms', { query: filters, signal });
}

export const farmsQueryOptions = (filters: FarmListFilters = ALL_FARMS) =>
  queryOptions({
    queryKey: farmKeys.list(filters),
    queryFn: ({ signal }) => getFarms(filters, signal),
    staleTime: 60_000,
  });

export function useFarms(filters: FarmListFilters = ALL_FARMS) {
  return useQuery(farmsQueryOptions(filters));
}

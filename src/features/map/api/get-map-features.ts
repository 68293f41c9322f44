import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { mapKeys } from './keys';
import type { MapFeatures, MapFilters } from './types';

export function getMapFeatures(filters: MapFilters, signal?: AbortSignal) {
  return api.get<MapFeatures>('/api/map/features', { query: filters, signal });
}

export const mapFeaturesQueryOptions = (filters: MapFilters) =>
  queryOptions({
    queryKey: mapKeys.featureList(filters),
    queryFn: ({ signal }) => getMapFeatures(filters, signal),
    // Keep the plants on the map while a new filter loads, so the map does not blink empty.
    placeholderData: keepPreviousData,
    staleTime: 30_000,
  });

export function useMapFeatures(filters: MapFilters) {
  return useQuery(mapFeaturesQueryOptions(filters));
}

// The map route's loader, kept apart from the map page so the router can hold it statically:
// the plants and the basemap's description are then asked for at once on navigation, while
// the map page's code (Leaflet and its plugins) is still downloading, not after it.
import type { LoaderFunctionArgs } from 'react-router-dom';
import { HEALTH_STATUSES, type HealthStatus } from '../../../../shared/domain';
import { queryClient } from '../../../app/query-client';
import { mapFeaturesQueryOptions } from './get-map-features';
import { tileMetaQueryOptions } from './get-tile-meta';
import type { MapFilters } from './types';

export function readMapFilters(params: URLSearchParams): MapFilters {
  const status = params.get('status');
  return {
    speciesId: params.get('speciesId') || undefined,
    varietyId: params.get('varietyId') || undefined,
    status: (HEALTH_STATUSES as readonly string[]).includes(status ?? '') ? (status as HealthStatus) : undefined,
    farmId: params.get('farmId') || undefined,
  };
}

/** Starts both requests and returns at once: navigation is never held up by them. */
export function mapLoader({ request }: LoaderFunctionArgs) {
  const filters = readMapFilters(new URL(request.url).searchParams);
  void queryClient.prefetchQuery(mapFeaturesQueryOptions(filters));
  void queryClient.prefetchQuery(tileMetaQueryOptions());
  return null;
}

import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useMemo } from 'react';
import { useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { HEALTH_STATUSES, type HealthStatus } from '../../../shared/domain';
import type { MapFilters } from '../../features/map/api/types';
import { mapFeaturesQueryOptions } from '../../features/map/api/get-map-features';
import { tileMetaQueryOptions } from '../../features/map/api/get-tile-meta';
import { MapPage } from '../../features/map/components/map-page';
import { plantKeys } from '../../features/plants/api/keys';
import { useSpecies } from '../../features/species/api/get-species';
import { PageHeader } from '../../components/ui/page-header';
import { queryClient } from '../query-client';
import { paths } from '../paths';

function readFilters(params: URLSearchParams): MapFilters {
  const status = params.get('status');
  return {
    speciesId: params.get('speciesId') || undefined,
    varietyId: params.get('varietyId') || undefined,
    status: (HEALTH_STATUSES as readonly string[]).includes(status ?? '') ? (status as HealthStatus) : undefined,
    farmId: params.get('farmId') || undefined,
  };
}

/**
 * Starts fetching the plants and the basemap's description while the page draws: with 10,000
 * plants the answer takes a moment, and the page should not wait to render before asking.
 * Not awaited, so navigation is never held up.
 */
export function mapLoader({ request }: LoaderFunctionArgs) {
  const filters = readFilters(new URL(request.url).searchParams);
  void queryClient.prefetchQuery(mapFeaturesQueryOptions(filters));
  void queryClient.prefetchQuery(tileMetaQueryOptions());
  return null;
}

/** The offline map: farms and plants, placing plants, drawing beds and hedgerows. */
export function MapRoute() {
  const [params, setParams] = useSearchParams();
  const filters = useMemo(() => readFilters(params), [params]);
  const species = useSpecies();
  const queryClient = useQueryClient();

  const onFiltersChange = useCallback(
    (next: MapFilters) => {
      const href = paths.map(next);
      setParams(new URLSearchParams(href.split('?')[1] ?? ''), { replace: true });
    },
    [setParams],
  );

  return (
    <>
      <title>Map · Heelwood</title>
      <PageHeader
        title="Map"
        lead="The cooperative’s farms and mother plants, served by Heelwood itself: it works without internet. Plan a hedgerow, place plants, draw your farm."
      />
      <MapPage
        filters={filters}
        onFiltersChange={onFiltersChange}
        species={species.data?.items ?? []}
        onPlantMoved={() => void queryClient.invalidateQueries({ queryKey: plantKeys.all })}
      />
    </>
  );
}

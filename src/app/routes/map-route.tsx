import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import type { MapFilters } from '../../features/map/api/types';
import { readMapFilters } from '../../features/map/api/map-loader';
import { MapPage } from '../../features/map/components/map-page';
import { plantKeys } from '../../features/plants/api/keys';
import { useSpecies } from '../../features/species/api/get-species';
import { PageHeader } from '../../components/ui/page-header';
import { paths } from '../paths';

/** The offline map: farms and plants, placing plants, drawing beds and hedgerows. */
export function MapRoute() {
  if (!performance.getEntriesByName('heelwood:map-route').length) performance.mark('heelwood:map-route');
  const [params, setParams] = useSearchParams();
  const filters = useMemo(() => readMapFilters(params), [params]);
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

import { useCallback, useRef } from 'react';
import { useSearchParams } from 'react-router-dom';
import { useFarms } from '../../features/farms/api/get-farms';
import { DistrictNoteForm } from '../../features/health/components/district-note-form';
import type { PlantListParams } from '../../features/plants/api/keys';
import { plantParamsToSearch, readPlantParams } from '../../features/plants/api/plant-params';
import { PlantRegister } from '../../features/plants/components/plant-register';
import { useSpecies } from '../../features/species/api/get-species';
import { Alert } from '../../components/ui/alert';
import { PageHeader } from '../../components/ui/page-header';
import { errorMessage } from '../../lib/api-client';
import { farmOptions, isCoordinator, mayKeepRegister } from './plant-routes-shared';
import { useSignedIn } from './use-signed-in';

export function PlantsRoute() {
  const me = useSignedIn();
  const [searchParams, setSearchParams] = useSearchParams();
  const params = readPlantParams(searchParams);
  const farms = useFarms();
  const species = useSpecies();

  // Stable across renders, so the debounced search box is not restarted by every render.
  const current = useRef({ params, setSearchParams });
  current.current = { params, setSearchParams };
  const onParamsChange = useCallback((next: Partial<PlantListParams>) => {
    const { params: now, setSearchParams: set } = current.current;
    // Typing in the search box should not leave a history entry per pause.
    set(plantParamsToSearch({ ...now, ...next }), { replace: 'q' in next });
  }, []);

  const lead = isCoordinator(me)
    ? 'Every mother plant on the member farms: search, sort and filter, export, import and print labels.'
    : me.farms.length > 0
      ? "Your farms' mother plants, and the clean plants of other member farms."
      : 'The clean mother plants of the member farms, where cutting wood may come from.';

  return (
    <>
      <title>Plants · Heelwood</title>
      <PageHeader title="Plants" lead={lead} />
      {farms.isError || species.isError ? (
        <Alert tone="warning" className="mb-4">
          Some filter lists did not load: {errorMessage(farms.error ?? species.error)}
        </Alert>
      ) : null}
      <PlantRegister
        params={params}
        onParamsChange={onParamsChange}
        farms={farmOptions(farms.data?.items)}
        species={species.data?.items ?? []}
        showMine={me.farms.length > 0}
        canAdd={mayKeepRegister(me)}
      />
      <details className="mt-8 rounded-card border border-paper-edge bg-white/60 p-4 sm:p-5">
        <summary className="min-h-touch cursor-pointer py-2 font-semibold">Seen something in the district? Tell the coordinators</summary>
        <div className="mt-3">
          <DistrictNoteForm />
        </div>
      </details>
    </>
  );
}

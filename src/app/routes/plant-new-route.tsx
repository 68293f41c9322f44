import { useNavigate, useSearchParams } from 'react-router-dom';
import { useFarms } from '../../features/farms/api/get-farms';
import { PlantForm } from '../../features/plants/components/plant-form';
import { useSpecies } from '../../features/species/api/get-species';
import { Alert } from '../../components/ui/alert';
import { ButtonLink } from '../../components/ui/button';
import { EmptyState } from '../../components/ui/empty-state';
import { Loading } from '../../components/ui/loading';
import { PageHeader } from '../../components/ui/page-header';
import { errorMessage } from '../../lib/api-client';
import { paths } from '../paths';
import { farmsForNewPlant, isCoordinator, mayKeepRegister } from './plant-routes-shared';
import { useSignedIn } from './use-signed-in';

export function PlantNewRoute() {
  const me = useSignedIn();
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const species = useSpecies();
  const farms = useFarms();

  const header = (
    <>
      <title>Add a plant · Heelwood</title>
      <PageHeader title="Add a plant" lead="One mother plant: its species and variety, planting year, role, where it came from and where it stands." />
    </>
  );

  if (!mayKeepRegister(me)) {
    return (
      <>
        {header}
        <EmptyState title="You are not on a farm yet" action={<ButtonLink to={paths.plants()}>Go to the plant list</ButtonLink>}>
          Plants are added by the people of the farm they stand on. If you keep mother plants on a member farm, ask your coordinator to add you to that farm.
        </EmptyState>
      </>
    );
  }
  if (species.isPending || (isCoordinator(me) && farms.isPending)) {
    return (
      <>
        {header}
        <Loading label="Loading the species list…" />
      </>
    );
  }
  if (species.isError || (isCoordinator(me) && farms.isError)) {
    return (
      <>
        {header}
        <Alert tone="danger">The lists this form needs did not load: {errorMessage(species.error ?? farms.error)} Reload the page to try again.</Alert>
      </>
    );
  }
  if (species.data.items.length === 0) {
    return (
      <>
        {header}
        <EmptyState title="No species are listed yet">
          A coordinator adds the species and varieties first (on the Species page); then plants of them can be added here.
        </EmptyState>
      </>
    );
  }
  return (
    <>
      {header}
      <PlantForm
        mode="create"
        farms={farmsForNewPlant(me, farms.data?.items)}
        species={species.data.items}
        defaultFarmId={params.get('farmId') ?? undefined}
        cancelHref={paths.plants()}
        onSaved={(plant) => navigate(paths.plant(plant.id))}
      />
    </>
  );
}

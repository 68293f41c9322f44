import { useParams } from 'react-router-dom';
import { useFarms } from '../../features/farms/api/get-farms';
import { usePlant } from '../../features/plants/api/get-plant';
import { genusOf, PlantPage } from '../../features/plants/components/plant-page';
import { useSpecies } from '../../features/species/api/get-species';
import { Alert } from '../../components/ui/alert';
import { ButtonLink } from '../../components/ui/button';
import { Loading } from '../../components/ui/loading';
import { ApiError, errorMessage } from '../../lib/api-client';
import { paths } from '../paths';
import { farmOptions, isCoordinator } from './plant-routes-shared';
import { useSignedIn } from './use-signed-in';

export function PlantRoute() {
  const { id = '' } = useParams();
  const me = useSignedIn();
  const plant = usePlant(id);
  const species = useSpecies();
  const farms = useFarms();

  if (plant.isPending) return <Loading label="Loading the plant…" />;
  if (plant.isError) {
    const missing = plant.error instanceof ApiError && (plant.error.status === 404 || plant.error.status === 400);
    return (
      <div className="flex max-w-2xl flex-col gap-4">
        <title>{`${missing ? 'Plant not found' : 'Plant did not load'} · Heelwood`}</title>
        <h1 className="text-2xl font-bold">{missing ? 'Plant not found' : 'The plant did not load'}</h1>
        <Alert tone="danger">
          {missing
            ? 'There is no plant at this address that your account may see. It may belong to another farm and not be clean, or the link may be wrong.'
            : errorMessage(plant.error)}
        </Alert>
        <div>
          <ButtonLink to={paths.plants()}>Go to the plant list</ButtonLink>
        </div>
      </div>
    );
  }
  const genus = species.data?.items.find((s) => s.id === plant.data.speciesId)?.genus;
  return <PlantPage plant={plant.data} genus={genusOf(plant.data, genus)} farms={farmOptions(farms.data?.items)} coordinator={isCoordinator(me)} />;
}

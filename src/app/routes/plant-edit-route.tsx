import { useNavigate, useParams } from 'react-router-dom';
import { usePlant } from '../../features/plants/api/get-plant';
import { PlantForm } from '../../features/plants/components/plant-form';
import { useSpecies } from '../../features/species/api/get-species';
import { Alert } from '../../components/ui/alert';
import { ButtonLink } from '../../components/ui/button';
import { Loading } from '../../components/ui/loading';
import { PageHeader } from '../../components/ui/page-header';
import { errorMessage } from '../../lib/api-client';
import { paths } from '../paths';

export function PlantEditRoute() {
  const { id = '' } = useParams();
  const navigate = useNavigate();
  const plant = usePlant(id);
  const species = useSpecies();

  if (plant.isPending || species.isPending) return <Loading label="Loading the plant…" />;
  if (plant.isError || species.isError) {
    return (
      <div className="flex max-w-2xl flex-col gap-4">
        <title>Plant did not load · Heelwood</title>
        <Alert tone="danger">{errorMessage(plant.error ?? species.error)}</Alert>
        <div>
          <ButtonLink to={paths.plants()}>Go to the plant list</ButtonLink>
        </div>
      </div>
    );
  }
  const p = plant.data;
  return (
    <>
      <title>{`Edit ${p.code} · Heelwood`}</title>
      <PageHeader title={`Edit ${p.code}`} lead={`${p.varietyName ? `${p.varietyName} · ` : ''}${p.speciesName} · ${p.farmName}`} />
      {p.can.edit ? (
        <PlantForm mode="edit" plant={p} species={species.data.items} cancelHref={paths.plant(p.id)} onSaved={(saved) => navigate(paths.plant(saved.id))} />
      ) : (
        <div className="flex max-w-2xl flex-col gap-4">
          <Alert tone="info">
            {p.healthStatus === 'retired'
              ? 'A retired plant is kept as history and cannot be edited.'
              : 'Only the people of this plant’s farm, or a coordinator, may edit it.'}
          </Alert>
          <div>
            <ButtonLink to={paths.plant(p.id)}>Back to {p.code}</ButtonLink>
          </div>
        </div>
      )}
    </>
  );
}

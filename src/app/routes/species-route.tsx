import { useSpecies } from '../../features/species/api/get-species';
import { SpeciesList } from '../../features/species/components/species-list';
import { Alert } from '../../components/ui/alert';
import { Loading } from '../../components/ui/loading';
import { PageHeader } from '../../components/ui/page-header';
import { errorMessage } from '../../lib/api-client';
import { isCoordinator } from './plant-routes-shared';
import { useSignedIn } from './use-signed-in';

export function SpeciesRoute() {
  const me = useSignedIn();
  const species = useSpecies();
  const coordinator = isCoordinator(me);
  return (
    <>
      <title>Species · Heelwood</title>
      <PageHeader
        title="Species and varieties"
        lead={
          coordinator
            ? 'The species and varieties farms choose from, with their default cutting size and reference strike rate. You keep these lists.'
            : 'The species and varieties kept in the cooperative, how they are propagated, and the cautions on moving them.'
        }
      />
      {species.isPending ? (
        <Loading label="Loading species…" />
      ) : species.isError ? (
        <Alert tone="danger" title="The species list did not load">
          {errorMessage(species.error)} Reload the page to try again.
        </Alert>
      ) : (
        <SpeciesList species={species.data.items} canEdit={coordinator} />
      )}
    </>
  );
}

import { CsvImport } from '../../features/plants/components/csv-import';
import { ButtonLink } from '../../components/ui/button';
import { EmptyState } from '../../components/ui/empty-state';
import { PageHeader } from '../../components/ui/page-header';
import { paths } from '../paths';
import { mayKeepRegister } from './plant-routes-shared';
import { useSignedIn } from './use-signed-in';

export function PlantImportRoute() {
  const me = useSignedIn();
  return (
    <>
      <title>Import plants · Heelwood</title>
      <PageHeader
        title="Import plants from a CSV file"
        lead="Check the file first: every problem is listed by row and column. The plants are added only when the whole file is right."
      />
      {mayKeepRegister(me) ? (
        <CsvImport />
      ) : (
        <EmptyState title="You are not on a farm yet" action={<ButtonLink to={paths.plants()}>Go to the plant list</ButtonLink>}>
          Plants are imported by the people of the farm they stand on, or by a coordinator.
        </EmptyState>
      )}
    </>
  );
}

import { useHealthOverview } from '../../features/health/api/get-health-overview';
import { DistrictNoteForm } from '../../features/health/components/district-note-form';
import { HealthOverviewView } from '../../features/health/components/health-overview';
import { Alert } from '../../components/ui/alert';
import { Loading } from '../../components/ui/loading';
import { PageHeader } from '../../components/ui/page-header';
import { errorMessage } from '../../lib/api-client';
import { CoordinatorOnly } from './coordinator-only';

function HealthPage() {
  const overview = useHealthOverview();
  return (
    <>
      <title>Health · Heelwood</title>
      <PageHeader
        title="Plant health"
        lead="Which plants need you: on hold, on watch, or not inspected in time. Wood is only ever offered from clean plants inspected within the look-back."
      />
      {overview.isPending ? (
        <Loading label="Loading the health record…" />
      ) : overview.isError ? (
        <Alert tone="danger" title="The health record did not load">
          {errorMessage(overview.error)} Reload the page to try again.
        </Alert>
      ) : (
        <HealthOverviewView overview={overview.data} noteForm={<DistrictNoteForm />} />
      )}
    </>
  );
}

export function HealthRoute() {
  return (
    <CoordinatorOnly>
      <HealthPage />
    </CoordinatorOnly>
  );
}

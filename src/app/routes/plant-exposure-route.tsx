import { Link, useParams, useSearchParams } from 'react-router-dom';
import { usePlant } from '../../features/plants/api/get-plant';
import { useExposure } from '../../features/trace/api/get-exposure';
import { ExposureView } from '../../features/trace/components/exposure-view';
import { NoticeForm } from '../../features/trace/components/notice-form';
import { Alert } from '../../components/ui/alert';
import { Card, CardTitle } from '../../components/ui/card';
import { EmptyState } from '../../components/ui/empty-state';
import { Loading } from '../../components/ui/loading';
import { PageHeader } from '../../components/ui/page-header';
import { StatusBadge } from '../../components/ui/status-badge';
import { errorMessage } from '../../lib/api-client';
import { formatDay } from '../../lib/format';
import { paths } from '../paths';
import { CoordinatorOnly } from './coordinator-only';
import { useSignedIn } from './use-signed-in';

function ExposurePage() {
  const { id = '' } = useParams();
  const [search] = useSearchParams();
  const findingId = search.get('findingId') ?? undefined;
  const me = useSignedIn();
  const exposure = useExposure(id, findingId);
  const plant = usePlant(id);

  if (exposure.isPending) return <Loading label="Working out what may be affected…" />;
  if (exposure.isError) {
    return (
      <>
        <title>Exposure · Heelwood</title>
        <PageHeader title="Exposure did not load" />
        <Alert tone="danger">
          {errorMessage(exposure.error)} <Link to={paths.plant(id)}>Back to the plant</Link>
        </Alert>
      </>
    );
  }
  const x = exposure.data;
  const finding = x.finding;
  // Other findings on the plant that travel in wood, to switch between them.
  const travelling = (plant.data?.inspections ?? []).flatMap((i) => i.findings.filter((f) => f.travelsInWood).map((f) => ({ ...f, on: i.inspectedOn })));

  return (
    <>
      <title>{`Exposure of ${x.plant.code} · Heelwood`}</title>
      <p className="mb-2 flex flex-wrap gap-x-4">
        <Link to={paths.plant(x.plant.id)}>{x.plant.code}</Link>
        <Link to={paths.plantTrace(x.plant.id)}>Trace of {x.plant.code}</Link>
      </p>
      <PageHeader
        title={finding ? `What may carry ${finding.pest.name}` : `Exposure of ${x.plant.code}`}
        lead={`${x.plant.code}: ${x.plant.varietyName ? `${x.plant.varietyName} · ` : ''}${x.plant.speciesName} at ${x.plant.farmName}. Wood from it and from plants raised from it, since its last clean inspection, and the growers who got that wood.`}
        actions={<StatusBadge status={x.plant.healthStatus} className="text-base" />}
      />
      {travelling.length > 1 ? (
        <nav aria-label="Findings that travel in wood on this plant" className="mb-5">
          <p className="mb-1 font-medium">Findings on this plant that travel in wood:</p>
          <ul className="flex flex-wrap gap-2">
            {travelling.map((f) => (
              <li key={f.id}>
                <Link
                  to={paths.plantExposure(x.plant.id, f.id)}
                  aria-current={f.id === finding?.id ? 'true' : undefined}
                  className="inline-flex min-h-touch items-center rounded-lg border-2 border-paper-edge px-3 aria-[current=true]:border-currant aria-[current=true]:font-semibold"
                >
                  {f.pestName}, {formatDay(f.on)}
                </Link>
              </li>
            ))}
          </ul>
        </nav>
      ) : null}
      {!finding ? (
        <EmptyState title="No finding that travels in wood on this plant">
          Nothing to trace or notify: exposure follows a finding of a pest or disease that travels in cutting wood. The plant's{' '}
          <Link to={paths.plantTrace(x.plant.id)}>trace</Link> still shows where its wood went.
        </EmptyState>
      ) : (
        <div className="flex flex-col gap-5">
          <ExposureView exposure={x} finding={finding} />
          <Card tone="emphasis">
            <CardTitle>Notify the growers</CardTitle>
            <NoticeForm key={finding.id} plantId={x.plant.id} exposure={x} finding={finding} signedBy={me.user.name} />
          </Card>
        </div>
      )}
    </>
  );
}

export function PlantExposureRoute() {
  return (
    <CoordinatorOnly>
      <ExposurePage />
    </CoordinatorOnly>
  );
}

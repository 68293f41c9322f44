import { Link, useParams } from 'react-router-dom';
import { useTrace } from '../../features/trace/api/get-trace';
import { TraceView, traceSummary } from '../../features/trace/components/trace-view';
import { Alert } from '../../components/ui/alert';
import { ButtonLink } from '../../components/ui/button';
import { Loading } from '../../components/ui/loading';
import { PageHeader } from '../../components/ui/page-header';
import { StatusBadge } from '../../components/ui/status-badge';
import { ApiError, errorMessage } from '../../lib/api-client';
import { paths } from '../paths';
import { useSignedIn } from './use-signed-in';

export function PlantTraceRoute() {
  const { id = '' } = useParams();
  const me = useSignedIn();
  const trace = useTrace(id);

  if (trace.isPending) return <Loading label="Tracing the lineage…" />;
  if (trace.isError) {
    const missing = trace.error instanceof ApiError && (trace.error.status === 404 || trace.error.status === 400);
    return (
      <div className="flex max-w-2xl flex-col gap-4">
        <title>Trace · Heelwood</title>
        <h1 className="text-2xl font-bold">{missing ? 'Plant not found' : 'The trace did not load'}</h1>
        <Alert tone="danger">{missing ? 'There is no plant at this address that your account may see.' : errorMessage(trace.error)}</Alert>
        <div>
          <ButtonLink to={paths.plants()}>Go to the plant list</ButtonLink>
        </div>
      </div>
    );
  }
  const t = trace.data;
  const coordinator = me.user.role === 'coordinator';
  return (
    <>
      <title>{`Trace of ${t.plant.code} · Heelwood`}</title>
      <p className="mb-2">
        <Link to={paths.plant(t.plant.id)}>{t.plant.code}</Link>
      </p>
      <PageHeader
        title={`Trace of ${t.plant.code}`}
        lead={traceSummary(t)}
        actions={<StatusBadge status={t.plant.healthStatus} className="text-base" />}
      />
      {coordinator && t.plant.healthStatus !== 'clean' ? (
        <Alert tone="warning" title={t.plant.healthStatus === 'hold' ? 'This plant is on hold' : 'This plant is not clean'} className="mb-5">
          <p>See what may carry a finding that travels in wood — the wood taken since its last clean inspection and who got it — and notify those growers.</p>
          <p className="mt-2">
            <Link to={paths.plantExposure(t.plant.id)} className="font-semibold">
              Exposure and notices
            </Link>
          </p>
        </Alert>
      ) : null}
      <TraceView trace={t} />
    </>
  );
}

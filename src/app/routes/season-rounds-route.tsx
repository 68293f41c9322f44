import { Link, useParams } from 'react-router-dom';
import { SeasonRounds } from '../../features/allocation-rounds/components/season-rounds';
import { useSeason } from '../../features/seasons/api/get-season';
import { Alert } from '../../components/ui/alert';
import { Loading } from '../../components/ui/loading';
import { PageHeader } from '../../components/ui/page-header';
import { StatusBadge } from '../../components/ui/status-badge';
import { errorMessage } from '../../lib/api-client';
import { paths } from '../paths';
import { CoordinatorOnly } from './coordinator-only';

function SeasonRoundsPage() {
  const { seasonId = '' } = useParams();
  const season = useSeason(seasonId);
  if (season.isPending) return <Loading label="Loading the season…" />;
  if (season.isError) {
    return (
      <>
        <title>Allocation rounds · Heelwood</title>
        <Alert tone="danger" title="The season did not load">
          {errorMessage(season.error)} <Link to={paths.seasons()}>All seasons</Link>
        </Alert>
      </>
    );
  }
  const s = season.data;
  return (
    <>
      <title>{`Allocation rounds · ${s.name} · Heelwood`}</title>
      <p className="mb-2">
        <Link to={paths.season(s.id)}>{s.name}</Link>
      </p>
      <PageHeader title="Allocation rounds" lead={`${s.name}: ${s.requestCount} requests asking for ${s.cuttingsAsked.toLocaleString('en')} cuttings; ${s.cuttingsOffered.toLocaleString('en')} cuttings offered.`} actions={<StatusBadge status={s.stage} className="text-base" />} />
      <SeasonRounds season={{ id: s.id, name: s.name, stage: s.stage }} />
    </>
  );
}

export function SeasonRoundsRoute() {
  return (
    <CoordinatorOnly>
      <SeasonRoundsPage />
    </CoordinatorOnly>
  );
}

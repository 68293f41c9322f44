import { useQueryClient } from '@tanstack/react-query';
import { Link, useParams } from 'react-router-dom';
import { useSeason } from '../../features/seasons/api/get-season';
import { SeasonActions } from '../../features/seasons/components/season-actions';
import { SeasonFacts, StageRules } from '../../features/seasons/components/season-facts';
import { StageControls } from '../../features/seasons/components/stage-controls';
import { offerKeys, windowKeys } from '../../features/wood-offers/api/keys';
import { boardKeys, requestKeys } from '../../features/wood-requests/api/keys';
import { SeasonRequests } from '../../features/wood-requests/components/season-requests';
import { Alert } from '../../components/ui/alert';
import { Card, CardTitle } from '../../components/ui/card';
import { Loading } from '../../components/ui/loading';
import { PageHeader } from '../../components/ui/page-header';
import { StatusBadge } from '../../components/ui/status-badge';
import { errorMessage } from '../../lib/api-client';
import { paths } from '../paths';
import { useSignedIn } from './use-signed-in';

export function SeasonRoute() {
  const { seasonId = '' } = useParams();
  const me = useSignedIn();
  const queryClient = useQueryClient();
  const season = useSeason(seasonId);
  const coordinator = me.user.role === 'coordinator';

  if (season.isPending) return <Loading label="Loading the season…" />;
  if (season.isError) {
    return (
      <>
        <title>Season · Heelwood</title>
        <Alert tone="danger" title="The season did not load">
          {errorMessage(season.error)} <Link to={paths.seasons()}>All seasons</Link>
        </Alert>
      </>
    );
  }
  const s = season.data;

  // What the offers, windows, requests and board pages allow follows the stage.
  const onMoved = () => {
    for (const key of [offerKeys.all, windowKeys.all, requestKeys.all, boardKeys.all]) void queryClient.invalidateQueries({ queryKey: key });
  };

  return (
    <>
      <title>{`${s.name} · Heelwood`}</title>
      <p className="mb-2">
        <Link to={paths.seasons()}>All seasons</Link>
      </p>
      <PageHeader title={s.name} actions={<StatusBadge status={s.stage} className="text-base" />} />
      <div className="grid items-start gap-5 lg:grid-cols-2">
        <Card tone="emphasis">
          <CardTitle>What this stage allows</CardTitle>
          <StageRules season={s} />
        </Card>
        <Card>
          <CardTitle>Dates and figures</CardTitle>
          <SeasonFacts season={s} />
          {s.notes ? <p className="mt-4 whitespace-pre-wrap rounded-lg bg-paper-deep px-4 py-3">{s.notes}</p> : null}
        </Card>
      </div>
      <section aria-labelledby="season-go-title" className="mt-8">
        <h2 id="season-go-title" className="mb-4 text-xl font-semibold">
          In this season
        </h2>
        <SeasonActions season={s} me={me} />
      </section>
      {coordinator ? (
        <div className="mt-8 flex flex-col gap-5">
          <Card>
            <CardTitle>Move the season on</CardTitle>
            <StageControls season={s} onMoved={onMoved} />
          </Card>
          <Card>
            <CardTitle>Requests</CardTitle>
            <SeasonRequests seasonId={s.id} />
          </Card>
        </div>
      ) : null}
    </>
  );
}

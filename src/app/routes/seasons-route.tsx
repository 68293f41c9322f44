import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { useCooperative } from '../../features/cooperative/api/get-cooperative';
import { useSeasons } from '../../features/seasons/api/get-seasons';
import { OpenSeasonForm } from '../../features/seasons/components/open-season-form';
import { SeasonsList } from '../../features/seasons/components/seasons-list';
import { Alert } from '../../components/ui/alert';
import { Button } from '../../components/ui/button';
import { Card, CardTitle } from '../../components/ui/card';
import { Loading } from '../../components/ui/loading';
import { PageHeader } from '../../components/ui/page-header';
import { errorMessage } from '../../lib/api-client';
import { paths } from '../paths';
import { useSignedIn } from './use-signed-in';

export function SeasonsRoute() {
  const me = useSignedIn();
  const navigate = useNavigate();
  const seasons = useSeasons();
  const cooperative = useCooperative();
  const [opening, setOpening] = useState(false);
  const coordinator = me.user.role === 'coordinator';

  return (
    <>
      <title>Seasons · Heelwood</title>
      <PageHeader
        title="Seasons"
        lead="In each season farms offer current-year wood from clean plants, growers ask for it, and the coordinator shares it out fairly."
        actions={coordinator && !opening ? <Button onClick={() => setOpening(true)}>Open a season</Button> : null}
      />
      {opening ? (
        <Card className="mb-8 max-w-3xl">
          <CardTitle>Open a season</CardTitle>
          {cooperative.isPending ? (
            <Loading label="Loading the cooperative's settings…" />
          ) : (
            <OpenSeasonForm
              hemisphere={cooperative.data?.hemisphere ?? 'north'}
              onCreated={(season) => navigate(paths.season(season.id))}
              onCancel={() => setOpening(false)}
            />
          )}
        </Card>
      ) : null}
      {seasons.isPending ? (
        <Loading label="Loading seasons…" />
      ) : seasons.isError ? (
        <Alert tone="danger" title="The seasons did not load">
          {errorMessage(seasons.error)} Reload the page to try again.
        </Alert>
      ) : (
        <SeasonsList seasons={seasons.data.items} isCoordinator={coordinator} />
      )}
    </>
  );
}

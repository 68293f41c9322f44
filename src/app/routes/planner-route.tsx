import { useMemo } from 'react';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { useCooperative } from '../../features/cooperative/api/get-cooperative';
import { Planner } from '../../features/planner/components/planner';
import type { PlanStart } from '../../features/planner/lib/plan-form';
import { useSeasons } from '../../features/seasons/api/get-seasons';
import { currentSeason, seasonsTakingRequests } from '../../features/seasons/lib/season-facts';
import { useSpecies } from '../../features/species/api/get-species';
import { Alert } from '../../components/ui/alert';
import { ButtonLink } from '../../components/ui/button';
import { Loading } from '../../components/ui/loading';
import { PageHeader } from '../../components/ui/page-header';
import { errorMessage } from '../../lib/api-client';
import { paths } from '../paths';

/** ?lengthM= comes from the map (a drawn hedgerow); species and treatment from a request line. */
function readStart(params: URLSearchParams): PlanStart {
  const length = Number(params.get('lengthM'));
  return {
    lengthM: params.has('lengthM') && Number.isFinite(length) && length > 0 ? Math.round(length * 10) / 10 : undefined,
    speciesId: params.get('speciesId') ?? undefined,
    varietyId: params.get('varietyId'),
    treatment: params.get('treatment') ?? undefined,
  };
}

export function PlannerRoute() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const species = useSpecies();
  const cooperative = useCooperative();
  const seasons = useSeasons();
  const start = useMemo(() => readStart(params), [params]);

  const header = (
    <PageHeader
      title="Planner"
      lead="Describe a planting and see how many cuttings to ask for, the chance each place ends with a rooted plant, and how many may stay empty. The strike rates come from growers’ strike reports."
      actions={
        <ButtonLink variant="secondary" to={paths.strikeRates()}>
          Strike rates
        </ButtonLink>
      }
    />
  );

  if (species.isPending || cooperative.isPending || seasons.isPending) {
    return (
      <>
        <title>Planner · Heelwood</title>
        {header}
        <Loading label="Loading species and seasons…" />
      </>
    );
  }
  const failed = species.error ?? cooperative.error ?? seasons.error;
  if (failed || !species.data || !cooperative.data || !seasons.data) {
    return (
      <>
        <title>Planner · Heelwood</title>
        {header}
        <Alert tone="danger" title="The planner could not start">
          {errorMessage(failed)} Reload the page to try again.
        </Alert>
      </>
    );
  }

  const items = seasons.data.items;
  const requestSeasons = seasonsTakingRequests(items).map((s) => ({ id: s.id, name: s.name }));
  const current = currentSeason(items);

  return (
    <>
      <title>Planner · Heelwood</title>
      {header}
      <Planner
        // A new length from the map starts a new plan.
        key={params.toString()}
        species={species.data.items}
        hemisphere={cooperative.data.hemisphere}
        seasonKind={current?.kind ?? null}
        requestSeasons={requestSeasons}
        start={start}
        onAddToRequest={(seasonId, line) => navigate(paths.seasonRequest(seasonId, line))}
        strikeRatesHref={paths.strikeRates}
      />
    </>
  );
}

import { useQueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import { Link, useLocation, useParams, useSearchParams } from 'react-router-dom';
import { useFarms } from '../../features/farms/api/get-farms';
import { useSeason } from '../../features/seasons/api/get-season';
import { seasonKeys } from '../../features/seasons/api/keys';
import { FarmOffers } from '../../features/wood-offers/components/farm-offers';
import { OfferCaution } from '../../features/wood-offers/components/offer-caution';
import { PickupWindows } from '../../features/wood-offers/components/pickup-windows';
import { Alert } from '../../components/ui/alert';
import { ButtonLink } from '../../components/ui/button';
import { Field, Select } from '../../components/ui/field';
import { Loading } from '../../components/ui/loading';
import { PageHeader } from '../../components/ui/page-header';
import { StatusBadge } from '../../components/ui/status-badge';
import { errorMessage } from '../../lib/api-client';
import { paths } from '../paths';
import { useSignedIn } from './use-signed-in';

type FarmChoice = { id: string; name: string; code: string };

export function WoodOffersRoute() {
  const { seasonId = '' } = useParams();
  const [params, setParams] = useSearchParams();
  const location = useLocation();
  const me = useSignedIn();
  const queryClient = useQueryClient();
  const coordinator = me.user.role === 'coordinator';
  const season = useSeason(seasonId);
  const allFarms = useFarms();

  // A coordinator may look after any farm; everyone else only the farms they work on.
  const choices: FarmChoice[] = coordinator
    ? (allFarms.data?.items ?? []).map((f) => ({ id: f.id, name: f.name, code: f.code }))
    : me.farms.map((f) => ({ id: f.farmId, name: f.farmName, code: f.farmCode }));
  const wanted = params.get('farmId');
  const farm = choices.find((f) => f.id === wanted) ?? choices[0] ?? null;
  const farmRole = me.farms.find((f) => f.farmId === farm?.id)?.farmRole ?? null;

  // Keep the chosen farm in the address, so a reload or a shared link opens the same farm.
  useEffect(() => {
    if (farm && wanted !== farm.id) setParams({ farmId: farm.id }, { replace: true });
  }, [farm, wanted, setParams]);

  // Offers change the season's totals: they are fetched afresh once the person leaves this page.
  useEffect(() => () => void queryClient.invalidateQueries({ queryKey: seasonKeys.all }), [queryClient]);

  // /offers#pickup-windows: the windows sit below the plants, which load first.
  useEffect(() => {
    if (location.hash !== '#pickup-windows' || season.isPending) return;
    const timer = setTimeout(() => document.getElementById('pickup-windows')?.scrollIntoView(), 300);
    return () => clearTimeout(timer);
  }, [location.hash, season.isPending, farm?.id]);

  if (season.isPending || (coordinator && allFarms.isPending)) return <Loading label="Loading the season…" />;
  if (season.isError) {
    return (
      <Alert tone="danger" title="The season did not load">
        {errorMessage(season.error)}
      </Alert>
    );
  }
  const s = season.data;

  if (!farm) {
    return (
      <>
        <title>Wood offers · Heelwood</title>
        <PageHeader title="Wood offers" lead={s.name} />
        <Alert tone="info" title="This page is for the people of member farms">
          Farm leads and farm hands state here how much wood each of their plants can spare. If you keep mother plants on a member
          farm, ask a coordinator to add you to it. To ask for wood yourself, <Link to={paths.seasonRequest(s.id)}>open your request</Link>.
        </Alert>
      </>
    );
  }

  const canEditWindows = (coordinator || farmRole === 'lead') && s.rules.windows;

  return (
    <>
      <title>{`Wood offers, ${farm.name} · Heelwood`}</title>
      <p className="mb-2">
        <Link to={paths.season(s.id)}>{s.name}</Link>
      </p>
      <PageHeader
        title={`Wood offers of ${farm.name}`}
        lead="For each plant, count this year's shoots and measure their mean length, or give a number of cuttings. Heelwood estimates the yield and caps what may be taken by the plant's role."
        actions={<StatusBadge status={s.stage} className="text-base" />}
      />
      {choices.length > 1 ? (
        <div className="mb-6 max-w-md">
          <Field label="Farm">
            <Select value={farm.id} onChange={(event) => setParams({ farmId: event.target.value })}>
              {choices.map((f) => (
                <option key={f.id} value={f.id}>
                  {f.name} ({f.code})
                </option>
              ))}
            </Select>
          </Field>
        </div>
      ) : null}
      <div className="mb-6 flex flex-col gap-4">
        <Alert tone={s.rules.offers ? 'info' : 'warning'} title={s.rules.offers ? 'Offers are open' : 'Offers cannot change now'}>
          {s.rules.text}
        </Alert>
        <OfferCaution />
        <div>
          <ButtonLink variant="secondary" to={paths.seasonOffers(s.id, farm.id, 'pickup-windows')} onClick={() => document.getElementById('pickup-windows')?.scrollIntoView()}>
            Go to the pickup windows
          </ButtonLink>
        </div>
      </div>
      <FarmOffers key={farm.id} seasonId={s.id} farmId={farm.id} canChange={s.rules.offers} />
      <div className="mt-10 border-t-2 border-paper-edge pt-8">
        <PickupWindows
          key={farm.id}
          seasonId={s.id}
          farmId={farm.id}
          farmName={farm.name}
          collectionStart={s.collectionStart}
          collectionEnd={s.collectionEnd}
          canEdit={canEditWindows}
          readOnlyReason={
            !s.rules.windows ? 'Pickup windows cannot change now: the season is closed.' : !canEditWindows ? 'The farm lead sets the pickup windows.' : undefined
          }
        />
      </div>
    </>
  );
}

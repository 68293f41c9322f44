import { CoordinatorHome, type PendingCount } from '../../features/home/components/coordinator-home';
import { MemberHome } from '../../features/home/components/member-home';
import { usePendingMemberCount } from '../../features/members/api/get-members';
import { PickupsHomeCard } from '../../features/pickups/components/pickups-home-card';
import { BundlesHomeCard } from '../../features/strike-reports/components/bundles-home-card';
import { useSeasons } from '../../features/seasons/api/get-seasons';
import { OpenSeasonCard } from '../../features/seasons/components/open-season-card';
import { currentSeason } from '../../features/seasons/lib/season-facts';
import { errorMessage } from '../../lib/api-client';
import { useSignedIn } from './use-signed-in';

function CoordinatorHomeRoute() {
  const me = useSignedIn();
  const count = usePendingMemberCount();
  const pending: PendingCount = count.isPending
    ? { state: 'loading' }
    : count.isError
      ? { state: 'error', message: errorMessage(count.error) }
      : { state: 'ready', count: count.data };
  return <CoordinatorHome me={me} pending={pending} />;
}

/** The season members act on now, if any: request wood, or offer it for farm people. */
function HomeSeasonCard() {
  const me = useSignedIn();
  const seasons = useSeasons();
  const season = seasons.data ? currentSeason(seasons.data.items) : null;
  return season ? <OpenSeasonCard season={season} me={me} /> : null;
}

/** "My pickups" for a member with wood to collect in a season still under way. */
function HomePickups() {
  const seasons = useSeasons();
  const live = (seasons.data?.items ?? []).filter((s) => s.stage === 'allocating' || s.stage === 'collections');
  return <PickupsHomeCard seasons={live.map((s) => ({ id: s.id, name: s.name }))} />;
}

export function HomeRoute() {
  const me = useSignedIn();
  return (
    <>
      <title>Home · Heelwood</title>
      {me.user.role === 'coordinator' ? (
        <CoordinatorHomeRoute />
      ) : (
        <MemberHome
          me={me}
          season={
            <>
              <HomePickups />
              <BundlesHomeCard />
              <HomeSeasonCard />
            </>
          }
        />
      )}
    </>
  );
}

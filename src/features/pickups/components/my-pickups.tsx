import { Link } from 'react-router-dom';
import { paths } from '../../../app/paths';
import { Alert } from '../../../components/ui/alert';
import { ButtonLink } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { Loading } from '../../../components/ui/loading';
import { errorMessage } from '../../../lib/api-client';
import { useMyPickups } from '../api/get-my-pickups';
import { PickupSlipView } from './pickup-slip';

/** The signed-in grower's slip for a season, or what to expect when there is none yet. */
export function MyPickups({ seasonId, seasonName }: { seasonId: string; seasonName?: string }) {
  const slip = useMyPickups(seasonId);
  if (slip.isPending) return <Loading label="Loading your pickup slip…" />;
  if (slip.isError) {
    return (
      <Alert tone="danger" title="Your pickup slip did not load">
        {errorMessage(slip.error)} Reload the page to try again.
      </Alert>
    );
  }
  if (!slip.data.slip) {
    return (
      <>
        <h1 className="mb-6 text-2xl font-bold tracking-tight sm:text-3xl">My pickups</h1>
        <EmptyState
          title="No wood to collect yet"
          action={
            <ButtonLink variant="secondary" to={paths.seasonRequest(seasonId)}>
              My wood request
            </ButtonLink>
          }
        >
          {seasonName ? `Nothing is reserved for you in ${seasonName} so far. ` : 'Nothing is reserved for you in this season so far. '}
          Once the coordinator approves an allocation round that gives you wood, your pickup slip appears here and comes by e-mail, with the farms to visit,
          when, and which bundles to collect.
        </EmptyState>
      </>
    );
  }
  return (
    <>
      <p className="hw-no-print mb-3 print:hidden">
        <Link to={paths.season(seasonId)}>About {slip.data.slip.seasonName}</Link>
      </p>
      <PickupSlipView slip={slip.data.slip} />
      <p className="hw-no-print mt-6 max-w-prose print:hidden">
        Once the cuttings have had time to root, report how many did under <Link to={paths.myBundles()}>My bundles</Link>: every strike report sharpens the
        strike rates the planner uses.
      </p>
    </>
  );
}

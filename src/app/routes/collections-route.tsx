import { Link, useParams } from 'react-router-dom';
import { FarmCollections } from '../../features/collections/components/farm-collections';
import { FarmPicker } from '../../features/collections/components/farm-picker';
import { useSeason } from '../../features/seasons/api/get-season';
import { EmptyState } from '../../components/ui/empty-state';
import { Loading } from '../../components/ui/loading';
import { PageHeader } from '../../components/ui/page-header';
import { paths } from '../paths';
import { useCollectionFarm } from './collection-routes-shared';
import { useSignedIn } from './use-signed-in';

export function CollectionsRoute() {
  const { seasonId = '' } = useParams();
  const me = useSignedIn();
  const season = useSeason(seasonId);
  const { coordinator, options, farmId, farm, choose, loadingFarms } = useCollectionFarm(me);
  const seasonName = season.data?.name ?? 'this season';

  if (!coordinator && me.farms.length === 0) {
    return (
      <>
        <title>Collections · Heelwood</title>
        <PageHeader title="Collections" />
        <EmptyState title="This page is for farm people">
          Collections are kept by the lead and hands of the farm that gives the wood. To see what you collect, open <Link to={paths.seasonPickups(seasonId)}>my pickups</Link>.
        </EmptyState>
      </>
    );
  }

  return (
    <>
      <title>{`Collections${farm ? ` at ${farm.name}` : ''} · Heelwood`}</title>
      <p className="mb-2">
        <Link to={paths.season(seasonId)}>{season.data?.name ?? 'The season'}</Link>
      </p>
      <PageHeader title={farm ? `Collections at ${farm.name}` : 'Collections'} lead={`Who comes when in ${seasonName}, and which bundles to hand over. Mark each bundle as it leaves the farm.`} />
      {options.length > 1 ? (
        <div className="mb-6">
          <FarmPicker farms={options} value={farm ? farmId : ''} onChange={choose} />
        </div>
      ) : null}
      {loadingFarms ? <Loading label="Loading the farms…" /> : farm ? <FarmCollections seasonId={seasonId} farmId={farm.id} farmName={farm.name} /> : <EmptyState title="Choose a farm">Pick a farm above to see its collections.</EmptyState>}
    </>
  );
}

import { Link, useParams } from 'react-router-dom';
import { BundleLabels } from '../../features/collections/components/bundle-labels';
import { FarmPicker } from '../../features/collections/components/farm-picker';
import { ButtonLink } from '../../components/ui/button';
import { EmptyState } from '../../components/ui/empty-state';
import { Loading } from '../../components/ui/loading';
import { PageHeader } from '../../components/ui/page-header';
import { paths } from '../paths';
import { useCollectionFarm } from './collection-routes-shared';
import { useSignedIn } from './use-signed-in';

export function BundleLabelsRoute() {
  const { seasonId = '' } = useParams();
  const me = useSignedIn();
  const { coordinator, options, farmId, farm, choose, loadingFarms } = useCollectionFarm(me);

  if (!coordinator && me.farms.length === 0) {
    return (
      <>
        <title>Bundle labels · Heelwood</title>
        <PageHeader title="Bundle labels" />
        <EmptyState title="This page is for farm people">
          The farm that gives the wood prints the labels. To see what you collect, open <Link to={paths.seasonPickups(seasonId)}>my pickups</Link>.
        </EmptyState>
      </>
    );
  }

  return (
    <>
      <title>{`Bundle labels${farm ? ` · ${farm.name}` : ''} · Heelwood`}</title>
      <div className="hw-no-print print:hidden">
        <PageHeader
          title={farm ? `Bundle labels for ${farm.name}` : 'Bundle labels'}
          lead="One label per approved bundle: its code, the wood, the plant it is cut from and who collects it. The QR code opens the source plant's page here."
          actions={
            <ButtonLink variant="secondary" to={paths.seasonCollections(seasonId, farm?.id)}>
              Back to collections
            </ButtonLink>
          }
        />
        {options.length > 1 ? (
          <div className="mb-6">
            <FarmPicker farms={options} value={farm ? farmId : ''} onChange={choose} />
          </div>
        ) : null}
      </div>
      {loadingFarms ? <Loading label="Loading the farms…" /> : farm ? <BundleLabels seasonId={seasonId} farmId={farm.id} farmName={farm.name} /> : <EmptyState title="Choose a farm">Pick a farm above to print its bundle labels.</EmptyState>}
    </>
  );
}

import { useParams } from 'react-router-dom';
import { MyPickups } from '../../features/pickups/components/my-pickups';
import { useSeason } from '../../features/seasons/api/get-season';

export function PickupsRoute() {
  const { seasonId = '' } = useParams();
  const season = useSeason(seasonId);
  return (
    <>
      <title>{season.data ? `My pickups · ${season.data.name} · Heelwood` : 'My pickups · Heelwood'}</title>
      <MyPickups seasonId={seasonId} seasonName={season.data?.name} />
    </>
  );
}

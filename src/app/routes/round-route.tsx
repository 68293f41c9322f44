import { useParams } from 'react-router-dom';
import { RoundReview } from '../../features/allocation-rounds/components/round-review';
import { CoordinatorOnly } from './coordinator-only';

export function RoundRoute() {
  const { roundId = '' } = useParams();
  return (
    <CoordinatorOnly>
      <RoundReview key={roundId} roundId={roundId} />
    </CoordinatorOnly>
  );
}

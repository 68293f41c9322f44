import type { QueryClient } from '@tanstack/react-query';
import type { RoundView } from '../../../../shared/schemas/allocation';
import { roundKeys } from './keys';

/**
 * Every round endpoint answers with the whole round: put it in the cache as it is (no second
 * request), and refresh the lists, whose counts may have changed.
 */
export function storeRound(queryClient: QueryClient, round: RoundView) {
  queryClient.setQueryData(roundKeys.detail(round.id), round);
  return queryClient.invalidateQueries({ queryKey: roundKeys.lists() });
}

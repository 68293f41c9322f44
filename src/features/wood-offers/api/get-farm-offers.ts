import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OfferRow } from '../../../../shared/schemas/seasons';
import { api } from '../../../lib/api-client';
import { offerKeys, type FarmSeason } from './keys';

/** Every non-retired plant of a farm with its offer for the season, if any. */
export function getFarmOffers({ seasonId, farmId }: FarmSeason, signal?: AbortSignal) {
  return api.get<{ items: OfferRow[]; total: number }>(
    `/api/seasons/${encodeURIComponent(seasonId)}/farms/${encodeURIComponent(farmId)}/offers`,
    { signal },
  );
}

export const farmOffersQueryOptions = (key: FarmSeason) =>
  queryOptions({
    queryKey: offerKeys.list(key),
    queryFn: ({ signal }) => getFarmOffers(key, signal),
  });

export function useFarmOffers(key: FarmSeason) {
  return useQuery(farmOffersQueryOptions(key));
}

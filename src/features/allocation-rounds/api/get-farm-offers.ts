import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OfferRow } from '../../../../shared/schemas/seasons';
import { api } from '../../../lib/api-client';
import { roundKeys } from './keys';

/** One farm's plants and their offers this season (a coordinator may read any farm's). */
export function getFarmOffers(seasonId: string, farmId: string, signal?: AbortSignal) {
  return api.get<{ items: OfferRow[]; total: number }>(
    `/api/seasons/${encodeURIComponent(seasonId)}/farms/${encodeURIComponent(farmId)}/offers`,
    { signal },
  );
}

export const farmOffersQueryOptions = (seasonId: string, farmId: string) =>
  queryOptions({
    queryKey: roundKeys.farmOffers(seasonId, farmId),
    queryFn: ({ signal }) => getFarmOffers(seasonId, farmId, signal),
  });

export function useFarmOffers(seasonId: string, farmId: string | null) {
  return useQuery({ ...farmOffersQueryOptions(seasonId, farmId ?? ''), enabled: !!farmId });
}

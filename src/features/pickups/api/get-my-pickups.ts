import { queryOptions, useQueries, useQuery } from '@tanstack/react-query';
import type { PickupSlip } from '../../../../shared/schemas/allocation';
import { api } from '../../../lib/api-client';
import { pickupKeys } from './keys';

/** The signed-in person's pickup slip for a season, or null when no approved round gives them wood. */
export function getMyPickups(seasonId: string, signal?: AbortSignal) {
  return api.get<{ slip: PickupSlip | null }>(`/api/seasons/${encodeURIComponent(seasonId)}/my-pickups`, { signal });
}

export const myPickupsQueryOptions = (seasonId: string) =>
  queryOptions({
    queryKey: pickupKeys.detail(seasonId),
    queryFn: ({ signal }) => getMyPickups(seasonId, signal),
  });

export function useMyPickups(seasonId: string) {
  return useQuery(myPickupsQueryOptions(seasonId));
}

/** Slips for several seasons at once (the home page asks for the seasons still under way). */
export function useMyPickupsFor(seasonIds: string[]) {
  return useQueries({ queries: seasonIds.map((id) => ({ ...myPickupsQueryOptions(id), staleTime: 60_000 })) });
}

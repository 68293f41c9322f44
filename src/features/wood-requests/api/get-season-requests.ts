import { queryOptions, useQuery } from '@tanstack/react-query';
import type { WoodRequest } from '../../../../shared/schemas/seasons';
import { api } from '../../../lib/api-client';
import { requestKeys } from './keys';

/** Coordinator only: every request of the season that is not withdrawn. */
export function getSeasonRequests(seasonId: string, signal?: AbortSignal) {
  return api.get<{ items: WoodRequest[]; total: number }>(`/api/seasons/${encodeURIComponent(seasonId)}/requests`, { signal });
}

export const seasonRequestsQueryOptions = (seasonId: string) =>
  queryOptions({
    queryKey: requestKeys.list(seasonId),
    queryFn: ({ signal }) => getSeasonRequests(seasonId, signal),
  });

export function useSeasonRequests(seasonId: string, enabled = true) {
  return useQuery({ ...seasonRequestsQueryOptions(seasonId), enabled });
}

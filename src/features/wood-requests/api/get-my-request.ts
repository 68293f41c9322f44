import { queryOptions, useQuery } from '@tanstack/react-query';
import type { WoodRequest } from '../../../../shared/schemas/seasons';
import { api } from '../../../lib/api-client';
import { requestKeys } from './keys';

export function getMyRequest(seasonId: string, signal?: AbortSignal) {
  return api.get<{ request: WoodRequest | null }>(`/api/seasons/${encodeURIComponent(seasonId)}/my-request`, { signal });
}

export const myRequestQueryOptions = (seasonId: string) =>
  queryOptions({
    queryKey: requestKeys.mine(seasonId),
    queryFn: ({ signal }) => getMyRequest(seasonId, signal),
  });

export function useMyRequest(seasonId: string) {
  return useQuery(myRequestQueryOptions(seasonId));
}

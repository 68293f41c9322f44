import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PickupWindow } from '../../../../shared/schemas/seasons';
import { api } from '../../../lib/api-client';
import { windowKeys, type FarmSeason } from './keys';

export function getPickupWindows({ seasonId, farmId }: FarmSeason, signal?: AbortSignal) {
  return api.get<{ items: PickupWindow[]; total: number }>(`/api/seasons/${encodeURIComponent(seasonId)}/windows`, { query: { farmId }, signal });
}

export const pickupWindowsQueryOptions = (key: FarmSeason) =>
  queryOptions({
    queryKey: windowKeys.list(key),
    queryFn: ({ signal }) => getPickupWindows(key, signal),
  });

export function usePickupWindows(key: FarmSeason) {
  return useQuery(pickupWindowsQueryOptions(key));
}

import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PickupWindow } from '../../../../shared/schemas/seasons';
import { api } from '../../../lib/api-client';
import { collectionKeys } from './keys';

export function getFarmWindows(seasonId: string, farmId: string, signal?: AbortSignal) {
  return api.get<{ items: PickupWindow[]; total: number }>(`/api/seasons/${encodeURIComponent(seasonId)}/windows`, { query: { farmId }, signal });
}

export const farmWindowsQueryOptions = (seasonId: string, farmId: string) =>
  queryOptions({
    queryKey: collectionKeys.windows(seasonId, farmId),
    queryFn: ({ signal }) => getFarmWindows(seasonId, farmId, signal),
    staleTime: 60_000,
  });

export function useFarmWindows(seasonId: string, farmId: string | null) {
  return useQuery({ ...farmWindowsQueryOptions(seasonId, farmId ?? ''), enabled: !!farmId });
}

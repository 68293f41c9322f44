import { queryOptions, useQuery } from '@tanstack/react-query';
import type { FarmCollection } from '../../../../shared/schemas/allocation';
import { api } from '../../../lib/api-client';
import { collectionKeys } from './keys';

/** The farm's bundles from approved rounds of the season: who collects what, and when. */
export function getCollections(seasonId: string, farmId: string, signal?: AbortSignal) {
  return api.get<{ items: FarmCollection[]; total: number }>(
    `/api/seasons/${encodeURIComponent(seasonId)}/farms/${encodeURIComponent(farmId)}/collections`,
    { signal },
  );
}

export const collectionsQueryOptions = (seasonId: string, farmId: string) =>
  queryOptions({
    queryKey: collectionKeys.list(seasonId, farmId),
    queryFn: ({ signal }) => getCollections(seasonId, farmId, signal),
  });

export function useCollections(seasonId: string, farmId: string | null) {
  return useQuery({ ...collectionsQueryOptions(seasonId, farmId ?? ''), enabled: !!farmId });
}

import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { mapKeys } from './keys';
import type { TileMeta } from './types';

/** The basemap served by this application (never a tile host on the internet). */
export function getTileMeta(signal?: AbortSignal) {
  return api.get<TileMeta>('/tiles/meta.json', { signal });
}

export const tileMetaQueryOptions = () =>
  queryOptions({ queryKey: mapKeys.tileMeta(), queryFn: ({ signal }) => getTileMeta(signal), staleTime: Infinity });

export function useTileMeta() {
  return useQuery(tileMetaQueryOptions());
}

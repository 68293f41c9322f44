import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { BoardRow } from '../../../../shared/schemas/seasons';
import { api } from '../../../lib/api-client';
import { boardKeys, type BoardFrom } from './keys';

/** Offered and asked by species and variety; with a place, the nearest farm's distance. */
export function getWoodBoard(seasonId: string, from: BoardFrom, signal?: AbortSignal) {
  return api.get<{ items: BoardRow[]; total: number }>(`/api/seasons/${encodeURIComponent(seasonId)}/board`, {
    query: from ? { lat: from.lat, lon: from.lon } : undefined,
    signal,
  });
}

export const woodBoardQueryOptions = (seasonId: string, from: BoardFrom) =>
  queryOptions({
    queryKey: boardKeys.board(seasonId, from),
    queryFn: ({ signal }) => getWoodBoard(seasonId, from, signal),
    placeholderData: keepPreviousData,
  });

export function useWoodBoard(seasonId: string, from: BoardFrom) {
  return useQuery(woodBoardQueryOptions(seasonId, from));
}

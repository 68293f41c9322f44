import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SeasonFigures } from '../../../../shared/schemas/figures';
import { api } from '../../../lib/api-client';
import { figuresKeys } from './keys';

/** A season's figures; the server decides whose (the coordinator's: all; a member's: their own). */
export function getFigures(seasonId: string, signal?: AbortSignal) {
  return api.get<SeasonFigures>(`/api/seasons/${encodeURIComponent(seasonId)}/figures`, { signal });
}

/** The same figures as a CSV file, downloaded by the browser with the session cookie. */
export function figuresCsvUrl(seasonId: string): string {
  return `/api/seasons/${encodeURIComponent(seasonId)}/figures.csv`;
}

export const figuresQueryOptions = (seasonId: string) =>
  queryOptions({
    queryKey: figuresKeys.season(seasonId),
    queryFn: ({ signal }) => getFigures(seasonId, signal),
  });

export function useFigures(seasonId: string) {
  return useQuery(figuresQueryOptions(seasonId));
}

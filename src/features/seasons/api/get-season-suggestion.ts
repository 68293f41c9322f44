import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Hemisphere, SeasonKind } from '../../../../shared/domain';
import type { SuggestedDates } from '../../../../shared/seasons';
import { api } from '../../../lib/api-client';
import { seasonKeys } from './keys';

export type SeasonSuggestion = SuggestedDates & { hemisphere: Hemisphere };

/** Coordinator only: the next season of a kind, with dates for the hemisphere. */
export function getSeasonSuggestion(kind: SeasonKind, hemisphere: Hemisphere, signal?: AbortSignal) {
  return api.get<SeasonSuggestion>('/api/seasons/suggest', { query: { kind, hemisphere }, signal });
}

export const seasonSuggestionQueryOptions = (kind: SeasonKind, hemisphere: Hemisphere) =>
  queryOptions({
    queryKey: seasonKeys.suggestion(kind, hemisphere),
    queryFn: ({ signal }) => getSeasonSuggestion(kind, hemisphere, signal),
    staleTime: 60 * 60_000,
  });

export function useSeasonSuggestion(kind: SeasonKind, hemisphere: Hemisphere, enabled = true) {
  return useQuery({ ...seasonSuggestionQueryOptions(kind, hemisphere), enabled });
}

import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { StrikeRateRow, StrikeRatesQuery } from '../../../../shared/schemas/strike-reports';
import { api } from '../../../lib/api-client';
import { strikeReportKeys } from './keys';

/** Strike-rate estimates by species, variety and treatment (the prior where nothing is reported). */
export function getStrikeRates(query: StrikeRatesQuery, signal?: AbortSignal) {
  return api.get<{ items: StrikeRateRow[]; total: number }>('/api/strike-rates', { query, signal });
}

export const strikeRatesQueryOptions = (query: StrikeRatesQuery) =>
  queryOptions({
    queryKey: strikeReportKeys.rate(query),
    queryFn: ({ signal }) => getStrikeRates(query, signal),
    placeholderData: keepPreviousData,
  });

export function useStrikeRates(query: StrikeRatesQuery) {
  return useQuery(strikeRatesQueryOptions(query));
}

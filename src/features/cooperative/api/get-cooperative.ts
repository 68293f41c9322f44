import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Hemisphere } from '../../../../shared/domain';
import { api } from '../../../lib/api-client';
import { cooperativeKeys } from './keys';

export type Cooperative = { name: string; region: string; hemisphere: Hemisphere };

export function getCooperative(signal?: AbortSignal) {
  return api.get<Cooperative>('/api/cooperative', { signal });
}

export const cooperativeQueryOptions = () =>
  queryOptions({
    queryKey: cooperativeKeys.all,
    queryFn: ({ signal }) => getCooperative(signal),
    // The cooperative's name changes rarely; one fetch per visit is plenty.
    staleTime: Infinity,
  });

export function useCooperative() {
  return useQuery(cooperativeQueryOptions());
}

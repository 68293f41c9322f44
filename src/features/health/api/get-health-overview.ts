import { queryOptions, useQuery } from '@tanstack/react-query';
import type { HealthOverview } from '../../../../shared/schemas/health';
import { api } from '../../../lib/api-client';
import { healthKeys } from './keys';

export function getHealthOverview(signal?: AbortSignal) {
  return api.get<HealthOverview>('/api/health/overview', { signal });
}

export const healthOverviewQueryOptions = () =>
  queryOptions({
    queryKey: healthKeys.overview(),
    queryFn: ({ signal }) => getHealthOverview(signal),
  });

export function useHealthOverview() {
  return useQuery(healthOverviewQueryOptions());
}

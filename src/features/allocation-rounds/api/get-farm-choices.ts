import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Page } from '../../../../shared/schemas/common';
import type { FarmSummary } from '../../../../shared/schemas/farms';
import { api } from '../../../lib/api-client';
import { roundKeys } from './keys';

/** Every farm, to pick one to take wood from when adding a bundle by hand (200 is the API's page limit). */
export function getFarmChoices(signal?: AbortSignal) {
  return api.get<Page<FarmSummary>>('/api/farms', { query: { page: 1, pageSize: 200 }, signal });
}

export function useFarmChoices(enabled = true) {
  return useQuery({
    ...queryOptions({ queryKey: roundKeys.farms(), queryFn: ({ signal }) => getFarmChoices(signal), staleTime: 60_000 }),
    enabled,
  });
}

import { useQuery } from '@tanstack/react-query';
import type { Page } from '../../../../shared/schemas/common';
import type { FarmSummary } from '../../../../shared/schemas/farms';
import { api } from '../../../lib/api-client';
import { collectionKeys } from './keys';

/** Every farm, for a coordinator choosing whose collections to see (200 is the API's page limit). */
export function getFarmChoices(signal?: AbortSignal) {
  return api.get<Page<FarmSummary>>('/api/farms', { query: { page: 1, pageSize: 200 }, signal });
}

export function useFarmChoices(enabled: boolean) {
  return useQuery({ queryKey: collectionKeys.farms(), queryFn: ({ signal }) => getFarmChoices(signal), staleTime: 60_000, enabled });
}

import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Exposure } from '../../../../shared/schemas/trace';
import { api } from '../../../lib/api-client';
import { traceKeys } from './keys';

/**
 * What may carry a finding that travels in wood (coordinator): the bundles taken from the
 * plant and its descendants since its last clean inspection, and who got them. Without a
 * finding the server takes the plant's latest one that travels in wood.
 */
export function getExposure(plantId: string, findingId?: string, signal?: AbortSignal) {
  return api.get<Exposure>(`/api/mother-plants/${encodeURIComponent(plantId)}/exposure`, { query: { findingId }, signal });
}

export const exposureQueryOptions = (plantId: string, findingId?: string) =>
  queryOptions({
    queryKey: traceKeys.exposure(plantId, findingId),
    queryFn: ({ signal }) => getExposure(plantId, findingId, signal),
  });

export function useExposure(plantId: string, findingId?: string) {
  return useQuery(exposureQueryOptions(plantId, findingId));
}

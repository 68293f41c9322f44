import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Trace } from '../../../../shared/schemas/trace';
import { api } from '../../../lib/api-client';
import { traceKeys } from './keys';

/** A plant's ancestors, descendants and the bundles between them, as far as the caller may see. */
export function getTrace(plantId: string, signal?: AbortSignal) {
  return api.get<Trace>(`/api/mother-plants/${encodeURIComponent(plantId)}/trace`, { signal });
}

export const traceQueryOptions = (plantId: string) =>
  queryOptions({
    queryKey: traceKeys.trace(plantId),
    queryFn: ({ signal }) => getTrace(plantId, signal),
  });

export function useTrace(plantId: string) {
  return useQuery(traceQueryOptions(plantId));
}

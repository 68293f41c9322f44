import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { PlannerEstimate, PlannerEstimateBody } from '../../../../shared/schemas/planner';
import { api } from '../../../lib/api-client';
import { plannerKeys } from './keys';

/** The server's estimate for a plan; it also finds the learned strike rate. */
export function estimatePlanting(body: PlannerEstimateBody, signal?: AbortSignal) {
  return api.post<PlannerEstimate>('/api/planner/estimate', body, { signal });
}

export type EstimateFor = { body: PlannerEstimateBody; estimate: PlannerEstimate };

// A POST that changes nothing, so it is cached like a read: the same plan is not asked twice.
export const estimateQueryOptions = (body: PlannerEstimateBody) =>
  queryOptions({
    queryKey: plannerKeys.estimate(body),
    queryFn: async ({ signal }): Promise<EstimateFor> => ({ body, estimate: await estimatePlanting(body, signal) }),
    staleTime: 60_000,
    placeholderData: keepPreviousData,
  });

export function useEstimate(body: PlannerEstimateBody | null) {
  return useQuery({ ...estimateQueryOptions(body ?? {}), enabled: body !== null });
}

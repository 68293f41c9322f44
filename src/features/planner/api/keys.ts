import type { PlannerEstimateBody } from '../../../../shared/schemas/planner';

export const plannerKeys = {
  all: ['planner'] as const,
  estimates: () => [...plannerKeys.all, 'estimate'] as const,
  estimate: (body: PlannerEstimateBody) => [...plannerKeys.estimates(), body] as const,
};

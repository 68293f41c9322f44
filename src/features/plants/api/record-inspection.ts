import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { HealthStatus } from '../../../../shared/domain';
import type { InspectionCreate } from '../../../../shared/schemas/health';
import { api } from '../../../lib/api-client';
import { plantKeys } from './keys';

export type InspectionOutcome = {
  inspection: { id: string; inspectedOn: string };
  statusBefore: HealthStatus;
  statusAfter: HealthStatus;
  rule: string;
  withdrawnOffers: number;
};

export function recordInspection({ plantId, input }: { plantId: string; input: InspectionCreate }) {
  return api.post<InspectionOutcome>(`/api/mother-plants/${encodeURIComponent(plantId)}/inspections`, input);
}

export function useRecordInspection() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: recordInspection,
    // The plant's status, history and audit all change; so may any list it appears in.
    onSuccess: (_outcome, { plantId }) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: plantKeys.detail(plantId) }),
        queryClient.invalidateQueries({ queryKey: plantKeys.lists() }),
      ]),
  });
}

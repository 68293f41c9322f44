import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { NoticeInput, NoticeOutcome } from '../../../../shared/schemas/trace';
import { api } from '../../../lib/api-client';
import { traceKeys } from './keys';

export type SendNoticesInput = { plantId: string } & NoticeInput;

/**
 * E-mails each grower who received exposed wood a plant-health notice. The server sends it
 * once per finding and grower: a second send reports duplicates and e-mails nobody again.
 */
export function sendNotices({ plantId, ...body }: SendNoticesInput) {
  return api.post<NoticeOutcome>(`/api/mother-plants/${encodeURIComponent(plantId)}/notices`, body);
}

export function useSendNotices() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: sendNotices,
    // The growers' "notice sent" marks come from the exposure.
    onSuccess: (_outcome, input) => queryClient.invalidateQueries({ queryKey: [...traceKeys.exposures(), input.plantId] }),
  });
}

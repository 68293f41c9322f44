import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { windowKeys, type FarmSeason } from './keys';

/** Date and times are the farm's own wall-clock time; the server places them in its zone. */
export type PickupWindowInput = { date: string; from: string; to: string; note: string };

export function addPickupWindow({ seasonId, farmId, input }: FarmSeason & { input: PickupWindowInput }) {
  return api.post<unknown>(`/api/seasons/${encodeURIComponent(seasonId)}/farms/${encodeURIComponent(farmId)}/windows`, input);
}

export function useAddPickupWindow() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: addPickupWindow,
    onSuccess: (_row, { seasonId, farmId }) => queryClient.invalidateQueries({ queryKey: windowKeys.list({ seasonId, farmId }) }),
  });
}

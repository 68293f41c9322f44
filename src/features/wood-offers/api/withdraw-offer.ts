import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { offerKeys } from './keys';

/** Takes a plant's offer back; the server refuses (409) once cuttings are reserved from it. */
export function withdrawOffer({ seasonId, plantId }: { seasonId: string; plantId: string }) {
  return api.delete(`/api/seasons/${encodeURIComponent(seasonId)}/offers/${encodeURIComponent(plantId)}`);
}

export function useWithdrawOffer() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: withdrawOffer,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: offerKeys.lists() }),
  });
}

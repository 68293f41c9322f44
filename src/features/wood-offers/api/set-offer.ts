import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { OfferInput } from '../../../../shared/schemas/seasons';
import { api } from '../../../lib/api-client';
import { offerKeys } from './keys';

export type SavedOffer = {
  offer: { id: string; estimatedYield: number; offered: number; reserved: number; capFraction: number };
  /** The most this plant may offer (its estimate capped by its role). */
  max: number;
};

export function setOffer({ seasonId, plantId, input }: { seasonId: string; plantId: string; input: OfferInput }) {
  return api.put<SavedOffer>(`/api/seasons/${encodeURIComponent(seasonId)}/offers/${encodeURIComponent(plantId)}`, input);
}

export function useSetOffer() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: setOffer,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: offerKeys.lists() }),
  });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RoundView } from '../../../../shared/schemas/allocation';
import { api } from '../../../lib/api-client';
import { storeRound } from './round-cache';

export type BundleAdd = { roundId: string; offerId: string; lineId: string; cuttings: number };

/** Adds a bundle by hand (it is locked, so a re-run keeps it). */
export function addBundle({ roundId, ...body }: BundleAdd) {
  return api.post<RoundView>(`/api/rounds/${encodeURIComponent(roundId)}/bundles`, body);
}

export function useAddBundle() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: addBundle,
    onSuccess: (round) => storeRound(queryClient, round),
  });
}

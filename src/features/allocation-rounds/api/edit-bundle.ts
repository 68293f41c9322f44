import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RoundView } from '../../../../shared/schemas/allocation';
import { api } from '../../../lib/api-client';
import { storeRound } from './round-cache';

export type BundleEdit = { roundId: string; bundleId: string; cuttings: number };

/** Changes a bundle's cuttings; the server checks capacity, health, distance and line size, and locks the bundle. */
export function editBundle({ roundId, bundleId, cuttings }: BundleEdit) {
  return api.patch<RoundView>(`/api/rounds/${encodeURIComponent(roundId)}/bundles/${encodeURIComponent(bundleId)}`, { cuttings });
}

export function useEditBundle() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: editBundle,
    onSuccess: (round) => storeRound(queryClient, round),
  });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RoundView } from '../../../../shared/schemas/allocation';
import { api } from '../../../lib/api-client';
import { storeRound } from './round-cache';

export function removeBundle({ roundId, bundleId }: { roundId: string; bundleId: string }) {
  return api.delete<RoundView>(`/api/rounds/${encodeURIComponent(roundId)}/bundles/${encodeURIComponent(bundleId)}`);
}

export function useRemoveBundle() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: removeBundle,
    onSuccess: (round) => storeRound(queryClient, round),
  });
}

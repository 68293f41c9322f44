import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RoundView } from '../../../../shared/schemas/allocation';
import { api } from '../../../lib/api-client';
import { storeRound } from './round-cache';

/** Solves the round again; bundles the coordinator edited or added (locked) stay as they are. */
export function rerunRound(roundId: string) {
  return api.post<RoundView>(`/api/rounds/${encodeURIComponent(roundId)}/rerun`);
}

export function useRerunRound() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: rerunRound,
    onSuccess: (round) => storeRound(queryClient, round),
  });
}

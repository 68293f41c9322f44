import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RoundView } from '../../../../shared/schemas/allocation';
import { api } from '../../../lib/api-client';
import { storeRound } from './round-cache';

/** Starts solving on the server; answers at once (202) with the round and its first stage. */
export function startRound(seasonId: string) {
  return api.post<RoundView>(`/api/seasons/${encodeURIComponent(seasonId)}/rounds`);
}

export function useStartRound() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: startRound,
    onSuccess: (round) => storeRound(queryClient, round),
  });
}

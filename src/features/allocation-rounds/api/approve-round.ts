import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RoundView } from '../../../../shared/schemas/allocation';
import { api } from '../../../lib/api-client';
import { storeRound } from './round-cache';

export type MailOutcome = { sent: number; duplicate: number; failed: number };
export type RoundAndMail = { round: RoundView; mail: MailOutcome };

/** Reserves the wood, codes the bundles and sends the pickup slips and farm lists. */
export function approveRound(roundId: string) {
  return api.post<RoundAndMail>(`/api/rounds/${encodeURIComponent(roundId)}/approve`);
}

export function useApproveRound() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: approveRound,
    onSuccess: (result) => storeRound(queryClient, result.round),
  });
}

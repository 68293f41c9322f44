import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { RoundAndMail } from './approve-round';
import { storeRound } from './round-cache';

/** Sends again only the e-mails of an approved round that failed (the others are never repeated). */
export function resendMail(roundId: string) {
  return api.post<RoundAndMail>(`/api/rounds/${encodeURIComponent(roundId)}/resend`);
}

export function useResendMail() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: resendMail,
    onSuccess: (result) => storeRound(queryClient, result.round),
  });
}

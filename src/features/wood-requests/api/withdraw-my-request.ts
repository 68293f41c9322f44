import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { WoodRequest } from '../../../../shared/schemas/seasons';
import { api } from '../../../lib/api-client';
import { boardKeys, requestKeys } from './keys';

export function withdrawMyRequest({ seasonId }: { seasonId: string }) {
  return api.post<{ request: WoodRequest | null }>(`/api/seasons/${encodeURIComponent(seasonId)}/my-request/withdraw`);
}

export function useWithdrawMyRequest() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: withdrawMyRequest,
    onSuccess: (data, { seasonId }) => {
      queryClient.setQueryData(requestKeys.mine(seasonId), data);
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: requestKeys.lists() }),
        queryClient.invalidateQueries({ queryKey: boardKeys.all }),
      ]);
    },
  });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { WoodRequest, WoodRequestInput } from '../../../../shared/schemas/seasons';
import { api } from '../../../lib/api-client';
import { boardKeys, requestKeys } from './keys';

/** Saves the whole request (lines replaced), as a draft or filed. */
export function saveMyRequest({ seasonId, input }: { seasonId: string; input: WoodRequestInput }) {
  return api.put<{ request: WoodRequest }>(`/api/seasons/${encodeURIComponent(seasonId)}/my-request`, input);
}

export function useSaveMyRequest() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveMyRequest,
    onSuccess: ({ request }, { seasonId }) => {
      queryClient.setQueryData(requestKeys.mine(seasonId), { request });
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: requestKeys.lists() }),
        queryClient.invalidateQueries({ queryKey: boardKeys.all }),
      ]);
    },
  });
}

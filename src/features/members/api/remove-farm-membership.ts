import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { memberKeys } from './keys';

export function removeFarmMembership({ farmId, userId }: { farmId: string; userId: string }) {
  return api.delete(`/api/farms/${encodeURIComponent(farmId)}/members/${encodeURIComponent(userId)}`);
}

export function useRemoveFarmMembership() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: removeFarmMembership,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: memberKeys.lists() }),
  });
}

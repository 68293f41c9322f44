import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { windowKeys } from './keys';

export function deletePickupWindow({ windowId }: { windowId: string }) {
  return api.delete(`/api/windows/${encodeURIComponent(windowId)}`);
}

export function useDeletePickupWindow() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deletePickupWindow,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: windowKeys.lists() }),
  });
}

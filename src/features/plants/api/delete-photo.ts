import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { plantKeys } from './keys';

export function deletePhoto({ photoId }: { photoId: string; plantId: string }) {
  return api.delete(`/api/photos/${encodeURIComponent(photoId)}`);
}

export function useDeletePhoto() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deletePhoto,
    onSuccess: (_r, { plantId }) => queryClient.invalidateQueries({ queryKey: plantKeys.detail(plantId) }),
  });
}

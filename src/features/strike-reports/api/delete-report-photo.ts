import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { strikeReportKeys } from './keys';

export function deleteReportPhoto(photoId: string) {
  return api.delete(`/api/photos/${encodeURIComponent(photoId)}`);
}

/** Removes a photo from a report the caller filed. */
export function useDeleteReportPhoto() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteReportPhoto,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: strikeReportKeys.myBundles() }),
  });
}

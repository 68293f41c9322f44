import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { StrikeReportPhotoView } from '../../../../shared/schemas/strike-reports';
import { ApiError, toApiError } from '../../../lib/api-client';
import { strikeReportKeys } from './keys';

/** The same limit the server keeps (MAX_UPLOAD_BYTES in server/modules/photos/photos.service.ts). */
export const MAX_PHOTO_BYTES = 10 * 1024 * 1024;
export const PHOTO_TYPES = 'image/jpeg,image/png,image/webp';

export type ReportPhotoInput = { reportId: string; file: File; caption?: string };

/** multipart/form-data, so not through api.post (which sends JSON); errors are the same ApiError. */
export async function uploadReportPhoto({ reportId, file, caption }: ReportPhotoInput): Promise<{ photo: StrikeReportPhotoView }> {
  const form = new FormData();
  form.append('caption', caption ?? '');
  form.append('photo', file);
  let response: Response;
  try {
    response = await fetch(`/api/strike-reports/${encodeURIComponent(reportId)}/photos`, {
      method: 'POST',
      body: form,
      credentials: 'include',
      headers: { Accept: 'application/json' },
    });
  } catch {
    throw new ApiError(0, 'NETWORK', 'Heelwood could not reach its server. Check your connection and try again.');
  }
  if (!response.ok) throw await toApiError(response);
  return (await response.json()) as { photo: StrikeReportPhotoView };
}

/** Adds a photo of the rooted cuttings to a report the caller filed. */
export function useUploadReportPhoto() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: uploadReportPhoto,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: strikeReportKeys.myBundles() }),
  });
}

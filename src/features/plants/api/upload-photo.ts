import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PhotoView } from '../../../../shared/schemas/register';
import { plantKeys } from './keys';
import { jsonOrThrow, sendWithProgress, type Progress } from './send-with-progress';

export type PhotoUploadResult = { photo: PhotoView; gps: { lat: number; lon: number } | null };

export type PhotoUploadInput = {
  plantId: string;
  file: File;
  caption?: string;
  findingId?: string;
  onProgress?: (progress: Progress) => void;
};

export async function uploadPhoto({ plantId, file, caption, findingId, onProgress }: PhotoUploadInput) {
  const form = new FormData();
  form.append('caption', caption ?? '');
  if (findingId) form.append('findingId', findingId);
  form.append('photo', file);
  const response = await sendWithProgress(`/api/mother-plants/${encodeURIComponent(plantId)}/photos`, { body: form, onProgress });
  return jsonOrThrow<PhotoUploadResult>(response);
}

export function useUploadPhoto() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: uploadPhoto,
    onSuccess: (_result, { plantId }) => queryClient.invalidateQueries({ queryKey: plantKeys.detail(plantId) }),
  });
}

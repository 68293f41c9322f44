import { useMutation } from '@tanstack/react-query';
import { jsonOrThrow, sendWithProgress } from './send-with-progress';

export type PhotoPosition = { gps: { lat: number; lon: number } | null; takenAt: string | null };

/** Reads the position a camera wrote into a photo; the photo itself is not kept. */
export async function readPhotoGps(file: File) {
  const form = new FormData();
  form.append('photo', file);
  return jsonOrThrow<PhotoPosition>(await sendWithProgress('/api/photos/read-gps', { body: form }));
}

export function useReadPhotoGps() {
  return useMutation({ mutationFn: readPhotoGps });
}

import { useId, useRef, useState, type FormEvent } from 'react';
import type { PhotoView } from '../../../../shared/schemas/register';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { DeletePhotoDialog } from '../../../components/ui/delete-photo-dialog';
import { Field, TextInput } from '../../../components/ui/field';
import { ApiError, errorMessage } from '../../../lib/api-client';
import { formatDay } from '../../../lib/format';
import { useDeletePhoto } from '../api/delete-photo';
import type { Progress } from '../api/send-with-progress';
import { useUpdatePlant } from '../api/update-plant';
import { useUploadPhoto } from '../api/upload-photo';
import { UploadProgress } from './upload-progress';
import { formatPosition, named } from './words';

export function PlantPhotos({
  plantId,
  plantCode,
  photos,
  canEdit,
  hasPosition,
}: {
  plantId: string;
  plantCode: string;
  photos: PhotoView[];
  canEdit: boolean;
  hasPosition: boolean;
}) {
  const upload = useUploadPhoto();
  const update = useUpdatePlant();
  const remove = useDeletePhoto();
  const fileRef = useRef<HTMLInputElement>(null);
  const [caption, setCaption] = useState('');
  const [fileError, setFileError] = useState<string | undefined>();
  const [progress, setProgress] = useState<Progress | null>(null);
  const [offer, setOffer] = useState<{ lat: number; lon: number } | null>(null);
  const [positionSaved, setPositionSaved] = useState(false);
  const [removing, setRemoving] = useState<PhotoView | null>(null);
  const formId = useId();

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    const file = fileRef.current?.files?.[0];
    setOffer(null);
    setPositionSaved(false);
    if (!file) {
      setFileError('Photo: choose a photo to upload');
      return;
    }
    setFileError(undefined);
    try {
      const result = await upload.mutateAsync({ plantId, file, caption: caption.trim(), onProgress: setProgress });
      setCaption('');
      if (fileRef.current) fileRef.current.value = '';
      if (result.gps) setOffer(result.gps);
    } catch (error) {
      if (error instanceof ApiError && error.fields.photo) setFileError(named('Photo', error.fields.photo));
    } finally {
      setProgress(null);
    }
  };

  const usePosition = async () => {
    if (!offer) return;
    try {
      const round = (v: number) => Math.round(v * 1e6) / 1e6;
      await update.mutateAsync({ id: plantId, patch: { lat: round(offer.lat), lon: round(offer.lon) } });
      setOffer(null);
      setPositionSaved(true);
    } catch {
      // Shown from the mutation below.
    }
  };

  return (
    <div className="flex flex-col gap-5">
      {photos.length === 0 ? (
        <p className="text-ink-soft">{canEdit ? 'No photos yet. A photo of the whole plant and one of its label help whoever comes next.' : 'No photos yet.'}</p>
      ) : (
        <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-4">
          {photos.map((photo) => (
            <li key={photo.id} className="flex flex-col gap-1.5">
              <a href={photo.url} target="_blank" rel="noopener" className="block overflow-hidden rounded-lg border border-paper-edge bg-paper-deep">
                <img
                  src={photo.thumbUrl}
                  alt={photo.caption ? photo.caption : `Photo of ${plantCode}, added ${formatDay(photo.createdAt)}`}
                  loading="lazy"
                  className="aspect-square w-full object-cover"
                />
              </a>
              <p className="text-sm">
                {photo.caption ? <span className="block">{photo.caption}</span> : null}
                <span className="text-ink-soft">{formatDay(photo.createdAt)}</span>
              </p>
              {canEdit ? (
                <button
                  type="button"
                  className="min-h-touch self-start rounded px-2 text-sm font-medium text-rust underline underline-offset-2 hover:bg-rust-light"
                  onClick={() => setRemoving(photo)}
                >
                  Delete photo
                </button>
              ) : null}
            </li>
          ))}
        </ul>
      )}

      {positionSaved ? <Alert tone="success">The plant's position is now the photo's position.</Alert> : null}
      {offer ? (
        <Alert tone="info" title="This photo carries a position">
          <p>
            {formatPosition(offer.lat, offer.lon)}.{' '}
            {hasPosition ? 'The plant already has a position; use this one only if it is more accurate.' : 'The plant has no position yet.'}
          </p>
          {update.isError ? <p className="mt-1 font-medium text-rust">{errorMessage(update.error)}</p> : null}
          <div className="mt-3 flex flex-wrap gap-2">
            <Button size="sm" onClick={usePosition} busy={update.isPending}>
              Use this photo's position for the plant
            </Button>
            <Button size="sm" variant="secondary" onClick={() => setOffer(null)}>
              Keep the plant where it is
            </Button>
          </div>
        </Alert>
      ) : null}

      {canEdit ? (
        <form id={formId} onSubmit={submit} noValidate className="flex flex-col gap-4 rounded-lg border border-paper-edge bg-white/60 p-4">
          <p className="font-semibold">Add a photo</p>
          {upload.isError && !fileError ? <Alert tone="danger">{errorMessage(upload.error)}</Alert> : null}
          <Field label="Photo" hint="JPEG, PNG or WebP, up to 10 MB. A phone photo may carry its position; you can use it for the plant." error={fileError}>
            <TextInput ref={fileRef} type="file" accept="image/jpeg,image/png,image/webp" className="py-2" onChange={() => setFileError(undefined)} />
          </Field>
          <Field label="Caption" optional>
            <TextInput value={caption} maxLength={500} onChange={(event) => setCaption(event.target.value)} />
          </Field>
          <UploadProgress progress={progress} noun="photo" processingLabel="Making the copies…" />
          <div>
            <Button type="submit" variant="secondary" busy={upload.isPending}>
              Upload photo
            </Button>
          </div>
        </form>
      ) : null}

      <DeletePhotoDialog
        photo={removing}
        consequence="The photo is removed from the plant's record for good."
        busy={remove.isPending}
        error={remove.isError ? errorMessage(remove.error) : null}
        onClose={() => setRemoving(null)}
        onDelete={(photoId) => remove.mutateAsync({ photoId, plantId })}
      />
    </div>
  );
}

import { Alert } from './alert';
import { Button } from './button';
import { Dialog } from './dialog';

/**
 * "Delete this photo?" with the photo's thumbnail, what deleting means (`consequence`), the
 * error of the last try, "Keep it" and "Delete photo". Closes itself only when `onDelete`
 * succeeds; a failure stays on screen as `error`.
 */
export function DeletePhotoDialog({
  photo,
  consequence,
  busy,
  error,
  onClose,
  onDelete,
}: {
  photo: { id: string; thumbUrl: string } | null;
  consequence: string;
  busy: boolean;
  error: string | null;
  onClose: () => void;
  onDelete: (photoId: string) => Promise<unknown>;
}) {
  return (
    <Dialog open={photo !== null} onClose={onClose} title="Delete this photo?">
      <div className="flex flex-col gap-4">
        {photo ? <img src={photo.thumbUrl} alt="" className="max-h-48 self-start rounded-lg" /> : null}
        <p className="text-ink-soft">{consequence}</p>
        {error ? <Alert tone="danger">{error}</Alert> : null}
        <div className="flex flex-wrap justify-end gap-2">
          <Button variant="secondary" onClick={onClose}>
            Keep it
          </Button>
          <Button
            variant="danger"
            busy={busy}
            onClick={async () => {
              if (!photo) return;
              try {
                await onDelete(photo.id);
                onClose();
              } catch {
                // Shown above.
              }
            }}
          >
            Delete photo
          </Button>
        </div>
      </div>
    </Dialog>
  );
}

import { useRef, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { errorMessage } from '../../../lib/api-client';
import { useReadPhotoGps } from '../api/read-photo-gps';
import { formatPosition } from './words';

type Note = { tone: 'ok' | 'problem'; text: string } | null;

function geolocationProblem(error: GeolocationPositionError): string {
  if (error.code === error.PERMISSION_DENIED) return 'Your browser did not allow Heelwood to read your position. Allow location for this site, or type the position.';
  if (error.code === error.TIMEOUT) return 'Your phone did not find its position in time. Step into the open and try again, or type the position.';
  return 'Your position could not be read. Type it instead.';
}

/**
 * Two ways to fill latitude and longitude without typing: the phone's own position (stand
 * by the plant), or the GPS tag of a photo taken beside it.
 */
export function PositionHelpers({ onPosition }: { onPosition: (lat: number, lon: number) => void }) {
  const [locating, setLocating] = useState(false);
  const [note, setNote] = useState<Note>(null);
  const readGps = useReadPhotoGps();
  const fileRef = useRef<HTMLInputElement>(null);

  const useMyPosition = () => {
    if (!('geolocation' in navigator)) {
      setNote({ tone: 'problem', text: 'This browser cannot give a position. Type it, or use a photo taken by the plant.' });
      return;
    }
    setLocating(true);
    setNote(null);
    navigator.geolocation.getCurrentPosition(
      (position) => {
        setLocating(false);
        const { latitude, longitude, accuracy } = position.coords;
        const lat = Math.round(latitude * 1e6) / 1e6;
        const lon = Math.round(longitude * 1e6) / 1e6;
        onPosition(lat, lon);
        setNote({ tone: 'ok', text: `Your position: ${formatPosition(lat, lon)}, good to about ${Math.round(accuracy)} m.` });
      },
      (error) => {
        setLocating(false);
        setNote({ tone: 'problem', text: geolocationProblem(error) });
      },
      { enableHighAccuracy: true, timeout: 20_000, maximumAge: 30_000 },
    );
  };

  const fromPhoto = async (file: File | undefined) => {
    if (!file) return;
    setNote(null);
    try {
      const result = await readGps.mutateAsync(file);
      if (result.gps) {
        // Six decimals is about 10 cm: finer digits from the camera are noise.
        const lat = Math.round(result.gps.lat * 1e6) / 1e6;
        const lon = Math.round(result.gps.lon * 1e6) / 1e6;
        onPosition(lat, lon);
        setNote({ tone: 'ok', text: `Position from the photo: ${formatPosition(lat, lon)}.` });
      } else {
        setNote({ tone: 'problem', text: 'That photo carries no position. Phones add one only when location is switched on for the camera.' });
      }
    } catch (error) {
      setNote({ tone: 'problem', text: `The photo could not be read: ${errorMessage(error)}` });
    } finally {
      if (fileRef.current) fileRef.current.value = '';
    }
  };

  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" onClick={useMyPosition} busy={locating}>
          Use my position
        </Button>
        <Button variant="secondary" onClick={() => fileRef.current?.click()} busy={readGps.isPending}>
          From a photo's GPS tag
        </Button>
        <input
          ref={fileRef}
          type="file"
          accept="image/jpeg,image/png,image/webp"
          className="sr-only"
          tabIndex={-1}
          aria-label="Photo to read the position from"
          onChange={(event) => void fromPhoto(event.target.files?.[0])}
        />
      </div>
      {locating ? <p role="status" className="text-sm text-ink-soft">Finding your position…</p> : null}
      {readGps.isPending ? <p role="status" className="text-sm text-ink-soft">Reading the photo…</p> : null}
      {note ? (
        <p role={note.tone === 'problem' ? 'alert' : 'status'} className={note.tone === 'problem' ? 'text-sm font-medium text-rust' : 'text-sm text-leaf-dark'}>
          {note.text}
        </p>
      ) : null}
    </div>
  );
}

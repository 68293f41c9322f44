// Lay a farm's own scanned plan or aerial photo over the map, placed by two corners. The image
// stays in this browser (IndexedDB): it is not uploaded and nobody else sees it.
import type * as Leaflet from 'leaflet';
import { useEffect, useRef, useState } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { loadOverlay, removeOverlay, saveOverlay, type StoredOverlay } from '../lib/overlay-store';
import { L } from '../lib/leaflet-plugins';

type Props = { map: Leaflet.Map | null; active: boolean; onActiveChange: (active: boolean) => void };
type Step = 'choose' | 'first' | 'second';

const MAX_BYTES = 25 * 1024 * 1024;

export function ImageOverlayTool({ map, active, onActiveChange }: Props) {
  const [stored, setStored] = useState<StoredOverlay | null>(null);
  const [file, setFile] = useState<File | null>(null);
  const [step, setStep] = useState<Step>('choose');
  const [corner, setCorner] = useState<Leaflet.LatLng | null>(null);
  const [error, setError] = useState<string | null>(null);
  const layer = useRef<Leaflet.ImageOverlay | null>(null);

  useEffect(() => {
    loadOverlay()
      .then(setStored)
      .catch(() => setStored(null));
  }, []);

  // Show the stored image on the map, below the plants.
  useEffect(() => {
    if (!map || !stored) return;
    const url = URL.createObjectURL(stored.image);
    const overlay = L.imageOverlay(url, stored.bounds, { opacity: stored.opacity, interactive: false, alt: `Your overlay: ${stored.name}` }).addTo(map);
    layer.current = overlay;
    return () => {
      overlay.remove();
      layer.current = null;
      URL.revokeObjectURL(url);
    };
  }, [map, stored?.image, stored?.bounds]);

  useEffect(() => {
    if (stored) layer.current?.setOpacity(stored.opacity);
  }, [stored?.opacity]);

  // Two taps on the map: one corner, then the opposite one.
  useEffect(() => {
    if (!map || !active || (step !== 'first' && step !== 'second') || !file) return;
    const onClick = async (e: Leaflet.LeafletMouseEvent) => {
      if (step === 'first') {
        setCorner(e.latlng);
        setStep('second');
        return;
      }
      const b = L.latLngBounds(corner!, e.latlng);
      const next: StoredOverlay = {
        name: file.name,
        image: file,
        bounds: [
          [b.getSouth(), b.getWest()],
          [b.getNorth(), b.getEast()],
        ],
        opacity: stored?.opacity ?? 0.7,
      };
      try {
        await saveOverlay(next);
        setStored(next);
        setFile(null);
        setStep('choose');
        setCorner(null);
        onActiveChange(false);
      } catch (err) {
        setError(err instanceof Error ? err.message : 'The browser could not keep the image.');
      }
    };
    map.on('click', onClick);
    return () => {
      map.off('click', onClick);
    };
  }, [map, active, step, file, corner, stored?.opacity, onActiveChange]);

  const choose = (f: File | undefined) => {
    setError(null);
    if (!f) return;
    if (!/^image\/(png|jpeg|webp|gif)$/.test(f.type)) {
      setError('Choose a PNG, JPEG or WebP image.');
      return;
    }
    if (f.size > MAX_BYTES) {
      setError('That image is larger than 25 MB; make a smaller copy first.');
      return;
    }
    setFile(f);
    setStep('first');
  };

  const clear = async () => {
    await removeOverlay().catch(() => undefined);
    setStored(null);
  };

  const opacity = stored ? (
    <label className="flex flex-col gap-1 text-sm text-ink">
      Show the image at {Math.round(stored.opacity * 100)} %
      <input
        type="range"
        min={0.2}
        max={1}
        step={0.05}
        value={stored.opacity}
        className="h-11 accent-leaf"
        onChange={(e) => {
          const next = { ...stored, opacity: Number(e.target.value) };
          setStored(next);
          void saveOverlay(next).catch(() => undefined);
        }}
      />
    </label>
  ) : null;

  const keptNote = <p className="text-sm text-ink-soft">The image is kept in this browser on this device only: it is not uploaded, and nobody else sees it.</p>;

  if (!active) {
    if (!stored) return null;
    return (
      <div className="flex flex-col gap-2">
        <p className="text-sm text-ink">
          Your overlay: <span className="font-medium">{stored.name}</span>
        </p>
        {opacity}
        <div className="flex flex-wrap gap-2">
          <Button size="sm" variant="secondary" onClick={() => onActiveChange(true)}>
            Place it again
          </Button>
          <Button size="sm" variant="quiet" onClick={clear}>
            Remove the overlay
          </Button>
        </div>
      </div>
    );
  }

  return (
    <div className="flex flex-col gap-3">
      <h2 className="font-semibold text-ink">Lay a plan or photo over the map</h2>
      {keptNote}
      {step === 'choose' ? (
        <label className="flex flex-col gap-1.5 font-medium text-ink">
          Choose an image (a scanned plan or an aerial photo of your own)
          <input
            type="file"
            accept="image/png,image/jpeg,image/webp"
            className="min-h-touch rounded-lg border-2 border-paper-edge bg-white px-2 py-2 text-base"
            onChange={(e) => choose(e.target.files?.[0])}
          />
        </label>
      ) : (
        <p className="rounded-lg border-l-4 border-currant bg-currant-light/50 px-3 py-2 text-ink" aria-live="polite">
          {step === 'first'
            ? `Tap the map where the top-left (north-west) corner of ${file?.name ?? 'the image'} belongs.`
            : 'Now tap where its bottom-right (south-east) corner belongs.'}
        </p>
      )}
      <p className="text-sm text-ink-soft">The image is stretched between the two corners with north up; straighten a rotated scan first.</p>
      {error ? <Alert tone="warning">{error}</Alert> : null}
      {opacity}
      <div className="flex flex-wrap gap-2">
        {step !== 'choose' ? (
          <Button variant="secondary" onClick={() => (setStep('choose'), setFile(null), setCorner(null))}>
            Choose another image
          </Button>
        ) : null}
        {stored ? (
          <Button variant="quiet" onClick={clear}>
            Remove the overlay
          </Button>
        ) : null}
        <Button variant="quiet" onClick={() => (setStep('choose'), setFile(null), setCorner(null), onActiveChange(false))}>
          Close
        </Button>
      </div>
    </div>
  );
}

// Place or move one plant: drag the ring, tap "Place here by clicking" and tap the map, or use
// the phone's position; then confirm, and the register's own edit (PATCH) stores it.
import type * as Leaflet from 'leaflet';
import { useEffect, useRef, useState } from 'react';
import { distanceM } from '../../../../shared/geo';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { errorMessage } from '../../../lib/api-client';
import { useMovePlant } from '../api/move-plant';
import type { MapPlant, UnplacedPlant } from '../api/types';
import { formatLatLon, roundCoord } from '../lib/format';
import { currentPosition, geolocationMessage } from '../lib/geolocation';
import { L } from '../lib/leaflet-plugins';
import { formatMetres } from '../lib/length';
import { PENDING_HTML } from '../lib/marker-icons';

type Props = {
  map: Leaflet.Map | null;
  plant: MapPlant | UnplacedPlant;
  onDone: () => void;
  onMoved?: (id: string) => void;
};

const hasPosition = (p: MapPlant | UnplacedPlant): p is MapPlant => 'lat' in p && p.lat != null;

export function MovePlantTool({ map, plant, onDone, onMoved }: Props) {
  const from = hasPosition(plant) ? { lat: plant.lat, lon: plant.lon } : null;
  const [pos, setPos] = useState<{ lat: number; lon: number } | null>(from);
  const [byClick, setByClick] = useState(!from);
  const [locating, setLocating] = useState(false);
  const [geoError, setGeoError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const marker = useRef<Leaflet.Marker | null>(null);
  const move = useMovePlant(onMoved);

  // The ring that shows the new position, draggable.
  useEffect(() => {
    if (!map || !pos) return;
    if (!marker.current) {
      const m = L.marker([pos.lat, pos.lon], {
        draggable: true,
        autoPan: true,
        keyboard: true,
        zIndexOffset: 2000,
        title: 'New position: drag to adjust',
        icon: L.divIcon({ html: PENDING_HTML, className: 'hw-pending-icon', iconSize: [34, 34] }),
      });
      m.on('dragend', () => {
        const ll = m.getLatLng();
        setPos({ lat: ll.lat, lon: ll.lng });
      });
      m.addTo(map);
      marker.current = m;
    } else {
      marker.current.setLatLng([pos.lat, pos.lon]);
    }
  }, [map, pos]);

  useEffect(
    () => () => {
      marker.current?.remove();
      marker.current = null;
    },
    [],
  );

  // "Place here by clicking": the next tap on the map sets the position.
  useEffect(() => {
    if (!map || !byClick) return;
    const onClick = (e: Leaflet.LeafletMouseEvent) => {
      setPos({ lat: e.latlng.lat, lon: e.latlng.lng });
      setByClick(false);
      setSaved(false);
    };
    map.on('click', onClick);
    return () => {
      map.off('click', onClick);
    };
  }, [map, byClick]);

  const useMine = async () => {
    setGeoError(null);
    setLocating(true);
    try {
      const fix = await currentPosition();
      setPos({ lat: fix.lat, lon: fix.lon });
      setByClick(false);
      setSaved(false);
      map?.setView([fix.lat, fix.lon], Math.max(map.getZoom(), 18));
    } catch (err) {
      setGeoError(geolocationMessage(err as GeolocationPositionError | Error));
    } finally {
      setLocating(false);
    }
  };

  const confirm = () => {
    if (!pos) return;
    move.mutate({ id: plant.id, lat: roundCoord(pos.lat), lon: roundCoord(pos.lon) }, { onSuccess: () => setSaved(true) });
  };

  const moved = from && pos ? distanceM(from, pos) : null;

  return (
    <div className="flex flex-col gap-3">
      <h2 className="font-semibold text-ink">{from ? `Move ${plant.code}` : `Place ${plant.code}`}</h2>
      <p className="text-sm text-ink-soft">
        Drag the ring to the bush, or choose “Place here by clicking” and tap the map, or stand at the bush and use your position. Then confirm.
      </p>
      <div className="flex flex-col gap-2">
        <Button variant={byClick ? 'primary' : 'secondary'} onClick={() => setByClick((v) => !v)} aria-pressed={byClick}>
          {byClick ? 'Tap the map where the plant stands…' : 'Place here by clicking'}
        </Button>
        <Button variant="secondary" onClick={useMine} busy={locating}>
          Use my position
        </Button>
      </div>
      {geoError ? <Alert tone="warning">{geoError}</Alert> : null}
      <p className="text-sm text-ink" aria-live="polite">
        {pos ? (
          <>
            New position: <span className="tabular-nums">{formatLatLon(pos.lat, pos.lon)}</span>
            {moved != null ? <span className="block text-ink-soft">{formatMetres(moved)} from where it was</span> : null}
          </>
        ) : (
          'No position chosen yet.'
        )}
      </p>
      {move.isError ? <Alert tone="danger" title="The position was not saved">{errorMessage(move.error)}</Alert> : null}
      {saved ? <Alert tone="success">Position saved for {plant.code}.</Alert> : null}
      <div className="flex flex-wrap gap-2">
        <Button onClick={confirm} disabled={!pos || saved} busy={move.isPending}>
          Confirm position
        </Button>
        <Button variant="quiet" onClick={onDone}>
          {saved ? 'Done' : 'Cancel'}
        </Button>
      </div>
    </div>
  );
}

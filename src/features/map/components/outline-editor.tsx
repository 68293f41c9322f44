// A farm lead (or a coordinator) draws the farm's outline, beds and rows with geoman, names
// them, and saves the drawing (PUT /api/farms/:farmId/outline).
import type * as Leaflet from 'leaflet';
import { useEffect, useRef, useState } from 'react';
import { polygonArea } from '../../../../shared/geo';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Loading } from '../../../components/ui/loading';
import { TextInput } from '../../../components/ui/field';
import { errorMessage } from '../../../lib/api-client';
import { useSaveOutline } from '../api/save-outline';
import type { MapFarm, OutlineCollection, OutlineFeature, OutlineKind, Position } from '../api/types';
import { drawInstance } from '../lib/draw';
import { useGeomanMap } from '../lib/geoman';
import { L } from '../lib/leaflet-plugins';
import { formatMetres, hedgerowLengthM } from '../lib/length';
import { KIND_STYLE } from './heelwood-map';

type Shape = { key: number; kind: OutlineKind; label: string; layer: Leaflet.Polygon | Leaflet.Polyline };

const KIND_WORD: Record<OutlineKind, string> = { outline: 'Farm outline', bed: 'Bed', row: 'Row' };
const EDIT = { snappable: true, snapDistance: 12, allowSelfIntersection: false } as const;

function toLayer(f: OutlineFeature): Leaflet.Polygon | Leaflet.Polyline {
  const style = { ...KIND_STYLE[f.properties.kind], pmIgnore: false };
  if (f.geometry.type === 'Polygon') {
    // GeoJSON repeats the first point at the end; Leaflet closes rings itself.
    const rings = f.geometry.coordinates.map((ring) => ring.slice(0, -1).map(([lon, lat]) => [lat, lon] as [number, number]));
    return L.polygon(rings, style);
  }
  return L.polyline(
    f.geometry.coordinates.map(([lon, lat]) => [lat, lon] as [number, number]),
    style,
  ) as Leaflet.Polyline;
}

function toFeature(s: Shape): OutlineFeature {
  const gj = s.layer.toGeoJSON(7).geometry as { type: string; coordinates: unknown };
  const properties = { kind: s.kind, ...(s.label.trim() ? { label: s.label.trim() } : {}) };
  if (gj.type === 'Polygon') return { type: 'Feature', properties, geometry: { type: 'Polygon', coordinates: gj.coordinates as Position[][] } };
  if (gj.type === 'MultiPolygon') {
    return { type: 'Feature', properties, geometry: { type: 'Polygon', coordinates: (gj.coordinates as Position[][][])[0] } };
  }
  return { type: 'Feature', properties, geometry: { type: 'LineString', coordinates: gj.coordinates as Position[] } };
}

function sizeOf(s: Shape): string {
  const latlngs = s.layer.getLatLngs().flat(2) as Leaflet.LatLng[];
  const pts = latlngs.map((p) => ({ lat: p.lat, lon: p.lng }));
  if (s.kind === 'row') return formatMetres(hedgerowLengthM(pts));
  const { areaM2 } = polygonArea(pts);
  return `${Math.round(areaM2).toLocaleString('en-GB')} m²`;
}

export function OutlineEditor({ map: baseMap, farm, onDone }: { map: Leaflet.Map | null; farm: MapFarm; onDone: () => void }) {
  const map = useGeomanMap(baseMap, true);
  const [shapes, setShapes] = useState<Shape[]>([]);
  const [drawing, setDrawing] = useState<OutlineKind | null>(null);
  const [, setTick] = useState(0);
  const nextKey = useRef(1);
  const drawingRef = useRef<OutlineKind | null>(null);
  const shapesRef = useRef<Shape[]>([]);
  shapesRef.current = shapes;
  const save = useSaveOutline();

  const watch = (layer: Leaflet.Layer) => layer.on('pm:edit pm:markerdragend pm:vertexremoved', () => setTick((t) => t + 1));

  // Load the farm's drawing as editable shapes; take them off the map when done.
  useEffect(() => {
    if (!map) return;
    const loaded: Shape[] = (farm.outline?.features ?? []).map((f) => {
      const layer = toLayer(f).addTo(map);
      layer.pm.enable(EDIT);
      watch(layer);
      return { key: nextKey.current++, kind: f.properties.kind, label: f.properties.label ?? (f.properties.kind === 'outline' ? farm.name : ''), layer };
    });
    setShapes(loaded);
    const first = loaded.find((s) => s.kind === 'outline') ?? loaded[0];
    if (first) map.fitBounds(first.layer.getBounds(), { padding: [30, 30], maxZoom: 19 });
    else map.setView([farm.lat, farm.lon], 18);

    const onCreate = (e: { shape: string; layer: Leaflet.Layer }) => {
      const kind = drawingRef.current;
      if (!kind) return;
      const layer = e.layer as Leaflet.Polygon | Leaflet.Polyline;
      layer.setStyle(KIND_STYLE[kind]);
      layer.pm.enable(EDIT);
      watch(layer);
      const n = shapesRef.current.filter((s) => s.kind === kind).length + 1;
      const label = kind === 'outline' ? farm.name : `${KIND_WORD[kind]} ${n}`;
      setShapes((list) => [...list, { key: nextKey.current++, kind, label, layer }]);
    };
    const onDrawEnd = () => {
      drawingRef.current = null;
      setDrawing(null);
    };
    map.on('pm:create', onCreate as never);
    map.on('pm:drawend', onDrawEnd);
    return () => {
      map.off('pm:create', onCreate as never);
      map.off('pm:drawend', onDrawEnd);
      if (drawingRef.current) map.pm.disableDraw();
      for (const s of shapesRef.current) s.layer.remove();
    };
    // Loaded once per farm: fresh data for the same farm must not undo edits in progress.
  }, [map, farm.id]);

  const startDrawing = (kind: OutlineKind) => {
    if (!map) return;
    if (drawingRef.current) map.pm.disableDraw();
    drawingRef.current = kind;
    setDrawing(kind);
    const style = KIND_STYLE[kind];
    map.pm.enableDraw(kind === 'row' ? 'Line' : 'Polygon', {
      snappable: true,
      snapDistance: 12,
      tooltips: true,
      allowSelfIntersection: false,
      templineStyle: style,
      hintlineStyle: { ...style, dashArray: '5 5' },
      pathOptions: { ...style, pmIgnore: false },
    });
  };

  const remove = (key: number) => {
    const s = shapes.find((x) => x.key === key);
    s?.layer.remove();
    setShapes((list) => list.filter((x) => x.key !== key));
  };

  const submit = () => {
    const outline: OutlineCollection = { type: 'FeatureCollection', features: shapes.map(toFeature) };
    save.mutate({ farmId: farm.id, outline }, { onSuccess: onDone });
  };

  const fieldErrors = save.error && 'fields' in save.error ? Object.entries((save.error as { fields: Record<string, string> }).fields) : [];

  if (!map) return <Loading label="Loading the drawing tools…" />;

  return (
    <div className="flex flex-col gap-3">
      <h2 className="font-semibold text-ink">Draw {farm.name}</h2>
      <p className="text-sm text-ink-soft">
        Tap the map at each corner; finish a shape by tapping its first point (a row: its last point) or with “Finish shape”. Drag the corner handles to adjust any
        shape.
      </p>
      {drawing ? (
        <div className="flex flex-wrap gap-2">
          <Button onClick={() => drawInstance(map, drawing === 'row' ? 'Line' : 'Polygon')?._finishShape()}>Finish shape</Button>
          <Button variant="secondary" onClick={() => drawInstance(map, drawing === 'row' ? 'Line' : 'Polygon')?._removeLastVertex()}>
            Undo last point
          </Button>
          <Button variant="quiet" onClick={() => map?.pm.disableDraw()}>
            Stop drawing
          </Button>
        </div>
      ) : (
        <div className="flex flex-wrap gap-2">
          <Button variant="secondary" onClick={() => startDrawing('outline')}>
            Draw the farm outline
          </Button>
          <Button variant="secondary" onClick={() => startDrawing('bed')}>
            Draw a bed
          </Button>
          <Button variant="secondary" onClick={() => startDrawing('row')}>
            Draw a row
          </Button>
        </div>
      )}
      {shapes.length ? (
        <ul className="flex flex-col gap-2" aria-label="Shapes of this farm">
          {shapes.map((s) => (
            <li key={s.key} className="rounded-lg border border-paper-edge bg-white/60 p-2">
              <div className="flex items-center justify-between gap-2 text-sm">
                <span className="font-medium text-ink">
                  {KIND_WORD[s.kind]} <span className="font-normal text-ink-soft">· {sizeOf(s)}</span>
                </span>
                <Button size="sm" variant="quiet" onClick={() => remove(s.key)} aria-label={`Remove ${s.label || KIND_WORD[s.kind]}`}>
                  Remove
                </Button>
              </div>
              <TextInput
                aria-label={`Name of ${KIND_WORD[s.kind].toLowerCase()}`}
                value={s.label}
                maxLength={100}
                onChange={(e) => {
                  const label = e.target.value;
                  setShapes((list) => list.map((x) => (x.key === s.key ? { ...x, label } : x)));
                }}
              />
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-sm text-ink-soft">Nothing drawn yet for this farm. Start with its outline.</p>
      )}
      {save.isError ? (
        <Alert tone="danger" title="The drawing was not saved">
          {errorMessage(save.error)}
          {fieldErrors.length ? (
            <ul className="mt-1 list-disc pl-5">
              {fieldErrors.slice(0, 5).map(([k, v]) => (
                <li key={k}>{v}</li>
              ))}
            </ul>
          ) : null}
        </Alert>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <Button onClick={submit} busy={save.isPending} disabled={!!drawing}>
          Save the drawing
        </Button>
        <Button variant="quiet" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </div>
  );
}

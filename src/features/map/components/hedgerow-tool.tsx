// Draw a planned hedgerow line and read its geodesic length (shared/geo.ts lineLengthM),
// then take it to the planner. The line is drawn with geoman and stays editable: drag a
// point and the length follows.
import type * as Leaflet from 'leaflet';
import { useCallback, useEffect, useRef, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { Loading } from '../../../components/ui/loading';
import { hedgerowLengthM } from '../lib/length';
import { drawInstance } from '../lib/draw';
import { useGeomanMap } from '../lib/geoman';
import { HEDGEROW_STYLE } from './heelwood-map';
import { LengthReadout } from './length-readout';

type Props = {
  map: Leaflet.Map | null;
  active: boolean;
  onActiveChange: (active: boolean) => void;
};

export function HedgerowTool({ map: baseMap, active, onActiveChange }: Props) {
  // The map with geoman on it, once the drawing tools have loaded.
  const map = useGeomanMap(baseMap, active);
  const [points, setPoints] = useState<Leaflet.LatLng[]>([]);
  const [drawing, setDrawing] = useState(false);
  const [round, setRound] = useState(0);
  const lineRef = useRef<Leaflet.Polyline | null>(null);
  const lengthM = hedgerowLengthM(points);

  const clearLine = useCallback(() => {
    lineRef.current?.remove();
    lineRef.current = null;
    setPoints([]);
  }, []);

  // Start drawing when the tool opens; stop (keeping a finished line) when it closes.
  useEffect(() => {
    if (!map || !active) return;
    const onDrawStart = (e: { shape: string; workingLayer: Leaflet.Layer }) => {
      if (e.shape !== 'Line') return;
      const working = e.workingLayer as Leaflet.Polyline;
      working.on('pm:vertexadded pm:vertexremoved', () => setPoints([...(working.getLatLngs() as Leaflet.LatLng[])]));
    };
    const onCreate = (e: { shape: string; layer: Leaflet.Layer }) => {
      if (e.shape !== 'Line') return;
      const line = e.layer as Leaflet.Polyline;
      lineRef.current = line;
      const sync = () => setPoints([...(line.getLatLngs() as Leaflet.LatLng[])]);
      sync();
      line.on('pm:markerdrag pm:edit pm:vertexremoved pm:vertexadded', sync);
      line.pm.enable({ snappable: false, allowSelfIntersection: true });
      setDrawing(false);
    };
    const onDrawEnd = () => setDrawing(false);
    map.on('pm:drawstart', onDrawStart as never);
    map.on('pm:create', onCreate as never);
    map.on('pm:drawend', onDrawEnd);
    if (!lineRef.current) {
      setPoints([]);
      map.pm.enableDraw('Line', {
        snappable: false,
        tooltips: true,
        finishOn: null,
        templineStyle: HEDGEROW_STYLE,
        hintlineStyle: { ...HEDGEROW_STYLE, dashArray: '6 6', opacity: 0.6 },
        pathOptions: { ...HEDGEROW_STYLE, pmIgnore: false },
      });
      setDrawing(true);
    } else {
      lineRef.current.pm.enable({ snappable: false, allowSelfIntersection: true });
    }
    return () => {
      map.off('pm:drawstart', onDrawStart as never);
      map.off('pm:create', onCreate as never);
      map.off('pm:drawend', onDrawEnd);
      if (map.pm.Draw.getActiveShape() === 'Line') map.pm.disableDraw();
      lineRef.current?.pm.disable();
      setDrawing(false);
    };
  }, [map, active, round]);

  if (!active) {
    if (!lineRef.current || points.length < 2) return null;
    return (
      <div className="flex flex-col gap-3">
        <LengthReadout lengthM={lengthM} points={points.length} finished />
        <div className="flex flex-wrap gap-2">
          <Button variant="secondary" onClick={() => onActiveChange(true)}>
            Change the line
          </Button>
          <Button variant="quiet" onClick={clearLine}>
            Clear the line
          </Button>
        </div>
      </div>
    );
  }

  if (!map) return <Loading label="Loading the drawing tools…" />;

  return (
    <div className="flex flex-col gap-3">
      <h2 className="font-semibold text-ink">Plan a hedgerow</h2>
      <p className="text-sm text-ink-soft">
        {drawing
          ? 'Tap the map where the hedgerow starts, then at each bend. Finish with the button below, or by tapping the last point again.'
          : 'Drag a point to adjust the line; the length follows.'}
      </p>
      <LengthReadout lengthM={lengthM} points={points.length} finished={!drawing} />
      <div className="flex flex-wrap gap-2">
        {drawing ? (
          <>
            <Button onClick={() => drawInstance(map, 'Line')?._finishShape()} disabled={points.length < 2}>
              Finish line
            </Button>
            <Button variant="secondary" onClick={() => drawInstance(map, 'Line')?._removeLastVertex()} disabled={points.length < 1}>
              Undo last point
            </Button>
          </>
        ) : (
          <Button
            variant="secondary"
            onClick={() => {
              clearLine();
              setRound((r) => r + 1);
            }}
          >
            Start again
          </Button>
        )}
        <Button variant="quiet" onClick={() => onActiveChange(false)}>
          {drawing ? 'Cancel' : 'Done'}
        </Button>
      </div>
    </div>
  );
}

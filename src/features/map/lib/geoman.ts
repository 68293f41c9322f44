// geoman (drawing and editing) is most of the map's code by weight; it loads only when someone
// opens a drawing tool, and is then attached to the map that already exists.
import type * as Leaflet from 'leaflet';
import { useEffect, useState } from 'react';

let loading: Promise<void> | null = null;

function loadGeoman(): Promise<void> {
  loading ??= import('./geoman-plugin').then(() => undefined);
  return loading;
}

/** The map once geoman is ready on it (null until then, or while `wanted` is false). */
export function useGeomanMap(map: Leaflet.Map | null, wanted: boolean): Leaflet.Map | null {
  const [ready, setReady] = useState<Leaflet.Map | null>(null);
  useEffect(() => {
    if (!map || !wanted) return;
    let live = true;
    loadGeoman().then(
      () => {
        const L = window.L!;
        // geoman's types say every map has `pm`; one made before geoman loaded does not yet.
        if (!(map as { pm?: unknown }).pm) {
          L.PM.reInitLayer(map as unknown as Leaflet.Layer);
          map.pm.setGlobalOptions({});
        }
        if (live) setReady(map);
      },
      (err) => {
        console.error('[heelwood] the drawing tools failed to load', err);
      },
    );
    return () => {
      live = false;
    };
  }, [map, wanted]);
  return wanted ? ready : null;
}

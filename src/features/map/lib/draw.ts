import type * as Leaflet from 'leaflet';

type DrawControls = { _finishShape(): void; _removeLastVertex(): void };

/**
 * geoman's draw instance for a shape. Its own toolbar's "Finish" and "Remove last vertex"
 * actions call these two methods; Heelwood has its own, larger buttons for them.
 */
export function drawInstance(map: Leaflet.Map | null, shape: 'Line' | 'Polygon'): DrawControls | null {
  const d = map?.pm?.Draw as unknown as Record<string, Partial<DrawControls> | undefined> | undefined;
  const inst = d?.[shape];
  return inst && typeof inst._finishShape === 'function' && typeof inst._removeLastVertex === 'function' ? (inst as DrawControls) : null;
}

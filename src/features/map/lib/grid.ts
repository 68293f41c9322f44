// A light metric grid for farm zoom, where the basemap has no detail: squares of `stepM`
// metres, sized with GeographicLib at the view's latitude and anchored to whole multiples of
// the step so the lines stay put while the map is panned.
import { destination } from '../../../../shared/geo';

export type GridBounds = { south: number; west: number; north: number; east: number };

/** Degrees of latitude and longitude that make `stepM` metres at latitude `lat`. */
export function gridStepDegrees(lat: number, stepM: number): { dLat: number; dLon: number } {
  // Round the latitude so that small pans do not shift the lines.
  const at = Math.round(lat * 20) / 20;
  const north = destination({ lat: at, lon: 0 }, 0, stepM);
  const east = destination({ lat: at, lon: 0 }, 90, stepM);
  return { dLat: north.lat - at, dLon: east.lon };
}

/** Grid lines covering `b`, as [lat, lon] pairs per line; empty when there would be too many. */
export function gridLines(b: GridBounds, stepM: number, maxLines = 400): [number, number][][] {
  const { dLat, dLon } = gridStepDegrees((b.south + b.north) / 2, stepM);
  const lat0 = Math.floor(b.south / dLat) * dLat;
  const lon0 = Math.floor(b.west / dLon) * dLon;
  const rows = Math.ceil((b.north - lat0) / dLat) + 1;
  const cols = Math.ceil((b.east - lon0) / dLon) + 1;
  if (rows + cols > maxLines) return [];
  const lines: [number, number][][] = [];
  for (let i = 0; i < rows; i++) {
    const lat = lat0 + i * dLat;
    lines.push([
      [lat, b.west],
      [lat, b.east],
    ]);
  }
  for (let j = 0; j < cols; j++) {
    const lon = lon0 + j * dLon;
    lines.push([
      [b.south, lon],
      [b.north, lon],
    ]);
  }
  return lines;
}

/** 10 m squares close in, 50 m and 100 m further out (lines at least about 20 px apart). */
export function gridStepForZoom(zoom: number): number | null {
  if (zoom >= 18) return 10;
  if (zoom >= 16) return 50;
  if (zoom >= 14) return 100;
  return null;
}

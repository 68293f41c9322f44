// Web Mercator tile numbering (XYZ "slippy map": tile 0/0/0 is the whole world, y grows
// southwards). Used by the tile renderer, the tile server's range checks and the map page.
// The projection itself comes from @mapbox/tilebelt; this module only adds clamping, pixel
// positions and ranges over a bounding box.
import { pointToTileFraction, tileToBBOX } from '@mapbox/tilebelt';

/** Latitude where the square Mercator world ends: atan(sinh(pi)) in degrees. */
export const MAX_LATITUDE = 85.0511287798066;
/** Deepest zoom the server accepts in a tile address. */
export const MAX_TILE_ZOOM = 22;
export const TILE_SIZE = 256;

/** [west, south, east, north] in degrees. */
export type BBox = [number, number, number, number];
export type TileXY = { x: number; y: number };
export type TileRange = { z: number; minX: number; maxX: number; minY: number; maxY: number };

function clampLat(lat: number): number {
  return Math.max(-MAX_LATITUDE, Math.min(MAX_LATITUDE, lat));
}

/**
 * Position of a point in tile units at zoom z (x 0..2^z from lon -180, y 0..2^z from the
 * north edge). Latitudes beyond the Mercator edge are clamped; lon 180 stays at the east edge
 * instead of wrapping to 0.
 */
export function lonLatToTileFraction(lon: number, lat: number, z: number): TileXY {
  const n = 2 ** z;
  if (lon >= 180) {
    const [, y] = pointToTileFraction(0, clampLat(lat), z);
    return { x: n, y };
  }
  const [x, y] = pointToTileFraction(lon, clampLat(lat), z);
  return { x, y };
}

/** The tile holding a point at zoom z. */
export function lonLatToTile(lon: number, lat: number, z: number): TileXY {
  const n = 2 ** z;
  const f = lonLatToTileFraction(lon, lat, z);
  return { x: Math.min(n - 1, Math.floor(f.x)), y: Math.max(0, Math.min(n - 1, Math.floor(f.y))) };
}

/** Position of a point in pixels of the whole world at zoom z (256 px tiles). */
export function lonLatToWorldPixel(lon: number, lat: number, z: number): TileXY {
  const f = lonLatToTileFraction(lon, lat, z);
  return { x: f.x * TILE_SIZE, y: f.y * TILE_SIZE };
}

/** The north-west corner of a tile. */
export function tileToLonLat(x: number, y: number, z: number): { lon: number; lat: number } {
  const [west, , , north] = tileToBBOX([x, y, z]);
  return { lon: west, lat: north };
}

/** A tile's extent as [west, south, east, north]. */
export function tileBounds(x: number, y: number, z: number): BBox {
  const [w, s, e, n] = tileToBBOX([x, y, z]);
  return [w, s, e, n];
}

/** The tiles at zoom z that cover a bounding box (inclusive ranges). */
export function tileRange(bbox: BBox, z: number): TileRange {
  const [west, south, east, north] = bbox;
  const nw = lonLatToTile(west, north, z);
  const se = lonLatToTile(east, south, z);
  return { z, minX: nw.x, maxX: se.x, minY: nw.y, maxY: se.y };
}

export function tileCount(r: TileRange): number {
  return (r.maxX - r.minX + 1) * (r.maxY - r.minY + 1);
}

/** Whether z/x/y addresses a tile that can exist: integers, z 0..maxZoom, x and y 0..2^z-1. */
export function isValidTile(z: number, x: number, y: number, maxZoom = MAX_TILE_ZOOM): boolean {
  if (![z, x, y].every(Number.isSafeInteger)) return false;
  if (z < 0 || z > maxZoom) return false;
  const n = 2 ** z;
  return x >= 0 && x < n && y >= 0 && y < n;
}

/** MBTiles stores rows in TMS order (row 0 at the south); XYZ counts y from the north. */
export function flipY(y: number, z: number): number {
  return 2 ** z - 1 - y;
}

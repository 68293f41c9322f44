// Tile numbering against the published reference: OpenStreetMap wiki, "Slippy map tilenames"
// (CHECK-VALUES.md row "Tile numbering"). The wiki gives the formula
//   n = 2^zoom; xtile = n * ((lon_deg + 180) / 360)
//   ytile = n * (1 - (ln(tan(lat_rad) + sec(lat_rad)) / pi)) / 2
// and its "Zoom levels" table: zoom 0 is one tile covering 360 x 170.1022 degrees, zoom 1 tiles
// are 180 x 85.0511 degrees, zoom 12 has 4096 x 4096 tiles 0.0879 degrees wide.
import { describe, expect, it } from 'vitest';
import {
  flipY,
  isValidTile,
  lonLatToTile,
  lonLatToTileFraction,
  MAX_LATITUDE,
  tileBounds,
  tileCount,
  tileRange,
  tileToLonLat,
} from '../tile-math.js';

/** The wiki's formula, written out as published, to compare the library against. */
function wikiTile(lon: number, lat: number, zoom: number) {
  const n = 2 ** zoom;
  const latRad = (lat * Math.PI) / 180;
  const x = n * ((lon + 180) / 360);
  const y = (n * (1 - Math.log(Math.tan(latRad) + 1 / Math.cos(latRad)) / Math.PI)) / 2;
  return { x: Math.floor(x), y: Math.floor(y), fx: x, fy: y };
}

/** The wiki's inverse: NW corner of a tile. */
function wikiCorner(x: number, y: number, zoom: number) {
  const n = 2 ** zoom;
  const lon = (x / n) * 360 - 180;
  const lat = (Math.atan(Math.sinh(Math.PI * (1 - (2 * y) / n))) * 180) / Math.PI;
  return { lon, lat };
}

const places: [string, number, number][] = [
  ['Hereford', -2.7163, 52.0565],
  ['Leominster', -2.7375, 52.2266],
  ['Greenwich', 0, 51.4779],
  ['Quito', -78.4678, -0.1807],
  ['Wellington', 174.7762, -41.2865],
  ['Honolulu', -157.8583, 21.3069],
];

describe('tile numbering (OSM wiki, Slippy map tilenames)', () => {
  it('tile 0/0/0 covers the whole world: 360 x 170.1022 degrees', () => {
    expect(lonLatToTile(-179.9, 85, 0)).toEqual({ x: 0, y: 0 });
    expect(lonLatToTile(179.9, -85, 0)).toEqual({ x: 0, y: 0 });
    const [w, s, e, n] = tileBounds(0, 0, 0);
    expect(e - w).toBe(360);
    // The wiki prints 170.1022 (the exact span is 170.10226...).
    expect(n - s).toBeCloseTo(170.1022, 3);
    expect(n).toBeCloseTo(MAX_LATITUDE, 9);
  });

  it('zoom 1 tiles are 180 x 85.0511 degrees, meeting at lon 0, lat 0', () => {
    const [w, s, e, n] = tileBounds(0, 0, 1);
    expect([w, s, e]).toEqual([-180, 0, 0]);
    expect(n).toBeCloseTo(85.0511, 4);
    expect(lonLatToTile(0.001, -0.001, 1)).toEqual({ x: 1, y: 1 });
    expect(lonLatToTile(-0.001, 0.001, 1)).toEqual({ x: 0, y: 0 });
  });

  it('zoom 12 has 4096 columns 0.0879 degrees wide', () => {
    const [w, , e] = tileBounds(2047, 1361, 12);
    expect(e - w).toBeCloseTo(0.0879, 4);
    expect(lonLatToTile(179.99, 0, 12).x).toBe(4095);
  });

  for (const [name, lon, lat] of places) {
    it(`${name} lands on the wiki formula's tile at zooms 0-18`, () => {
      for (let z = 0; z <= 18; z++) {
        const ref = wikiTile(lon, lat, z);
        expect(lonLatToTile(lon, lat, z), `z${z}`).toEqual({ x: ref.x, y: ref.y });
        const f = lonLatToTileFraction(lon, lat, z);
        expect(f.x).toBeCloseTo(ref.fx, 6);
        expect(f.y).toBeCloseTo(ref.fy, 6);
      }
    });
  }

  it('Hereford is tile 12/2017/1351, and back: the tile holds the point', () => {
    // Worked by hand from the wiki formula: x = 4096 * (177.2837 / 360) = 2017.07;
    // y = 4096 * (1 - ln(tan(52.0565 deg) + sec(52.0565 deg)) / pi) / 2 = 4096 * (1 - 1.0680 / pi) / 2 = 1351.8.
    const t = lonLatToTile(-2.7163, 52.0565, 12);
    expect(t).toEqual({ x: 2017, y: 1351 });
    const [w, s, e, n] = tileBounds(t.x, t.y, 12);
    expect(-2.7163).toBeGreaterThanOrEqual(w);
    expect(-2.7163).toBeLessThan(e);
    expect(52.0565).toBeGreaterThanOrEqual(s);
    expect(52.0565).toBeLessThan(n);
  });

  it('tile corners match the wiki inverse formula', () => {
    for (const [x, y, z] of [
      [0, 0, 0],
      [1, 1, 1],
      [2017, 1351, 12],
      [32, 21, 6],
      [130000, 87000, 18],
    ]) {
      const ref = wikiCorner(x, y, z);
      const got = tileToLonLat(x, y, z);
      expect(got.lon).toBeCloseTo(ref.lon, 9);
      expect(got.lat).toBeCloseTo(ref.lat, 9);
      // Round trip: a point just inside the NW corner falls back on the same tile.
      expect(lonLatToTile(got.lon + 1e-9, got.lat - 1e-9, z)).toEqual({ x, y });
    }
  });

  it('clamps the poles and the antimeridian into the grid', () => {
    expect(lonLatToTile(0, 90, 3)).toEqual({ x: 4, y: 0 });
    expect(lonLatToTile(0, -90, 3)).toEqual({ x: 4, y: 7 });
    expect(lonLatToTile(180, 0, 3)).toEqual({ x: 7, y: 4 });
    expect(lonLatToTile(-180, 0, 3)).toEqual({ x: 0, y: 4 });
  });
});

describe('ranges and checks', () => {
  it('covers the demo region at zoom 12 with whole tiles', () => {
    const r = tileRange([-3.3, 51.8, -2.2, 52.45], 12);
    expect(r).toEqual({ z: 12, minX: wikiTile(-3.3, 0, 12).x, maxX: wikiTile(-2.2, 0, 12).x, minY: wikiTile(0, 52.45, 12).y, maxY: wikiTile(0, 51.8, 12).y });
    expect(tileCount(r)).toBe((r.maxX - r.minX + 1) * (r.maxY - r.minY + 1));
  });

  it('accepts only integer addresses inside the grid', () => {
    expect(isValidTile(0, 0, 0)).toBe(true);
    expect(isValidTile(22, 2 ** 22 - 1, 0)).toBe(true);
    expect(isValidTile(23, 0, 0)).toBe(false);
    expect(isValidTile(-1, 0, 0)).toBe(false);
    expect(isValidTile(3, 8, 0)).toBe(false);
    expect(isValidTile(3, 0, -1)).toBe(false);
    expect(isValidTile(3, 1.5, 0)).toBe(false);
    expect(isValidTile(Number.NaN, 0, 0)).toBe(false);
  });

  it('flips rows between XYZ and the TMS order MBTiles stores', () => {
    expect(flipY(0, 0)).toBe(0);
    expect(flipY(0, 3)).toBe(7);
    expect(flipY(1351, 12)).toBe(2744);
    expect(flipY(flipY(5, 4), 4)).toBe(5);
  });
});

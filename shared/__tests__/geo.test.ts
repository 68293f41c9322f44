import { describe, expect, it } from 'vitest';
import { distanceM, inverse, lineLengthM, polygonArea } from '../geo.js';

const dms = (d: number, m: number, s: number) => d + m / 60 + s / 3600;

describe('geodesic distances on WGS84', () => {
  it('JFK to Singapore Changi', () => {
    // published: GeographicLib, GeodSolve manual — 15,347,628 m; azimuths 3°18'29.9", 177°29'09.2"
    const r = inverse({ lat: dms(40, 38, 23), lon: -dms(73, 46, 44) }, { lat: dms(1, 21, 33), lon: dms(103, 59, 22) });
    expect(r.distanceM).toBeCloseTo(15_347_628, -1);
    expect(Math.abs(r.azi1 - dms(3, 18, 29.9))).toBeLessThan(0.1 / 3600);
    expect(Math.abs(r.azi2 - dms(177, 29, 9.2))).toBeLessThan(0.1 / 3600);
  });

  it('Wellington to Salamanca', () => {
    // published: GeographicLib documentation — 19,959,679.267 m; azi1 161.067669986160°, azi2 18.825195123247°
    const r = inverse({ lat: -41.32, lon: 174.81 }, { lat: 40.96, lon: -5.5 });
    expect(r.distanceM).toBeCloseTo(19_959_679.267, 3);
    expect(r.azi1).toBeCloseTo(161.06766998616, 9);
    expect(r.azi2).toBeCloseTo(18.825195123247, 9);
  });

  it('a short line', () => {
    // published: Karney, "Algorithms for geodesics", J. Geodesy 87 (2013), table 3 — 4.944208 m
    const r = inverse({ lat: -30.12345, lon: 0 }, { lat: -30.12344, lon: 0.00005 });
    expect(r.distanceM).toBeCloseTo(4.944208, 6);
    expect(Math.abs(r.azi1 - 77.043533)).toBeLessThan(1e-6); // the table is given to 6 decimals
    expect(Math.abs(r.azi2 - 77.043508)).toBeLessThan(1e-6);
  });

  it('differs from the haversine sphere, as it should', () => {
    // published: Rosetta Code, "Haversine formula": BNA to LAX on a 6372.8 km sphere = 2887.2599506 km.
    // The ellipsoid gives a different figure; this only shows the size of the difference.
    const d = distanceM({ lat: 36.12, lon: -86.67 }, { lat: 33.94, lon: -118.4 });
    expect(Math.abs(d / 1000 - 2887.2599506)).toBeGreaterThan(1);
    expect(Math.abs(d / 1000 - 2887.2599506)).toBeLessThan(15);
  });

  it('sums a drawn line segment by segment', () => {
    const a = { lat: 52.05, lon: -2.72 };
    const b = { lat: 52.051, lon: -2.718 };
    const c = { lat: 52.052, lon: -2.719 };
    expect(lineLengthM([a, b, c])).toBeCloseTo(distanceM(a, b) + distanceM(b, c), 6);
    expect(lineLengthM([a])).toBe(0);
  });

  it('measures an outline', () => {
    // A 0.001° square near 52° N: about 111 m by 68.6 m (from memory: 1° latitude ≈ 111.2 km;
    // 1° longitude ≈ 111.3 km x cos 52°).
    const s = polygonArea([
      { lat: 52, lon: -2 },
      { lat: 52.001, lon: -2 },
      { lat: 52.001, lon: -1.999 },
      { lat: 52, lon: -1.999 },
    ]);
    expect(s.areaM2).toBeGreaterThan(7500);
    expect(s.areaM2).toBeLessThan(7700);
  });
});

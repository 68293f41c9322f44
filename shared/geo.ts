// Distances on the WGS84 ellipsoid, from GeographicLib (Karney's algorithms): accurate to
// nanometres, where a spherical formula is off by up to 0.5 %.
// The package is CommonJS: take its exports from the default import so Node and Vite agree.
import geographiclib from 'geographiclib-geodesic';

const { Geodesic, PolygonArea } = geographiclib;

export type LatLon = { lat: number; lon: number };

const WGS84 = Geodesic.WGS84;

/** Geodesic distance in metres between two points. */
export function distanceM(a: LatLon, b: LatLon): number {
  return WGS84.Inverse(a.lat, a.lon, b.lat, b.lon, Geodesic.DISTANCE).s12 ?? Number.NaN;
}

/** Distance and the azimuths at both ends (degrees clockwise from north). */
export function inverse(a: LatLon, b: LatLon): { distanceM: number; azi1: number; azi2: number } {
  const r = WGS84.Inverse(a.lat, a.lon, b.lat, b.lon);
  return { distanceM: r.s12 ?? Number.NaN, azi1: r.azi1 ?? Number.NaN, azi2: r.azi2 ?? Number.NaN };
}

/** Length of a drawn line (a hedgerow), the sum of its geodesic segments. */
export function lineLengthM(points: readonly LatLon[]): number {
  if (points.length < 2) return 0;
  const line = new PolygonArea.PolygonArea(WGS84, true);
  for (const p of points) line.AddPoint(p.lat, p.lon);
  return line.Compute(false, true).perimeter;
}

/** Area in square metres of a drawn outline (a bed, a farm), and its perimeter. */
export function polygonArea(points: readonly LatLon[]): { areaM2: number; perimeterM: number } {
  if (points.length < 3) return { areaM2: 0, perimeterM: 0 };
  const poly = new PolygonArea.PolygonArea(WGS84, false);
  for (const p of points) poly.AddPoint(p.lat, p.lon);
  const r = poly.Compute(false, true);
  return { areaM2: Math.abs(r.area ?? 0), perimeterM: r.perimeter };
}

/** The point `distanceM` metres from `from` along azimuth `aziDeg` (degrees from north). */
export function destination(from: LatLon, aziDeg: number, distance: number): LatLon {
  const r = WGS84.Direct(from.lat, from.lon, aziDeg, distance);
  return { lat: r.lat2 ?? Number.NaN, lon: r.lon2 ?? Number.NaN };
}

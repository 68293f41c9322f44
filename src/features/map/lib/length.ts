// The length of a drawn line. Geodesic on the WGS84 ellipsoid from shared/geo.ts
// (GeographicLib): never Leaflet's own distanceTo, which is spherical.
import { lineLengthM, type LatLon } from '../../../../shared/geo';

export function hedgerowLengthM(points: readonly { lat: number; lng?: number; lon?: number }[]): number {
  const pts: LatLon[] = points.map((p) => ({ lat: p.lat, lon: p.lon ?? p.lng ?? Number.NaN }));
  return lineLengthM(pts);
}

/** The length handed to the planner: metres to one decimal. */
export function plannerLength(lengthM: number): number {
  return Math.round(lengthM * 10) / 10;
}

const metres = new Intl.NumberFormat('en-GB', { minimumFractionDigits: 1, maximumFractionDigits: 1 });

/** "1,234.5 m" */
export function formatMetres(lengthM: number): string {
  return `${metres.format(plannerLength(lengthM))} m`;
}

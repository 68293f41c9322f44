// What the map's endpoints answer (GET /api/map/features, PUT /api/farms/:id/outline).
import type { HealthStatus } from '../domain.js';

export type OutlineKind = 'outline' | 'bed' | 'row';
export type Position = [number, number];
export type OutlineFeature = {
  type: 'Feature';
  properties: { kind: OutlineKind; label?: string };
  geometry: { type: 'Polygon'; coordinates: Position[][] } | { type: 'LineString'; coordinates: Position[] };
};
export type OutlineCollection = { type: 'FeatureCollection'; features: OutlineFeature[] };

export type MapFarm = {
  id: string;
  code: string;
  name: string;
  lat: number;
  lon: number;
  outline: OutlineCollection | null;
  /** The caller may redraw this farm's outline, beds and rows (its lead, or a coordinator). */
  canEditOutline: boolean;
  /** The caller may place and move this farm's plants (its people, or a coordinator). */
  canPlace: boolean;
};

export type MapPlant = {
  id: string;
  code: string;
  farmId: string;
  lat: number;
  lon: number;
  healthStatus: HealthStatus;
  speciesName: string;
  varietyName: string | null;
  /** True when the position is the real one and the caller may move the plant. */
  full: boolean;
};

/** A plant of the caller's own farms that has no position yet (to place on the map). */
export type UnplacedPlant = Omit<MapPlant, 'lat' | 'lon'>;

export type MapFeatures = { farms: MapFarm[]; plants: MapPlant[]; unplaced: UnplacedPlant[] };

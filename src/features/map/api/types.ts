// What the map's endpoints answer. The server's shapes live in server/modules/map/map.service.ts;
// the client may not import server code, so the same shapes are written out here.
import type { HealthStatus } from '../../../../shared/domain';

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
  canEditOutline: boolean;
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

export type UnplacedPlant = Omit<MapPlant, 'lat' | 'lon'>;

export type MapFeatures = { farms: MapFarm[]; plants: MapPlant[]; unplaced: UnplacedPlant[] };

export type MapFilters = {
  speciesId?: string;
  varietyId?: string;
  status?: HealthStatus;
  farmId?: string;
};

/** GET /tiles/meta.json: where the basemap's tiles are and how deep they go. */
export type TileMeta = {
  kind: 'folder' | 'mbtiles' | 'pmtiles';
  minZoom: number;
  maxZoom: number;
  worldMaxZoom?: number;
  /** [west, south, east, north] of the deepest tiles. */
  bounds?: [number, number, number, number];
  /** Plain text, never HTML. */
  attribution: string;
  tileUrl: string;
};

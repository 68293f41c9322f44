// What the map's endpoints answer: the shapes are shared with the server (shared/schemas/map.ts).
import type { HealthStatus } from '../../../../shared/domain';

export type { OutlineCollection, OutlineFeature, OutlineKind, MapFarm, MapFeatures, MapPlant, Position, UnplacedPlant } from '../../../../shared/schemas/map';

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

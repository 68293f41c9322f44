// Plants in clusters with supercluster: one index per plants array, asked for the clusters and
// plants of the view on every move, so only those become Leaflet markers.
import * as Leaflet from 'leaflet';
import Supercluster, { type ClusterFeature, type Options, type PointFeature } from 'supercluster';
import type { HealthStatus } from '../../../../shared/domain';
import type { MapPlant } from '../api/types';
import type { ClusterCounts } from './marker-icons';

/** The deepest zoom of the map, where plants sharing one position are spread on a ring. */
export const SPREAD_ZOOM = 19;
/** The ring's least radius, in screen pixels at SPREAD_ZOOM: past half a 28 px plant icon. */
const SPREAD_MIN_PX = 16;
/** Neighbours on the ring at least this far apart (pixels at SPREAD_ZOOM), so each is clickable. */
const SPREAD_GAP_PX = 18;

export type PlantProps = { plant: MapPlant; status: HealthStatus };
export type ClusterProps = ClusterCounts;
export type PlantFeature = PointFeature<PlantProps>;
export type ClusterOrPlant = ClusterFeature<ClusterProps> | PlantFeature;

/**
 * Where each plant is drawn: its own position, except that plants sharing one exact position
 * sit evenly on a ring around it (radius in pixels at SPREAD_ZOOM, so a few centimetres on the
 * ground), and every one stays reachable at the deepest zoom. Leaflet's CRS does the projection.
 */
export function spreadPositions(plants: readonly MapPlant[]): { lat: number; lon: number }[] {
  const crs = Leaflet.CRS.EPSG3857;
  const groups = new Map<string, number[]>();
  plants.forEach((p, i) => {
    const key = `${p.lat},${p.lon}`;
    const g = groups.get(key);
    if (g) g.push(i);
    else groups.set(key, [i]);
  });
  const out = plants.map((p) => ({ lat: p.lat, lon: p.lon }));
  for (const idx of groups.values()) {
    if (idx.length < 2) continue;
    const first = plants[idx[0]];
    const centre = crs.latLngToPoint(Leaflet.latLng(first.lat, first.lon), SPREAD_ZOOM);
    const n = idx.length;
    // The chord between neighbours is 2 r sin(pi / n); make it at least SPREAD_GAP_PX.
    const r = Math.max(SPREAD_MIN_PX, SPREAD_GAP_PX / (2 * Math.sin(Math.PI / n)));
    idx.forEach((i, k) => {
      const a = (2 * Math.PI * k) / n - Math.PI / 2;
      const ll = crs.pointToLatLng(Leaflet.point(centre.x + r * Math.cos(a), centre.y + r * Math.sin(a)), SPREAD_ZOOM);
      out[i] = { lat: ll.lat, lon: ll.lng };
    });
  }
  return out;
}

function clusterOptions(radius: number, minZoom: number, maxZoom: number): Options<PlantProps, ClusterProps> {
  return {
    radius,
    // Leaflet's 256 px tiles, so the radius is in screen pixels.
    extent: 256,
    minZoom,
    maxZoom,
    // Plants of each status under a cluster, summed as the clusters are built.
    map: (props) => {
      const c: ClusterCounts = { clean: 0, watch: 0, hold: 0, retired: 0 };
      c[props.status] = 1;
      return c;
    },
    reduce: (acc, props) => {
      acc.clean += props.clean;
      acc.watch += props.watch;
      acc.hold += props.hold;
      acc.retired += props.retired;
    },
  };
}

/**
 * The plants' clusters at every zoom: 50 px apart up to zoom 16, 28 px at 17 and 18, and each
 * plant on its own at 19 (where shared positions are spread on a ring instead).
 */
export class PlantClusters {
  private readonly points: PlantFeature[];
  private readonly far: Supercluster<PlantProps, ClusterProps>;
  /** Built on the first view past zoom 16: a first load at farm-wide zoom never needs it. */
  private nearIndex: Supercluster<PlantProps, ClusterProps> | undefined;
  readonly total: number;

  constructor(plants: readonly MapPlant[]) {
    const at = spreadPositions(plants);
    const points: PlantFeature[] = plants.map((p, i) => ({
      type: 'Feature',
      properties: { plant: p, status: p.healthStatus },
      geometry: { type: 'Point', coordinates: [at[i].lon, at[i].lat] },
    }));
    this.points = points;
    this.total = plants.length;
    this.far = new Supercluster(clusterOptions(50, 0, 16)).load(points);
  }

  private get near(): Supercluster<PlantProps, ClusterProps> {
    return (this.nearIndex ??= new Supercluster(clusterOptions(28, 17, 18)).load(this.points));
  }

  private index(zoom: number): Supercluster<PlantProps, ClusterProps> {
    return zoom <= 16 ? this.far : this.near;
  }

  /** The clusters and single plants within [west, south, east, north] at a whole zoom. */
  clusters(bbox: [number, number, number, number], zoom: number): ClusterOrPlant[] {
    const z = Math.round(zoom);
    return this.index(z).getClusters(bbox, z);
  }

  /** The plants under a cluster (got at `zoom`). */
  leaves(clusterId: number, zoom: number): MapPlant[] {
    return this.index(Math.round(zoom))
      .getLeaves(clusterId, Infinity)
      .map((f) => f.properties.plant);
  }

  /** The zoom at which a cluster (got at `zoom`) falls apart. */
  expansionZoom(clusterId: number, zoom: number): number {
    return this.index(Math.round(zoom)).getClusterExpansionZoom(clusterId);
  }
}

export function isCluster(f: ClusterOrPlant): f is ClusterFeature<ClusterProps> {
  return (f.properties as { cluster?: boolean }).cluster === true;
}

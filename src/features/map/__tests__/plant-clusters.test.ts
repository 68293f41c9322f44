// @vitest-environment jsdom
// The map's plant clusters: every cluster's per-status counts are those of the plants under it,
// the clusters of a zoom together hold every plant once, and plants sharing one position are
// spread so that each is its own marker at the deepest zoom.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { HEALTH_STATUSES, type HealthStatus } from '../../../../shared/domain';
import type { MapPlant } from '../api/types';
import { isCluster, PlantClusters, SPREAD_ZOOM, spreadPositions } from '../lib/plant-clusters';

function plant(i: number, lat: number, lon: number, healthStatus: HealthStatus): MapPlant {
  return { id: `p${i}`, code: `P-${i}`, farmId: 'f1', lat, lon, healthStatus, speciesName: 'Apple', varietyName: null, full: true };
}

function tally(plants: readonly MapPlant[]): Record<HealthStatus, number> {
  const t: Record<HealthStatus, number> = { clean: 0, watch: 0, hold: 0, retired: 0 };
  for (const p of plants) t[p.healthStatus] += 1;
  return t;
}

/** Web Mercator (EPSG:3857) pixel position at a zoom with 256 px tiles, written out here apart from Leaflet's. */
function pixel(lat: number, lon: number, zoom: number): [number, number] {
  const size = 256 * 2 ** zoom;
  const phi = (lat * Math.PI) / 180;
  return [((lon + 180) / 360) * size, (0.5 - Math.log(Math.tan(Math.PI / 4 + phi / 2)) / (2 * Math.PI)) * size];
}

const WORLD: [number, number, number, number] = [-180, -85, 180, 85];

// Plants in a farm-sized box (about 1 km), some sharing positions, as in a nursery bed.
const plantsArb = fc
  .array(
    fc.record({
      lat: fc.integer({ min: 0, max: 400 }).map((n) => 52.1 + n * 2e-5),
      lon: fc.integer({ min: 0, max: 400 }).map((n) => 5.3 + n * 2e-5),
      status: fc.constantFrom(...HEALTH_STATUSES),
    }),
    { minLength: 1, maxLength: 400 },
  )
  .map((rows) => rows.map((r, i) => plant(i, r.lat, r.lon, r.status)));

describe('plant clusters', () => {
  it('each cluster counts the statuses of exactly the plants under it, and every zoom shows every plant once', () => {
    fc.assert(
      fc.property(plantsArb, fc.integer({ min: 3, max: 19 }), (plants, zoom) => {
        const index = new PlantClusters(plants);
        const seen: MapPlant[] = [];
        for (const f of index.clusters(WORLD, zoom)) {
          if (isCluster(f)) {
            const under = index.leaves(f.properties.cluster_id, zoom);
            const t = tally(under);
            expect({ clean: f.properties.clean, watch: f.properties.watch, hold: f.properties.hold, retired: f.properties.retired }).toEqual(t);
            expect(f.properties.point_count).toBe(under.length);
            seen.push(...under);
          } else seen.push(f.properties.plant);
        }
        expect(seen.map((p) => p.id).sort()).toEqual(plants.map((p) => p.id).sort());
        expect(tally(seen)).toEqual(tally(plants));
      }),
      { numRuns: 60 },
    );
  });

  it('a far view shows the whole farm as one cluster holding its counts', () => {
    const plants = [
      ...Array.from({ length: 7 }, (_, i) => plant(i, 52.1 + i * 1e-4, 5.3, 'clean')),
      plant(7, 52.1, 5.301, 'watch'),
      plant(8, 52.1, 5.302, 'hold'),
      plant(9, 52.1, 5.303, 'hold'),
      plant(10, 52.1, 5.304, 'retired'),
    ];
    const [only, ...rest] = new PlantClusters(plants).clusters(WORLD, 8);
    expect(rest).toEqual([]);
    if (!isCluster(only)) throw new Error('expected one cluster');
    expect(only.properties.point_count).toBe(11);
    expect([only.properties.clean, only.properties.watch, only.properties.hold, only.properties.retired]).toEqual([7, 1, 2, 1]);
  });

  it('plants sharing one position sit on a ring, apart and each its own marker at the deepest zoom', () => {
    for (const n of [2, 5, 12, 40]) {
      const plants = [...Array.from({ length: n }, (_, i) => plant(i, 52.1, 5.3, 'clean')), plant(n, 52.2, 5.4, 'watch')];
      const at = spreadPositions(plants);
      // A plant alone keeps its position.
      expect(at[n]).toEqual({ lat: 52.2, lon: 5.4 });
      const centre = pixel(52.1, 5.3, SPREAD_ZOOM);
      const px = at.slice(0, n).map((p) => pixel(p.lat, p.lon, SPREAD_ZOOM));
      const radii = px.map(([x, y]) => Math.hypot(x - centre[0], y - centre[1]));
      // On one ring, at least 16 px out (half a 28 px icon and a little more).
      for (const r of radii) {
        expect(r).toBeGreaterThanOrEqual(16 - 0.01);
        expect(Math.abs(r - radii[0])).toBeLessThan(0.01);
      }
      // Neighbours at least 18 px apart, so each can be clicked.
      let nearest = Infinity;
      for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) nearest = Math.min(nearest, Math.hypot(px[i][0] - px[j][0], px[i][1] - px[j][1]));
      expect(nearest).toBeGreaterThanOrEqual(18 - 0.01);
      // A small group stays within a few metres of the real position (a pixel at zoom 19 is
      // under 0.3 m); a large ring grows only as its neighbours need room.
      if (n <= 5) expect(radii[0]).toBeLessThan(20);
      expect(radii[0]).toBeLessThan(Math.max(20, (n * 18) / Math.PI));
      for (const p of at.slice(0, n).filter(() => n <= 12)) {
        expect(Math.abs(p.lat - 52.1)).toBeLessThan(1e-4);
        expect(Math.abs(p.lon - 5.3)).toBeLessThan(2e-4);
      }
      // At the deepest zoom each is a marker of its own; a zoom out, they are one cluster.
      const index = new PlantClusters(plants);
      const deepest = index.clusters(WORLD, SPREAD_ZOOM);
      expect(deepest.filter(isCluster)).toEqual([]);
      expect(deepest).toHaveLength(n + 1);
      if (n <= 12) {
        const out = index.clusters(WORLD, 17).filter(isCluster);
        expect(out.map((c) => c.properties.point_count)).toEqual([n]);
      }
    }
  });
});

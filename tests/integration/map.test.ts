// The offline map's API over HTTP, on a copy of the demo cooperative: what each person sees,
// who may redraw a farm, moving a plant, and the length of a drawn line.
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { distanceM, lineLengthM } from '../../shared/geo.js';
import { dataVersions, farms, motherPlants, species } from '../../server/db/schema/index.js';
import { Client } from '../fixtures/http.js';
import { startTestApp, type TestApp } from '../fixtures/test-app.js';

type MapPlant = { id: string; code: string; farmId: string; lat: number; lon: number; healthStatus: string; speciesName: string; varietyName: string | null; full: boolean };
type Feature = { type: 'Feature'; properties: { kind: string; label?: string }; geometry: { type: string; coordinates: unknown } };
type MapFarm = { id: string; code: string; name: string; lat: number; lon: number; outline: { type: 'FeatureCollection'; features: Feature[] } | null; canEditOutline: boolean; canPlace: boolean };
type Features = { farms: MapFarm[]; plants: MapPlant[]; unplaced: unknown[] };

let app: TestApp;
const as: Record<'coordinator' | 'lead' | 'hand' | 'grower', Client> = {} as never;
let leadFarmId: string;
let otherFarmId: string;

beforeAll(async () => {
  app = await startTestApp({ seeded: true });
  for (const who of ['coordinator', 'lead', 'hand', 'grower'] as const) {
    as[who] = new Client(app.url);
    await as[who].signIn(`${who}@heelwood.test`, 'heelwood-demo');
  }
  leadFarmId = (await as.lead.get('/api/me')).body.farms[0].farmId;
  const all = (await as.coordinator.get<Features>('/api/map/features')).body;
  otherFarmId = all.farms.find((f) => f.id !== leadFarmId)!.id;
});
afterAll(() => app?.close());

const isApproximate = (v: number) => Math.abs(v * 100 - Math.round(v * 100)) < 1e-6;

async function storedOutline(farmId: string) {
  const [row] = await app.ctx.db.select({ outline: farms.outline }).from(farms).where(eq(farms.id, farmId));
  return row.outline;
}

const square = (lon: number, lat: number, d = 0.0002): [number, number][][] => [
  [
    [lon, lat],
    [lon + d, lat],
    [lon + d, lat + d],
    [lon, lat + d],
    [lon, lat],
  ],
];

describe('GET /api/map/features', () => {
  it('asks for a signed-in member, and unknown /api paths still answer 404 to nobody', async () => {
    const nobody = new Client(app.url);
    expect((await nobody.get('/api/map/features')).status).toBe(401);
    expect((await nobody.get('/api/no-such-thing')).status).toBe(404);
  });

  it('a coordinator sees every farm and every placed plant, at its real position', async () => {
    const r = await as.coordinator.get<Features>('/api/map/features');
    expect(r.status).toBe(200);
    expect(r.body.farms).toHaveLength(7);
    const stored = await app.ctx.db.select({ id: motherPlants.id, lat: motherPlants.lat }).from(motherPlants);
    expect(r.body.plants).toHaveLength(stored.filter((p) => p.lat != null).length);
    expect(r.body.plants.every((p) => p.full)).toBe(true);
    expect(r.body.plants.some((p) => p.healthStatus === 'hold')).toBe(true);
    expect(r.body.farms.every((f) => f.canEditOutline && f.canPlace)).toBe(true);
    // Only the columns the map draws.
    expect(Object.keys(r.body.plants[0]).sort()).toEqual(['code', 'farmId', 'full', 'healthStatus', 'id', 'lat', 'lon', 'speciesName', 'varietyName']);
  });

  it('a grower sees no plant of another farm that is not clean, and only approximate positions', async () => {
    const [grower, coordinator] = await Promise.all([
      as.grower.get<Features>('/api/map/features'),
      as.coordinator.get<Features>('/api/map/features'),
    ]);
    expect(grower.status).toBe(200);
    expect(grower.body.farms).toHaveLength(7);
    expect(grower.body.plants.length).toBeGreaterThan(0);
    expect(grower.body.plants.every((p) => p.healthStatus === 'clean')).toBe(true);
    expect(grower.body.plants.every((p) => !p.full && isApproximate(p.lat) && isApproximate(p.lon))).toBe(true);
    expect(grower.body.plants).toHaveLength(coordinator.body.plants.filter((p) => p.healthStatus === 'clean').length);
    const real = new Map(coordinator.body.plants.map((p) => [p.id, p]));
    for (const p of grower.body.plants.slice(0, 20)) {
      const r = real.get(p.id)!;
      expect(Math.abs(r.lat - p.lat)).toBeLessThanOrEqual(0.005 + 1e-9);
      expect(Math.abs(r.lon - p.lon)).toBeLessThanOrEqual(0.005 + 1e-9);
    }
    // Farm boundaries, but not the beds that would give the bushes' places away.
    const kinds = grower.body.farms.flatMap((f) => f.outline?.features.map((x) => x.properties.kind) ?? []);
    expect(kinds.length).toBeGreaterThan(0);
    expect(new Set(kinds)).toEqual(new Set(['outline']));
    expect(grower.body.farms.some((f) => f.canEditOutline || f.canPlace)).toBe(false);
    expect(grower.body.unplaced).toEqual([]);
  });

  it('a farm lead sees the own farm in full and other farms as any member does', async () => {
    const r = await as.lead.get<Features>('/api/map/features');
    const own = r.body.plants.filter((p) => p.farmId === leadFarmId);
    const others = r.body.plants.filter((p) => p.farmId !== leadFarmId);
    expect(own.length).toBeGreaterThan(0);
    expect(own.every((p) => p.full)).toBe(true);
    expect(others.every((p) => !p.full && p.healthStatus === 'clean')).toBe(true);
    const farm = r.body.farms.find((f) => f.id === leadFarmId)!;
    expect(farm.canEditOutline).toBe(true);
    expect(farm.outline?.features.some((f) => f.properties.kind === 'bed')).toBe(true);
    expect(r.body.farms.filter((f) => f.canEditOutline).map((f) => f.id)).toEqual([leadFarmId]);
  });

  it('filters by species, variety, status and farm', async () => {
    const all = (await as.coordinator.get<Features>('/api/map/features')).body.plants;
    const species = (await as.coordinator.get('/api/species')).body.items as { id: string; commonName: string; varieties: { id: string; name: string }[] }[];
    const withPlants = species.find((s) => all.some((p) => p.speciesName === s.commonName) && s.varieties.length)!;
    const bySpecies = (await as.coordinator.get<Features>(`/api/map/features?speciesId=${withPlants.id}`)).body.plants;
    expect(bySpecies.length).toBeGreaterThan(0);
    expect(bySpecies.every((p) => p.speciesName === withPlants.commonName)).toBe(true);
    const variety = withPlants.varieties.find((v) => bySpecies.some((p) => p.varietyName === v.name))!;
    const byVariety = (await as.coordinator.get<Features>(`/api/map/features?varietyId=${variety.id}`)).body.plants;
    expect(byVariety.length).toBeGreaterThan(0);
    expect(byVariety.every((p) => p.varietyName === variety.name)).toBe(true);
    const held = (await as.coordinator.get<Features>('/api/map/features?status=hold,watch')).body.plants;
    expect(held.length).toBe(all.filter((p) => p.healthStatus === 'hold' || p.healthStatus === 'watch').length);
    const oneFarm = (await as.coordinator.get<Features>(`/api/map/features?farmId=${otherFarmId}`)).body;
    expect(oneFarm.plants.every((p) => p.farmId === otherFarmId)).toBe(true);
    expect(oneFarm.farms).toHaveLength(7);
    // A grower asking for holds gets none: the filter narrows what they may see, never widens it.
    expect((await as.grower.get<Features>('/api/map/features?status=hold')).body.plants).toEqual([]);
    expect((await as.coordinator.get('/api/map/features?status=sick')).status).toBe(400);
    expect((await as.coordinator.get('/api/map/features?speciesId=nope')).status).toBe(400);
  });
});

describe('PUT /api/farms/:farmId/outline', () => {
  const drawing = (lon: number, lat: number) => ({
    type: 'FeatureCollection',
    features: [
      { type: 'Feature', properties: { kind: 'outline', label: 'Boundary' }, geometry: { type: 'Polygon', coordinates: square(lon, lat, 0.001) } },
      { type: 'Feature', properties: { kind: 'bed', label: 'Bed 7' }, geometry: { type: 'Polygon', coordinates: square(lon + 0.0002, lat + 0.0002) } },
      { type: 'Feature', properties: { kind: 'row' }, geometry: { type: 'LineString', coordinates: [[lon + 0.0001, lat + 0.0005], [lon + 0.0008, lat + 0.0005]] } },
    ],
  });

  it('refuses growers, farm hands and the lead of another farm, and changes nothing', async () => {
    const before = await storedOutline(leadFarmId);
    const body = drawing(-2.5, 52);
    expect((await as.grower.put(`/api/farms/${leadFarmId}/outline`, body)).status).toBe(403);
    expect((await as.hand.put(`/api/farms/${leadFarmId}/outline`, body)).status).toBe(403);
    expect((await as.lead.put(`/api/farms/${otherFarmId}/outline`, body)).status).toBe(403);
    // Refused before the body is even read.
    expect((await as.grower.put(`/api/farms/${leadFarmId}/outline`, { nonsense: true })).status).toBe(403);
    expect(await storedOutline(leadFarmId)).toEqual(before);
  });

  it('refuses a drawing that is not valid, and changes nothing', async () => {
    const before = await storedOutline(leadFarmId);
    const put = (body: unknown) => as.lead.put(`/api/farms/${leadFarmId}/outline`, body);
    const good = drawing(-2.5, 52);
    const withFeature = (f: unknown) => ({ ...good, features: [...good.features, f] });
    const cases: [string, unknown][] = [
      ['not a collection', { type: 'Feature' }],
      ['latitude out of range', withFeature({ type: 'Feature', properties: { kind: 'bed' }, geometry: { type: 'Polygon', coordinates: square(-2.5, 95) } })],
      ['longitude not a number', withFeature({ type: 'Feature', properties: { kind: 'row' }, geometry: { type: 'LineString', coordinates: [['a', 52], [-2.5, 52]] } })],
      ['ring not closed', withFeature({ type: 'Feature', properties: { kind: 'bed' }, geometry: { type: 'Polygon', coordinates: [[[-2.5, 52], [-2.49, 52], [-2.49, 52.01], [-2.5, 52.01]]] } })],
      ['line of one point', withFeature({ type: 'Feature', properties: { kind: 'row' }, geometry: { type: 'LineString', coordinates: [[-2.5, 52]] } })],
      ['unknown kind', withFeature({ type: 'Feature', properties: { kind: 'road' }, geometry: { type: 'LineString', coordinates: [[-2.5, 52], [-2.4, 52]] } })],
      ['point geometry', withFeature({ type: 'Feature', properties: { kind: 'bed' }, geometry: { type: 'Point', coordinates: [-2.5, 52] } })],
      ['outline as a line', withFeature({ type: 'Feature', properties: { kind: 'outline' }, geometry: { type: 'LineString', coordinates: [[-2.5, 52], [-2.4, 52]] } })],
      ['too many shapes', { type: 'FeatureCollection', features: Array.from({ length: 501 }, () => good.features[2]) }],
    ];
    for (const [what, body] of cases) {
      const r = await put(body);
      expect(r.status, what).toBe(400);
      expect(r.body.error.code, what).toBe('invalid_input');
    }
    expect(await storedOutline(leadFarmId)).toEqual(before);
  });

  it('the farm lead saves the farm drawing; a coordinator may redraw any farm', async () => {
    const body = drawing(-2.505, 51.993);
    const r = await as.lead.put(`/api/farms/${leadFarmId}/outline`, body);
    expect(r.status).toBe(200);
    expect(await storedOutline(leadFarmId)).toEqual(body);
    const seen = (await as.lead.get<Features>('/api/map/features')).body.farms.find((f) => f.id === leadFarmId)!;
    expect(seen.outline).toEqual(body);
    // Other members see the boundary only.
    const grower = (await as.grower.get<Features>('/api/map/features')).body.farms.find((f) => f.id === leadFarmId)!;
    expect(grower.outline?.features.map((f) => f.properties.kind)).toEqual(['outline']);

    const other = drawing(-2.89, 52.217);
    expect((await as.coordinator.put(`/api/farms/${otherFarmId}/outline`, other)).status).toBe(200);
    expect(await storedOutline(otherFarmId)).toEqual(other);
    expect((await as.coordinator.put('/api/farms/00000000-0000-4000-8000-000000000000/outline', other)).status).toBe(404);
    // An empty drawing clears it.
    expect((await as.coordinator.put(`/api/farms/${otherFarmId}/outline`, { type: 'FeatureCollection', features: [] })).status).toBe(200);
    expect(await storedOutline(otherFarmId)).toBeNull();
  });
});

describe('moving a plant (PATCH /api/mother-plants/:id)', () => {
  it('the farm lead moves an own plant; a grower may not, and nothing moves', async () => {
    const own = (await as.lead.get<Features>('/api/map/features')).body.plants.find((p) => p.farmId === leadFarmId && p.healthStatus === 'clean')!;
    const moved = await as.lead.patch(`/api/mother-plants/${own.id}`, { lat: own.lat + 0.0001, lon: own.lon - 0.0001 });
    expect(moved.status).toBe(200);
    expect(moved.body.lat).toBeCloseTo(own.lat + 0.0001, 9);

    const refused = await as.grower.patch(`/api/mother-plants/${own.id}`, { lat: 52, lon: -2.5 });
    expect(refused.status).toBe(403);
    const held = (await as.coordinator.get<Features>('/api/map/features?status=hold')).body.plants.find((p) => p.farmId !== leadFarmId)!;
    expect((await as.grower.patch(`/api/mother-plants/${held.id}`, { lat: 52, lon: -2.5 })).status).toBe(404);
    const [row] = await app.ctx.db.select({ lat: motherPlants.lat }).from(motherPlants).where(eq(motherPlants.id, own.id));
    expect(row.lat).toBeCloseTo(own.lat + 0.0001, 9);
  });
});

describe('the features cache (features-cache.ts, keyed by the register counter)', () => {
  const registerVersion = async () => {
    const [row] = await app.ctx.db.select({ version: dataVersions.version }).from(dataVersions).where(eq(dataVersions.name, 'register'));
    return row.version;
  };

  it('a change written straight to the database, past every route, shows on the next request', async () => {
    const before = (await as.grower.get<Features>('/api/map/features')).body;
    const shown = before.plants.find((p) => p.healthStatus === 'clean')!;
    await as.grower.get<Features>('/api/map/features');
    const v0 = await registerVersion();
    await app.ctx.db.update(motherPlants).set({ healthStatus: 'hold' }).where(eq(motherPlants.id, shown.id));
    expect(await registerVersion()).toBeGreaterThan(v0);
    try {
      // Another farm's plant on hold is not shown to a grower; the coordinator sees the new status.
      const grower = (await as.grower.get<Features>('/api/map/features')).body;
      expect(grower.plants.some((p) => p.id === shown.id)).toBe(false);
      expect(grower.plants).toHaveLength(before.plants.length - 1);
      const coordinator = (await as.coordinator.get<Features>('/api/map/features')).body;
      expect(coordinator.plants.find((p) => p.id === shown.id)?.healthStatus).toBe('hold');
    } finally {
      await app.ctx.db.update(motherPlants).set({ healthStatus: 'clean' }).where(eq(motherPlants.id, shown.id));
    }
    expect((await as.grower.get<Features>('/api/map/features')).body.plants.some((p) => p.id === shown.id)).toBe(true);
  });

  it('renaming a species moves the counter and the new name is drawn', async () => {
    const plant = (await as.coordinator.get<Features>('/api/map/features')).body.plants[0];
    const name = plant.speciesName;
    const v0 = await registerVersion();
    await app.ctx.db.update(species).set({ commonName: `${name} (renamed)` }).where(eq(species.commonName, name));
    try {
      expect(await registerVersion()).toBeGreaterThan(v0);
      const after = (await as.coordinator.get<Features>('/api/map/features')).body;
      expect(after.plants.find((p) => p.id === plant.id)!.speciesName).toBe(`${name} (renamed)`);
    } finally {
      await app.ctx.db.update(species).set({ commonName: name }).where(eq(species.commonName, `${name} (renamed)`));
    }
  });

  it('people of one farm with different roles do not share a cached view', async () => {
    const lead = (await as.lead.get<Features>('/api/map/features')).body;
    const hand = (await as.hand.get<Features>('/api/map/features')).body;
    expect(lead.farms.find((f) => f.id === leadFarmId)!.canEditOutline).toBe(true);
    expect(hand.farms.find((f) => f.id === leadFarmId)!.canEditOutline).toBe(false);
  });

  it('answers 304 to a caller that holds the same features, and 200 with a new ETag after a change', async () => {
    const first = await as.lead.get('/api/map/features');
    const etag = first.headers.get('etag')!;
    expect(etag).toMatch(/^W\/"/);
    // As a browser revalidates (fetch would add `Cache-Control: no-cache` to a hand-set If-None-Match).
    const revalidate = { 'if-none-match': etag, 'cache-control': 'max-age=0' };
    const again = await as.lead.request('GET', '/api/map/features', undefined, { headers: revalidate });
    expect(again.status).toBe(304);
    const [plant] = await app.ctx.db.select({ id: motherPlants.id }).from(motherPlants).where(eq(motherPlants.farmId, leadFarmId)).limit(1);
    await app.ctx.db.update(motherPlants).set({ lat: 52.1 }).where(eq(motherPlants.id, plant.id));
    const changed = await as.lead.request('GET', '/api/map/features', undefined, { headers: revalidate });
    expect(changed.status).toBe(200);
    expect(changed.headers.get('etag')).not.toBe(etag);
    expect(changed.body.plants.find((p: MapPlant) => p.id === plant.id).lat).toBe(52.1);
  });
});

describe('the length of a drawn line (shared/geo.ts lineLengthM)', () => {
  it('matches the short line of Karney 2013, table 3', () => {
    // Published: C. F. F. Karney, "Algorithms for geodesics", J. Geodesy 87 (2013), table 3:
    // lat -30.12345 deg to -30.12344 deg, longitude difference 0.00005 deg: s12 = 4.944208 m.
    const len = lineLengthM([
      { lat: -30.12345, lon: 0 },
      { lat: -30.12344, lon: 0.00005 },
    ]);
    expect(Math.abs(len - 4.944208)).toBeLessThan(5e-7);
  });

  it('matches the JFK to Singapore Changi geodesic of the GeodSolve manual', () => {
    // Published: GeographicLib, GeodSolve manual, example: JFK (40°38'23"N 73°46'44"W) to
    // Singapore Changi (1°21'33"N 103°59'22"E) is 15,347,628 m on WGS84.
    const dms = (d: number, m: number, s: number) => d + m / 60 + s / 3600;
    const len = lineLengthM([
      { lat: dms(40, 38, 23), lon: -dms(73, 46, 44) },
      { lat: dms(1, 21, 33), lon: dms(103, 59, 22) },
    ]);
    expect(Math.round(len)).toBe(15_347_628);
  });

  it('adds a hedgerow of several segments segment by segment', () => {
    const pts = [
      { lat: 52.0855, lon: -2.6385 },
      { lat: 52.0857, lon: -2.6379 },
      { lat: 52.0853, lon: -2.6371 },
    ];
    expect(lineLengthM(pts)).toBeCloseTo(distanceM(pts[0], pts[1]) + distanceM(pts[1], pts[2]), 6);
  });
});

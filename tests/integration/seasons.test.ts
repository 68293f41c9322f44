// Seasons, wood offers, pickup windows and wood requests over HTTP on the demo cooperative.
import { and, count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { requestLines, seasons, woodOffers, woodRequests } from '../../server/db/schema/index.js';
import { offerCap, plantYield } from '../../shared/yield.js';
import { Client } from '../fixtures/http.js';
import { startTestApp, type TestApp } from '../fixtures/test-app.js';

let app: TestApp;
const as: Record<'coordinator' | 'lead' | 'hand' | 'grower', Client> = {} as never;
let season: { id: string; stage: string; lookbackMonths: number };
let farmId: string;

beforeAll(async () => {
  app = await startTestApp({ seeded: true });
  for (const who of ['coordinator', 'lead', 'hand', 'grower'] as const) {
    as[who] = new Client(app.url);
    await as[who].signIn(`${who}@heelwood.test`, 'heelwood-demo');
  }
  const list = (await as.grower.get('/api/seasons')).body.items as { id: string; stage: string; lookbackMonths: number }[];
  season = list.find((s) => s.stage === 'requests_open')!;
  farmId = (await as.lead.get('/api/me')).body.farms[0].farmId;
});
afterAll(() => app?.close());

describe('seasons', () => {
  it('suggests dates from the kind and the hemisphere', async () => {
    const north = await as.coordinator.get('/api/seasons/suggest?kind=dormant_hardwood&hemisphere=north');
    const south = await as.coordinator.get('/api/seasons/suggest?kind=dormant_hardwood&hemisphere=south');
    expect(north.status).toBe(200);
    // Dormant wood is cut in midwinter: December-February in the north, June-August in the south.
    expect([12, 1, 2]).toContain(Number(north.body.collectionStart.slice(5, 7)));
    expect([6, 7, 8]).toContain(Number(south.body.collectionStart.slice(5, 7)));
    expect(new Date(north.body.requestDeadline) > new Date()).toBe(true);
    expect((await as.grower.get('/api/seasons/suggest?kind=dormant_hardwood')).status).toBe(403);
  });

  it('creates a season and moves it through its stages one at a time', async () => {
    const bad = await as.coordinator.post('/api/seasons', {
      name: 'Bad dates',
      kind: 'scion',
      hemisphere: 'north',
      requestDeadline: '2027-03-01T12:00:00Z',
      collectionStart: '2027-02-01',
      collectionEnd: '2027-01-01',
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toMatchObject({ collectionEnd: expect.any(String), requestDeadline: expect.any(String) });

    const created = await as.coordinator.post('/api/seasons', {
      name: '2027 scion wood test',
      kind: 'scion',
      hemisphere: 'north',
      requestDeadline: '2027-01-10T18:00:00Z',
      collectionStart: '2027-01-15',
      collectionEnd: '2027-02-28',
    });
    expect(created.status).toBe(201);
    expect(created.body.stage).toBe('planning');
    const skip = await as.coordinator.post(`/api/seasons/${created.body.id}/stage`, { stage: 'collections' });
    expect(skip.status).toBe(409);
    const open = await as.coordinator.post(`/api/seasons/${created.body.id}/stage`, { stage: 'requests_open' });
    expect(open.body.stage).toBe('requests_open');
    expect(open.body.rules.requests).toBe(true);
    const byLead = await as.lead.post(`/api/seasons/${created.body.id}/stage`, { stage: 'allocating' });
    expect(byLead.status).toBe(403);
  });
});

describe('wood offers', () => {
  it('lists the farm plants with eligibility and offers from shoot counts, capped by role', async () => {
    const list = await as.lead.get(`/api/seasons/${season.id}/farms/${farmId}/offers`);
    expect(list.status).toBe(200);
    const rows = list.body.items as Array<{ plantId: string; eligible: boolean; whyNot: string | null; role: string; capFraction: number; cuttingLengthCm: number; softTipCm: number; healthStatus: string }>;
    for (const r of rows) if (r.healthStatus !== 'clean') expect(r.eligible).toBe(false);
    const bush = rows.find((r) => r.eligible && r.role === 'fruiting_bush') ?? rows.find((r) => r.eligible)!;
    const basis = { shootCount: 14, meanShootLengthCm: 72.5, softTipCm: bush.softTipCm, cuttingLengthCm: bush.cuttingLengthCm };
    const expectedYield = plantYield(basis);
    const max = offerCap(expectedYield, bush.capFraction);

    const tooMuch = await as.hand.put(`/api/seasons/${season.id}/offers/${bush.plantId}`, { shootCount: 14, meanShootLengthCm: 72.5, offered: max + 1 });
    expect(tooMuch.status).toBe(400);
    expect(tooMuch.body.error.fields.offered).toBe(`at most ${max}`);

    const ok = await as.hand.put(`/api/seasons/${season.id}/offers/${bush.plantId}`, { shootCount: 14, meanShootLengthCm: 72.5 });
    expect(ok.status).toBe(200);
    expect(ok.body.offer.estimatedYield).toBe(expectedYield);
    expect(ok.body.offer.offered).toBe(max);
    const direct = await as.lead.put(`/api/seasons/${season.id}/offers/${bush.plantId}`, { directCount: 40, offered: 5 });
    expect(direct.body.offer.estimatedYield).toBe(40);
    expect(direct.body.offer.offered).toBe(5);
    expect(direct.body.offer.shootCount).toBeNull();
  });

  it('refuses an offer on a plant that is not clean, or from another farm, and stores nothing', async () => {
    const list = (await as.lead.get(`/api/seasons/${season.id}/farms/${farmId}/offers`)).body.items as Array<{ plantId: string; eligible: boolean; offer: unknown }>;
    const sick = list.find((r) => !r.eligible && !r.offer);
    const [{ n: before }] = await app.ctx.db.select({ n: count() }).from(woodOffers);
    if (sick) {
      const r = await as.lead.put(`/api/seasons/${season.id}/offers/${sick.plantId}`, { directCount: 10 });
      expect(r.status).toBe(400);
      expect(r.body.error.fields.plantId).toBeDefined();
    }
    const farms = (await as.lead.get('/api/farms')).body.items as { id: string }[];
    const other = farms.find((f) => f.id !== farmId)!;
    expect((await as.lead.get(`/api/seasons/${season.id}/farms/${other.id}/offers`)).status).toBe(403);
    const otherRows = (await as.coordinator.get(`/api/seasons/${season.id}/farms/${other.id}/offers`)).body.items as Array<{ plantId: string; eligible: boolean }>;
    const r2 = await as.lead.put(`/api/seasons/${season.id}/offers/${otherRows.find((r) => r.eligible)!.plantId}`, { directCount: 10 });
    expect(r2.status).toBe(403);
    const missing = await as.lead.put(`/api/seasons/${season.id}/offers/${list[0].plantId}`, { meanShootLengthCm: 50 });
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields.shootCount).toBeDefined();
    const [{ n: after }] = await app.ctx.db.select({ n: count() }).from(woodOffers);
    expect(after).toBe(before);
  });

  it('withdraws an offer at once when an inspection puts the plant on hold', async () => {
    const list = (await as.lead.get(`/api/seasons/${season.id}/farms/${farmId}/offers`)).body.items as Array<{ plantId: string; eligible: boolean; speciesName: string }>;
    const ribes = list.find((r) => r.eligible && /currant/i.test(r.speciesName))!;
    await as.lead.put(`/api/seasons/${season.id}/offers/${ribes.plantId}`, { directCount: 30 });
    const pests = (await as.lead.get('/api/pests')).body.items as { id: string; travelsInWood: boolean; genera: string[] }[];
    const mite = pests.find((p) => p.travelsInWood && p.genera.includes('Ribes'))!;
    const insp = await as.hand.post(`/api/mother-plants/${ribes.plantId}/inspections`, {
      inspectedOn: new Date().toISOString().slice(0, 10),
      findings: [{ pestId: mite.id, severity: 'moderate' }],
    });
    expect(insp.body.statusAfter).toBe('hold');
    expect(insp.body.withdrawnOffers).toBe(1);
    const [offer] = await app.ctx.db
      .select()
      .from(woodOffers)
      .where(and(eq(woodOffers.plantId, ribes.plantId), eq(woodOffers.seasonId, season.id)));
    expect(offer.withdrawnAt).not.toBeNull();
  });

  it('keeps pickup windows in the farm time zone, inside the collection window', async () => {
    const s = (await as.lead.get(`/api/seasons/${season.id}`)).body as { collectionStart: string; collectionEnd: string };
    const w = await as.lead.post(`/api/seasons/${season.id}/farms/${farmId}/windows`, { date: s.collectionStart, from: '09:00', to: '12:00', note: 'Yard gate' });
    expect(w.status).toBe(201);
    // The demo farms are in Europe/London: in winter local time is UTC.
    expect(new Date(w.body.startsAt).toISOString().slice(11, 16)).toBe('09:00');
    const outside = await as.lead.post(`/api/seasons/${season.id}/farms/${farmId}/windows`, { date: '2001-01-01', from: '09:00', to: '12:00' });
    expect(outside.status).toBe(400);
    expect(outside.body.error.fields.date).toBeDefined();
    const backwards = await as.lead.post(`/api/seasons/${season.id}/farms/${farmId}/windows`, { date: s.collectionStart, from: '12:00', to: '09:00' });
    expect(backwards.body.error.fields.to).toBeDefined();
    expect((await as.hand.post(`/api/seasons/${season.id}/farms/${farmId}/windows`, { date: s.collectionStart, from: '13:00', to: '14:00' })).status).toBe(403);
  });
});

describe('wood requests', () => {
  it('files, edits and reads back a request; the board counts it', async () => {
    const species = (await as.grower.get('/api/species')).body.items as { id: string; scientificName: string; varieties: { id: string }[] }[];
    const black = species.find((s) => s.scientificName === 'Ribes nigrum')!;
    const goose = species.find((s) => s.scientificName === 'Ribes uva-crispa')!;
    expect((await as.grower.get(`/api/seasons/${season.id}/my-request`)).body.request).toBeNull();
    const body = {
      destinationLat: 52.06,
      destinationLon: -2.7,
      destinationLabel: 'Home field',
      maxDistanceKm: 25,
      lines: [
        { speciesId: black.id, varietyId: black.varieties[0].id, cuttings: 60, substitutesAllowed: false, treatment: 'willow' },
        { speciesId: goose.id, varietyId: null, cuttings: 24, substitutesAllowed: true },
      ],
    };
    const before = (await as.grower.get(`/api/seasons/${season.id}/board`)).body.items as { varietyId: string | null; speciesId: string; asked: number }[];
    const askedBefore = before.find((r) => r.varietyId === black.varieties[0].id)?.asked ?? 0;
    const r = await as.grower.put(`/api/seasons/${season.id}/my-request`, body);
    expect(r.status).toBe(200);
    expect(r.body.request.lines).toHaveLength(2);
    expect(r.body.request.editable).toBe(true);
    expect(r.body.request.lines[0].restrictionNote).toMatch(/pine|restrict/i);
    const board = (await as.grower.get(`/api/seasons/${season.id}/board?lat=52.06&lon=-2.7`)).body.items as { varietyId: string | null; asked: number; nearestKm: number | null; offered: number }[];
    expect(board.find((x) => x.varietyId === black.varieties[0].id)!.asked).toBe(askedBefore + 60);

    const edit = await as.grower.put(`/api/seasons/${season.id}/my-request`, { ...body, lines: [body.lines[0]] });
    expect(edit.body.request.lines).toHaveLength(1);
    const [{ n }] = await app.ctx.db.select({ n: count() }).from(requestLines).where(eq(requestLines.requestId, edit.body.request.id));
    expect(n).toBe(1);
  });

  it('names bad lines and writes nothing', async () => {
    const species = (await as.grower.get('/api/species')).body.items as { id: string; scientificName: string; varieties: { id: string }[] }[];
    const black = species.find((s) => s.scientificName === 'Ribes nigrum')!;
    const goose = species.find((s) => s.scientificName === 'Ribes uva-crispa')!;
    const before = (await as.grower.get(`/api/seasons/${season.id}/my-request`)).body.request;
    const r = await as.grower.put(`/api/seasons/${season.id}/my-request`, {
      destinationLat: 52.06,
      destinationLon: -2.7,
      maxDistanceKm: 25,
      lines: [
        { speciesId: black.id, varietyId: goose.varieties[0].id, cuttings: 10 },
        { speciesId: black.id, varietyId: null, cuttings: 0 },
      ],
    });
    expect(r.status).toBe(400);
    expect(r.body.error.fields['lines.1.cuttings']).toBeDefined();
    const r2 = await as.grower.put(`/api/seasons/${season.id}/my-request`, {
      destinationLat: 52.06,
      destinationLon: -2.7,
      maxDistanceKm: 25,
      lines: [{ speciesId: black.id, varietyId: goose.varieties[0].id, cuttings: 10 }],
    });
    expect(r2.body.error.fields['lines.0.varietyId']).toBe('not a variety of this species');
    const after = (await as.grower.get(`/api/seasons/${season.id}/my-request`)).body.request;
    expect(after).toEqual(before);
  });

  it('refuses a request after the deadline and stores nothing', async () => {
    await app.ctx.db.update(seasons).set({ requestDeadline: new Date(Date.now() - 60_000) }).where(eq(seasons.id, season.id));
    const species = (await as.hand.get('/api/species')).body.items as { id: string }[];
    const [{ n: before }] = await app.ctx.db.select({ n: count() }).from(woodRequests);
    const r = await as.hand.put(`/api/seasons/${season.id}/my-request`, {
      destinationLat: 52,
      destinationLon: -2.7,
      maxDistanceKm: 10,
      lines: [{ speciesId: species[0].id, cuttings: 10 }],
    });
    expect(r.status).toBe(409);
    expect(r.body.error.fields.seasonId).toMatch(/deadline passed/);
    const [{ n: after }] = await app.ctx.db.select({ n: count() }).from(woodRequests);
    expect(after).toBe(before);
    expect((await as.grower.get(`/api/seasons/${season.id}/my-request`)).body.request.editable).toBe(false);
  });
});

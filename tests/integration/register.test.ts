// The mother-plant register and health record over HTTP, on a copy of the demo cooperative.
import { and, count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditLog, motherPlants } from '../../server/db/schema/index.js';
import { Client } from '../fixtures/http.js';
import { startTestApp, type TestApp } from '../fixtures/test-app.js';

let app: TestApp;
const as: Record<'coordinator' | 'lead' | 'hand' | 'grower', Client> = {} as never;
let farmA: { farmId: string; farmCode: string };
let farmB: { id: string; code: string };
let ribes: { id: string; varieties: { id: string }[]; genus: string };
let otherSpecies: { id: string; varieties: { id: string }[] };
let travelling: { id: string };
let local: { id: string };

beforeAll(async () => {
  app = await startTestApp({ seeded: true });
  for (const who of ['coordinator', 'lead', 'hand', 'grower'] as const) {
    as[who] = new Client(app.url);
    await as[who].signIn(`${who}@heelwood.test`, 'heelwood-demo');
  }
  farmA = (await as.lead.get('/api/me')).body.farms[0];
  const farms = (await as.lead.get('/api/farms')).body.items as { id: string; code: string }[];
  farmB = farms.find((f) => f.id !== farmA.farmId)!;
  const species = (await as.lead.get('/api/species')).body.items as { id: string; genus: string; scientificName: string; varieties: { id: string }[] }[];
  ribes = species.find((s) => s.scientificName === 'Ribes nigrum')!;
  otherSpecies = species.find((s) => s.genus !== 'Ribes' && s.varieties.length > 0)!;
  const pests = (await as.lead.get('/api/pests')).body.items as { id: string; travelsInWood: boolean; genera: string[] }[];
  travelling = pests.find((p) => p.travelsInWood && p.genera.includes('Ribes'))!;
  local = pests.find((p) => !p.travelsInWood && p.genera.includes('Ribes'))!;
});
afterAll(() => app?.close());

const newPlant = (over: Record<string, unknown> = {}) => ({
  farmId: farmA.farmId,
  speciesId: ribes.id,
  varietyId: ribes.varieties[0].id,
  plantingYear: 2022,
  role: 'stock_bed',
  provenance: 'bought',
  supplier: 'A nursery',
  lat: 52.05,
  lon: -2.71,
  bedRow: 'Bed 9, row 1',
  notes: 'planted for the test',
  ...over,
});

async function plantCount() {
  const [{ n }] = await app.ctx.db.select({ n: count() }).from(motherPlants);
  return n;
}

describe('create, edit, retire', () => {
  it('a farm lead adds a plant with the next code of the farm', async () => {
    const r = await as.lead.post('/api/mother-plants', newPlant());
    expect(r.status).toBe(201);
    expect(r.body.code).toMatch(new RegExp(`^${farmA.farmCode}-\\d{4}$`));
    expect(r.body.healthStatus).toBe('clean');
    expect(r.body.full).toBe(true);
    expect(r.body.can.edit).toBe(true);
  });

  it('names each bad field and writes nothing', async () => {
    const before = await plantCount();
    const r = await as.lead.post('/api/mother-plants', newPlant({ plantingYear: 1850, lat: 52.1, lon: null, role: 'hedge' }));
    expect(r.status).toBe(400);
    expect(r.body.error.fields).toMatchObject({ plantingYear: expect.any(String), role: expect.any(String) });
    const r2 = await as.lead.post('/api/mother-plants', newPlant({ lon: undefined }));
    expect(r2.status).toBe(400);
    expect(r2.body.error.fields.lon).toMatch(/both latitude and longitude/);
    const r3 = await as.lead.post('/api/mother-plants', newPlant({ varietyId: otherSpecies.varieties[0].id }));
    expect(r3.status).toBe(400);
    expect(r3.body.error.fields.varietyId).toMatch(/another species|not a variety/);
    const r4 = await as.lead.post('/api/mother-plants', newPlant({ provenance: 'exchange' }));
    expect(r4.status).toBe(400);
    expect(r4.body.error.fields.parentPlantId).toBeDefined();
    expect(await plantCount()).toBe(before);
  });

  it('edits, records the role change in the audit log, and retires keeping history', async () => {
    const created = (await as.lead.post('/api/mother-plants', newPlant())).body;
    const edit = await as.hand.patch(`/api/mother-plants/${created.id}`, { role: 'fruiting_bush', reason: 'moved to the orchard row', bedRow: 'Orchard row 2' });
    expect(edit.status).toBe(200);
    expect(edit.body.role).toBe('fruiting_bush');
    expect(edit.body.audit.map((x: { action: string }) => x.action)).toContain('role');
    const roleEntry = edit.body.audit.find((x: { action: string }) => x.action === 'role');
    expect(roleEntry.reason).toBe('moved to the orchard row');
    expect(roleEntry.before).toEqual({ role: 'stock_bed' });

    // A farm hand records, but retiring is the lead's call.
    const handRetire = await as.hand.post(`/api/mother-plants/${created.id}/retire`, { reason: 'old' });
    expect(handRetire.status).toBe(403);
    const noReason = await as.lead.post(`/api/mother-plants/${created.id}/retire`, {});
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.fields.reason).toBeDefined();
    const retired = await as.lead.post(`/api/mother-plants/${created.id}/retire`, { reason: 'canker in the stem base' });
    expect(retired.status).toBe(200);
    expect(retired.body.healthStatus).toBe('retired');
    expect(retired.body.retiredAt).not.toBeNull();
    const again = await as.lead.patch(`/api/mother-plants/${created.id}`, { notes: 'changed' });
    expect(again.status).toBe(409);
    // History stays readable.
    const detail = await as.lead.get(`/api/mother-plants/${created.id}`);
    expect(detail.status).toBe(200);
    expect(detail.body.audit.length).toBeGreaterThanOrEqual(3);
  });
});

describe('who sees and changes what', () => {
  it("a farm hand of A cannot read B's notes or inspections, nor edit B's plants", async () => {
    const list = await as.hand.get(`/api/mother-plants?farmId=${farmB.id}&pageSize=200`);
    expect(list.status).toBe(200);
    expect(list.body.total).toBeGreaterThan(0);
    for (const p of list.body.items) {
      expect(p.healthStatus).toBe('clean');
      expect(p.full).toBe(false);
      expect(p.bedRow).toBeNull();
    }
    const target = list.body.items[0];
    const detail = await as.hand.get(`/api/mother-plants/${target.id}`);
    expect(detail.status).toBe(200);
    expect(detail.body.notes).toBeNull();
    expect(detail.body.inspections).toEqual([]);
    expect(detail.body.can.edit).toBe(false);

    const [before] = await app.ctx.db.select().from(motherPlants).where(eq(motherPlants.id, target.id));
    const edit = await as.hand.patch(`/api/mother-plants/${target.id}`, { notes: 'mine now' });
    expect(edit.status).toBe(403);
    const inspect = await as.hand.post(`/api/mother-plants/${target.id}/inspections`, { inspectedOn: '2026-11-20', findings: [] });
    expect(inspect.status).toBe(403);
    const [after] = await app.ctx.db.select().from(motherPlants).where(eq(motherPlants.id, target.id));
    expect(after).toEqual(before);
  });

  it("hides another farm's plants that are not clean", async () => {
    const [held] = await app.ctx.db
      .select()
      .from(motherPlants)
      .where(and(eq(motherPlants.farmId, farmB.id), eq(motherPlants.healthStatus, 'hold')))
      .limit(1);
    if (held) {
      expect((await as.grower.get(`/api/mother-plants/${held.id}`)).status).toBe(404);
      expect((await as.coordinator.get(`/api/mother-plants/${held.id}`)).status).toBe(200);
    }
    const all = await as.grower.get('/api/mother-plants?status=hold,watch');
    expect(all.body.total).toBe(0);
  });

  it('filters, sorts and pages on the server', async () => {
    const r = await as.coordinator.get(`/api/mother-plants?speciesId=${ribes.id}&sort=plantingYear&dir=desc&page=1&pageSize=10`);
    expect(r.status).toBe(200);
    expect(r.body.items.length).toBeLessThanOrEqual(10);
    const years = r.body.items.map((p: { plantingYear: number }) => p.plantingYear);
    expect([...years].sort((a, b) => b - a)).toEqual(years);
    for (const p of r.body.items) expect(p.speciesId).toBe(ribes.id);
    const page2 = await as.coordinator.get(`/api/mother-plants?speciesId=${ribes.id}&sort=plantingYear&dir=desc&page=2&pageSize=10`);
    const ids1 = new Set(r.body.items.map((p: { id: string }) => p.id));
    for (const p of page2.body.items) expect(ids1.has(p.id)).toBe(false);
    expect(page2.body.total).toBe(r.body.total);
    const bad = await as.coordinator.get('/api/mother-plants?sort=colour&pageSize=5000');
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['pageSize', 'sort']);
  });
});

describe('inspections move the health status by the rules', () => {
  it('a finding that travels in wood puts the plant on hold; only a coordinator lifts it', async () => {
    const plant = (await as.lead.post('/api/mother-plants', newPlant())).body;
    const watch = await as.hand.post(`/api/mother-plants/${plant.id}/inspections`, {
      inspectedOn: '2026-11-10',
      findings: [{ pestId: local.id, severity: 'minor' }],
    });
    expect(watch.status).toBe(201);
    expect(watch.body.statusAfter).toBe('watch');
    const cleared = await as.hand.post(`/api/mother-plants/${plant.id}/inspections`, { inspectedOn: '2026-11-15', findings: [] });
    expect(cleared.body.statusAfter).toBe('clean');
    const hold = await as.hand.post(`/api/mother-plants/${plant.id}/inspections`, {
      inspectedOn: '2026-11-20',
      notes: 'swollen round buds',
      findings: [{ pestId: travelling.id, severity: 'moderate' }],
    });
    expect(hold.body.statusAfter).toBe('hold');
    const stillHeld = await as.hand.post(`/api/mother-plants/${plant.id}/inspections`, { inspectedOn: '2026-11-25', findings: [] });
    expect(stillHeld.body.statusAfter).toBe('hold');

    const byLead = await as.lead.post(`/api/mother-plants/${plant.id}/lift-hold`, { to: 'clean', reason: 'buds removed' });
    expect(byLead.status).toBe(403);
    const [row] = await app.ctx.db.select().from(motherPlants).where(eq(motherPlants.id, plant.id));
    expect(row.healthStatus).toBe('hold');
    const noReason = await as.coordinator.post(`/api/mother-plants/${plant.id}/lift-hold`, { to: 'clean' });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.fields.reason).toBeDefined();
    const lifted = await as.coordinator.post(`/api/mother-plants/${plant.id}/lift-hold`, { to: 'watch', reason: 'mite-free on re-inspection' });
    expect(lifted.status).toBe(200);
    expect(lifted.body.healthStatus).toBe('watch');
    const statusAudit = await app.ctx.db
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.entityId, plant.id), eq(auditLog.entity, 'mother_plant')));
    const actions = statusAudit.map((a) => a.action);
    expect(actions.filter((a) => a === 'status').length).toBe(3);
    expect(actions).toContain('lift_hold');
    expect(lifted.body.inspections.length).toBe(4);
  });

  it('refuses a finding that is not in the catalogue or not for the genus, and future dates', async () => {
    const plant = (await as.lead.post('/api/mother-plants', newPlant())).body;
    const unknown = await as.hand.post(`/api/mother-plants/${plant.id}/inspections`, {
      inspectedOn: '2026-11-10',
      findings: [{ pestId: '00000000-0000-4000-8000-000000000000', severity: 'minor' }],
    });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.fields['findings.0.pestId']).toBe('not in the catalogue');
    const future = await as.hand.post(`/api/mother-plants/${plant.id}/inspections`, { inspectedOn: '2099-01-01' });
    expect(future.status).toBe(400);
    expect(future.body.error.fields.inspectedOn).toMatch(/future/);
    const detail = await as.lead.get(`/api/mother-plants/${plant.id}`);
    expect(detail.body.inspections).toEqual([]);
  });

  it('shows the coordinator what needs attention', async () => {
    const r = await as.coordinator.get('/api/health/overview');
    expect(r.status).toBe(200);
    expect(r.body.counts.hold).toBeGreaterThan(0);
    expect(r.body.attention[0].healthStatus).toBe('hold');
    expect((await as.lead.get('/api/health/overview')).status).toBe(403);
    const note = await as.grower.post('/api/health/notes', { body: 'Swollen buds along the river road', notedOn: '2026-11-28' });
    expect(note.status).toBe(201);
    const again = await as.coordinator.get('/api/health/overview');
    expect(again.body.notes[0].body).toBe('Swollen buds along the river road');
  });
});

// Trace on the demo cooperative's four-generation lineage, checked against sets walked step by
// step with plain queries; who sees what; exposure after a finding that travels in wood; and
// health notices that go out once per finding and grower.
import { and, count, eq, inArray, isNotNull, notInArray, sql, type SQL } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { LINEAGE_ROOT_CODE } from '../../server/db/seed/demo-data.js';
import { allocationRounds, auditLog, bundles, emailLog, mailbox, motherPlants, seasons, user } from '../../server/db/schema/index.js';
import { Client } from '../fixtures/http.js';
import { waitForMail } from '../fixtures/mailbox.js';
import { startTestApp, type TestApp } from '../fixtures/test-app.js';

const DEMO_PASSWORD = 'heelwood-demo';

let app: TestApp;
const as: Record<'coordinator' | 'lead' | 'hand' | 'grower', Client> = {} as never;

/** A client signed in as one of the demo people. */
async function signedIn(email: string): Promise<Client> {
  const c = new Client(app.url);
  await c.signIn(email, DEMO_PASSWORD);
  return c;
}

async function rows<T>(query: SQL): Promise<T[]> {
  return ((await app.ctx.db.execute(query)) as unknown as { rows: T[] }).rows;
}

async function mailCount() {
  return (await app.ctx.db.select({ n: count() }).from(mailbox))[0].n;
}

/** Children of a set of plants, by either link, one step. */
async function childrenOf(ids: string[]): Promise<string[]> {
  if (!ids.length) return [];
  const byParent = await app.ctx.db.select({ id: motherPlants.id }).from(motherPlants).where(inArray(motherPlants.parentPlantId, ids));
  const byBundle = await app.ctx.db
    .select({ id: motherPlants.id })
    .from(motherPlants)
    .innerJoin(bundles, eq(bundles.id, motherPlants.sourceBundleId))
    .where(inArray(bundles.plantId, ids));
  return [...new Set([...byParent, ...byBundle].map((r) => r.id))];
}

/** Descendants with their generation, walked one generation at a time. */
async function walkDown(rootId: string, firstGeneration?: string[]): Promise<Map<string, number>> {
  const seen = new Map<string, number>();
  let frontier = firstGeneration ?? (await childrenOf([rootId]));
  let depth = 1;
  while (frontier.length) {
    const fresh = frontier.filter((id) => id !== rootId && !seen.has(id));
    for (const id of fresh) seen.set(id, depth);
    frontier = await childrenOf(fresh);
    depth += 1;
  }
  return seen;
}

async function plantByCode(code: string) {
  const [p] = await app.ctx.db.select().from(motherPlants).where(eq(motherPlants.code, code));
  return p;
}

type Node = { id: string; code: string; depth: number; parentId: string | null; healthStatus: string; full: boolean; via: { code: string | null; growerName: string | null } | null };

let root: typeof motherPlants.$inferSelect;
let coordinatorTrace: { plant: Node; ancestors: Node[]; descendants: Node[]; bundles: { id: string; growerId: string; farmName: string }[]; hidden: { plants: number; bundles: number } };

beforeAll(async () => {
  app = await startTestApp({ seeded: true });
  for (const who of ['coordinator', 'lead', 'hand', 'grower'] as const) as[who] = await signedIn(`${who}@heelwood.test`);
  root = await plantByCode(LINEAGE_ROOT_CODE);
});
afterAll(async () => {
  await app?.close();
});

describe('the trace of a plant', () => {
  it('finds exactly the descendants and bundles of the seeded four-generation lineage', async () => {
    expect(root.provenance).toBe('bought');
    const r = await as.coordinator.get(`/api/mother-plants/${root.id}/trace`);
    expect(r.status).toBe(200);
    coordinatorTrace = r.body;
    expect(r.body.plant).toMatchObject({ id: root.id, code: LINEAGE_ROOT_CODE, depth: 0 });
    expect(r.body.ancestors).toEqual([]);

    const expected = await walkDown(root.id);
    expect(Math.max(...expected.values())).toBeGreaterThanOrEqual(3);
    const got = new Map(r.body.descendants.map((d: Node) => [d.id, d.depth]));
    expect(got).toEqual(expected);

    // Each descendant names the plant it came from and the bundle it came through.
    const all = await app.ctx.db.select().from(motherPlants).where(inArray(motherPlants.id, [...expected.keys()]));
    const codes = new Map((await app.ctx.db.select({ id: bundles.id, code: bundles.code }).from(bundles)).map((b) => [b.id, b.code]));
    for (const d of r.body.descendants as Node[]) {
      const p = all.find((x) => x.id === d.id)!;
      expect(d.code).toBe(p.code);
      expect(d.healthStatus).toBe(p.healthStatus);
      expect(d.parentId).toBe(p.parentPlantId);
      expect(d.via?.code ?? null).toBe(p.sourceBundleId ? codes.get(p.sourceBundleId) : null);
    }

    // Every bundle from the plant and its descendants, in approved rounds, not cancelled.
    const from = [root.id, ...expected.keys()];
    const expectedBundles = await app.ctx.db
      .select({ id: bundles.id, growerName: user.name, seasonName: seasons.name })
      .from(bundles)
      .innerJoin(allocationRounds, eq(allocationRounds.id, bundles.roundId))
      .innerJoin(seasons, eq(seasons.id, allocationRounds.seasonId))
      .innerJoin(user, eq(user.id, bundles.growerId))
      .where(and(inArray(bundles.plantId, from), inArray(allocationRounds.status, ['approved', 'notified']), notInArray(bundles.status, ['cancelled'])));
    expect(new Set(r.body.bundles.map((b: { id: string }) => b.id))).toEqual(new Set(expectedBundles.map((b) => b.id)));
    for (const b of r.body.bundles as { id: string; growerName: string; seasonName: string }[]) {
      const e = expectedBundles.find((x) => x.id === b.id)!;
      expect(b.growerName).toBe(e.growerName);
      expect(b.seasonName).toBe(e.seasonName);
    }
    expect(r.body.bundles.length).toBeGreaterThanOrEqual(6);
    expect(r.body.hidden).toEqual({ plants: 0, bundles: 0 });
  });

  it('walks the ancestors up the parent links from the deepest plant', async () => {
    const deepest = [...coordinatorTrace.descendants].sort((a, b) => b.depth - a.depth)[0];
    const r = await as.coordinator.get(`/api/mother-plants/${deepest.id}/trace`);
    expect(r.status).toBe(200);
    const expected: { id: string; depth: number }[] = [];
    let at = await app.ctx.db.select().from(motherPlants).where(eq(motherPlants.id, deepest.id)).then((x) => x[0]);
    for (let depth = 1; at.parentPlantId; depth++) {
      const [parent] = await app.ctx.db.select().from(motherPlants).where(eq(motherPlants.id, at.parentPlantId));
      expected.push({ id: parent.id, depth });
      at = parent;
    }
    expect(expected.length).toBeGreaterThanOrEqual(3);
    expect(expected[expected.length - 1].id).toBe(root.id);
    expect(r.body.ancestors.map((a: Node) => ({ id: a.id, depth: a.depth }))).toEqual(expected);
  });

  it("shows the plant's farm people everything, and other members clean plants only", async () => {
    // The root is on WTH: its farm hand sees what the coordinator sees.
    const hand = await as.hand.get(`/api/mother-plants/${root.id}/trace`);
    expect(hand.body).toEqual(coordinatorTrace);

    // A grower with no farm: clean plants, public fields, only the bundles they received.
    const samId = (await app.ctx.db.select({ id: user.id }).from(user).where(eq(user.email, 'grower@heelwood.test')))[0].id;
    const sam = await as.grower.get(`/api/mother-plants/${root.id}/trace`);
    expect(sam.status).toBe(200);
    const cleanIds = coordinatorTrace.descendants.filter((d) => d.healthStatus === 'clean').map((d) => d.id);
    expect(sam.body.descendants.map((d: Node) => d.id).sort()).toEqual(cleanIds.sort());
    for (const d of sam.body.descendants as Node[]) {
      expect(d.full).toBe(false);
      if (d.via) expect(d.via.growerName).toBeNull();
    }
    expect(sam.body.bundles.every((b: { growerId: string }) => b.growerId === samId)).toBe(true);
    expect(sam.body.bundles.length + sam.body.hidden.bundles).toBe(coordinatorTrace.bundles.length);
    expect(sam.body.descendants.length + sam.body.hidden.plants).toBe(coordinatorTrace.descendants.length);

    // Another farm's plant that is not clean is not found for him.
    const [held] = await app.ctx.db.select().from(motherPlants).where(eq(motherPlants.healthStatus, 'hold')).limit(1);
    expect((await as.grower.get(`/api/mother-plants/${held.id}/trace`)).status).toBe(404);
    expect((await new Client(app.url).get(`/api/mother-plants/${root.id}/trace`)).status).toBe(401);
  });
});

describe('exposure and health notices', () => {
  let exposedId: string;
  let expectedGrowers: { id: string; email: string }[];

  beforeAll(async () => {
    // The demo's plant on hold that gave wood after its last clean inspection.
    const [x] = await rows<{ id: string }>(sql`
      with last_clean as (
        select p.id, max(i.inspected_on) as on_date from mother_plants p join inspections i on i.plant_id = p.id
        where p.health_status = 'hold' and not exists (select 1 from findings f where f.inspection_id = i.id)
        group by p.id
      )
      select lc.id from last_clean lc join bundles b on b.plant_id = lc.id and b.status = 'collected' and b.collected_at::date > lc.on_date
      group by lc.id order by count(*) desc limit 1`);
    exposedId = x.id;
  });

  it('lists the bundles and plants since the last clean inspection, and who got them', async () => {
    const r = await as.coordinator.get(`/api/mother-plants/${exposedId}/exposure`);
    expect(r.status).toBe(200);
    // The finding: the latest one on the plant of a pest that travels in wood.
    const [finding] = await rows<{ id: string; on: string; created: Date }>(sql`
      select f.id, to_char(i.inspected_on, 'YYYY-MM-DD') as on, i.created_at as created
      from findings f join inspections i on i.id = f.inspection_id join pests x on x.id = f.pest_id
      where i.plant_id = ${exposedId} and x.travels_in_wood order by i.inspected_on desc limit 1`);
    expect(r.body.finding.id).toBe(finding.id);
    expect(r.body.finding.pest.signs.length).toBeGreaterThan(10);
    const [clean] = await rows<{ on: string }>(sql`
      select to_char(max(i.inspected_on), 'YYYY-MM-DD') as on from inspections i
      where i.plant_id = ${exposedId} and i.inspected_on < ${finding.on}::date
        and not exists (select 1 from findings f where f.inspection_id = i.id)`);
    expect(r.body.since).toBe(clean.on);

    // Expected, step by step: bundles from the plant collected on or after that day; plants
    // raised from them and their descendants; bundles collected from those plants.
    const fromPlant = (
      await rows<{ id: string }>(sql`
        select b.id from bundles b join farms f on f.id = b.farm_id
        where b.plant_id = ${exposedId} and b.status = 'collected' and (b.collected_at at time zone f.timezone)::date >= ${clean.on}::date`)
    ).map((b) => b.id);
    expect(fromPlant.length).toBeGreaterThanOrEqual(2);
    const firstGen = fromPlant.length
      ? (await app.ctx.db.select({ id: motherPlants.id }).from(motherPlants).where(inArray(motherPlants.sourceBundleId, fromPlant))).map((p) => p.id)
      : [];
    expect(firstGen.length).toBeGreaterThan(0);
    const plants = await walkDown(exposedId, firstGen);
    expect(new Map(r.body.plants.map((p: { id: string; depth: number }) => [p.id, p.depth]))).toEqual(plants);
    const fromDescendants = plants.size
      ? (
          await app.ctx.db
            .select({ id: bundles.id })
            .from(bundles)
            .where(and(inArray(bundles.plantId, [...plants.keys()]), eq(bundles.status, 'collected')))
        ).map((b) => b.id)
      : [];
    const expectedBundles = new Set([...fromPlant, ...fromDescendants]);
    expect(new Set(r.body.bundles.map((b: { id: string }) => b.id))).toEqual(expectedBundles);
    expectedGrowers = await app.ctx.db
      .selectDistinct({ id: user.id, email: user.email })
      .from(bundles)
      .innerJoin(user, eq(user.id, bundles.growerId))
      .where(inArray(bundles.id, [...expectedBundles]));
    expect(new Set(r.body.growers.map((g: { id: string }) => g.id))).toEqual(new Set(expectedGrowers.map((g) => g.id)));
    expect(r.body.growers.every((g: { notified: boolean }) => g.notified === false)).toBe(true);
    expect(r.body.rule).toMatch(/last clean inspection/);
  });

  it('is for coordinators only', async () => {
    expect((await as.lead.get(`/api/mother-plants/${exposedId}/exposure`)).status).toBe(403);
    const before = await mailCount();
    expect((await as.lead.post(`/api/mother-plants/${exposedId}/notices`, {})).status).toBe(403);
    expect(await mailCount()).toBe(before);
  });

  it('e-mails each grower once per finding: a second send is a duplicate', async () => {
    const before = await mailCount();
    const r = await as.coordinator.post(`/api/mother-plants/${exposedId}/notices`, { note: 'Please check your cuttings this week.' });
    expect(r.status).toBe(200);
    expect(r.body).toEqual({ sent: expectedGrowers.length, duplicate: 0, failed: 0, recipients: expectedGrowers.length });
    for (const g of expectedGrowers) {
      const m = await waitForMail(app, g.email);
      expect(m.subject).toMatch(/^Plant-health notice: /);
      expect(m.textBody).toMatch(/local plant-health authority/);
      expect(m.textBody).toMatch(/does not certify/);
      expect(m.textBody).toMatch(/What to look for:/);
      expect(m.textBody).toMatch(/Please check your cuttings this week\./);
      expect(m.textBody).toMatch(/Bundle B\d\d-\d{4}/);
    }
    const until = Date.now() + 10_000;
    while ((await mailCount()) < before + expectedGrowers.length && Date.now() < until) await new Promise((res) => setTimeout(res, 100));
    const afterFirst = await mailCount();
    expect(afterFirst).toBe(before + expectedGrowers.length);

    const again = await as.coordinator.post(`/api/mother-plants/${exposedId}/notices`, {});
    expect(again.status).toBe(200);
    expect(again.body).toEqual({ sent: 0, duplicate: expectedGrowers.length, failed: 0, recipients: expectedGrowers.length });
    await new Promise((res) => setTimeout(res, 500));
    expect(await mailCount()).toBe(afterFirst);
    const logged = await app.ctx.db.select().from(emailLog).where(and(eq(emailLog.kind, 'health_notice'), isNotNull(emailLog.sentAt)));
    expect(logged).toHaveLength(expectedGrowers.length);

    const view = await as.coordinator.get(`/api/mother-plants/${exposedId}/exposure`);
    expect(view.body.growers.every((g: { notified: boolean }) => g.notified)).toBe(true);
    const audits = await app.ctx.db.select().from(auditLog).where(and(eq(auditLog.entityId, exposedId), eq(auditLog.action, 'health_notice')));
    expect(audits).toHaveLength(2);
  });

  it('has nothing to send for a plant with no finding that travels in wood', async () => {
    const before = await mailCount();
    const ex = await as.coordinator.get(`/api/mother-plants/${root.id}/exposure`);
    expect(ex.status).toBe(200);
    expect(ex.body).toMatchObject({ finding: null, bundles: [], growers: [] });
    const r = await as.coordinator.post(`/api/mother-plants/${root.id}/notices`, {});
    expect(r.status).toBe(409);
    expect(r.body.error.fields.findingId).toBeDefined();
    expect(await mailCount()).toBe(before);
  });
});

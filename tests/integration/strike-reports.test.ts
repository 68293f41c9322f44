// Strike reports end to end on a copy of the demo cooperative: refusals that name the field
// and write nothing, the Beta estimate checked against @stdlib and a worked example, the
// grower's bundle list, plants raised from a bundle, and reminders that go out once.
import betaQuantile from '@stdlib/stats-base-dists-beta-quantile';
import { and, count, eq, inArray, type SQL, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { TREATMENT_ODDS_RATIO } from '../../shared/strike-rate.js';
import type { Treatment } from '../../shared/domain.js';
import {
  allocationRounds,
  auditLog,
  bundles,
  emailLog,
  farms,
  mailbox,
  motherPlants,
  requestLines,
  seasons,
  species,
  strikeReports,
  user,
  varieties,
  woodOffers,
  woodRequests,
} from '../../server/db/schema/index.js';
import { nextPlantNumber } from '../../server/modules/mother-plants/mother-plants.repo.js';
import { runReminders } from '../../server/modules/reminders/reminders.js';
import { Client } from '../fixtures/http.js';
import { waitForMail } from '../fixtures/mailbox.js';
import { startTestApp, type TestApp } from '../fixtures/test-app.js';

const DEMO_PASSWORD = 'heelwood-demo';

let app: TestApp;
const as: Record<'coordinator' | 'lead' | 'grower', Client> = {} as never;

/** A client signed in as one of the demo people. */
async function signedIn(email: string): Promise<Client> {
  const c = new Client(app.url);
  await c.signIn(email, DEMO_PASSWORD);
  return c;
}

async function rows<T>(query: SQL): Promise<T[]> {
  return ((await app.ctx.db.execute(query)) as unknown as { rows: T[] }).rows;
}

async function userId(email: string): Promise<string> {
  const [u] = await app.ctx.db.select({ id: user.id }).from(user).where(eq(user.email, email));
  return u.id;
}

async function farmByCode(code: string) {
  const [f] = await app.ctx.db.select().from(farms).where(eq(farms.code, code));
  return f;
}

async function counts() {
  const [[r], [a], [p]] = await Promise.all([
    app.ctx.db.select({ n: count() }).from(strikeReports),
    app.ctx.db.select({ n: count() }).from(auditLog),
    app.ctx.db.select({ n: count() }).from(motherPlants),
  ]);
  return { reports: r.n, audit: a.n, plants: p.n };
}

/** Treated prior as shared/strike-rate.ts documents it: odds times the treatment's ratio. */
function treatedPrior(untreated: number, t: Treatment): number {
  const odds = (untreated / (1 - untreated)) * TREATMENT_ODDS_RATIO[t];
  return odds / (1 + odds);
}

// A species of our own with a round prior (0.7, strength 20) and one collected bundle of 60
// cuttings from an ARB plant to the WTH farm lead, plus a bundle not yet collected.
const fx = {} as {
  speciesId: string;
  varietyId: string;
  plantId: string;
  bundleId: string;
  reservedBundleId: string;
  leadId: string;
  wthId: string;
};
const COLLECTED_AT = new Date('2025-12-13T10:30:00Z');

async function makeFixture() {
  const db = app.ctx.db;
  fx.leadId = await userId('lead@heelwood.test');
  const arb = await farmByCode('ARB');
  fx.wthId = (await farmByCode('WTH')).id;
  const [sp] = await db
    .insert(species)
    .values({
      scientificName: 'Ribes testense',
      commonName: 'Test currant',
      genus: 'Ribes',
      propagationMethods: ['hardwood'],
      defaultCuttingLengthCm: 20,
      defaultCuttingDiameterMm: 7,
      strikeRatePrior: 0.7,
      priorStrength: 20,
    })
    .returning();
  fx.speciesId = sp.id;
  const [v] = await db.insert(varieties).values({ speciesId: sp.id, name: 'Trial Black' }).returning();
  fx.varietyId = v.id;
  const code = `ARB-${String(await nextPlantNumber(db, 'ARB')).padStart(4, '0')}`;
  const [plant] = await db
    .insert(motherPlants)
    .values({ code, farmId: arb.id, speciesId: sp.id, varietyId: v.id, plantingYear: 2018, role: 'stock_bed', provenance: 'bought', lastInspectedOn: '2025-10-01' })
    .returning();
  fx.plantId = plant.id;
  const [season] = await db
    .insert(seasons)
    .values({
      name: 'Test hardwood 2025–26',
      kind: 'dormant_hardwood',
      hemisphere: 'north',
      stage: 'closed',
      requestDeadline: new Date('2025-11-15T18:00:00Z'),
      collectionStart: '2025-12-01',
      collectionEnd: '2026-02-28',
    })
    .returning();
  const [offer] = await db
    .insert(woodOffers)
    .values({ seasonId: season.id, plantId: plant.id, directCount: 100, estimatedYield: 100, capFraction: 0.9, offered: 90, reserved: 75 })
    .returning();
  const [request] = await db
    .insert(woodRequests)
    .values({ seasonId: season.id, growerId: fx.leadId, status: 'filed', destinationLat: 52.1, destinationLon: -2.6, maxDistanceKm: 50 })
    .returning();
  const [line] = await db.insert(requestLines).values({ requestId: request.id, speciesId: sp.id, varietyId: v.id, cuttings: 75, treatment: 'none' }).returning();
  const [round] = await db
    .insert(allocationRounds)
    .values({ seasonId: season.id, number: 1, status: 'notified', approvedAt: new Date('2025-11-20T12:00:00Z'), notifiedAt: new Date('2025-11-20T12:01:00Z') })
    .returning();
  const [b1, b2] = await db
    .insert(bundles)
    .values([
      { code: 'BT5-0001', roundId: round.id, offerId: offer.id, lineId: line.id, plantId: plant.id, farmId: arb.id, growerId: fx.leadId, cuttings: 60, status: 'collected', collectedAt: COLLECTED_AT },
      { code: 'BT5-0002', roundId: round.id, offerId: offer.id, lineId: line.id, plantId: plant.id, farmId: arb.id, growerId: fx.leadId, cuttings: 15, status: 'reserved' },
    ])
    .returning();
  fx.bundleId = b1.id;
  fx.reservedBundleId = b2.id;
}

beforeAll(async () => {
  app = await startTestApp({ seeded: true });
  for (const who of ['coordinator', 'lead', 'grower'] as const) as[who] = await signedIn(`${who}@heelwood.test`);
  await makeFixture();
});
afterAll(async () => {
  await app?.close();
});

const report = (who: Client, bundleId: string, body: Record<string, unknown>) => who.post(`/api/bundles/${bundleId}/strike-reports`, body);
const good = { stuck: 50, rooted: 40, assessedOn: '2026-09-15', treatment: 'none', notes: 'Lined out in the nursery bed.' };

describe('a strike report', () => {
  it('refuses bad input, names the field, and writes nothing', async () => {
    const before = await counts();
    const tomorrow = new Date(Date.now() + 2 * 86_400_000).toISOString().slice(0, 10);

    const rootedOver = await report(as.lead, fx.bundleId, { ...good, rooted: 51 });
    expect(rootedOver.status).toBe(400);
    expect(rootedOver.body.error.fields.rooted).toMatch(/more than the cuttings stuck/);

    const stuckOver = await report(as.lead, fx.bundleId, { ...good, stuck: 61, rooted: 1 });
    expect(stuckOver.status).toBe(400);
    expect(stuckOver.body.error.fields.stuck).toMatch(/At most 60/);

    const future = await report(as.lead, fx.bundleId, { ...good, assessedOn: tomorrow });
    expect(future.status).toBe(400);
    expect(future.body.error.fields.assessedOn).toMatch(/future/);

    const early = await report(as.lead, fx.bundleId, { ...good, assessedOn: '2025-12-12' });
    expect(early.status).toBe(400);
    expect(early.body.error.fields.assessedOn).toMatch(/before the bundle was collected/);

    const badDate = await report(as.lead, fx.bundleId, { ...good, assessedOn: '2026-02-30' });
    expect(badDate.status).toBe(400);
    expect(badDate.body.error.fields.assessedOn).toBeDefined();

    const notCollected = await report(as.lead, fx.reservedBundleId, { ...good, stuck: 10, rooted: 5 });
    expect(notCollected.status).toBe(400);
    expect(notCollected.body.error.fields.bundleId).toMatch(/not collected/);

    const notYours = await report(as.grower, fx.bundleId, good);
    expect(notYours.status).toBe(403);

    const missing = await report(as.lead, '00000000-0000-4000-8000-000000000000', good);
    expect(missing.status).toBe(404);

    expect(await counts()).toEqual(before);
  });

  it('is filed by the bundle grower; the estimate is the prior updated by it (worked example)', async () => {
    const r = await report(as.lead, fx.bundleId, good);
    expect(r.status).toBe(201);
    expect(r.body).toMatchObject({ bundleId: fx.bundleId, stuck: 50, rooted: 40, assessedOn: '2026-09-15', treatment: 'none' });
    const [audit] = await app.ctx.db
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.entity, 'bundle'), eq(auditLog.entityId, fx.bundleId), eq(auditLog.action, 'strike_report')));
    expect(audit.actorId).toBe(fx.leadId);

    // Worked example: prior 0.7 with the weight of 20 cuttings is Beta(14, 6); 40 of 50 rooted
    // makes it Beta(54, 16), whose mean is 54/70. The 90 % interval is the 5 % and 95 % quantiles
    // of that Beta, taken here straight from @stdlib.
    const rates = await as.grower.get(`/api/strike-rates?speciesId=${fx.speciesId}&treatment=none`);
    expect(rates.status).toBe(200);
    const speciesRow = rates.body.items.find((x: { level: string }) => x.level === 'species');
    const varietyRow = rates.body.items.find((x: { level: string }) => x.level === 'variety');
    for (const row of [speciesRow, varietyRow]) {
      expect(row).toMatchObject({ treatment: 'none', reports: 1, stuck: 50, rooted: 40, source: 'reports' });
      expect(row.prior.rate).toBeCloseTo(0.7, 12);
      expect(row.prior.strength).toBe(20);
      expect(row.rate).toBeCloseTo(54 / 70, 12);
      expect(row.low).toBeCloseTo(betaQuantile(0.05, 54, 16), 10);
      expect(row.high).toBeCloseTo(betaQuantile(0.95, 54, 16), 10);
    }
    expect(varietyRow.varietyId).toBe(fx.varietyId);
    expect(speciesRow.low).toBeLessThan(54 / 70);
    expect(speciesRow.high).toBeGreaterThan(54 / 70);

    // Another treatment with no reports: the treated prior alone.
    const hormone = await as.grower.get(`/api/strike-rates?speciesId=${fx.speciesId}&treatment=hormone`);
    const h = hormone.body.items[0];
    expect(h).toMatchObject({ level: 'species', reports: 0, source: 'prior' });
    expect(h.rate).toBeCloseTo(treatedPrior(0.7, 'hormone'), 12);
    const a = treatedPrior(0.7, 'hormone') * 20;
    expect(h.low).toBeCloseTo(betaQuantile(0.05, a, 20 - a), 10);
  });

  it('counts each cutting once: a second report covers at most what is left', async () => {
    const before = await counts();
    const over = await report(as.lead, fx.bundleId, { ...good, stuck: 11, rooted: 2 });
    expect(over.status).toBe(400);
    expect(over.body.error.fields.stuck).toMatch(/At most 10/);
    expect(await counts()).toEqual(before);
  });

  it('answers the seeded estimates exactly as the statistics library does', async () => {
    const r = await as.coordinator.get('/api/strike-rates');
    expect(r.status).toBe(200);
    // Totals counted independently: through the bundle's own plant, not the offer.
    const sums = await rows<{ species_id: string; variety_id: string | null; treatment: Treatment; n: number; stuck: number; rooted: number }>(sql`
      select p.species_id, p.variety_id, r.treatment, count(*)::int as n, sum(r.stuck)::int as stuck, sum(r.rooted)::int as rooted
      from strike_reports r join bundles b on b.id = r.bundle_id join mother_plants p on p.id = b.plant_id
      group by 1, 2, 3`);
    const priors = new Map(
      (await rows<{ id: string; p: string; s: number }>(sql`select id, strike_rate_prior as p, prior_strength as s from species`)).map((x) => [x.id, { p: Number(x.p), s: Number(x.s) }]),
    );
    let checked = 0;
    for (const row of r.body.items as { level: string; speciesId: string; varietyId: string | null; treatment: Treatment; reports: number; stuck: number; rooted: number; rate: number; low: number; high: number }[]) {
      const mine = sums.filter((x) => x.species_id === row.speciesId && x.treatment === row.treatment && (row.level === 'species' || x.variety_id === row.varietyId));
      const stuck = mine.reduce((s, x) => s + x.stuck, 0);
      const rooted = mine.reduce((s, x) => s + x.rooted, 0);
      expect({ reports: row.reports, stuck: row.stuck, rooted: row.rooted }).toEqual({ reports: mine.reduce((s, x) => s + x.n, 0), stuck, rooted });
      const { p, s } = priors.get(row.speciesId)!;
      const prior = treatedPrior(p, row.treatment);
      const a = prior * s + rooted;
      const b = (1 - prior) * s + (stuck - rooted);
      expect(row.rate).toBeCloseTo(a / (a + b), 12);
      expect(row.low).toBeCloseTo(betaQuantile(0.05, a, b), 10);
      expect(row.high).toBeCloseTo(betaQuantile(0.95, a, b), 10);
      checked += 1;
    }
    // Every species appears with every treatment; varieties where reports exist.
    const nSpecies = priors.size;
    expect(r.body.items.filter((x: { level: string }) => x.level === 'species').length).toBe(nSpecies * 4);
    const varietyGroups = sums.filter((x) => x.variety_id !== null).length;
    expect(r.body.items.filter((x: { level: string }) => x.level === 'variety').length).toBe(varietyGroups);
    expect(checked).toBeGreaterThan(nSpecies * 4);
  });

  it('pools reports the way the planner does', async () => {
    const [{ id: blackcurrant }] = await rows<{ id: string }>(sql`select id from species where common_name ilike 'blackcurrant%' limit 1`);
    for (const treatment of ['none', 'willow', 'hormone', 'both'] as const) {
      const table = (await as.grower.get(`/api/strike-rates?speciesId=${blackcurrant}&treatment=${treatment}`)).body.items[0];
      const planner = await as.grower.post('/api/planner/estimate', { positions: 10, speciesId: blackcurrant, treatment });
      expect(planner.status).toBe(200);
      expect(planner.body.strikeRate.stuck).toBe(table.stuck);
      expect(planner.body.strikeRate.rooted).toBe(table.rooted);
      if (planner.body.strikeRate.scope !== 'variety') expect(planner.body.strikeRate.rate).toBeCloseTo(table.rate, 12);
    }
  });

  it('refuses unknown species and a variety of another species', async () => {
    const r = await as.grower.get(`/api/strike-rates?speciesId=00000000-0000-4000-8000-000000000000`);
    expect(r.status).toBe(400);
    expect(r.body.error.fields.speciesId).toBeDefined();
    const [{ id: other }] = await rows<{ id: string }>(sql`select id from species where id <> ${fx.speciesId} limit 1`);
    const mismatch = await as.grower.get(`/api/strike-rates?speciesId=${other}&varietyId=${fx.varietyId}`);
    expect(mismatch.status).toBe(400);
    expect(mismatch.body.error.fields.varietyId).toBeDefined();
    expect((await new Client(app.url).get('/api/strike-rates')).status).toBe(401);
  });
});

describe('my bundles', () => {
  it("lists the caller's collected bundles across seasons with their reports", async () => {
    const mine = await as.lead.get('/api/my/bundles');
    expect(mine.status).toBe(200);
    const expected = await rows<{ id: string }>(sql`select id from bundles where grower_id = ${fx.leadId} and status = 'collected'`);
    expect(new Set(mine.body.items.map((b: { id: string }) => b.id))).toEqual(new Set(expected.map((b) => b.id)));
    const b = mine.body.items.find((x: { id: string }) => x.id === fx.bundleId);
    expect(b).toMatchObject({ code: 'BT5-0001', cuttings: 60, collectedOn: '2025-12-13', reportDueOn: '2026-06-01', reported: { stuck: 50, rooted: 40 }, unreported: 10, mayRaise: 40 });
    expect(b.reports).toHaveLength(1);
    expect(mine.body.farms.map((f: { code: string }) => f.code)).toEqual(['WTH']);

    const sam = await as.grower.get('/api/my/bundles');
    const samId = await userId('grower@heelwood.test');
    const samExpected = await rows<{ id: string; stuck: number | null }>(sql`
      select b.id, (select sum(r.stuck)::int from strike_reports r where r.bundle_id = b.id) as stuck
      from bundles b where b.grower_id = ${samId} and b.status = 'collected'`);
    expect(sam.body.items.length).toBe(samExpected.length);
    expect(sam.body.items.length).toBeGreaterThan(0);
    for (const item of sam.body.items as { id: string; reported: { stuck: number } }[]) {
      expect(item.reported.stuck).toBe(samExpected.find((x) => x.id === item.id)!.stuck ?? 0);
    }
  });
});

describe('plants raised from a bundle', () => {
  it('refuses too many, a farm the grower does not work on, and other people; writes nothing', async () => {
    const before = await counts();
    const body = { farmId: fx.wthId, count: 41, role: 'stock_bed', plantingYear: 2026, bedRow: 'Nursery row 3' };
    const tooMany = await as.lead.post(`/api/bundles/${fx.bundleId}/raise-plants`, body);
    expect(tooMany.status).toBe(400);
    expect(tooMany.body.error.fields.count).toMatch(/At most 40/);
    const arb = await farmByCode('ARB');
    const wrongFarm = await as.lead.post(`/api/bundles/${fx.bundleId}/raise-plants`, { ...body, count: 2, farmId: arb.id });
    expect(wrongFarm.status).toBe(400);
    expect(wrongFarm.body.error.fields.farmId).toBeDefined();
    const early = await as.lead.post(`/api/bundles/${fx.bundleId}/raise-plants`, { ...body, count: 2, plantingYear: 2024 });
    expect(early.status).toBe(400);
    expect(early.body.error.fields.plantingYear).toBeDefined();
    const notYours = await as.grower.post(`/api/bundles/${fx.bundleId}/raise-plants`, { ...body, count: 2 });
    expect(notYours.status).toBe(403);
    const notCollected = await as.lead.post(`/api/bundles/${fx.reservedBundleId}/raise-plants`, { ...body, count: 2 });
    expect(notCollected.status).toBe(400);
    expect(notCollected.body.error.fields.bundleId).toBeDefined();
    expect(await counts()).toEqual(before);
  });

  it('registers the plants in one go with the right parent, source bundle and codes', async () => {
    const before = await counts();
    const next = await nextPlantNumber(app.ctx.db, 'WTH');
    const r = await as.lead.post(`/api/bundles/${fx.bundleId}/raise-plants`, { farmId: fx.wthId, count: 3, role: 'stock_bed', plantingYear: 2026, bedRow: 'Nursery row 3' });
    expect(r.status).toBe(201);
    expect(r.body.total).toBe(3);
    const codes = [0, 1, 2].map((i) => `WTH-${String(next + i).padStart(4, '0')}`);
    expect(r.body.items.map((p: { code: string }) => p.code)).toEqual(codes);
    const made = await app.ctx.db.select().from(motherPlants).where(inArray(motherPlants.code, codes));
    expect(made).toHaveLength(3);
    for (const p of made) {
      expect(p).toMatchObject({
        farmId: fx.wthId,
        speciesId: fx.speciesId,
        varietyId: fx.varietyId,
        provenance: 'exchange',
        parentPlantId: fx.plantId,
        sourceBundleId: fx.bundleId,
        role: 'stock_bed',
        plantingYear: 2026,
        bedRow: 'Nursery row 3',
        createdBy: fx.leadId,
      });
    }
    const audits = await app.ctx.db
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.entity, 'mother_plant'), eq(auditLog.action, 'create'), inArray(auditLog.entityId, made.map((p) => p.id))));
    expect(audits).toHaveLength(3);
    const after = await counts();
    expect(after.plants).toBe(before.plants + 3);
    expect(after.audit).toBe(before.audit + 4);

    const mine = (await as.lead.get('/api/my/bundles')).body.items.find((x: { id: string }) => x.id === fx.bundleId);
    expect(mine.mayRaise).toBe(37);
    expect(mine.raisedPlants.map((p: { code: string }) => p.code).sort()).toEqual(codes);

    // The trace of the source plant now shows them as its children, through the bundle.
    const trace = await as.coordinator.get(`/api/mother-plants/${fx.plantId}/trace`);
    expect(trace.status).toBe(200);
    const children = trace.body.descendants.filter((d: { depth: number }) => d.depth === 1);
    expect(children.map((d: { code: string }) => d.code).sort()).toEqual(codes);
    for (const c of children) expect(c.via).toMatchObject({ bundleId: fx.bundleId, code: 'BT5-0001', seasonName: 'Test hardwood 2025–26', growerName: 'Tom Bevan' });

    // A report the raised plants rest on cannot be removed.
    const [rep] = await app.ctx.db.select().from(strikeReports).where(eq(strikeReports.bundleId, fx.bundleId));
    const del = await as.lead.delete(`/api/strike-reports/${rep.id}`);
    expect(del.status).toBe(409);
    expect((await counts()).reports).toBe(after.reports);
  });
});

describe('strike-report reminders', () => {
  it('go out once per due bundle, to its grower', async () => {
    // The last closed demo season's bundles are due on 1 June after their winter (north).
    const [{ y }] = await rows<{ y: number }>(sql`
      select max(extract(year from b.collected_at))::int as y from bundles b
      join allocation_rounds ar on ar.id = b.round_id join seasons s on s.id = ar.season_id
      where s.stage = 'closed' and b.status = 'collected' and s.name not like 'Test%'`);
    const now = new Date(`${y}-06-10T08:00:00Z`);
    // The rule, restated in SQL: due on the first 1 June (north) / 1 December (south) after
    // collection, 28 days after for leafy cuttings; sent from the due day for 182 days.
    const expected = await rows<{ id: string; email: string }>(sql`
      with c as (
        select b.id, u.email, s.kind, s.hemisphere, (b.collected_at at time zone f.timezone)::date as d
        from bundles b
        join allocation_rounds ar on ar.id = b.round_id
        join seasons s on s.id = ar.season_id
        join farms f on f.id = b.farm_id
        join "user" u on u.id = b.grower_id
        where b.status = 'collected' and u.status = 'active' and b.collected_at <= ${now.toISOString()}::timestamptz
          and not exists (select 1 from strike_reports r where r.bundle_id = b.id)
      ), due as (
        select c.id, c.email,
          case when c.kind = 'leafy_summer' then c.d + 28
               when c.hemisphere = 'north' then make_date(extract(year from c.d)::int + (case when c.d >= make_date(extract(year from c.d)::int, 6, 1) then 1 else 0 end), 6, 1)
               else make_date(extract(year from c.d)::int + (case when c.d >= make_date(extract(year from c.d)::int, 12, 1) then 1 else 0 end), 12, 1)
          end as due_on
        from c
      )
      select due.id, due.email from due
      where due.due_on <= ${now.toISOString().slice(0, 10)}::date and ${now.toISOString().slice(0, 10)}::date - due.due_on <= 182`);
    expect(expected.length).toBeGreaterThan(0);
    expect(expected.map((e) => e.email)).toContain('grower@heelwood.test');
    const mailsBefore = (await app.ctx.db.select({ n: count() }).from(mailbox))[0].n;

    const first = await runReminders(app.ctx, now);
    expect(first).toEqual({ due: expected.length, sent: expected.length, duplicate: 0, failed: 0 });
    const logged = await app.ctx.db.select().from(emailLog).where(eq(emailLog.kind, 'strike_reminder'));
    expect(new Set(logged.map((l) => l.dedupeKey))).toEqual(new Set(expected.map((e) => `strike-reminder:bundle:${e.id}`)));
    const mail = await waitForMail(app, 'grower@heelwood.test');
    expect(mail.subject).toMatch(/How did bundle B\d\d-\d{4} root\?/);
    expect(mail.textBody).toMatch(/how many you stuck and how many rooted/);
    // The link lands on the grower's collected bundles, where the report is filed.
    expect(mail.textBody).toContain(`${app.ctx.config.publicUrl.replace(/\/$/, '')}/my-bundles`);
    const until = Date.now() + 10_000;
    while ((await app.ctx.db.select({ n: count() }).from(mailbox))[0].n < mailsBefore + expected.length && Date.now() < until) await new Promise((r) => setTimeout(r, 100));
    const mailsAfterFirst = (await app.ctx.db.select({ n: count() }).from(mailbox))[0].n;
    expect(mailsAfterFirst).toBe(mailsBefore + expected.length);

    const second = await runReminders(app.ctx, now);
    expect(second.sent).toBe(0);
    expect(second.failed).toBe(0);
    await new Promise((r) => setTimeout(r, 500));
    expect((await app.ctx.db.select({ n: count() }).from(mailbox))[0].n).toBe(mailsAfterFirst);
    expect((await app.ctx.db.select({ n: count() }).from(emailLog).where(eq(emailLog.kind, 'strike_reminder')))[0].n).toBe(expected.length);

    // Nothing is due before the due day.
    const early = await runReminders(app.ctx, new Date(`${y}-05-31T08:00:00Z`));
    expect(early.due).toBe(0);
  });
});

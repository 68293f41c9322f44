// A season's figures on the demo cooperative, checked against sums computed here with plain
// SQL: wood by species and variety, fill ratios, travel, strike rates (against @stdlib's beta
// quantile), the value of plants raised; the member's narrower view; the CSV.
import betaQuantile from '@stdlib/stats-base-dists-beta-quantile';
import { type SQL, sql } from 'drizzle-orm';
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Treatment } from '../../shared/domain.js';
import type { SeasonFigures } from '../../shared/schemas/figures.js';
import { TREATMENT_ODDS_RATIO } from '../../shared/strike-rate.js';
import { Client } from '../fixtures/http.js';
import { startTestApp, type TestApp } from '../fixtures/test-app.js';

const DEMO_PASSWORD = 'heelwood-demo';

let app: TestApp;
const as: Record<'coordinator' | 'lead' | 'grower', Client> = {} as never;
let seasonId: string;
let figures: SeasonFigures;

/** A client signed in as one of the demo people. */
async function signedIn(email: string): Promise<Client> {
  const c = new Client(app.url);
  await c.signIn(email, DEMO_PASSWORD);
  return c;
}

async function rows<T>(query: SQL): Promise<T[]> {
  return ((await app.ctx.db.execute(query)) as unknown as { rows: T[] }).rows;
}

const key = (s: string, v: string | null) => `${s}|${v ?? ''}`;

beforeAll(async () => {
  app = await startTestApp({ seeded: true });
  for (const who of ['coordinator', 'lead', 'grower'] as const) as[who] = await signedIn(`${who}@heelwood.test`);
  // The latest closed season: offers, requests, bundles, collections and strike reports.
  const [s] = await rows<{ id: string }>(sql`select id from seasons where stage = 'closed' order by collection_start desc limit 1`);
  seasonId = s.id;
});
afterAll(async () => {
  await app?.close();
});

describe("a season's figures for the coordinator", () => {
  it('match wood offered, asked, allocated and collected summed with plain SQL', async () => {
    const r = await as.coordinator.get(`/api/seasons/${seasonId}/figures`);
    expect(r.status).toBe(200);
    figures = r.body;
    expect(figures.scope).toBe('cooperative');
    const offered = await rows<{ s: string; v: string | null; n: number }>(sql`
      select p.species_id as s, p.variety_id as v, sum(o.offered)::int as n
      from wood_offers o join mother_plants p on p.id = o.plant_id
      where o.season_id = ${seasonId} and o.withdrawn_at is null group by 1, 2`);
    const asked = await rows<{ s: string; v: string | null; n: number }>(sql`
      select l.species_id as s, l.variety_id as v, sum(l.cuttings)::int as n
      from request_lines l join wood_requests q on q.id = l.request_id
      where q.season_id = ${seasonId} and q.status = 'filed' group by 1, 2`);
    const bundled = await rows<{ s: string; v: string | null; status: string; n: number }>(sql`
      select p.species_id as s, p.variety_id as v, b.status, sum(b.cuttings)::int as n
      from bundles b join allocation_rounds r on r.id = b.round_id join mother_plants p on p.id = b.plant_id
      where r.season_id = ${seasonId} and r.status in ('approved', 'notified') group by 1, 2, 3`);
    const expected = new Map<string, { offered: number; asked: number; allocated: number; collected: number; cancelled: number }>();
    const at = (s: string, v: string | null) => {
      const k = key(s, v);
      if (!expected.has(k)) expected.set(k, { offered: 0, asked: 0, allocated: 0, collected: 0, cancelled: 0 });
      return expected.get(k)!;
    };
    for (const o of offered) at(o.s, o.v).offered += o.n;
    for (const q of asked) at(q.s, q.v).asked += q.n;
    for (const b of bundled) {
      if (b.status !== 'cancelled') at(b.s, b.v).allocated += b.n;
      if (b.status === 'collected') at(b.s, b.v).collected += b.n;
      if (b.status === 'cancelled') at(b.s, b.v).cancelled += b.n;
    }
    const got = new Map(figures.byVariety.map((x) => [key(x.speciesId, x.varietyId), { offered: x.offered, asked: x.asked, allocated: x.allocated, collected: x.collected, cancelled: x.cancelled }]));
    expect(got).toEqual(expected);
    const sum = (f: (x: { offered: number; asked: number; allocated: number; collected: number; cancelled: number }) => number) => [...expected.values()].reduce((s, x) => s + f(x), 0);
    expect(figures.totals).toEqual({ offered: sum((x) => x.offered), asked: sum((x) => x.asked), allocated: sum((x) => x.allocated), collected: sum((x) => x.collected), cancelled: sum((x) => x.cancelled) });
    expect(figures.totals.collected).toBeGreaterThan(0);
    for (const s of figures.bySpecies) {
      const mine = figures.byVariety.filter((x) => x.speciesId === s.speciesId);
      expect(s.offered).toBe(mine.reduce((t, x) => t + x.offered, 0));
      expect(s.collected).toBe(mine.reduce((t, x) => t + x.collected, 0));
    }
  });

  it('fill ratios per request line and their summary', async () => {
    const lines = await rows<{ id: string; asked: number; allocated: number }>(sql`
      select l.id, l.cuttings as asked,
        coalesce((select sum(b.cuttings) from bundles b join allocation_rounds r on r.id = b.round_id
                  where b.line_id = l.id and r.status in ('approved', 'notified') and b.status <> 'cancelled'), 0)::int as allocated
      from request_lines l join wood_requests q on q.id = l.request_id
      where q.season_id = ${seasonId} and q.status = 'filed'`);
    expect(figures.lines.length).toBe(lines.length);
    for (const l of figures.lines) {
      const e = lines.find((x) => x.id === l.lineId)!;
      expect({ asked: l.asked, allocated: l.allocated }).toEqual({ asked: e.asked, allocated: e.allocated });
      expect(l.ratio).toBeCloseTo(Math.min(1, e.allocated / e.asked), 12);
    }
    expect(figures.fill.lines).toBe(lines.length);
    expect(figures.fill.fullyMet).toBe(lines.filter((l) => l.allocated >= l.asked).length);
    expect(figures.fill.unmet).toBe(lines.filter((l) => l.allocated === 0).length);
    expect(figures.fill.partlyMet).toBe(lines.length - figures.fill.fullyMet - figures.fill.unmet);
    const totalAsked = lines.reduce((s, l) => s + l.asked, 0);
    expect(figures.fill.overallRatio).toBeCloseTo(lines.reduce((s, l) => s + l.allocated, 0) / totalAsked, 12);
    const mean = lines.reduce((s, l) => s + Math.min(1, l.allocated / l.asked), 0) / lines.length;
    expect(figures.fill.meanRatio).toBeCloseTo(mean, 12);
  });

  it('travel: the sum of bundle distances, and a round trip per grower', async () => {
    const [t] = await rows<{ m: number; n: number; growers: number }>(sql`
      select coalesce(sum(b.distance_m), 0)::float8 as m, count(*)::int as n, count(distinct b.grower_id)::int as growers
      from bundles b join allocation_rounds r on r.id = b.round_id
      where r.season_id = ${seasonId} and r.status in ('approved', 'notified') and b.status <> 'cancelled'`);
    expect(figures.travel.bundles).toBe(t.n);
    expect(figures.travel.bundleKm).toBeCloseTo(t.m / 1000, 1);
    expect(figures.travel.growers.length).toBe(t.growers);
    for (const g of figures.travel.growers) {
      expect(g.roundTripKm).not.toBeNull();
      // A round trip is at least twice the distance to the farthest farm visited.
      const [far] = await rows<{ m: number }>(sql`
        select max(b.distance_m)::float8 as m from bundles b join allocation_rounds r on r.id = b.round_id
        where r.season_id = ${seasonId} and r.status in ('approved', 'notified') and b.status <> 'cancelled' and b.grower_id = ${g.growerId}`);
      expect(g.roundTripKm!).toBeGreaterThanOrEqual((2 * far.m) / 1000 - 0.2);
    }
  });

  it("strike rates by species, variety and treatment from this season's reports", async () => {
    const sums = await rows<{ s: string; v: string | null; t: Treatment; n: number; stuck: number; rooted: number }>(sql`
      select p.species_id as s, p.variety_id as v, r.treatment as t, count(*)::int as n, sum(r.stuck)::int as stuck, sum(r.rooted)::int as rooted
      from strike_reports r join bundles b on b.id = r.bundle_id join allocation_rounds ar on ar.id = b.round_id join mother_plants p on p.id = b.plant_id
      where ar.season_id = ${seasonId} group by 1, 2, 3`);
    expect(sums.length).toBeGreaterThan(0);
    const priors = new Map(
      (await rows<{ id: string; p: string; w: number }>(sql`select id, strike_rate_prior as p, prior_strength as w from species`)).map((x) => [x.id, { p: Number(x.p), w: Number(x.w) }]),
    );
    const varietyRows = figures.strikeRates.filter((x) => x.level === 'variety');
    expect(varietyRows.length).toBe(sums.filter((x) => x.v !== null).length);
    const speciesKeys = new Set(sums.map((x) => `${x.s}|${x.t}`));
    expect(figures.strikeRates.filter((x) => x.level === 'species').length).toBe(speciesKeys.size);
    for (const row of figures.strikeRates) {
      const mine = sums.filter((x) => x.s === row.speciesId && x.t === row.treatment && (row.level === 'species' || x.v === row.varietyId));
      const stuck = mine.reduce((s, x) => s + x.stuck, 0);
      const rooted = mine.reduce((s, x) => s + x.rooted, 0);
      expect({ reports: row.reports, stuck: row.stuck, rooted: row.rooted }).toEqual({ reports: mine.reduce((s, x) => s + x.n, 0), stuck, rooted });
      expect(row.observed).toBeCloseTo(rooted / stuck, 12);
      const { p, w } = priors.get(row.speciesId)!;
      const odds = (p / (1 - p)) * TREATMENT_ODDS_RATIO[row.treatment];
      const prior = odds / (1 + odds);
      const a = prior * w + rooted;
      const b = (1 - prior) * w + stuck - rooted;
      expect(row.rate).toBeCloseTo(a / (a + b), 12);
      expect(row.low).toBeCloseTo(betaQuantile(0.05, a, b), 10);
      expect(row.high).toBeCloseTo(betaQuantile(0.95, a, b), 10);
    }
  });

  it('the value of plants raised and their first crop year', async () => {
    const raised = await rows<{ s: string; y: number; years: number; rooted: number }>(sql`
      select p.species_id as s, extract(year from b.collected_at)::int as y, sp.first_crop_years as years, sum(r.rooted)::int as rooted
      from strike_reports r join bundles b on b.id = r.bundle_id join allocation_rounds ar on ar.id = b.round_id
      join mother_plants p on p.id = b.plant_id join species sp on sp.id = p.species_id
      where ar.season_id = ${seasonId} group by 1, 2, 3`);
    const [{ v }] = await rows<{ v: number }>(sql`select (value->>'valuePerPlant')::int as v from settings where key = 'cooperative'`);
    expect(figures.raised.valuePerPlant).toBe(v);
    const total = raised.reduce((s, x) => s + x.rooted, 0);
    expect(figures.raised.rooted).toBe(total);
    expect(figures.raised.value).toBe(total * v);
    expect(new Set(figures.raised.bySpecies.map((x) => `${x.speciesId}|${x.collectionYear}|${x.firstCropYear}|${x.rooted}|${x.value}`))).toEqual(
      new Set(raised.map((x) => `${x.s}|${x.y}|${x.y + x.years}|${x.rooted}|${x.rooted * v}`)),
    );
    expect(figures.raised.byFirstCropYear.reduce((s, x) => s + x.value, 0)).toBe(total * v);
  });

  it('as CSV, the same figures', async () => {
    const r = await as.coordinator.get(`/api/seasons/${seasonId}/figures.csv`);
    expect(r.status).toBe(200);
    expect(r.headers.get('content-type')).toMatch(/^text\/csv/);
    expect(r.headers.get('content-disposition')).toMatch(/attachment; filename="heelwood-figures-.*\.csv"/);
    const parsed = Papa.parse<Record<string, string>>(r.text.replace(/^\ufeff/, ''), { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    const total = parsed.data.find((x) => x.section === 'total')!;
    expect(Number(total.offered)).toBe(figures.totals.offered);
    expect(Number(total.asked)).toBe(figures.totals.asked);
    expect(Number(total.allocated)).toBe(figures.totals.allocated);
    expect(Number(total.collected)).toBe(figures.totals.collected);
    expect(parsed.data.filter((x) => x.section === 'variety').length).toBe(figures.byVariety.length);
    expect(parsed.data.filter((x) => x.section.startsWith('strike_rate')).length).toBe(figures.strikeRates.length);
    const raisedValue = parsed.data.filter((x) => x.section === 'raised').reduce((s, x) => s + Number(x.estimated_value), 0);
    expect(raisedValue).toBe(figures.raised.value);
  });
});

describe("a member's figures", () => {
  it("cover the member's farms' offers and bundles and the member's own requests", async () => {
    const r = await as.lead.get(`/api/seasons/${seasonId}/figures`);
    expect(r.status).toBe(200);
    const f: SeasonFigures = r.body;
    expect(f.scope).toBe('member');
    const [me] = await rows<{ id: string; farm: string }>(sql`
      select u.id, m.farm_id as farm from "user" u join farm_memberships m on m.user_id = u.id where u.email = 'lead@heelwood.test'`);
    const [e] = await rows<{ offered: number; asked: number; allocated: number; collected: number }>(sql`
      select
        (select coalesce(sum(o.offered), 0)::int from wood_offers o join mother_plants p on p.id = o.plant_id
          where o.season_id = ${seasonId} and o.withdrawn_at is null and p.farm_id = ${me.farm}) as offered,
        (select coalesce(sum(l.cuttings), 0)::int from request_lines l join wood_requests q on q.id = l.request_id
          where q.season_id = ${seasonId} and q.status = 'filed' and q.grower_id = ${me.id}) as asked,
        (select coalesce(sum(b.cuttings), 0)::int from bundles b join allocation_rounds r on r.id = b.round_id
          where r.season_id = ${seasonId} and r.status in ('approved', 'notified') and b.status <> 'cancelled'
            and (b.farm_id = ${me.farm} or b.grower_id = ${me.id})) as allocated,
        (select coalesce(sum(b.cuttings), 0)::int from bundles b join allocation_rounds r on r.id = b.round_id
          where r.season_id = ${seasonId} and r.status in ('approved', 'notified') and b.status = 'collected'
            and (b.farm_id = ${me.farm} or b.grower_id = ${me.id})) as collected`);
    expect({ offered: f.totals.offered, asked: f.totals.asked, allocated: f.totals.allocated, collected: f.totals.collected }).toEqual(e);
    expect(f.totals.offered).toBeLessThan(figures.totals.offered);
    expect(f.travel.growers.every((g) => g.growerId === me.id)).toBe(true);
    expect(f.lines.every((l) => l.growerName === 'Tom Bevan')).toBe(true);

    // A member with no farm: their own requests and bundles only, never anyone's offers.
    const sam = (await as.grower.get(`/api/seasons/${seasonId}/figures`)).body as SeasonFigures;
    expect(sam.totals.offered).toBe(0);
  });

  it('answer 404 for an unknown season and 401 without sign-in', async () => {
    expect((await as.lead.get('/api/seasons/00000000-0000-4000-8000-000000000000/figures')).status).toBe(404);
    expect((await new Client(app.url).get(`/api/seasons/${seasonId}/figures`)).status).toBe(401);
    expect((await new Client(app.url).get(`/api/seasons/${seasonId}/figures.csv`)).status).toBe(401);
  });
});

// POST /api/planner/estimate over HTTP, on a copy of the demo cooperative: the answers are
// the shared functions' answers, with the strike rate learned from the demo strike reports.
import { type SQL, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Treatment } from '../../shared/domain.js';
import { chanceOfAtLeast, cuttingsForTarget, expectedEmptyPositions, fillProbability, planFigures } from '../../shared/planner.js';
import { priorRate, type ReportTotals, strikeRateFor } from '../../shared/strike-rate.js';
import { species } from '../../server/db/schema/index.js';
import { Client } from '../fixtures/http.js';
import { startTestApp, type TestApp } from '../fixtures/test-app.js';
import { makeUser } from '../fixtures/users.js';

let app: TestApp;
let grower: Client;

type SpeciesRow = { id: string; strikeRatePrior: number; priorStrength: number };

beforeAll(async () => {
  app = await startTestApp({ seeded: true });
  grower = new Client(app.url);
  await grower.signIn('grower@heelwood.test', 'heelwood-demo');
});
afterAll(() => app?.close());

/** Raw SQL rows; the app's Db type covers both drivers, so execute() is untyped. */
async function rows<T>(query: SQL): Promise<T[]> {
  return ((await app.ctx.db.execute(query)) as unknown as { rows: T[] }).rows;
}

const estimate = (body: unknown, who: Client = grower) => who.post('/api/planner/estimate', body);

async function speciesRow(id: string): Promise<SpeciesRow> {
  const r = await rows<{ strike_rate_prior: string; prior_strength: number }>(
    sql`select strike_rate_prior, prior_strength from species where id = ${id}`,
  );
  return { id, strikeRatePrior: Number(r[0].strike_rate_prior), priorStrength: Number(r[0].prior_strength) };
}

/**
 * Report totals counted independently of the service: through the bundle's own plant
 * (bundles.plant_id) rather than through its wood offer.
 */
async function totals(where: { speciesId: string; varietyId?: string; treatment: Treatment }): Promise<ReportTotals> {
  const r = await rows<{ reports: number; stuck: number; rooted: number }>(sql`
    select count(*)::int as reports, coalesce(sum(sr.stuck), 0)::int as stuck, coalesce(sum(sr.rooted), 0)::int as rooted
    from strike_reports sr join bundles b on b.id = sr.bundle_id join mother_plants mp on mp.id = b.plant_id
    where mp.species_id = ${where.speciesId} and sr.treatment = ${where.treatment}
      ${where.varietyId ? sql`and mp.variety_id = ${where.varietyId}` : sql``}`);
  const row = r[0];
  return { reports: Number(row.reports), stuck: Number(row.stuck), rooted: Number(row.rooted) };
}

describe('POST /api/planner/estimate', () => {
  it('refuses anyone not signed in', async () => {
    const r = await estimate({ positions: 10, strikeRate: 0.7 }, new Client(app.url));
    expect(r.status).toBe(401);
  });

  it('refuses an applicant not yet admitted', async () => {
    const pending = await makeUser(app, { status: 'pending' });
    const r = await estimate({ positions: 10, strikeRate: 0.7 }, pending.client);
    expect(r.status).toBe(403);
  });

  it('answers with the shared functions for a typed strike rate', async () => {
    const r = await estimate({ lengthM: 12.3, spacingM: 0.3, rows: 2, strikeRate: 0.8, target: { rooted: 60, confidence: 0.9 } });
    expect(r.status).toBe(200);
    // 12.3 m at 0.3 m: 41 gaps, 42 plants a row (exact decimal division), two rows.
    expect(r.body.positions).toBe(84);
    expect(r.body.cuttingsPerPosition).toBe(2); // common practice: CHECK-VALUES.md, 2 cuttings per position
    expect(r.body.cuttings).toBe(168);
    expect(r.body.fillProbability).toBe(fillProbability(0.8, 2));
    // published: spreadsheet BINOM.DIST documentation — P(X >= 1; n 2, p 0.8) = 0.96.
    expect(r.body.fillProbability).toBeCloseTo(0.96, 14);
    expect(r.body.expectedEmptyPositions).toBe(expectedEmptyPositions(84, 0.8, 2));
    expect(r.body.cuttingsForTarget).toBe(cuttingsForTarget(60, 0.8, 0.9));
    expect(r.body.targetChance).toBe(chanceOfAtLeast(r.body.cuttingsForTarget, 0.8, 60));
    expect(r.body.strikeRate).toMatchObject({ rate: 0.8, low: 0.8, high: 0.8, source: 'given', reports: 0 });
  });

  it('takes a number of positions and cuttings per position', async () => {
    const r = await estimate({ positions: 40, cuttingsPerPosition: 3, strikeRate: 0.6 });
    expect(r.status).toBe(200);
    const f = planFigures({ layout: { positions: 40 }, cuttingsPerPosition: 3, strikeRate: 0.6 });
    expect(r.body).toMatchObject({
      positions: 40,
      cuttings: 120,
      fillProbability: f.fillProbability,
      expectedEmptyPositions: f.expectedEmptyPositions,
    });
    expect(r.body).not.toHaveProperty('cuttingsForTarget');
  });

  it('learns the strike rate from reports on the variety, treatment by treatment', async () => {
    // The variety and treatment with the most reported cuttings in the demo data.
    const found = await rows<{ species_id: string; variety_id: string; treatment: Treatment }>(sql`
      select mp.species_id, mp.variety_id, sr.treatment
      from strike_reports sr join bundles b on b.id = sr.bundle_id join mother_plants mp on mp.id = b.plant_id
      where mp.variety_id is not null
      group by mp.species_id, mp.variety_id, sr.treatment
      order by sum(sr.stuck) desc, mp.variety_id, sr.treatment limit 1`);
    expect(found.length).toBe(1);
    const { species_id: speciesId, variety_id: varietyId, treatment } = found[0];
    const sp = await speciesRow(speciesId);
    const t = await totals({ speciesId, varietyId, treatment });
    expect(t.reports).toBeGreaterThan(0);
    const expected = strikeRateFor(sp, treatment, t);

    const r = await estimate({ lengthM: 30, spacingM: 1.2, rows: 1, speciesId, varietyId, treatment, target: { rooted: 20, confidence: 0.95 } });
    expect(r.status).toBe(200);
    expect(r.body.strikeRate).toMatchObject({ ...expected, source: 'reports', scope: 'variety', treatment });
    expect(r.body.strikeRate.low).toBeLessThan(r.body.strikeRate.rate);
    expect(r.body.strikeRate.high).toBeGreaterThan(r.body.strikeRate.rate);
    // 30 m at 1.2 m: 26 positions (the currant in-row spacing 0.9-1.2 m is published: Penn State Extension).
    expect(r.body.positions).toBe(26);
    expect(r.body.fillProbability).toBe(fillProbability(expected.rate, 2));
    expect(r.body.expectedEmptyPositions).toBe(expectedEmptyPositions(26, expected.rate, 2));
    expect(r.body.cuttingsForTarget).toBe(cuttingsForTarget(20, expected.rate, 0.95));
  });

  it('falls back to the whole species when the variety has no reports for the treatment', async () => {
    // A variety with no reports under a treatment that its species does have reports for.
    const found = await rows<{ species_id: string; variety_id: string; treatment: Treatment }>(sql`
      select v.species_id, v.id as variety_id, t.treatment
      from varieties v cross join (values ('none'), ('willow'), ('hormone'), ('both')) as t(treatment)
      where exists (select 1 from strike_reports sr join bundles b on b.id = sr.bundle_id join mother_plants mp on mp.id = b.plant_id
                    where mp.species_id = v.species_id and sr.treatment = t.treatment)
        and not exists (select 1 from strike_reports sr join bundles b on b.id = sr.bundle_id join mother_plants mp on mp.id = b.plant_id
                    where mp.variety_id = v.id and sr.treatment = t.treatment)
      order by v.id, t.treatment limit 1`);
    expect(found.length).toBe(1);
    const { species_id: speciesId, variety_id: varietyId, treatment } = found[0];
    const sp = await speciesRow(speciesId);
    const t = await totals({ speciesId, treatment });
    const expected = strikeRateFor(sp, treatment, t);

    const r = await estimate({ positions: 50, speciesId, varietyId, treatment });
    expect(r.status).toBe(200);
    expect(r.body.strikeRate).toMatchObject({ ...expected, source: 'reports', scope: 'species' });
    expect(r.body.fillProbability).toBe(fillProbability(expected.rate, 2));

    // With no variety named, the species' reports are used directly.
    const any = await estimate({ positions: 50, speciesId, treatment });
    expect(any.body.strikeRate).toMatchObject({ ...expected, scope: 'species' });
  });

  it('falls back to the reference rate for the treatment when nobody has reported', async () => {
    const [fresh] = await app.ctx.db
      .insert(species)
      .values({
        scientificName: 'Ribes planneria testis',
        commonName: 'Planner test currant',
        genus: 'Ribes',
        propagationMethods: ['hardwood'],
        defaultCuttingLengthCm: 25,
        defaultCuttingDiameterMm: 7,
        strikeRatePrior: 0.7,
        priorStrength: 20,
      })
      .returning({ id: species.id });
    const r = await estimate({ positions: 20, speciesId: fresh.id, treatment: 'willow' });
    expect(r.status).toBe(200);
    const expected = strikeRateFor({ strikeRatePrior: 0.7, priorStrength: 20 }, 'willow');
    expect(r.body.strikeRate).toMatchObject({ ...expected, source: 'prior', scope: 'prior', reports: 0 });
    expect(r.body.strikeRate.rate).toBeCloseTo(priorRate(0.7, 'willow'), 15);
    // common practice: CHECK-VALUES.md — Ribes hardwood with a willow soak strikes about 70-80 %.
    expect(r.body.strikeRate.rate).toBeGreaterThanOrEqual(0.7);
    expect(r.body.strikeRate.rate).toBeLessThanOrEqual(0.8);
    // Treatment defaults to none: the untreated reference.
    const none = await estimate({ positions: 20, speciesId: fresh.id });
    expect(none.body.strikeRate.rate).toBeCloseTo(0.7, 15);
  });

  describe('refuses bad input with 400 naming the field', () => {
    const refused = async (body: unknown, field: string) => {
      const r = await estimate(body);
      expect(r.status).toBe(400);
      expect(r.body.error.code).toBe('invalid_input');
      expect(r.body.error.fields).toHaveProperty([field]);
      return r;
    };

    it('a negative length', () => refused({ lengthM: -12, spacingM: 0.3, rows: 1, strikeRate: 0.7 }, 'lengthM'));
    it('a length over 10 km', () => refused({ lengthM: 12_000, spacingM: 0.3, rows: 1, strikeRate: 0.7 }, 'lengthM'));
    it('a spacing longer than the row', () => refused({ lengthM: 3, spacingM: 4, rows: 1, strikeRate: 0.7 }, 'spacingM'));
    it('rows outside 1..20', () => refused({ lengthM: 30, spacingM: 1, rows: 21, strikeRate: 0.7 }, 'rows'));
    it('a confidence of 1.2', () =>
      refused({ positions: 10, strikeRate: 0.7, target: { rooted: 10, confidence: 1.2 } }, 'target.confidence'));
    it('a strike rate of 1', () => refused({ positions: 10, strikeRate: 1 }, 'strikeRate'));
    it('both layouts at once', () => refused({ positions: 10, lengthM: 30, spacingM: 1, rows: 1, strikeRate: 0.7 }, 'positions'));
    it('a strike rate and a species at once', async () => {
      const [row] = await app.ctx.db.select({ id: species.id }).from(species).limit(1);
      await refused({ positions: 10, strikeRate: 0.7, speciesId: row.id }, 'strikeRate');
    });
    it('no strike rate and no species', () => refused({ positions: 10 }, 'speciesId'));
    it('an unknown species', () => refused({ positions: 10, speciesId: '00000000-0000-4000-8000-000000000000' }, 'speciesId'));
    it('a variety of another species', async () => {
      const r = await rows<{ species_id: string; variety_id: string }>(sql`
        select s.id as species_id, v.id as variety_id from species s join varieties v on v.species_id <> s.id limit 1`);
      await refused({ positions: 10, speciesId: r[0].species_id, varietyId: r[0].variety_id }, 'varietyId');
    });
  });
});

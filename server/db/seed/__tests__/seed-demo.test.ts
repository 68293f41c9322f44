// The demo seed writes a whole, consistent cooperative into an empty database, once.
import path from 'node:path';
import { hashPassword, verifyPassword } from 'better-auth/crypto';
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openDatabase, type Database } from '../../client.js';
import { buildDemo, seedDemo, type SeedSummary } from '../seed-demo.js';

const migrationsFolder = path.resolve(import.meta.dirname, '../../../../drizzle');

let database: Database;
let summary: SeedSummary;
let seedMs = 0;
const now = new Date();

async function rows<T = Record<string, unknown>>(query: ReturnType<typeof sql>): Promise<T[]> {
  const result = (await database.db.execute(query)) as unknown as { rows: T[] };
  return result.rows;
}

async function one<T = Record<string, unknown>>(query: ReturnType<typeof sql>): Promise<T> {
  const [row] = await rows<T>(query);
  return row;
}

const TABLES = [
  'user',
  'account',
  'settings',
  'farms',
  'farm_memberships',
  'species',
  'varieties',
  'pests',
  'mother_plants',
  'inspections',
  'findings',
  'district_notes',
  'seasons',
  'pickup_windows',
  'wood_offers',
  'wood_requests',
  'request_lines',
  'allocation_rounds',
  'bundles',
  'strike_reports',
  'audit_log',
];

async function tableCounts(): Promise<Record<string, number>> {
  const out: Record<string, number> = {};
  for (const table of TABLES) {
    const r = await one<{ n: number }>(sql.raw(`select count(*)::int as n from "${table}"`));
    out[table] = r.n;
  }
  return out;
}

beforeAll(async () => {
  database = await openDatabase({ migrationsFolder });
  await database.migrate();
  const started = performance.now();
  summary = await seedDemo(database.db, { hashPassword, now });
  seedMs = performance.now() - started;
}, 120_000);

afterAll(async () => {
  await database?.close();
});

describe('demo seed', () => {
  it('reports what it wrote, and the counts match the tables', async () => {
    const c = await tableCounts();
    expect(summary.users).toBe(c.user);
    expect(summary.farms).toBe(c.farms);
    expect(summary.species).toBe(c.species);
    expect(summary.varieties).toBe(c.varieties);
    expect(summary.plants).toBe(c.mother_plants);
    expect(summary.inspections).toBe(c.inspections);
    expect(summary.seasons).toBe(c.seasons);
    expect(summary.bundles).toBe(c.bundles);
    expect(summary.strikeReports).toBe(c.strike_reports);
    // One transaction of bulk inserts: about 2-3 s on an idle machine (hashing included).
    // The bound only catches a regression to row-by-row writes; loaded CI machines are slow.
    console.info(`demo seed: ${Math.round(seedMs)} ms`, JSON.stringify(summary));
    expect(seedMs).toBeLessThan(60_000);
  });

  it('holds a cooperative of realistic size', async () => {
    const c = await tableCounts();
    expect(c.farms).toBeGreaterThanOrEqual(6);
    expect(c.species).toBeGreaterThanOrEqual(10);
    expect(c.varieties).toBeGreaterThanOrEqual(30);
    expect(c.mother_plants).toBeGreaterThanOrEqual(150);
    expect(c.pests).toBeGreaterThanOrEqual(7);
    const statuses = await rows<{ health_status: string; n: number }>(
      sql`select health_status, count(*)::int as n from mother_plants group by health_status`,
    );
    expect(statuses.map((s) => s.health_status).sort()).toEqual(['clean', 'hold', 'retired', 'watch']);
    const clean = statuses.find((s) => s.health_status === 'clean')!;
    expect(clean.n).toBeGreaterThan(c.mother_plants / 2);
  });

  it('creates the four demo sign-ins with their roles', async () => {
    const people = await rows<{ email: string; role: string; status: string; farm_role: string | null; farm_id: string | null; home_lat: number | null }>(sql`
      select u.email, u.role, u.status, m.farm_role, m.farm_id, u.home_lat
      from "user" u left join farm_memberships m on m.user_id = u.id
      where u.email in ('coordinator@heelwood.test', 'lead@heelwood.test', 'hand@heelwood.test', 'grower@heelwood.test')`);
    const by = Object.fromEntries(people.map((p) => [p.email, p]));
    expect(people).toHaveLength(4);
    expect(by['coordinator@heelwood.test']).toMatchObject({ role: 'coordinator', status: 'active' });
    expect(by['lead@heelwood.test']).toMatchObject({ role: 'member', status: 'active', farm_role: 'lead' });
    expect(by['hand@heelwood.test']).toMatchObject({ role: 'member', status: 'active', farm_role: 'hand' });
    expect(by['hand@heelwood.test'].farm_id).toBe(by['lead@heelwood.test'].farm_id);
    expect(by['grower@heelwood.test']).toMatchObject({ role: 'member', status: 'active', farm_role: null });
    expect(by['grower@heelwood.test'].home_lat).not.toBeNull();

    const others = await one<{ pending: number; suspended: number }>(sql`
      select count(*) filter (where status = 'pending' and application is not null and place_name is not null)::int as pending,
             count(*) filter (where status = 'suspended')::int as suspended
      from "user"`);
    expect(others).toEqual({ pending: 2, suspended: 1 });
    const leadless = await one<{ n: number }>(sql`
      select count(*)::int as n from farms f
      where not exists (select 1 from farm_memberships m where m.farm_id = f.id and m.farm_role = 'lead')`);
    expect(leadless.n).toBe(0);
  });

  it('stores a credential every demo user can sign in with', async () => {
    const accounts = await rows<{ password: string; provider_id: string; account_id: string; user_id: string }>(
      sql`select password, provider_id, account_id, user_id from account`,
    );
    expect(accounts.length).toBe(summary.users);
    for (const a of accounts) {
      expect(a.provider_id).toBe('credential');
      expect(a.account_id).toBe(a.user_id);
    }
    expect(await verifyPassword({ hash: accounts[0].password, password: 'heelwood-demo' })).toBe(true);
    expect(await verifyPassword({ hash: accounts[0].password, password: 'wrong password' })).toBe(false);
  });

  it('has exactly one season that is not closed, open for requests about three weeks ahead', async () => {
    const open = await rows<{ stage: string; request_deadline: Date; collection_start: string; collection_end: string; hemisphere: string }>(
      sql`select stage, request_deadline, collection_start::text, collection_end::text, hemisphere from seasons where stage <> 'closed'`,
    );
    expect(open).toHaveLength(1);
    expect(open[0].stage).toBe('requests_open');
    expect(open[0].hemisphere).toBe('north');
    const days = (new Date(open[0].request_deadline).getTime() - now.getTime()) / 86_400_000;
    expect(days).toBeGreaterThan(19);
    expect(days).toBeLessThan(23);
    expect(open[0].collection_end >= open[0].collection_start).toBe(true);
    const closed = await one<{ n: number }>(sql`
      select count(*)::int as n from seasons s
      where s.stage = 'closed' and s.kind = 'dormant_hardwood'
        and exists (select 1 from allocation_rounds r where r.season_id = s.id and r.status = 'approved' and r.approved_at is not null)`);
    expect(closed.n).toBeGreaterThanOrEqual(3);
  });

  it('traces a lineage at least four generations deep from the root', async () => {
    const root = await one<{ provenance: string; parent_plant_id: string | null }>(
      sql`select provenance, parent_plant_id from mother_plants where code = ${summary.lineageRootCode}`,
    );
    expect(root).toMatchObject({ provenance: 'bought', parent_plant_id: null });
    const depth = await one<{ depth: number; n: number }>(sql`
      with recursive tree as (
        select id, 1 as depth from mother_plants where code = ${summary.lineageRootCode}
        union all
        select c.id, t.depth + 1 from mother_plants c join tree t on c.parent_plant_id = t.id
      )
      select max(depth)::int as depth, count(*)::int as n from tree`);
    expect(depth.depth).toBeGreaterThanOrEqual(4);
    // Every plant raised through the exchange names its parent and a collected bundle from it.
    const bad = await one<{ n: number }>(sql`
      select count(*)::int as n from mother_plants p
      left join bundles b on b.id = p.source_bundle_id
      where p.provenance = 'exchange'
        and (p.parent_plant_id is null or b.id is null or b.plant_id <> p.parent_plant_id or b.status <> 'collected')`);
    expect(bad.n).toBe(0);
    const sideBranch = await one<{ n: number }>(sql`
      select count(*)::int as n from (select parent_plant_id from mother_plants where parent_plant_id is not null group by 1 having count(*) >= 2) x`);
    expect(sideBranch.n).toBeGreaterThan(0);
  });

  it('offers no wood in the open season from a plant that is not clean or not inspected recently', async () => {
    const offers = await one<{ total: number; not_clean: number; stale: number }>(sql`
      select count(*)::int as total,
             count(*) filter (where p.health_status <> 'clean')::int as not_clean,
             count(*) filter (where p.last_inspected_on is null or p.last_inspected_on < (${now.toISOString()}::timestamptz - interval '12 months')::date)::int as stale
      from wood_offers o join seasons s on s.id = o.season_id join mother_plants p on p.id = o.plant_id
      where s.stage <> 'closed'`);
    expect(offers.total).toBeGreaterThan(50);
    expect(offers.not_clean).toBe(0);
    expect(offers.stale).toBe(0);
    const stalePlants = await one<{ n: number }>(sql`
      select count(*)::int as n from mother_plants
      where health_status = 'clean' and (last_inspected_on is null or last_inspected_on < (${now.toISOString()}::timestamptz - interval '12 months')::date)`);
    expect(stalePlants.n).toBeGreaterThan(0);
  });

  it('keeps health statuses consistent with inspections and the audit log', async () => {
    const retired = await one<{ n: number }>(sql`select count(*)::int as n from mother_plants where health_status = 'retired' and retired_at is null`);
    expect(retired.n).toBe(0);
    // A plant on hold was last inspected with a finding that travels in wood.
    const holds = await one<{ n: number; ok: number }>(sql`
      select count(*)::int as n,
             count(*) filter (where exists (
               select 1 from inspections i join findings f on f.inspection_id = i.id join pests x on x.id = f.pest_id
               where i.plant_id = p.id and i.inspected_on = p.last_inspected_on and x.travels_in_wood))::int as ok
      from mother_plants p where p.health_status = 'hold'`);
    expect(holds.n).toBeGreaterThan(0);
    expect(holds.ok).toBe(holds.n);
    // A plant on watch has a minor finding of a pest that does not travel in wood.
    const watch = await one<{ n: number; ok: number }>(sql`
      select count(*)::int as n,
             count(*) filter (where exists (
               select 1 from inspections i join findings f on f.inspection_id = i.id join pests x on x.id = f.pest_id
               where i.plant_id = p.id and i.inspected_on = p.last_inspected_on and not x.travels_in_wood and f.severity = 'minor'))::int as ok
      from mother_plants p where p.health_status = 'watch'`);
    expect(watch.ok).toBe(watch.n);
    const unaudited = await one<{ n: number }>(sql`
      select count(*)::int as n from mother_plants p
      where p.health_status <> 'clean'
        and not exists (select 1 from audit_log a where a.entity = 'mother_plant' and a.entity_id = p.id::text and a.action = 'status' and a.after->>'healthStatus' = p.health_status)`);
    expect(unaudited.n).toBe(0);
  });

  it('keeps the exchange history within the database rules', async () => {
    // Strike reports come the September after a winter's collection: look at bundles old
    // enough to have been assessed.
    const b = await one<{ collected: number; cancelled: number; due: number; reported: number; bad_reports: number; over_reserved: number }>(sql`
      select
        (select count(*)::int from bundles where status = 'collected') as collected,
        (select count(*)::int from bundles where status = 'cancelled') as cancelled,
        (select count(*)::int from bundles where status = 'collected' and collected_at < ${now.toISOString()}::timestamptz - interval '10 months') as due,
        (select count(*)::int from bundles b where b.status = 'collected' and b.collected_at < ${now.toISOString()}::timestamptz - interval '10 months'
           and exists (select 1 from strike_reports r where r.bundle_id = b.id)) as reported,
        (select count(*)::int from strike_reports r join bundles b on b.id = r.bundle_id where r.stuck > b.cuttings or b.status <> 'collected') as bad_reports,
        (select count(*)::int from wood_offers o where o.reserved <> coalesce((select sum(cuttings) from bundles b where b.offer_id = o.id and b.status <> 'cancelled'), 0)) as over_reserved`);
    expect(b.collected).toBeGreaterThan(50);
    expect(b.cancelled).toBeGreaterThan(0);
    expect(b.due).toBeGreaterThan(40);
    expect(b.reported).toBeGreaterThan(b.due * 0.6);
    expect(b.bad_reports).toBe(0);
    expect(b.over_reserved).toBe(0);
    const grower = await one<{ open_requests: number }>(sql`
      select count(*)::int as open_requests from wood_requests q join seasons s on s.id = q.season_id join "user" u on u.id = q.grower_id
      where s.stage <> 'closed' and u.email = 'grower@heelwood.test'`);
    expect(grower.open_requests).toBe(0);
    const openRequests = await one<{ n: number; any_variety: number; by_variety: number }>(sql`
      select count(*)::int as n,
             count(*) filter (where l.variety_id is null)::int as any_variety,
             count(*) filter (where l.variety_id is not null)::int as by_variety
      from request_lines l join wood_requests q on q.id = l.request_id join seasons s on s.id = q.season_id where s.stage <> 'closed'`);
    expect(openRequests.any_variety).toBeGreaterThan(0);
    expect(openRequests.by_variety).toBeGreaterThan(0);
  });

  it('lays plants out in beds on their own farm, in the cooperative\'s region', async () => {
    const spread = await one<{ far: number; shared: number; outside: number }>(sql`
      select
        count(*) filter (where greatest(abs(p.lat - f.lat) * 111000, abs(p.lon - f.lon) * 68000) > 150)::int as far,
        (count(*) - count(distinct (p.lat, p.lon)))::int as shared,
        (select count(*)::int from farms where lat not between 51.9 and 52.3 or lon not between -3.0 and -2.4) as outside
      from mother_plants p join farms f on f.id = p.farm_id`);
    expect(spread).toEqual({ far: 0, shared: 0, outside: 0 });
  });

  it('lets a trace from a plant on hold find wood it gave after its last clean inspection', async () => {
    const exposed = await one<{ plants: number; bundles: number; raised: number }>(sql`
      with last_clean as (
        select p.id, max(i.inspected_on) as on_date from mother_plants p
        join inspections i on i.plant_id = p.id
        where p.health_status = 'hold' and not exists (select 1 from findings f where f.inspection_id = i.id)
        group by p.id
      )
      select count(distinct b.plant_id)::int as plants, count(*)::int as bundles,
             count(c.id)::int as raised
      from last_clean lc
      join bundles b on b.plant_id = lc.id and b.status = 'collected' and b.collected_at::date > lc.on_date
      left join mother_plants c on c.source_bundle_id = b.id`);
    expect(exposed.plants).toBeGreaterThan(0);
    expect(exposed.bundles).toBeGreaterThanOrEqual(2);
    expect(exposed.raised).toBeGreaterThan(0);
  });

  it('builds the same cooperative every time for the same moment', () => {
    const a = buildDemo(now, 'hash');
    const b = buildDemo(now, 'hash');
    expect(b.rows).toEqual(a.rows);
    expect(b.summary).toEqual(a.summary);
  });

  it('refuses to run on a database that has data, and writes nothing', async () => {
    const before = await tableCounts();
    await expect(seedDemo(database.db, { hashPassword, now })).rejects.toThrow('database already has data; demo seed skipped');
    expect(await tableCounts()).toEqual(before);
  });
});

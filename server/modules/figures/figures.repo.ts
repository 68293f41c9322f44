// The season's sums, as grouped queries. Raw SQL with every column qualified by its alias
// (DEVELOPERS.md), and one scope fragment per query: the whole cooperative, or a member's
// farms and own requests.
import { sql, type SQL } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client.js';

async function rows<T>(db: DbOrTx, query: SQL): Promise<T[]> {
  const result = (await db.execute(query)) as unknown as { rows: T[] };
  return result.rows;
}

/** Who the figures are for: everything, or one member's farms and own requests and bundles. */
export type FiguresScope = { all: true } | { all: false; userId: string; farmIds: string[] };

function uuidList(ids: string[]): SQL {
  return sql.join(
    ids.map((id) => sql`${id}::uuid`),
    sql`, `,
  );
}

/** Offers: on the member's farms. */
function offerScope(s: FiguresScope): SQL {
  if (s.all) return sql``;
  return s.farmIds.length ? sql`and mp.farm_id in (${uuidList(s.farmIds)})` : sql`and false`;
}

/** Request lines: the member's own. */
function requestScope(s: FiguresScope): SQL {
  return s.all ? sql`` : sql`and q.grower_id = ${s.userId}`;
}

/** Bundles: given by the member's farms or received by the member. */
export function bundleScope(s: FiguresScope): SQL {
  if (s.all) return sql``;
  return s.farmIds.length ? sql`and (b.farm_id in (${uuidList(s.farmIds)}) or b.grower_id = ${s.userId})` : sql`and b.grower_id = ${s.userId}`;
}

type Keyed = { species_id: string; variety_id: string | null };

/** Cuttings offered this season (withdrawn offers left out), by the plant's species and variety. */
export function offeredBy(db: DbOrTx, seasonId: string, s: FiguresScope) {
  return rows<Keyed & { offered: number }>(
    db,
    sql`select mp.species_id, mp.variety_id, coalesce(sum(o.offered), 0)::int as offered
        from wood_offers o join mother_plants mp on mp.id = o.plant_id
        where o.season_id = ${seasonId}::uuid and o.withdrawn_at is null ${offerScope(s)}
        group by mp.species_id, mp.variety_id`,
  );
}

/** Cuttings asked in filed requests, by the line's species and variety (null: any variety). */
export function askedBy(db: DbOrTx, seasonId: string, s: FiguresScope) {
  return rows<Keyed & { asked: number }>(
    db,
    sql`select l.species_id, l.variety_id, coalesce(sum(l.cuttings), 0)::int as asked
        from request_lines l join wood_requests q on q.id = l.request_id
        where q.season_id = ${seasonId}::uuid and q.status = 'filed' ${requestScope(s)}
        group by l.species_id, l.variety_id`,
  );
}

/**
 * Cuttings in bundles of approved rounds, by the wood's species and variety: allocated (not
 * cancelled), collected, cancelled.
 */
export function bundledBy(db: DbOrTx, seasonId: string, s: FiguresScope) {
  return rows<Keyed & { allocated: number; collected: number; cancelled: number }>(
    db,
    sql`select mp.species_id, mp.variety_id,
               coalesce(sum(b.cuttings) filter (where b.status <> 'cancelled'), 0)::int as allocated,
               coalesce(sum(b.cuttings) filter (where b.status = 'collected'), 0)::int as collected,
               coalesce(sum(b.cuttings) filter (where b.status = 'cancelled'), 0)::int as cancelled
        from bundles b
        join allocation_rounds ar on ar.id = b.round_id
        join mother_plants mp on mp.id = b.plant_id
        where ar.season_id = ${seasonId}::uuid and ar.status in ('approved', 'notified') ${bundleScope(s)}
        group by mp.species_id, mp.variety_id`,
  );
}

export type LineRow = {
  line_id: string;
  grower_name: string;
  species_name: string;
  variety_name: string | null;
  asked: number;
  allocated: number;
  collected: number;
};

/** Every filed request line in scope with what approved bundles gave it. */
export function lineFills(db: DbOrTx, seasonId: string, s: FiguresScope) {
  return rows<LineRow>(
    db,
    sql`select l.id as line_id, u.name as grower_name, sp.common_name as species_name, v.name as variety_name, l.cuttings as asked,
               coalesce(sum(b.cuttings) filter (where b.status <> 'cancelled' and ar.id is not null), 0)::int as allocated,
               coalesce(sum(b.cuttings) filter (where b.status = 'collected' and ar.id is not null), 0)::int as collected
        from request_lines l
        join wood_requests q on q.id = l.request_id
        join "user" u on u.id = q.grower_id
        join species sp on sp.id = l.species_id
        left join varieties v on v.id = l.variety_id
        left join bundles b on b.line_id = l.id
        left join allocation_rounds ar on ar.id = b.round_id and ar.status in ('approved', 'notified')
        where q.season_id = ${seasonId}::uuid and q.status = 'filed' ${requestScope(s)}
        group by l.id, u.name, sp.common_name, v.name, l.cuttings
        order by u.name, sp.common_name, v.name nulls first, l.id`,
  );
}

export type TravelRow = {
  grower_id: string;
  grower_name: string;
  farm_id: string;
  farm_lat: number;
  farm_lon: number;
  distance_m: number | null;
  start_lat: number | null;
  start_lon: number | null;
};

/** Allocated bundles in scope with the farm's place and the grower's starting point. */
export function travelRows(db: DbOrTx, seasonId: string, s: FiguresScope) {
  return rows<TravelRow>(
    db,
    sql`select b.grower_id, u.name as grower_name, b.farm_id, fa.lat as farm_lat, fa.lon as farm_lon, b.distance_m,
               coalesce(q.destination_lat, u.home_lat) as start_lat, coalesce(q.destination_lon, u.home_lon) as start_lon
        from bundles b
        join allocation_rounds ar on ar.id = b.round_id
        join "user" u on u.id = b.grower_id
        join farms fa on fa.id = b.farm_id
        left join wood_requests q on q.season_id = ar.season_id and q.grower_id = b.grower_id
        where ar.season_id = ${seasonId}::uuid and ar.status in ('approved', 'notified') and b.status <> 'cancelled' ${bundleScope(s)}
        order by u.name, b.grower_id`,
  );
}

export type RaisedSqlRow = { species_id: string; species_name: string; first_crop_years: number; collection_year: number; rooted: number };

/**
 * Rooted cuttings reported on this season's bundles, by species and the calendar year the
 * wood was collected (at the giving farm). Pooled along the same bundle -> offer -> plant path
 * as strike-reports.repo.ts.
 */
export function raisedBy(db: DbOrTx, seasonId: string, s: FiguresScope) {
  return rows<RaisedSqlRow>(
    db,
    sql`select mp.species_id, sp.common_name as species_name, sp.first_crop_years,
               extract(year from (b.collected_at at time zone fa.timezone))::int as collection_year,
               coalesce(sum(sr.rooted), 0)::int as rooted
        from strike_reports sr
        join bundles b on b.id = sr.bundle_id
        join wood_offers o on o.id = b.offer_id
        join mother_plants mp on mp.id = o.plant_id
        join species sp on sp.id = mp.species_id
        join farms fa on fa.id = b.farm_id
        where o.season_id = ${seasonId}::uuid and b.collected_at is not null ${bundleScope(s)}
        group by mp.species_id, sp.common_name, sp.first_crop_years, extract(year from (b.collected_at at time zone fa.timezone))
        order by sp.common_name, collection_year`,
  );
}

// Lineage queries: recursive CTEs over mother_plants.parent_plant_id (ancestors) and over
// parent_plant_id or source_bundle_id -> bundles.plant_id (descendants). Raw SQL with every
// column qualified by its table alias (DEVELOPERS.md: no bare columns in sql templates).
// Each walk keeps the path it took, so a cycle in bad data ends the walk instead of looping,
// and stops at MAX_DEPTH generations.
import { sql, type SQL } from 'drizzle-orm';
import type { BundleStatus, HealthStatus, Severity } from '../../../shared/domain.js';
import type { DbOrTx } from '../../db/client.js';

export const MAX_DEPTH = 100;

async function rows<T>(db: DbOrTx, query: SQL): Promise<T[]> {
  const result = (await db.execute(query)) as unknown as { rows: T[] };
  return result.rows;
}

export type NodeRow = {
  id: string;
  code: string;
  farm_id: string;
  farm_name: string;
  species_name: string;
  variety_name: string | null;
  health_status: HealthStatus;
  depth: number;
  parent_id: string | null;
  via_bundle_id: string | null;
  via_code: string | null;
  via_season_id: string | null;
  via_season_name: string | null;
  via_grower_id: string | null;
  via_grower_name: string | null;
};

/** Columns of a trace node, from a CTE `t(id, parent_id, depth)` joined as `t`. */
const NODE_COLUMNS = sql.raw(`
  mp.id, mp.code, mp.farm_id, f.name as farm_name, s.common_name as species_name, v.name as variety_name,
  mp.health_status, t.depth::int as depth, t.parent_id,
  sb.id as via_bundle_id, sb.code as via_code, se.id as via_season_id, se.name as via_season_name,
  sb.grower_id as via_grower_id, gu.name as via_grower_name`);

const NODE_JOINS = sql.raw(`
  join mother_plants mp on mp.id = t.id
  join farms f on f.id = mp.farm_id
  join species s on s.id = mp.species_id
  left join varieties v on v.id = mp.variety_id
  left join bundles sb on sb.id = mp.source_bundle_id
  left join allocation_rounds ar on ar.id = sb.round_id
  left join seasons se on se.id = ar.season_id
  left join "user" gu on gu.id = sb.grower_id`);

/** The plant itself as a node (depth 0). */
export async function selfNode(db: DbOrTx, plantId: string): Promise<NodeRow | undefined> {
  const [row] = await rows<NodeRow>(
    db,
    sql`with t(id, parent_id, depth) as (select p.id, p.parent_plant_id, 0 from mother_plants p where p.id = ${plantId}::uuid)
        select ${NODE_COLUMNS} from t ${NODE_JOINS}`,
  );
  return row;
}

/** Parent, grandparent … up the parent_plant_id links; depth 1 is the parent. */
export function ancestors(db: DbOrTx, plantId: string): Promise<NodeRow[]> {
  return rows<NodeRow>(
    db,
    sql`with recursive up(id, depth, path) as (
          select p.parent_plant_id, 1, array[p.id, p.parent_plant_id]
          from mother_plants p
          where p.id = ${plantId}::uuid and p.parent_plant_id is not null
          union all
          select p.parent_plant_id, up.depth + 1, up.path || p.parent_plant_id
          from up join mother_plants p on p.id = up.id
          where p.parent_plant_id is not null and not p.parent_plant_id = any(up.path) and up.depth < ${MAX_DEPTH}
        ),
        t(id, parent_id, depth) as (
          select up.id, p.parent_plant_id, up.depth from up join mother_plants p on p.id = up.id
        )
        select ${NODE_COLUMNS} from t ${NODE_JOINS}
        order by t.depth`,
  );
}

/**
 * `down(id, parent_id, depth)`: every plant raised from `rootId` or from a plant raised from
 * it, at its nearest depth. A child is a plant whose parent_plant_id is the plant, or whose
 * source bundle was taken from the plant (the two agree in clean data; either is enough).
 */
function descendantsCte(rootId: string): SQL {
  return sql`with recursive walk(id, parent_id, depth, path) as (
      select c.id, ${rootId}::uuid, 1, array[${rootId}::uuid, c.id]
      from mother_plants c
      left join bundles csb on csb.id = c.source_bundle_id
      where c.id <> ${rootId}::uuid and (c.parent_plant_id = ${rootId}::uuid or csb.plant_id = ${rootId}::uuid)
      union all
      select c.id, walk.id, walk.depth + 1, walk.path || c.id
      from walk
      join (mother_plants c left join bundles csb on csb.id = c.source_bundle_id)
        on c.parent_plant_id = walk.id or csb.plant_id = walk.id
      where not c.id = any(walk.path) and walk.depth < ${MAX_DEPTH}
    ),
    down(id, parent_id, depth) as (
      select distinct on (walk.id) walk.id, walk.parent_id, walk.depth from walk order by walk.id, walk.depth, walk.parent_id
    )`;
}

export function descendants(db: DbOrTx, plantId: string): Promise<NodeRow[]> {
  return rows<NodeRow>(
    db,
    sql`${descendantsCte(plantId)}
        select ${NODE_COLUMNS} from down t ${NODE_JOINS}
        order by t.depth, mp.code`,
  );
}

export type BundleRow = {
  id: string;
  code: string | null;
  status: BundleStatus;
  cuttings: number;
  collected_at: Date | string | null;
  collected_on: string | null;
  season_id: string;
  season_name: string;
  grower_id: string;
  grower_name: string;
  grower_email: string;
  grower_status: string;
  plant_id: string;
  plant_code: string;
  farm_id: string;
  farm_name: string;
  raised: number;
};

const BUNDLE_COLUMNS = sql.raw(`
  b.id, b.code, b.status, b.cuttings, b.collected_at,
  to_char((b.collected_at at time zone fa.timezone)::date, 'YYYY-MM-DD') as collected_on,
  se.id as season_id, se.name as season_name,
  b.grower_id, u.name as grower_name, u.email as grower_email, u.status as grower_status,
  b.plant_id, mp.code as plant_code, b.farm_id, fa.name as farm_name,
  (select count(*)::int from mother_plants r where r.source_bundle_id = b.id) as raised`);

const BUNDLE_JOINS = sql.raw(`
  join allocation_rounds ar on ar.id = b.round_id
  join seasons se on se.id = ar.season_id
  join "user" u on u.id = b.grower_id
  join mother_plants mp on mp.id = b.plant_id
  join farms fa on fa.id = b.farm_id`);

/**
 * Bundles taken from the plant and from every plant descended from it: approved rounds only
 * (a draft is not a bundle yet), cancelled bundles left out (no wood moved).
 */
export function lineageBundles(db: DbOrTx, plantId: string): Promise<BundleRow[]> {
  return rows<BundleRow>(
    db,
    sql`${descendantsCte(plantId)}
        select ${BUNDLE_COLUMNS}
        from bundles b ${BUNDLE_JOINS}
        where (b.plant_id = ${plantId}::uuid or b.plant_id in (select down.id from down))
          and ar.status in ('approved', 'notified') and b.status <> 'cancelled'
        order by coalesce(b.collected_at, ar.approved_at), b.code`,
  );
}

// Exposure -------------------------------------------------------------------------------

export type FindingRow = {
  id: string;
  inspection_id: string;
  inspected_on: string;
  inspection_created_at: Date | string;
  severity: Severity;
  notes: string;
  pest_id: string;
  pest_code: string;
  pest_name: string;
  scientific_name: string | null;
  signs: string;
  advice: string;
};

/** The plant's finding of a pest that travels in wood: the one asked for, or the latest. */
export async function travellingFinding(db: DbOrTx, plantId: string, findingId?: string): Promise<FindingRow | undefined> {
  const [row] = await rows<FindingRow>(
    db,
    sql`select fi.id, fi.inspection_id, to_char(i.inspected_on, 'YYYY-MM-DD') as inspected_on, i.created_at as inspection_created_at,
               fi.severity, fi.notes, x.id as pest_id, x.code as pest_code, x.name as pest_name, x.scientific_name, x.signs, x.advice
        from findings fi
        join inspections i on i.id = fi.inspection_id
        join pests x on x.id = fi.pest_id
        where i.plant_id = ${plantId}::uuid and x.travels_in_wood
          ${findingId ? sql`and fi.id = ${findingId}::uuid` : sql``}
        order by i.inspected_on desc, i.created_at desc, fi.id
        limit 1`,
  );
  return row;
}

/**
 * The last clean inspection before a finding: the latest inspection of the plant, earlier
 * than the finding's inspection (by date, then by when it was recorded), with no finding
 * recorded at all. A finding of any kind makes an inspection not clean: the conservative
 * choice, which can only widen what counts as exposed.
 */
export async function lastCleanBefore(db: DbOrTx, plantId: string, finding: FindingRow): Promise<string | null> {
  const [row] = await rows<{ on_date: string | null }>(
    db,
    sql`select to_char(max(i.inspected_on), 'YYYY-MM-DD') as on_date
        from inspections i
        where i.plant_id = ${plantId}::uuid
          and (i.inspected_on, i.created_at) < (${finding.inspected_on}::date, ${new Date(finding.inspection_created_at).toISOString()}::timestamptz)
          and not exists (select 1 from findings f2 where f2.inspection_id = i.id)`,
  );
  return row?.on_date ?? null;
}

/**
 * `exposed(id, parent_id, depth, source_bundle_id)`: plants that may carry what was found on
 * `plantId`, given the day `since` it was last seen clean (null: never seen clean, so all of
 * its wood counts):
 *  - generation 1: plants raised from a bundle of `plantId` collected on or after `since`
 *    (the calendar day at the giving farm), and plants registered as its children without a
 *    source bundle on or after `since`;
 *  - then every plant descended from an exposed plant, at any date (it came from exposed wood).
 */
function exposedCte(plantId: string, since: string | null): SQL {
  const sinceDate = since ? sql`${since}::date` : sql`null::date`;
  return sql`with recursive root_bundles as (
      select b.id from bundles b join farms fa on fa.id = b.farm_id
      where b.plant_id = ${plantId}::uuid and b.status = 'collected'
        and (${sinceDate} is null or (b.collected_at at time zone fa.timezone)::date >= ${sinceDate})
    ),
    walk(id, parent_id, depth, path) as (
      select c.id, ${plantId}::uuid, 1, array[${plantId}::uuid, c.id]
      from mother_plants c
      where c.id <> ${plantId}::uuid
        and (c.source_bundle_id in (select root_bundles.id from root_bundles)
             or (c.source_bundle_id is null and c.parent_plant_id = ${plantId}::uuid
                 and (${sinceDate} is null or c.created_at::date >= ${sinceDate})))
      union all
      select c.id, walk.id, walk.depth + 1, walk.path || c.id
      from walk
      join (mother_plants c left join bundles csb on csb.id = c.source_bundle_id)
        on c.parent_plant_id = walk.id or csb.plant_id = walk.id
      where not c.id = any(walk.path) and walk.depth < ${MAX_DEPTH}
    ),
    exposed(id, parent_id, depth) as (
      select distinct on (walk.id) walk.id, walk.parent_id, walk.depth from walk order by walk.id, walk.depth, walk.parent_id
    )`;
}

export type ExposedPlantRow = { id: string; code: string; farm_name: string; health_status: HealthStatus; depth: number; source_bundle_code: string | null };

export function exposedPlants(db: DbOrTx, plantId: string, since: string | null): Promise<ExposedPlantRow[]> {
  return rows<ExposedPlantRow>(
    db,
    sql`${exposedCte(plantId, since)}
        select mp.id, mp.code, f.name as farm_name, mp.health_status, e.depth::int as depth, sb.code as source_bundle_code
        from exposed e
        join mother_plants mp on mp.id = e.id
        join farms f on f.id = mp.farm_id
        left join bundles sb on sb.id = mp.source_bundle_id
        order by e.depth, mp.code`,
  );
}

/**
 * Bundles of exposed wood: from `plantId` collected on or after `since`, and from any exposed
 * plant. `collected`: the wood has left the farm (exposure); otherwise approved bundles not
 * yet collected (to cancel).
 */
export function exposedBundles(db: DbOrTx, plantId: string, since: string | null, which: 'collected' | 'pending'): Promise<BundleRow[]> {
  const sinceDate = since ? sql`${since}::date` : sql`null::date`;
  const status = which === 'collected' ? sql`b.status = 'collected'` : sql`b.status in ('reserved', 'ready')`;
  const fromRoot =
    which === 'collected'
      ? sql`(b.plant_id = ${plantId}::uuid and (${sinceDate} is null or (b.collected_at at time zone fa.timezone)::date >= ${sinceDate}))`
      : sql`b.plant_id = ${plantId}::uuid`;
  return rows<BundleRow>(
    db,
    sql`${exposedCte(plantId, since)}
        select ${BUNDLE_COLUMNS}
        from bundles b ${BUNDLE_JOINS}
        where ${status} and ar.status in ('approved', 'notified')
          and (${fromRoot} or b.plant_id in (select exposed.id from exposed))
        order by coalesce(b.collected_at, ar.approved_at), b.code`,
  );
}

/** Dedupe keys of notices already sent. */
export async function sentKeys(db: DbOrTx, keys: string[]): Promise<Set<string>> {
  if (!keys.length) return new Set();
  const found = await rows<{ dedupe_key: string }>(
    db,
    sql`select el.dedupe_key from email_log el where el.status = 'sent' and el.dedupe_key in (${sql.join(
      keys.map((k) => sql`${k}`),
      sql`, `,
    )})`,
  );
  return new Set(found.map((r) => r.dedupe_key));
}

// Drizzle queries for mother plants. The list is built for 10,000+ plants: filters and
// sorting run in SQL on indexed columns, and one count query uses the same WHERE.
import { and, asc, desc, eq, ilike, inArray, isNull, lt, or, sql, type SQL } from 'drizzle-orm';
import type { PlantListFilters, PlantListItem } from '../../../shared/schemas/register.js';
import type { DbOrTx } from '../../db/client.js';
import { farms, motherPlants, species, varieties } from '../../db/schema/index.js';

export const plantSelect = {
  id: motherPlants.id,
  code: motherPlants.code,
  farmId: motherPlants.farmId,
  farmName: farms.name,
  farmCode: farms.code,
  speciesId: motherPlants.speciesId,
  speciesName: species.commonName,
  scientificName: species.scientificName,
  varietyId: motherPlants.varietyId,
  varietyName: varieties.name,
  plantingYear: motherPlants.plantingYear,
  role: motherPlants.role,
  provenance: motherPlants.provenance,
  healthStatus: motherPlants.healthStatus,
  lastInspectedOn: motherPlants.lastInspectedOn,
  lat: motherPlants.lat,
  lon: motherPlants.lon,
  bedRow: motherPlants.bedRow,
};

const SORTS = {
  code: [motherPlants.code],
  species: [species.commonName, varieties.name, motherPlants.code],
  variety: [varieties.name, motherPlants.code],
  farm: [farms.name, motherPlants.code],
  plantingYear: [motherPlants.plantingYear, motherPlants.code],
  lastInspectedOn: [motherPlants.lastInspectedOn, motherPlants.code],
  healthStatus: [motherPlants.healthStatus, motherPlants.code],
  role: [motherPlants.role, motherPlants.code],
} as const;

export type Visibility = { all: true } | { all: false; farmIds: string[] };

export function plantWhere(f: PlantListFilters, vis: Visibility, lookbackStart: string): SQL | undefined {
  const c: (SQL | undefined)[] = [];
  if (!vis.all) {
    // Other farms' plants are visible only while clean.
    c.push(
      vis.farmIds.length
        ? or(inArray(motherPlants.farmId, vis.farmIds), eq(motherPlants.healthStatus, 'clean'))
        : eq(motherPlants.healthStatus, 'clean'),
    );
  }
  if (f.mine && !vis.all) c.push(vis.farmIds.length ? inArray(motherPlants.farmId, vis.farmIds) : sql`false`);
  if (f.farmId) c.push(eq(motherPlants.farmId, f.farmId));
  if (f.speciesId) c.push(eq(motherPlants.speciesId, f.speciesId));
  if (f.varietyId) c.push(eq(motherPlants.varietyId, f.varietyId));
  if (f.status?.length) c.push(inArray(motherPlants.healthStatus, f.status));
  if (f.role) c.push(eq(motherPlants.role, f.role));
  if (f.yearFrom) c.push(sql`${motherPlants.plantingYear} >= ${f.yearFrom}`);
  if (f.yearTo) c.push(sql`${motherPlants.plantingYear} <= ${f.yearTo}`);
  if (f.inspected === 'never') c.push(isNull(motherPlants.lastInspectedOn));
  if (f.inspected === 'stale') c.push(or(isNull(motherPlants.lastInspectedOn), lt(motherPlants.lastInspectedOn, lookbackStart)));
  if (f.inspected === 'recent') c.push(sql`${motherPlants.lastInspectedOn} >= ${lookbackStart}`);
  if (f.q) {
    const like = `%${f.q.replace(/[%_\\]/g, (ch) => `\\${ch}`)}%`;
    c.push(
      or(
        ilike(motherPlants.code, like),
        ilike(varieties.name, like),
        ilike(species.commonName, like),
        ilike(species.scientificName, like),
        ilike(farms.name, like),
      ),
    );
  }
  const parts = c.filter((x): x is SQL => x !== undefined);
  return parts.length ? and(...parts) : undefined;
}

function baseQuery(db: DbOrTx) {
  return db
    .select(plantSelect)
    .from(motherPlants)
    .innerJoin(farms, eq(farms.id, motherPlants.farmId))
    .innerJoin(species, eq(species.id, motherPlants.speciesId))
    .leftJoin(varieties, eq(varieties.id, motherPlants.varietyId));
}

export async function listPlants(db: DbOrTx, f: PlantListFilters, vis: Visibility, lookbackStart: string) {
  const where = plantWhere(f, vis, lookbackStart);
  const order = SORTS[f.sort].map((col, i) => (i === 0 && f.dir === 'desc' ? desc(col) : asc(col)));
  const [rows, [{ total }]] = await Promise.all([
    baseQuery(db)
      .where(where)
      .orderBy(...order, asc(motherPlants.id))
      .limit(f.pageSize)
      .offset((f.page - 1) * f.pageSize),
    // Only a text search reads the joined names; the joins on required keys drop no row, so
    // without one the count reads the plants alone.
    f.q
      ? db
          .select({ total: sql<number>`count(*)::int` })
          .from(motherPlants)
          .innerJoin(farms, eq(farms.id, motherPlants.farmId))
          .innerJoin(species, eq(species.id, motherPlants.speciesId))
          .leftJoin(varieties, eq(varieties.id, motherPlants.varietyId))
          .where(where)
      : db.select({ total: sql<number>`count(*)::int` }).from(motherPlants).where(where),
  ]);
  return { rows, total };
}

/** Every row matching the filters (CSV export), in the list's order. */
export function allPlants(db: DbOrTx, f: PlantListFilters, vis: Visibility, lookbackStart: string) {
  const order = SORTS[f.sort].map((col, i) => (i === 0 && f.dir === 'desc' ? desc(col) : asc(col)));
  return baseQuery(db)
    .where(plantWhere(f, vis, lookbackStart))
    .orderBy(...order, asc(motherPlants.id));
}

export async function findPlant(db: DbOrTx, id: string) {
  const [row] = await db.select().from(motherPlants).where(eq(motherPlants.id, id));
  return row;
}

export async function findPlantRow(db: DbOrTx, id: string): Promise<Omit<PlantListItem, 'full'> | undefined> {
  const [row] = await baseQuery(db).where(eq(motherPlants.id, id));
  return row;
}

export async function findPlantByCode(db: DbOrTx, code: string) {
  const [row] = await db.select().from(motherPlants).where(eq(motherPlants.code, code));
  return row;
}

/** The next free number for a farm's codes, e.g. BRK-0043 after BRK-0042. */
export async function nextPlantNumber(db: DbOrTx, farmCode: string): Promise<number> {
  const prefix = `${farmCode}-`;
  const [row] = await db
    .select({
      n: sql<number>`coalesce(max(nullif(regexp_replace(substr(${motherPlants.code}, ${prefix.length + 1}), '[^0-9]', '', 'g'), '')::int), 0)`,
    })
    .from(motherPlants)
    .where(sql`${motherPlants.code} like ${`${prefix}%`}`);
  return Number(row.n) + 1;
}

export async function insertPlant(db: DbOrTx, values: typeof motherPlants.$inferInsert) {
  const [row] = await db.insert(motherPlants).values(values).returning();
  return row;
}

export async function updatePlant(db: DbOrTx, id: string, patch: Partial<typeof motherPlants.$inferInsert>) {
  const [row] = await db
    .update(motherPlants)
    .set({ ...patch, updatedAt: new Date() })
    .where(eq(motherPlants.id, id))
    .returning();
  return row;
}

// Bulk insert for imports. The rows travel as one JSON parameter: a multi-row VALUES list with
// thousands of bound parameters measured three times slower on PGlite. Columns are listed so
// that any column left out takes its default.
export type NewPlant = typeof motherPlants.$inferInsert & { id: string };

export async function insertPlants(tx: DbOrTx, values: NewPlant[]) {
  const rows = values.map((v) => ({
    id: v.id,
    code: v.code,
    farm_id: v.farmId,
    species_id: v.speciesId,
    variety_id: v.varietyId ?? null,
    planting_year: v.plantingYear,
    lat: v.lat ?? null,
    lon: v.lon ?? null,
    bed_row: v.bedRow ?? '',
    role: v.role,
    provenance: v.provenance,
    parent_plant_id: v.parentPlantId ?? null,
    supplier: v.supplier ?? null,
    health_status: v.healthStatus ?? 'clean',
    last_inspected_on: v.lastInspectedOn ?? null,
    notes: v.notes ?? '',
    created_by: v.createdBy ?? null,
    retired_at: v.retiredAt ?? null,
  }));
  await tx.execute(sql`
    insert into mother_plants (id, code, farm_id, species_id, variety_id, planting_year, lat, lon, bed_row, role,
      provenance, parent_plant_id, supplier, health_status, last_inspected_on, notes, created_by, retired_at)
    select id, code, farm_id, species_id, variety_id, planting_year, lat, lon, bed_row, role,
      provenance, parent_plant_id, supplier, health_status, last_inspected_on, notes, created_by, retired_at
    from json_populate_recordset(null::mother_plants, ${JSON.stringify(rows)}::json)`);
}

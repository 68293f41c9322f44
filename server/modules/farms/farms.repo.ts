import { and, asc, eq, ne, sql } from 'drizzle-orm';
import type { FarmSummary } from '../../../shared/schemas/farms.js';
import type { FarmRole } from '../../../shared/domain.js';
import type { DbOrTx } from '../../db/client.js';
import { farmMemberships, farms, motherPlants } from '../../db/schema/index.js';

export async function listFarms(db: DbOrTx): Promise<FarmSummary[]> {
  const [rows, members, plants] = await Promise.all([
    db.select({ id: farms.id, code: farms.code, name: farms.name, address: farms.address, lat: farms.lat, lon: farms.lon }).from(farms).orderBy(asc(farms.name)),
    db.select({ farmId: farmMemberships.farmId, n: sql<number>`count(*)::int` }).from(farmMemberships).groupBy(farmMemberships.farmId),
    db
      .select({ farmId: motherPlants.farmId, n: sql<number>`count(*)::int` })
      .from(motherPlants)
      .where(ne(motherPlants.healthStatus, 'retired'))
      .groupBy(motherPlants.farmId),
  ]);
  const m = new Map(members.map((x) => [x.farmId, x.n]));
  const p = new Map(plants.map((x) => [x.farmId, x.n]));
  return rows.map((f) => ({ ...f, memberCount: m.get(f.id) ?? 0, plantCount: p.get(f.id) ?? 0 }));
}

export async function findFarm(db: DbOrTx, id: string) {
  const [row] = await db.select().from(farms).where(eq(farms.id, id));
  return row;
}

export async function findMembership(db: DbOrTx, farmId: string, userId: string) {
  const [row] = await db
    .select()
    .from(farmMemberships)
    .where(and(eq(farmMemberships.farmId, farmId), eq(farmMemberships.userId, userId)));
  return row;
}

export function upsertMembership(db: DbOrTx, farmId: string, userId: string, farmRole: FarmRole) {
  return db
    .insert(farmMemberships)
    .values({ farmId, userId, farmRole })
    .onConflictDoUpdate({ target: [farmMemberships.farmId, farmMemberships.userId], set: { farmRole } });
}

export function deleteMembership(db: DbOrTx, farmId: string, userId: string) {
  return db.delete(farmMemberships).where(and(eq(farmMemberships.farmId, farmId), eq(farmMemberships.userId, userId)));
}

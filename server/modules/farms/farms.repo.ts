import { and, asc, eq, sql } from 'drizzle-orm';
import type { FarmSummary } from '../../../shared/schemas/farms.js';
import type { FarmRole } from '../../../shared/domain.js';
import type { DbOrTx } from '../../db/client.js';
import { farmMemberships, farms, motherPlants } from '../../db/schema/index.js';

export async function listFarms(db: DbOrTx): Promise<FarmSummary[]> {
  return db
    .select({
      id: farms.id,
      code: farms.code,
      name: farms.name,
      address: farms.address,
      lat: farms.lat,
      lon: farms.lon,
      memberCount: sql<number>`(select count(*)::int from ${farmMemberships} where ${farmMemberships.farmId} = ${farms.id})`,
      plantCount: sql<number>`(select count(*)::int from ${motherPlants} where ${motherPlants.farmId} = ${farms.id} and ${motherPlants.healthStatus} <> 'retired')`,
    })
    .from(farms)
    .orderBy(asc(farms.name));
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

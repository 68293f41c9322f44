import { and, asc, eq, ne, sql } from 'drizzle-orm';
import type { Species, Variety } from '../../../shared/schemas/register.js';
import type { DbOrTx } from '../../db/client.js';
import { motherPlants, species, varieties } from '../../db/schema/index.js';

export async function listSpecies(db: DbOrTx): Promise<Species[]> {
  const [rows, vs] = await Promise.all([
    db.select().from(species).orderBy(asc(species.commonName)),
    db
      .select({
        id: varieties.id,
        speciesId: varieties.speciesId,
        name: varieties.name,
        description: varieties.description,
        plantCount: sql<number>`count(${motherPlants.id})::int`,
      })
      .from(varieties)
      .leftJoin(motherPlants, and(eq(motherPlants.varietyId, varieties.id), ne(motherPlants.healthStatus, 'retired')))
      .groupBy(varieties.id)
      .orderBy(asc(varieties.name)),
  ]);
  const bySpecies = new Map<string, Variety[]>();
  for (const v of vs) bySpecies.set(v.speciesId, [...(bySpecies.get(v.speciesId) ?? []), v]);
  return rows.map(({ createdAt: _c, ...s }) => ({ ...s, varieties: bySpecies.get(s.id) ?? [] }));
}

export async function findSpecies(db: DbOrTx, id: string) {
  const [row] = await db.select().from(species).where(eq(species.id, id));
  return row;
}

// Drizzle only: the species facts the planner's estimate needs. Strike reports are pooled once,
// in ../strike-reports/strike-reports.repo.ts (planner, strike-rate table, season figures).
import { eq } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client.js';
import { species, varieties } from '../../db/schema/index.js';

export { strikeReportTotals } from '../strike-reports/strike-reports.repo.js';

export async function findSpeciesPrior(db: DbOrTx, speciesId: string) {
  const [row] = await db
    .select({ id: species.id, strikeRatePrior: species.strikeRatePrior, priorStrength: species.priorStrength })
    .from(species)
    .where(eq(species.id, speciesId));
  return row;
}

export async function findVarietySpecies(db: DbOrTx, varietyId: string): Promise<string | undefined> {
  const [row] = await db.select({ speciesId: varieties.speciesId }).from(varieties).where(eq(varieties.id, varietyId));
  return row?.speciesId;
}

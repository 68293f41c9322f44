// Drizzle only: the species facts and the strike reports the planner's estimate needs.
import { and, eq, sql } from 'drizzle-orm';
import type { Treatment } from '../../../shared/domain.js';
import type { ReportTotals } from '../../../shared/strike-rate.js';
import type { DbOrTx } from '../../db/client.js';
import { bundles, motherPlants, species, strikeReports, varieties, woodOffers } from '../../db/schema/index.js';

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

/**
 * Reports on wood of a species (and, if given, a variety) treated the given way. A report
 * belongs to a bundle, the bundle to a wood offer, the offer to the mother plant the wood
 * came from.
 */
export async function strikeReportTotals(
  db: DbOrTx,
  where: { speciesId: string; varietyId?: string | null; treatment: Treatment },
): Promise<ReportTotals> {
  const [row] = await db
    .select({
      reports: sql<number>`count(*)::int`,
      stuck: sql<number>`coalesce(sum(${strikeReports.stuck}), 0)::int`,
      rooted: sql<number>`coalesce(sum(${strikeReports.rooted}), 0)::int`,
    })
    .from(strikeReports)
    .innerJoin(bundles, eq(bundles.id, strikeReports.bundleId))
    .innerJoin(woodOffers, eq(woodOffers.id, bundles.offerId))
    .innerJoin(motherPlants, eq(motherPlants.id, woodOffers.plantId))
    .where(
      and(
        eq(motherPlants.speciesId, where.speciesId),
        where.varietyId ? eq(motherPlants.varietyId, where.varietyId) : undefined,
        eq(strikeReports.treatment, where.treatment),
      ),
    );
  return { reports: Number(row.reports), stuck: Number(row.stuck), rooted: Number(row.rooted) };
}

// Drizzle only: strike reports, and THE one way reports are pooled for an estimate. The
// planner (learnedStrikeRate), the strike-rate table and the season figures all read
// strikeReportGroups / strikeReportTotals, so the same reports count the same way everywhere.
//
// Pooling: a report belongs to a bundle, the bundle to a wood offer, the offer to the mother
// plant the wood came from; reports are grouped by that plant's species and variety and by the
// treatment the report states.
import { and, asc, count, desc, eq, inArray, sql, type SQL } from 'drizzle-orm';
import type { Treatment } from '../../../shared/domain.js';
import type { StrikeReportView } from '../../../shared/schemas/strike-reports.js';
import type { ReportTotals } from '../../../shared/strike-rate.js';
import type { DbOrTx } from '../../db/client.js';
import { bundles, motherPlants, strikeReports, user, woodOffers } from '../../db/schema/index.js';

export type ReportGroup = { speciesId: string; varietyId: string | null; treatment: Treatment; reports: number; stuck: number; rooted: number };

export type ReportPoolFilter = {
  speciesId?: string;
  varietyId?: string | null;
  treatment?: Treatment;
  /** Only reports on wood of this season's offers. */
  seasonId?: string;
  /** Any further condition on the bundle (e.g. the caller's scope). */
  bundleWhere?: SQL;
};

/** Reports summed per species x variety x treatment. */
export async function strikeReportGroups(db: DbOrTx, f: ReportPoolFilter = {}): Promise<ReportGroup[]> {
  const rows = await db
    .select({
      speciesId: motherPlants.speciesId,
      varietyId: motherPlants.varietyId,
      treatment: strikeReports.treatment,
      reports: count(),
      stuck: sql<number>`coalesce(sum(${strikeReports.stuck}), 0)::int`,
      rooted: sql<number>`coalesce(sum(${strikeReports.rooted}), 0)::int`,
    })
    .from(strikeReports)
    .innerJoin(bundles, eq(bundles.id, strikeReports.bundleId))
    .innerJoin(woodOffers, eq(woodOffers.id, bundles.offerId))
    .innerJoin(motherPlants, eq(motherPlants.id, woodOffers.plantId))
    .where(
      and(
        f.speciesId ? eq(motherPlants.speciesId, f.speciesId) : undefined,
        f.varietyId ? eq(motherPlants.varietyId, f.varietyId) : undefined,
        f.treatment ? eq(strikeReports.treatment, f.treatment) : undefined,
        f.seasonId ? eq(woodOffers.seasonId, f.seasonId) : undefined,
        f.bundleWhere,
      ),
    )
    .groupBy(motherPlants.speciesId, motherPlants.varietyId, strikeReports.treatment);
  return rows.map((r) => ({ ...r, reports: Number(r.reports), stuck: Number(r.stuck), rooted: Number(r.rooted) }));
}

/** Adds groups up (a species' total is the sum of its variety groups). */
export function sumGroups(groups: readonly Pick<ReportGroup, 'reports' | 'stuck' | 'rooted'>[]): ReportTotals {
  return groups.reduce((t, g) => ({ reports: t.reports + g.reports, stuck: t.stuck + g.stuck, rooted: t.rooted + g.rooted }), { reports: 0, stuck: 0, rooted: 0 });
}

/**
 * Reports on wood of a species (and, if given, a variety) treated the given way: the totals
 * the planner's estimate uses.
 */
export async function strikeReportTotals(
  db: DbOrTx,
  where: { speciesId: string; varietyId?: string | null; treatment: Treatment },
): Promise<ReportTotals> {
  return sumGroups(await strikeReportGroups(db, { speciesId: where.speciesId, varietyId: where.varietyId, treatment: where.treatment }));
}

/** Reports on these bundles as the grower's page shows them, with who filed each (photos are added by the service). */
export async function reportsOfBundles(db: DbOrTx, bundleIds: string[]): Promise<(Omit<StrikeReportView, 'mine' | 'photos'> & { reporterId: string | null })[]> {
  if (!bundleIds.length) return [];
  const rows = await db
    .select({
      id: strikeReports.id,
      bundleId: strikeReports.bundleId,
      stuck: strikeReports.stuck,
      rooted: strikeReports.rooted,
      assessedOn: strikeReports.assessedOn,
      treatment: strikeReports.treatment,
      notes: strikeReports.notes,
      reporterName: user.name,
      reporterId: strikeReports.reporterId,
      createdAt: strikeReports.createdAt,
    })
    .from(strikeReports)
    .leftJoin(user, eq(user.id, strikeReports.reporterId))
    .where(inArray(strikeReports.bundleId, bundleIds))
    .orderBy(asc(strikeReports.assessedOn), asc(strikeReports.createdAt));
  return rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() }));
}

/** What the reports on one bundle add up to, and how many plants were raised from it. */
export async function bundleReportSums(db: DbOrTx, bundleId: string): Promise<{ reports: number; stuck: number; rooted: number; raised: number }> {
  const [r] = await db
    .select({
      reports: count(),
      stuck: sql<number>`coalesce(sum(${strikeReports.stuck}), 0)::int`,
      rooted: sql<number>`coalesce(sum(${strikeReports.rooted}), 0)::int`,
    })
    .from(strikeReports)
    .where(eq(strikeReports.bundleId, bundleId));
  const [p] = await db.select({ n: count() }).from(motherPlants).where(eq(motherPlants.sourceBundleId, bundleId));
  return { reports: Number(r.reports), stuck: Number(r.stuck), rooted: Number(r.rooted), raised: Number(p.n) };
}

export async function insertStrikeReport(db: DbOrTx, values: typeof strikeReports.$inferInsert) {
  const [row] = await db.insert(strikeReports).values(values).returning();
  return row;
}

export async function findStrikeReport(db: DbOrTx, id: string) {
  const [row] = await db.select().from(strikeReports).where(eq(strikeReports.id, id));
  return row;
}

export function deleteStrikeReport(db: DbOrTx, id: string) {
  return db.delete(strikeReports).where(eq(strikeReports.id, id));
}

/** Plants raised from these bundles, newest first. */
export function plantsFromBundles(db: DbOrTx, bundleIds: string[]) {
  if (!bundleIds.length) return Promise.resolve([]);
  return db
    .select({ id: motherPlants.id, code: motherPlants.code, sourceBundleId: motherPlants.sourceBundleId, farmId: motherPlants.farmId })
    .from(motherPlants)
    .where(inArray(motherPlants.sourceBundleId, bundleIds))
    .orderBy(desc(motherPlants.createdAt), asc(motherPlants.code));
}

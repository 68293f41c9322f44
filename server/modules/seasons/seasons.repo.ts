import { and, desc, eq, inArray, isNull, sql } from 'drizzle-orm';
import { STAGE_RULES } from '../../../shared/seasons.js';
import type { Season } from '../../../shared/schemas/seasons.js';
import type { DbOrTx } from '../../db/client.js';
import { requestLines, seasons, woodOffers, woodRequests } from '../../db/schema/index.js';

type Totals = Pick<Season, 'offerCount' | 'cuttingsOffered' | 'requestCount' | 'cuttingsAsked'>;

/** Offer and request totals per season, one grouped query each (a handful of seasons). */
async function totals(db: DbOrTx, ids: string[]): Promise<Map<string, Totals>> {
  const map = new Map<string, Totals>(ids.map((id) => [id, { offerCount: 0, cuttingsOffered: 0, requestCount: 0, cuttingsAsked: 0 }]));
  if (!ids.length) return map;
  const offers = await db
    .select({
      seasonId: woodOffers.seasonId,
      offerCount: sql<number>`count(*) filter (where ${woodOffers.offered} > 0)::int`,
      cuttingsOffered: sql<number>`coalesce(sum(${woodOffers.offered}), 0)::int`,
    })
    .from(woodOffers)
    .where(and(inArray(woodOffers.seasonId, ids), isNull(woodOffers.withdrawnAt)))
    .groupBy(woodOffers.seasonId);
  const asks = await db
    .select({
      seasonId: woodRequests.seasonId,
      requestCount: sql<number>`count(distinct ${woodRequests.id})::int`,
      cuttingsAsked: sql<number>`coalesce(sum(${requestLines.cuttings}), 0)::int`,
    })
    .from(woodRequests)
    .leftJoin(requestLines, eq(requestLines.requestId, woodRequests.id))
    .where(and(inArray(woodRequests.seasonId, ids), eq(woodRequests.status, 'filed')))
    .groupBy(woodRequests.seasonId);
  for (const o of offers) Object.assign(map.get(o.seasonId)!, { offerCount: o.offerCount, cuttingsOffered: o.cuttingsOffered });
  for (const a of asks) Object.assign(map.get(a.seasonId)!, { requestCount: a.requestCount, cuttingsAsked: a.cuttingsAsked });
  return map;
}

async function withTotals(db: DbOrTx, rows: (typeof seasons.$inferSelect)[]): Promise<Season[]> {
  const t = await totals(db, rows.map((r) => r.id));
  return rows.map(({ createdAt: _c, createdBy: _b, ...r }) => ({
    ...r,
    ...t.get(r.id)!,
    requestDeadline: r.requestDeadline.toISOString(),
    rules: STAGE_RULES[r.stage],
  }));
}

export async function listSeasons(db: DbOrTx): Promise<Season[]> {
  return withTotals(db, await db.select().from(seasons).orderBy(desc(seasons.collectionStart)));
}

export async function getSeason(db: DbOrTx, id: string): Promise<Season | undefined> {
  const rows = await db.select().from(seasons).where(eq(seasons.id, id));
  return rows.length ? (await withTotals(db, rows))[0] : undefined;
}

/** The season row itself, locked for the rest of the transaction when `lock` is set. */
export async function seasonRow(db: DbOrTx, id: string, lock = false) {
  const q = db.select().from(seasons).where(eq(seasons.id, id));
  const [row] = lock ? await q.for('update') : await q;
  return row;
}

// Drizzle queries for allocation rounds: the solver's inputs, and the round as reviewed.
import { and, asc, desc, eq, isNull, ne, sql } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client.js';
import {
  allocationRounds,
  bundles,
  farms,
  motherPlants,
  requestLines,
  seasons,
  species,
  user,
  varieties,
  woodOffers,
  woodRequests,
} from '../../db/schema/index.js';

/** Offers of the season with the plant, farm and how much is not yet reserved (or just one). */
export function seasonOffers(db: DbOrTx, seasonId: string, offerId?: string) {
  return db
    .select({
      id: woodOffers.id,
      plantId: motherPlants.id,
      plantCode: motherPlants.code,
      healthStatus: motherPlants.healthStatus,
      lastInspectedOn: motherPlants.lastInspectedOn,
      farmId: farms.id,
      speciesId: motherPlants.speciesId,
      varietyId: motherPlants.varietyId,
      offered: woodOffers.offered,
      reserved: woodOffers.reserved,
      lat: farms.lat,
      lon: farms.lon,
    })
    .from(woodOffers)
    .innerJoin(motherPlants, eq(motherPlants.id, woodOffers.plantId))
    .innerJoin(farms, eq(farms.id, motherPlants.farmId))
    .where(and(eq(woodOffers.seasonId, seasonId), isNull(woodOffers.withdrawnAt), offerId ? eq(woodOffers.id, offerId) : undefined))
    .orderBy(asc(woodOffers.id));
}

/** Lines of filed requests, with the grower's destination and distance limit (or just one). */
export function seasonLines(db: DbOrTx, seasonId: string, lineId?: string) {
  return db
    .select({
      id: requestLines.id,
      growerId: woodRequests.growerId,
      speciesId: requestLines.speciesId,
      varietyId: requestLines.varietyId,
      cuttings: requestLines.cuttings,
      substitutesAllowed: requestLines.substitutesAllowed,
      priority: requestLines.priority,
      maxDistanceKm: woodRequests.maxDistanceKm,
      lat: woodRequests.destinationLat,
      lon: woodRequests.destinationLon,
    })
    .from(requestLines)
    .innerJoin(woodRequests, eq(woodRequests.id, requestLines.requestId))
    .where(and(eq(woodRequests.seasonId, seasonId), eq(woodRequests.status, 'filed'), lineId ? eq(requestLines.id, lineId) : undefined))
    .orderBy(asc(requestLines.id));
}

export async function farmLimits(db: DbOrTx): Promise<Record<string, number>> {
  const rows = await db.select({ id: farms.id, limit: farms.perGrowerLimit }).from(farms);
  return Object.fromEntries(rows.filter((r) => r.limit != null).map((r) => [r.id, r.limit!]));
}

export async function roundRow(db: DbOrTx, id: string, lock = false) {
  const q = db.select().from(allocationRounds).where(eq(allocationRounds.id, id));
  const [row] = lock ? await q.for('update') : await q;
  return row;
}

export async function nextRoundNumber(db: DbOrTx, seasonId: string) {
  const [r] = await db
    .select({ n: sql<number>`coalesce(max(${allocationRounds.number}), 0)::int` })
    .from(allocationRounds)
    .where(eq(allocationRounds.seasonId, seasonId));
  return r.n + 1;
}

export function roundBundles(db: DbOrTx, roundId: string) {
  return db
    .select({
      id: bundles.id,
      code: bundles.code,
      offerId: bundles.offerId,
      lineId: bundles.lineId,
      plantId: bundles.plantId,
      plantCode: motherPlants.code,
      plantStatus: motherPlants.healthStatus,
      lastInspectedOn: motherPlants.lastInspectedOn,
      farmId: bundles.farmId,
      farmName: farms.name,
      growerId: bundles.growerId,
      growerName: user.name,
      speciesName: species.commonName,
      varietyName: varieties.name,
      cuttings: bundles.cuttings,
      distanceM: bundles.distanceM,
      locked: bundles.locked,
      status: bundles.status,
    })
    .from(bundles)
    .innerJoin(motherPlants, eq(motherPlants.id, bundles.plantId))
    .innerJoin(farms, eq(farms.id, bundles.farmId))
    .innerJoin(user, eq(user.id, bundles.growerId))
    .innerJoin(species, eq(species.id, motherPlants.speciesId))
    .leftJoin(varieties, eq(varieties.id, motherPlants.varietyId))
    .where(eq(bundles.roundId, roundId))
    .orderBy(asc(user.name), asc(farms.name), asc(motherPlants.code));
}

export function linesWithNames(db: DbOrTx, seasonId: string) {
  return db
    .select({
      lineId: requestLines.id,
      growerId: woodRequests.growerId,
      growerName: user.name,
      speciesName: species.commonName,
      varietyName: varieties.name,
      substitutesAllowed: requestLines.substitutesAllowed,
      maxDistanceKm: woodRequests.maxDistanceKm,
      asked: requestLines.cuttings,
    })
    .from(requestLines)
    .innerJoin(woodRequests, eq(woodRequests.id, requestLines.requestId))
    .innerJoin(user, eq(user.id, woodRequests.growerId))
    .innerJoin(species, eq(species.id, requestLines.speciesId))
    .leftJoin(varieties, eq(varieties.id, requestLines.varietyId))
    .where(and(eq(woodRequests.seasonId, seasonId), eq(woodRequests.status, 'filed')))
    .orderBy(asc(user.name), asc(species.commonName));
}

export function listRounds(db: DbOrTx, seasonId: string) {
  return db
    .select({
      id: allocationRounds.id,
      number: allocationRounds.number,
      status: allocationRounds.status,
      createdAt: allocationRounds.createdAt,
      approvedAt: allocationRounds.approvedAt,
      bundles: sql<number>`count(${bundles.id})::int`,
      cuttings: sql<number>`coalesce(sum(${bundles.cuttings}), 0)::int`,
    })
    .from(allocationRounds)
    .leftJoin(bundles, and(eq(bundles.roundId, allocationRounds.id), ne(bundles.status, 'cancelled')))
    .where(eq(allocationRounds.seasonId, seasonId))
    .groupBy(allocationRounds.id)
    .orderBy(desc(allocationRounds.number));
}

export async function seasonOf(db: DbOrTx, seasonId: string) {
  const [s] = await db.select().from(seasons).where(eq(seasons.id, seasonId));
  return s;
}


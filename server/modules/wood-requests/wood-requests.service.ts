// Wood requests: a grower's ask for a season, in lines by variety or "any variety of this
// species". Editable until the deadline; replaced whole in one transaction.
import { and, asc, eq, inArray, isNull, sql } from 'drizzle-orm';
import { distanceM } from '../../../shared/geo.js';
import { mayGiveWood } from '../../../shared/health-rules.js';
import { requestsOpen } from '../../../shared/seasons.js';
import type { BoardRow, WoodRequest, WoodRequestInput } from '../../../shared/schemas/seasons.js';
import type { woodRequestSchema } from '../../../shared/schemas/seasons.js';
import type { Actor } from '../../auth/guards.js';
import type { Db, DbOrTx } from '../../db/client.js';
import { farms, motherPlants, requestLines, species, user, varieties, woodOffers, woodRequests } from '../../db/schema/index.js';
import { badRequest, conflict, notFound } from '../../lib/http-error.js';
import { seasonRow } from '../seasons/seasons.repo.js';
import type { z } from 'zod';

type RequestBody = z.output<typeof woodRequestSchema>;

async function loadRequests(db: DbOrTx, where: ReturnType<typeof and>, now: Date): Promise<WoodRequest[]> {
  const reqs = await db
    .select({ r: woodRequests, growerName: user.name })
    .from(woodRequests)
    .innerJoin(user, eq(user.id, woodRequests.growerId))
    .where(where)
    .orderBy(asc(user.name));
  if (!reqs.length) return [];
  const lines = await db
    .select({
      l: requestLines,
      speciesName: species.commonName,
      varietyName: varieties.name,
      restrictionNote: species.restrictionNote,
    })
    .from(requestLines)
    .innerJoin(species, eq(species.id, requestLines.speciesId))
    .leftJoin(varieties, eq(varieties.id, requestLines.varietyId))
    .where(inArray(requestLines.requestId, reqs.map((x) => x.r.id)))
    .orderBy(asc(requestLines.createdAt), asc(requestLines.id));
  const seasonIds = [...new Set(reqs.map((x) => x.r.seasonId))];
  const open = new Map<string, boolean>();
  for (const id of seasonIds) {
    const s = await seasonRow(db, id);
    open.set(id, !!s && requestsOpen(s.stage, s.requestDeadline, now));
  }
  return reqs.map(({ r, growerName }) => ({
    id: r.id,
    seasonId: r.seasonId,
    growerId: r.growerId,
    growerName,
    status: r.status,
    destinationLat: r.destinationLat,
    destinationLon: r.destinationLon,
    destinationLabel: r.destinationLabel,
    maxDistanceKm: r.maxDistanceKm,
    notes: r.notes,
    updatedAt: r.updatedAt.toISOString(),
    editable: open.get(r.seasonId) ?? false,
    lines: lines
      .filter((x) => x.l.requestId === r.id)
      .map((x) => ({
        id: x.l.id,
        speciesId: x.l.speciesId,
        speciesName: x.speciesName,
        varietyId: x.l.varietyId,
        varietyName: x.varietyName,
        cuttings: x.l.cuttings,
        substitutesAllowed: x.l.substitutesAllowed,
        treatment: x.l.treatment,
        plan: (x.l.plan as Record<string, unknown> | null) ?? null,
        restrictionNote: x.restrictionNote,
      })),
  }));
}

export async function myRequest(db: Db, a: Actor, seasonId: string, now = new Date()) {
  const [r] = await loadRequests(db, and(eq(woodRequests.seasonId, seasonId), eq(woodRequests.growerId, a.id)), now);
  return r ?? null;
}

export async function seasonRequests(db: Db, seasonId: string, now = new Date()) {
  return loadRequests(db, and(eq(woodRequests.seasonId, seasonId), sql`${woodRequests.status} <> 'withdrawn'`), now);
}

async function assertOpen(db: DbOrTx, seasonId: string, now: Date) {
  const s = await seasonRow(db, seasonId, true);
  if (!s) throw notFound('That season');
  if (!requestsOpen(s.stage, s.requestDeadline, now)) {
    const why = s.requestDeadline <= now ? `the deadline passed on ${s.requestDeadline.toISOString().slice(0, 10)}` : `the season is ${s.stage.replace('_', ' ')}`;
    throw conflict(`Requests cannot be changed now: ${why}.`, { seasonId: why });
  }
  return s;
}

export async function saveRequest(db: Db, a: Actor, seasonId: string, input: WoodRequestInput | RequestBody, now = new Date()) {
  const body = input as RequestBody;
  await db.transaction(async (tx) => {
    await assertOpen(tx, seasonId, now);
    // Species and varieties must exist and match; the same line twice is a mistake.
    const speciesIds = [...new Set(body.lines.map((l) => l.speciesId))];
    const varietyIds = [...new Set(body.lines.map((l) => l.varietyId).filter((v): v is string => !!v))];
    const sp = new Set((await tx.select({ id: species.id }).from(species).where(inArray(species.id, speciesIds))).map((x) => x.id));
    const vs = new Map(
      (varietyIds.length ? await tx.select({ id: varieties.id, speciesId: varieties.speciesId }).from(varieties).where(inArray(varieties.id, varietyIds)) : []).map(
        (v) => [v.id, v.speciesId],
      ),
    );
    const fields: Record<string, string> = {};
    const seen = new Map<string, number>();
    body.lines.forEach((l, i) => {
      if (!sp.has(l.speciesId)) fields[`lines.${i}.speciesId`] = 'unknown species';
      else if (l.varietyId && !vs.has(l.varietyId)) fields[`lines.${i}.varietyId`] = 'unknown variety';
      else if (l.varietyId && vs.get(l.varietyId) !== l.speciesId) fields[`lines.${i}.varietyId`] = 'not a variety of this species';
      const key = `${l.speciesId}:${l.varietyId ?? '*'}:${l.treatment}`;
      if (seen.has(key)) fields[`lines.${i}.varietyId`] = `same as line ${seen.get(key)! + 1}: add the cuttings there`;
      seen.set(key, i);
    });
    if (Object.keys(fields).length) throw badRequest('Check the request lines.', fields);

    const [existing] = await tx
      .select()
      .from(woodRequests)
      .where(and(eq(woodRequests.seasonId, seasonId), eq(woodRequests.growerId, a.id)));
    const values = {
      destinationLat: body.destinationLat,
      destinationLon: body.destinationLon,
      destinationLabel: body.destinationLabel,
      maxDistanceKm: body.maxDistanceKm,
      notes: body.notes,
      status: body.status,
      updatedAt: new Date(),
    };
    const [req] = existing
      ? await tx.update(woodRequests).set(values).where(eq(woodRequests.id, existing.id)).returning()
      : await tx.insert(woodRequests).values({ ...values, seasonId, growerId: a.id }).returning();
    await tx.delete(requestLines).where(eq(requestLines.requestId, req.id));
    await tx.insert(requestLines).values(
      body.lines.map((l) => ({
        requestId: req.id,
        speciesId: l.speciesId,
        varietyId: l.varietyId,
        cuttings: l.cuttings,
        substitutesAllowed: l.substitutesAllowed,
        treatment: l.treatment,
        plan: l.plan ?? null,
      })),
    );
  });
  return myRequest(db, a, seasonId, now);
}

export async function withdrawRequest(db: Db, a: Actor, seasonId: string, now = new Date()) {
  await db.transaction(async (tx) => {
    await assertOpen(tx, seasonId, now);
    const r = await tx
      .update(woodRequests)
      .set({ status: 'withdrawn', updatedAt: new Date() })
      .where(and(eq(woodRequests.seasonId, seasonId), eq(woodRequests.growerId, a.id)))
      .returning();
    if (!r.length) throw notFound('Your request');
  });
  return myRequest(db, a, seasonId, now);
}

/**
 * The season's wood board: what is on offer by species and variety across the cooperative,
 * what is asked, and where wood is scarce. Only wood from plants that may give wood counts.
 */
export async function woodBoard(db: Db, seasonId: string, from: { lat: number; lon: number } | null, now = new Date()): Promise<BoardRow[]> {
  const season = await seasonRow(db, seasonId);
  if (!season) throw notFound('That season');
  const offers = await db
    .select({
      speciesId: motherPlants.speciesId,
      speciesName: species.commonName,
      restrictionNote: species.restrictionNote,
      varietyId: motherPlants.varietyId,
      varietyName: varieties.name,
      farmId: farms.id,
      farmLat: farms.lat,
      farmLon: farms.lon,
      available: sql<number>`(${woodOffers.offered} - ${woodOffers.reserved})::int`,
      healthStatus: motherPlants.healthStatus,
      lastInspectedOn: motherPlants.lastInspectedOn,
    })
    .from(woodOffers)
    .innerJoin(motherPlants, eq(motherPlants.id, woodOffers.plantId))
    .innerJoin(farms, eq(farms.id, motherPlants.farmId))
    .innerJoin(species, eq(species.id, motherPlants.speciesId))
    .leftJoin(varieties, eq(varieties.id, motherPlants.varietyId))
    .where(and(eq(woodOffers.seasonId, seasonId), isNull(woodOffers.withdrawnAt)));
  const asks = await db
    .select({
      speciesId: requestLines.speciesId,
      speciesName: species.commonName,
      restrictionNote: species.restrictionNote,
      varietyId: requestLines.varietyId,
      varietyName: varieties.name,
      asked: sql<number>`sum(${requestLines.cuttings})::int`,
    })
    .from(requestLines)
    .innerJoin(woodRequests, eq(woodRequests.id, requestLines.requestId))
    .innerJoin(species, eq(species.id, requestLines.speciesId))
    .leftJoin(varieties, eq(varieties.id, requestLines.varietyId))
    .where(and(eq(woodRequests.seasonId, seasonId), eq(woodRequests.status, 'filed')))
    .groupBy(requestLines.speciesId, species.commonName, species.restrictionNote, requestLines.varietyId, varieties.name);

  const rows = new Map<string, BoardRow & { farmSet: Set<string> }>();
  const keyOf = (s: string, v: string | null) => `${s}:${v ?? '*'}`;
  const rowFor = (x: { speciesId: string; speciesName: string; varietyId: string | null; varietyName: string | null; restrictionNote: string | null }) => {
    const k = keyOf(x.speciesId, x.varietyId);
    let row = rows.get(k);
    if (!row) {
      row = { speciesId: x.speciesId, speciesName: x.speciesName, varietyId: x.varietyId, varietyName: x.varietyName, offered: 0, farms: 0, plants: 0, asked: 0, pressure: null, nearestKm: null, restrictionNote: x.restrictionNote, farmSet: new Set() };
      rows.set(k, row);
    }
    return row;
  };
  for (const o of offers) {
    if (o.available <= 0 || !mayGiveWood(o.healthStatus, o.lastInspectedOn, season.lookbackMonths, now)) continue;
    const row = rowFor(o);
    row.offered += o.available;
    row.plants += 1;
    row.farmSet.add(o.farmId);
    if (from) {
      const km = distanceM(from, { lat: o.farmLat, lon: o.farmLon }) / 1000;
      row.nearestKm = row.nearestKm == null ? km : Math.min(row.nearestKm, km);
    }
  }
  for (const a of asks) rowFor(a).asked += a.asked;
  return [...rows.values()]
    .map(({ farmSet, ...r }) => ({ ...r, farms: farmSet.size, pressure: r.offered > 0 ? r.asked / r.offered : r.asked > 0 ? null : 0, nearestKm: r.nearestKm == null ? null : Math.round(r.nearestKm * 10) / 10 }))
    .sort((p, q) => p.speciesName.localeCompare(q.speciesName) || (p.varietyName ?? '').localeCompare(q.varietyName ?? ''));
}

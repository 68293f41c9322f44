// Allocation rounds: gather the season's eligible offers and filed request lines, solve the
// model, keep the proposal for review and hand edits, and on approval reserve the wood in one
// transaction (the database refuses over-allocation), make bundle codes, then send the
// pickup slips and farm lists.
import { and, eq, inArray, ne, sql } from 'drizzle-orm';
import { mayGiveWood } from '../../../shared/health-rules.js';
import { distanceM } from '../../../shared/geo.js';
import type { LineReason, RoundView } from '../../../shared/schemas/allocation.js';
import type { Actor } from '../../auth/guards.js';
import type { AppContext } from '../../context.js';
import type { Db, DbOrTx } from '../../db/client.js';
import { allocationRounds, bundles, emailLog, pickupWindows, woodOffers } from '../../db/schema/index.js';
import { badRequest, conflict, notFound } from '../../lib/http-error.js';
import { writeAudit } from '../audit/audit.repo.js';
import { type AllocInput, type AllocResult, solveAllocation } from './allocation-model.js';
import {
  farmLimits,
  linesWithNames,
  nextRoundNumber,
  roundBundles,
  roundRow,
  seasonLines,
  seasonOf,
  seasonOffers,
} from './allocation-rounds.repo.js';
import { notifyRound } from './allocation-notify.js';
import { woodBoard } from '../wood-requests/wood-requests.service.js';

/** Rounds being solved right now, for the progress shown on the review page. */
const running = new Map<string, { stage: string; startedAt: Date; done: Promise<void> }>();

type OfferRow = Awaited<ReturnType<typeof seasonOffers>>[number];

async function eligibleOffers(db: DbOrTx, seasonId: string, lookbackMonths: number, now: Date): Promise<OfferRow[]> {
  const rows = await seasonOffers(db, seasonId);
  return rows.filter((o) => o.offered - o.reserved > 0 && mayGiveWood(o.healthStatus, o.lastInspectedOn, lookbackMonths, now));
}

/** Everything the solver sees; stored with the round so it can be reproduced. */
export async function buildInput(db: DbOrTx, roundId: string, seasonId: string, now: Date): Promise<AllocInput> {
  const season = await seasonOf(db, seasonId);
  const offers = await eligibleOffers(db, seasonId, season.lookbackMonths, now);
  const lines = await seasonLines(db, seasonId);
  const locked = await db
    .select({ offerId: bundles.offerId, lineId: bundles.lineId, cuttings: bundles.cuttings })
    .from(bundles)
    .where(and(eq(bundles.roundId, roundId), eq(bundles.locked, true), ne(bundles.status, 'cancelled')));
  return {
    offers: offers.map((o) => ({
      id: o.id,
      plantId: o.plantId,
      farmId: o.farmId,
      speciesId: o.speciesId,
      varietyId: o.varietyId,
      available: o.offered - o.reserved,
      lat: o.lat,
      lon: o.lon,
    })),
    lines: lines.map((l) => ({ ...l, priority: Number(l.priority), maxDistanceKm: Number(l.maxDistanceKm) })),
    farmLimits: await farmLimits(db),
    locked,
  };
}

async function storeResult(db: Db, roundId: string, input: AllocInput, result: AllocResult) {
  const offerById = new Map(input.offers.map((o) => [o.id, o]));
  const lineById = new Map(input.lines.map((l) => [l.id, l]));
  await db.transaction(async (tx) => {
    const round = await roundRow(tx, roundId, true);
    if (!round || round.status === 'approved' || round.status === 'notified') return;
    await tx.delete(bundles).where(and(eq(bundles.roundId, roundId), eq(bundles.locked, false)));
    const lockedKeys = new Set(input.locked?.map((l) => `${l.offerId}:${l.lineId}`) ?? []);
    const fresh = result.assignments.filter((a) => a.cuttings > 0 && !lockedKeys.has(`${a.offerId}:${a.lineId}`));
    if (fresh.length) {
      await tx.insert(bundles).values(
        fresh.map((a) => {
          const o = offerById.get(a.offerId)!;
          const l = lineById.get(a.lineId)!;
          return { roundId, offerId: a.offerId, lineId: a.lineId, plantId: o.plantId, farmId: o.farmId, growerId: l.growerId, cuttings: a.cuttings, distanceM: a.distanceM };
        }),
      );
    }
    await tx
      .update(allocationRounds)
      .set({ status: 'proposed', inputs: input, solverStats: { ...result.stats, lines: result.lines } })
      .where(eq(allocationRounds.id, roundId));
  });
}

function launch(ctx: AppContext, roundId: string, seasonId: string): Promise<void> {
  const state = { stage: 'gathering offers and requests', startedAt: new Date(), done: Promise.resolve() };
  state.done = (async () => {
    try {
      const input = await buildInput(ctx.db, roundId, seasonId, new Date());
      state.stage = `solving: ${input.offers.length} offers, ${input.lines.length} request lines`;
      const result = await solveAllocation(input);
      state.stage = 'saving the proposal';
      await storeResult(ctx.db, roundId, input, result);
    } catch (err) {
      console.error(`[heelwood] allocation round ${roundId} failed:`, err);
      await ctx.db
        .update(allocationRounds)
        .set({ solverStats: { error: err instanceof Error ? err.message : String(err) } })
        .where(eq(allocationRounds.id, roundId));
    } finally {
      running.delete(roundId);
    }
  })();
  running.set(roundId, state);
  return state.done;
}

export async function startRound(ctx: AppContext, a: Actor, seasonId: string, wait: boolean) {
  const season = await seasonOf(ctx.db, seasonId);
  if (!season) throw notFound('That season');
  if (season.stage !== 'allocating') {
    throw conflict('Rounds run while the season is allocating: move the season to "Allocating" first.', { seasonId: `season is ${season.stage}` });
  }
  const round = await ctx.db.transaction(async (tx) => {
    const [busy] = await tx
      .select({ id: allocationRounds.id })
      .from(allocationRounds)
      .where(and(eq(allocationRounds.seasonId, seasonId), inArray(allocationRounds.status, ['draft', 'proposed'])));
    if (busy) throw conflict('This season already has a round under review: approve it or run it again.', { roundId: busy.id });
    const [row] = await tx
      .insert(allocationRounds)
      .values({ seasonId, number: await nextRoundNumber(tx, seasonId), status: 'draft', createdBy: a.id })
      .returning();
    return row;
  });
  const done = launch(ctx, round.id, seasonId);
  if (wait) await done;
  return round.id;
}

export async function rerunRound(ctx: AppContext, roundId: string, wait: boolean) {
  const round = await roundRow(ctx.db, roundId);
  if (!round) throw notFound('That round');
  if (round.status !== 'proposed' && round.status !== 'draft') throw conflict(`The round is ${round.status}; start a new round instead.`);
  if (running.has(roundId)) throw conflict('The round is still being solved.');
  const done = launch(ctx, roundId, round.seasonId);
  if (wait) await done;
}

export async function waitForRound(roundId: string) {
  await running.get(roundId)?.done;
}

// Review ---------------------------------------------------------------------------

export async function roundView(db: Db, roundId: string, now = new Date()): Promise<RoundView> {
  const round = await roundRow(db, roundId);
  if (!round) throw notFound('That round');
  const season = await seasonOf(db, round.seasonId);
  const b = await roundBundles(db, roundId);
  const lines = await linesWithNames(db, round.seasonId);
  const stats = (round.solverStats ?? null) as (RoundView['stats'] & { lines?: { lineId: string; reason: LineReason }[]; error?: string }) | null;
  const reasons = new Map((stats?.lines ?? []).map((l) => [l.lineId, l.reason]));
  const allocatedByLine = new Map<string, number>();
  for (const x of b) if (x.status !== 'cancelled') allocatedByLine.set(x.lineId, (allocatedByLine.get(x.lineId) ?? 0) + x.cuttings);

  const supplyKey = (s: string, v: string | null) => `${s}|${v ?? ''}`;
  const supply = new Map<string, RoundView['supply'][number]>();
  for (const row of await woodBoard(db, round.seasonId, null, now)) {
    supply.set(supplyKey(row.speciesName, row.varietyName), { speciesName: row.speciesName, varietyName: row.varietyName, offered: row.offered, asked: 0, allocated: 0 });
  }
  const roundLines = lines.map((l) => {
    const allocated = allocatedByLine.get(l.lineId) ?? 0;
    const fill = l.asked ? allocated / l.asked : 0;
    const reason: LineReason = reasons.get(l.lineId) ?? (allocated >= l.asked ? 'filled' : allocated > 0 ? 'partly' : 'shared_out');
    const k = supplyKey(l.speciesName, l.varietyName);
    const s = supply.get(k) ?? { speciesName: l.speciesName, varietyName: l.varietyName, offered: 0, asked: 0, allocated: 0 };
    s.asked += l.asked;
    s.allocated += allocated;
    supply.set(k, s);
    const finalReason: LineReason = allocated >= l.asked ? 'filled' : reason === 'filled' ? 'partly' : reason;
    return { ...l, maxDistanceKm: Number(l.maxDistanceKm), allocated, fill, reason: finalReason };
  });
  const log = await db
    .select({ kind: emailLog.kind, to: emailLog.toAddress, status: emailLog.status, attempts: emailLog.attempts, lastError: emailLog.lastError })
    .from(emailLog)
    .where(sql`${emailLog.related}->>'roundId' = ${roundId}`);
  const r = running.get(roundId);
  return {
    id: round.id,
    seasonId: round.seasonId,
    seasonName: season.name,
    number: round.number,
    status: round.status,
    running: r ? { stage: r.stage, startedAt: r.startedAt.toISOString() } : null,
    error: stats?.error ?? null,
    createdAt: round.createdAt.toISOString(),
    approvedAt: round.approvedAt?.toISOString() ?? null,
    notifiedAt: round.notifiedAt?.toISOString() ?? null,
    stats: stats && !stats.error ? stats : null,
    bundles: b.map((x) => ({
      ...x,
      distanceKm: x.distanceM == null ? null : Math.round(x.distanceM / 100) / 10,
      problem:
        x.status === 'cancelled' || mayGiveWood(x.plantStatus, x.lastInspectedOn, season.lookbackMonths, now)
          ? null
          : `The source plant is ${x.plantStatus === 'clean' ? 'not inspected within the look-back' : `on ${x.plantStatus}`}: change this bundle before approving.`,
    })),
    lines: roundLines,
    supply: [...supply.values()].sort((p, q) => p.speciesName.localeCompare(q.speciesName)),
    emails: log,
  };
}

// Hand edits -------------------------------------------------------------------------

async function assertEditable(tx: DbOrTx, roundId: string) {
  const round = await roundRow(tx, roundId, true);
  if (!round) throw notFound('That round');
  if (round.status !== 'proposed') throw conflict(`The round is ${round.status}: only a proposed round can be edited.`);
  if (running.has(roundId)) throw conflict('The round is still being solved.');
  return round;
}

/** Live checks for a bundle: compatibility, health, distance, and the offer's capacity. */
async function checkBundle(tx: DbOrTx, round: { id: string; seasonId: string }, offerId: string, lineId: string, cuttings: number, exceptBundleId?: string) {
  const season = await seasonOf(tx, round.seasonId);
  const [offer] = await seasonOffers(tx, round.seasonId, offerId);
  if (!offer) throw badRequest('That offer is not part of this season (or was withdrawn).', { offerId: 'not offered this season' });
  const [line] = await seasonLines(tx, round.seasonId, lineId);
  if (!line) throw badRequest('That request line is not filed in this season.', { lineId: 'not a filed line' });
  if (!mayGiveWood(offer.healthStatus, offer.lastInspectedOn, season.lookbackMonths, new Date())) {
    throw badRequest(`Plant ${offer.plantCode} may not give wood (it is ${offer.healthStatus}, or not inspected within the look-back).`, { offerId: 'plant not clean' });
  }
  const sameVariety = line.varietyId != null && line.varietyId === offer.varietyId;
  const speciesOk = offer.speciesId === line.speciesId && (line.varietyId == null || line.substitutesAllowed);
  if (!sameVariety && !speciesOk) throw badRequest('That wood does not match the line (variety, or species where substitutes are allowed).', { offerId: 'not compatible with the line' });
  const km = distanceM({ lat: line.lat, lon: line.lon }, { lat: offer.lat, lon: offer.lon }) / 1000;
  if (km > Number(line.maxDistanceKm)) {
    throw badRequest(`The farm is ${km.toFixed(1)} km away; the grower travels at most ${line.maxDistanceKm} km.`, { offerId: 'beyond the distance' });
  }
  const others = await tx
    .select({ n: sql<number>`coalesce(sum(${bundles.cuttings}), 0)::int` })
    .from(bundles)
    .where(
      and(
        eq(bundles.roundId, round.id),
        eq(bundles.offerId, offerId),
        ne(bundles.status, 'cancelled'),
        exceptBundleId ? ne(bundles.id, exceptBundleId) : sql`true`,
      ),
    );
  const free = offer.offered - offer.reserved - others[0].n;
  if (cuttings > free) throw badRequest(`Only ${free} more cuttings are free on plant ${offer.plantCode}.`, { cuttings: `at most ${free}` });
  const lineOthers = await tx
    .select({ n: sql<number>`coalesce(sum(${bundles.cuttings}), 0)::int` })
    .from(bundles)
    .where(and(eq(bundles.roundId, round.id), eq(bundles.lineId, lineId), ne(bundles.status, 'cancelled'), exceptBundleId ? ne(bundles.id, exceptBundleId) : sql`true`));
  if (cuttings + lineOthers[0].n > line.cuttings) {
    throw badRequest(`The line asks for ${line.cuttings}; ${lineOthers[0].n} are already given.`, { cuttings: `at most ${line.cuttings - lineOthers[0].n}` });
  }
  return { offer, line, distanceM: km * 1000 };
}

export async function editBundle(db: Db, a: Actor, roundId: string, bundleId: string, cuttings: number) {
  await db.transaction(async (tx) => {
    const round = await assertEditable(tx, roundId);
    const [b] = await tx.select().from(bundles).where(and(eq(bundles.id, bundleId), eq(bundles.roundId, roundId)));
    if (!b) throw notFound('That bundle');
    await checkBundle(tx, round, b.offerId, b.lineId, cuttings, b.id);
    await tx.update(bundles).set({ cuttings, locked: true }).where(eq(bundles.id, bundleId));
    await writeAudit(tx, { actorId: a.id, entity: 'bundle', entityId: bundleId, action: 'edit', before: { cuttings: b.cuttings }, after: { cuttings } });
  });
}

export async function addBundle(db: Db, a: Actor, roundId: string, input: { offerId: string; lineId: string; cuttings: number }) {
  return db.transaction(async (tx) => {
    const round = await assertEditable(tx, roundId);
    const [dup] = await tx.select({ id: bundles.id }).from(bundles).where(and(eq(bundles.roundId, roundId), eq(bundles.offerId, input.offerId), eq(bundles.lineId, input.lineId)));
    if (dup) throw conflict('That plant already gives to that line in this round: change the bundle instead.', { offerId: 'bundle exists' });
    const { offer, line, distanceM: d } = await checkBundle(tx, round, input.offerId, input.lineId, input.cuttings);
    const [row] = await tx
      .insert(bundles)
      .values({ roundId, offerId: offer.id, lineId: line.id, plantId: offer.plantId, farmId: offer.farmId, growerId: line.growerId, cuttings: input.cuttings, distanceM: d, locked: true })
      .returning();
    await writeAudit(tx, { actorId: a.id, entity: 'bundle', entityId: row.id, action: 'add', after: input });
    return row;
  });
}

export async function removeBundle(db: Db, a: Actor, roundId: string, bundleId: string) {
  await db.transaction(async (tx) => {
    await assertEditable(tx, roundId);
    const deleted = await tx.delete(bundles).where(and(eq(bundles.id, bundleId), eq(bundles.roundId, roundId))).returning();
    if (!deleted.length) throw notFound('That bundle');
    await writeAudit(tx, { actorId: a.id, entity: 'bundle', entityId: bundleId, action: 'remove', before: { cuttings: deleted[0].cuttings } });
  });
}

// Approval -----------------------------------------------------------------------------

/**
 * Test hook (HEELWOOD_TEST_APPROVAL_DELAY_MS, refused in production by config.ts): holds the
 * approval open after its first writes so a test can kill the server mid-transaction.
 */
async function testPause(roundId: string, ms: number) {
  console.log(`[heelwood] test hook: approval of round ${roundId} paused inside its transaction for ${ms} ms`);
  await new Promise((r) => setTimeout(r, ms));
}

export async function approveRound(ctx: AppContext, a: Actor, roundId: string, now = new Date()) {
  await ctx.db.transaction(async (tx) => {
    const round = await roundRow(tx, roundId, true);
    if (!round) throw notFound('That round');
    if (round.status === 'approved' || round.status === 'notified') throw conflict('The round is already approved.', { roundId: 'already approved' });
    if (round.status !== 'proposed' || running.has(roundId)) throw conflict('The round is not ready: wait for the proposal.');
    const season = await seasonOf(tx, round.seasonId);
    const list = await roundBundles(tx, roundId);
    const live = list.filter((b) => b.status !== 'cancelled');
    const sick = live.filter((b) => !mayGiveWood(b.plantStatus, b.lastInspectedOn, season.lookbackMonths, now));
    if (sick.length) {
      throw conflict(`Bundles from plants that may no longer give wood: ${sick.map((b) => b.plantCode).join(', ')}. Change them first.`, {
        bundles: sick.map((b) => b.id).join(','),
      });
    }
    if (!live.length) throw conflict('The round has no bundles to approve.');
    // Reserve per offer; the CHECK (reserved <= offered) refuses over-allocation, even when
    // another approval or an offer edit runs at the same moment.
    const perOffer = new Map<string, number>();
    for (const b of live) perOffer.set(b.offerId, (perOffer.get(b.offerId) ?? 0) + b.cuttings);
    for (const [offerId, n] of [...perOffer].sort(([x], [y]) => x.localeCompare(y))) {
      try {
        await tx.update(woodOffers).set({ reserved: sql`${woodOffers.reserved} + ${n}` }).where(eq(woodOffers.id, offerId));
      } catch (err) {
        throw conflict('Another approval has taken some of this wood already: run the round again.', { offerId });
      }
    }
    // Bundle codes: B<yy>-NNNN, one sequence per collection year, made under a lock.
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext('heelwood-bundle-codes'))`);
    const prefix = `B${season.collectionStart.slice(2, 4)}-`;
    const [{ n: last }] = await tx
      .select({ n: sql<number>`coalesce(max(substr(${bundles.code}, ${prefix.length + 1})::int), 0)::int` })
      .from(bundles)
      .where(sql`${bundles.code} like ${`${prefix}%`}`);
    const windows = await tx.select().from(pickupWindows).where(eq(pickupWindows.seasonId, round.seasonId)).orderBy(pickupWindows.startsAt);
    let seq = last;
    for (const b of live) {
      seq += 1;
      const w = windows.find((x) => x.farmId === b.farmId);
      await tx
        .update(bundles)
        .set({ code: `${prefix}${String(seq).padStart(4, '0')}`, status: 'reserved', pickupWindowId: w?.id ?? null })
        .where(eq(bundles.id, b.id));
      if (seq === last + 1 && ctx.config.testApprovalDelayMs > 0) await testPause(roundId, ctx.config.testApprovalDelayMs);
    }
    await tx.update(allocationRounds).set({ status: 'approved', approvedBy: a.id, approvedAt: new Date() }).where(eq(allocationRounds.id, roundId));
    await writeAudit(tx, { actorId: a.id, entity: 'allocation_round', entityId: roundId, action: 'approve', after: { bundles: live.length, cuttings: live.reduce((s, b) => s + b.cuttings, 0) } });
  });
  return notifyRound(ctx, roundId);
}


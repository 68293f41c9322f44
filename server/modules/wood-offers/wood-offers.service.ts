// Wood offers: for each clean, recently inspected plant a farm states its new growth;
// Heelwood estimates the cuttings it yields and caps what may be offered by the plant's role.
import { TZDate } from '@date-fns/tz';
import { and, asc, eq, ne } from 'drizzle-orm';
import { mayGiveWood } from '../../../shared/health-rules.js';
import type { OfferInput, OfferRow, PickupWindow } from '../../../shared/schemas/seasons.js';
import { STAGE_RULES } from '../../../shared/seasons.js';
import { DEFAULT_ROLE_CAPS, offerCap, plantYield } from '../../../shared/yield.js';
import type { PlantRole } from '../../../shared/domain.js';
import type { Actor } from '../../auth/guards.js';
import { farmRoleOf } from '../../auth/guards.js';
import type { Db, DbOrTx } from '../../db/client.js';
import { farms, motherPlants, pickupWindows, species, varieties, woodOffers } from '../../db/schema/index.js';
import { badRequest, conflict, forbidden, notFound } from '../../lib/http-error.js';
import { getSetting } from '../cooperative/cooperative.repo.js';
import { isCoordinator, seesFull } from '../mother-plants/plant-access.js';
import { seasonRow } from '../seasons/seasons.repo.js';

export async function roleCaps(db: DbOrTx): Promise<Record<PlantRole, number>> {
  return { ...DEFAULT_ROLE_CAPS, ...((await getSetting<Partial<Record<PlantRole, number>>>(db, 'roleCaps')) ?? {}) };
}

function assertFarmWorker(a: Actor, farmId: string, leadOnly = false) {
  if (isCoordinator(a)) return;
  const role = farmRoleOf(a, farmId);
  if (!role || (leadOnly && role !== 'lead')) {
    throw forbidden(leadOnly ? "Only the farm's lead or a coordinator may do that." : 'Only the people of that farm, or a coordinator, may do that.');
  }
}

function whyNot(status: string, last: string | null, eligible: boolean, lookbackMonths: number): string | null {
  if (eligible) return null;
  if (status !== 'clean') return `Health status is ${status}: wood is taken only from clean plants.`;
  if (!last) return 'Never inspected: record a clean inspection first.';
  return `Last inspected ${last}, more than ${lookbackMonths} months ago: inspect it first.`;
}

export async function farmOffers(db: Db, a: Actor, seasonId: string, farmId: string, now = new Date()): Promise<OfferRow[]> {
  assertFarmWorker(a, farmId);
  const season = await seasonRow(db, seasonId);
  if (!season) throw notFound('That season');
  const caps = await roleCaps(db);
  const rows = await db
    .select({
      plantId: motherPlants.id,
      code: motherPlants.code,
      farmId: motherPlants.farmId,
      farmName: farms.name,
      speciesName: species.commonName,
      varietyName: varieties.name,
      role: motherPlants.role,
      healthStatus: motherPlants.healthStatus,
      lastInspectedOn: motherPlants.lastInspectedOn,
      cuttingLengthCm: species.defaultCuttingLengthCm,
      softTipCm: species.softTipCm,
      offer: woodOffers,
    })
    .from(motherPlants)
    .innerJoin(farms, eq(farms.id, motherPlants.farmId))
    .innerJoin(species, eq(species.id, motherPlants.speciesId))
    .leftJoin(varieties, eq(varieties.id, motherPlants.varietyId))
    .leftJoin(woodOffers, and(eq(woodOffers.plantId, motherPlants.id), eq(woodOffers.seasonId, seasonId)))
    .where(and(eq(motherPlants.farmId, farmId), ne(motherPlants.healthStatus, 'retired')))
    .orderBy(asc(species.commonName), asc(varieties.name), asc(motherPlants.code));
  return rows.map(({ offer, ...r }) => {
    const eligible = mayGiveWood(r.healthStatus, r.lastInspectedOn, season.lookbackMonths, now);
    return {
      ...r,
      eligible,
      whyNot: whyNot(r.healthStatus, r.lastInspectedOn, eligible, season.lookbackMonths),
      capFraction: caps[r.role],
      offer: offer
        ? {
            id: offer.id,
            shootCount: offer.shootCount,
            meanShootLengthCm: offer.meanShootLengthCm,
            directCount: offer.directCount,
            estimatedYield: offer.estimatedYield,
            offered: offer.offered,
            reserved: offer.reserved,
            withdrawnAt: offer.withdrawnAt?.toISOString() ?? null,
            withdrawnReason: offer.withdrawnReason,
          }
        : null,
    };
  });
}

export async function setOffer(db: Db, a: Actor, seasonId: string, plantId: string, input: OfferInput, now = new Date()) {
  return db.transaction(async (tx) => {
    const season = await seasonRow(tx, seasonId);
    if (!season) throw notFound('That season');
    const [plant] = await tx
      .select({ p: motherPlants, cuttingLengthCm: species.defaultCuttingLengthCm, softTipCm: species.softTipCm })
      .from(motherPlants)
      .innerJoin(species, eq(species.id, motherPlants.speciesId))
      .where(eq(motherPlants.id, plantId));
    // A plant the caller may not see at all (another farm's, not clean) is "not found".
    if (!plant || (!seesFull(a, plant.p.farmId) && plant.p.healthStatus !== 'clean')) throw notFound('That plant');
    assertFarmWorker(a, plant.p.farmId);
    if (!STAGE_RULES[season.stage].offers) {
      throw conflict(`Offers are closed: the season is ${season.stage.replace('_', ' ')}.`, { seasonId: STAGE_RULES[season.stage].text });
    }
    if (!mayGiveWood(plant.p.healthStatus, plant.p.lastInspectedOn, season.lookbackMonths, now)) {
      throw badRequest('Wood is offered only from clean plants inspected within the look-back.', {
        plantId: whyNot(plant.p.healthStatus, plant.p.lastInspectedOn, false, season.lookbackMonths)!,
      });
    }
    const basis =
      input.directCount != null
        ? { directCount: input.directCount }
        : { shootCount: input.shootCount!, meanShootLengthCm: input.meanShootLengthCm!, softTipCm: plant.softTipCm, cuttingLengthCm: plant.cuttingLengthCm };
    const estimatedYield = plantYield(basis);
    const capFraction = (await roleCaps(tx))[plant.p.role];
    const max = offerCap(estimatedYield, capFraction);
    const offered = input.offered ?? max;
    if (offered > max) {
      throw badRequest(`At most ${max} cuttings may be offered from this plant (its estimate is ${estimatedYield}, capped by its role).`, {
        offered: `at most ${max}`,
      });
    }
    const [existing] = await tx
      .select()
      .from(woodOffers)
      .where(and(eq(woodOffers.seasonId, seasonId), eq(woodOffers.plantId, plantId)))
      .for('update');
    if (existing && offered < existing.reserved) {
      throw conflict(`${existing.reserved} cuttings are already reserved from this plant.`, { offered: `at least ${existing.reserved} (reserved)` });
    }
    const values = {
      shootCount: input.directCount != null ? null : input.shootCount!,
      meanShootLengthCm: input.directCount != null ? null : input.meanShootLengthCm!,
      directCount: input.directCount ?? null,
      estimatedYield,
      capFraction,
      offered,
      withdrawnAt: null,
      withdrawnReason: null,
      updatedAt: new Date(),
    };
    const [row] = existing
      ? await tx.update(woodOffers).set(values).where(eq(woodOffers.id, existing.id)).returning()
      : await tx.insert(woodOffers).values({ ...values, seasonId, plantId, createdBy: a.id }).returning();
    return { offer: row, max };
  });
}

export async function withdrawOffer(db: Db, a: Actor, seasonId: string, plantId: string) {
  await db.transaction(async (tx) => {
    const [offer] = await tx
      .select({ o: woodOffers, farmId: motherPlants.farmId, healthStatus: motherPlants.healthStatus })
      .from(woodOffers)
      .innerJoin(motherPlants, eq(motherPlants.id, woodOffers.plantId))
      .where(and(eq(woodOffers.seasonId, seasonId), eq(woodOffers.plantId, plantId)))
      .for('update');
    if (!offer || (!seesFull(a, offer.farmId) && offer.healthStatus !== 'clean')) throw notFound('That offer');
    assertFarmWorker(a, offer.farmId);
    if (offer.o.reserved > 0) throw conflict(`${offer.o.reserved} cuttings are already reserved; ask the coordinator to change the bundles first.`);
    await tx.delete(woodOffers).where(eq(woodOffers.id, offer.o.id));
  });
}

// Pickup windows ------------------------------------------------------------------------

export async function listWindows(db: DbOrTx, seasonId: string, farmId?: string): Promise<PickupWindow[]> {
  const rows = await db
    .select({ w: pickupWindows, timezone: farms.timezone })
    .from(pickupWindows)
    .innerJoin(farms, eq(farms.id, pickupWindows.farmId))
    .where(farmId ? and(eq(pickupWindows.seasonId, seasonId), eq(pickupWindows.farmId, farmId)) : eq(pickupWindows.seasonId, seasonId))
    .orderBy(asc(pickupWindows.startsAt));
  return rows.map(({ w, timezone }) => ({
    id: w.id,
    farmId: w.farmId,
    startsAt: w.startsAt.toISOString(),
    endsAt: w.endsAt.toISOString(),
    note: w.note,
    timezone,
  }));
}

/** Wall-clock date and time in the farm's zone to an instant. */
export function farmTime(date: string, hhmm: string, timezone: string): Date {
  const [y, m, d] = date.split('-').map(Number);
  const [hh, mm] = hhmm.split(':').map(Number);
  return new Date(new TZDate(y, m - 1, d, hh, mm, timezone).getTime());
}

export async function addWindow(db: Db, a: Actor, seasonId: string, farmId: string, input: { date: string; from: string; to: string; note: string }) {
  assertFarmWorker(a, farmId, true);
  const season = await seasonRow(db, seasonId);
  if (!season) throw notFound('That season');
  if (!STAGE_RULES[season.stage].windows) throw conflict('The season is closed.');
  const [farm] = await db.select().from(farms).where(eq(farms.id, farmId));
  if (!farm) throw notFound('That farm');
  if (input.date < season.collectionStart || input.date > season.collectionEnd) {
    throw badRequest(`Pickup windows fall inside the collection window, ${season.collectionStart} to ${season.collectionEnd}.`, { date: 'outside the collection window' });
  }
  const [row] = await db
    .insert(pickupWindows)
    .values({ seasonId, farmId, startsAt: farmTime(input.date, input.from, farm.timezone), endsAt: farmTime(input.date, input.to, farm.timezone), note: input.note })
    .returning();
  return row;
}

export async function deleteWindow(db: Db, a: Actor, windowId: string) {
  const [w] = await db.select().from(pickupWindows).where(eq(pickupWindows.id, windowId));
  if (!w) throw notFound('That pickup window');
  assertFarmWorker(a, w.farmId, true);
  await db.delete(pickupWindows).where(eq(pickupWindows.id, windowId));
}

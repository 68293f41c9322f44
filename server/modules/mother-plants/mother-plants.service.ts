// The rules of the register: who sees what, codes, provenance, retiring, holds, and an
// audit row for every change of status, role or ownership.
import { and, asc, desc, eq, inArray } from 'drizzle-orm';
import { lookbackStart } from '../../../shared/health-rules.js';
import type {
  AuditItem,
  InspectionView,
  PhotoView,
  PlantCreate,
  PlantDetail,
  PlantListFilters,
  PlantListItem,
  PlantUpdate,
  WoodHistoryItem,
} from '../../../shared/schemas/register.js';
import type { Actor } from '../../auth/guards.js';
import type { Db, DbOrTx } from '../../db/client.js';
import {
  allocationRounds,
  auditLog,
  bundles,
  farms,
  findings,
  inspections,
  motherPlants,
  pests,
  photos,
  seasons,
  species,
  user,
  varieties,
  woodOffers,
} from '../../db/schema/index.js';
import { badRequest, conflict, forbidden, notFound } from '../../lib/http-error.js';
import { writeAudit } from '../audit/audit.repo.js';
import { getSetting } from '../cooperative/cooperative.repo.js';
import { approximate, isCoordinator, mayEdit, mayInspect, mayRetire, seesFull } from './plant-access.js';
import {
  allPlants,
  findPlant,
  findPlantRow,
  insertPlant,
  listPlants,
  nextPlantNumber,
  updatePlant,
  type Visibility,
} from './mother-plants.repo.js';

export async function healthLookbackMonths(db: DbOrTx): Promise<number> {
  return (await getSetting<number>(db, 'healthLookbackMonths')) ?? 12;
}

function visibility(a: Actor): Visibility {
  return isCoordinator(a) ? { all: true } : { all: false, farmIds: a.farms.map((f) => f.farmId) };
}

/** Shapes a row for the caller: full for their own farms, trimmed for others. */
export function present(a: Actor, row: Omit<PlantListItem, 'full'>): PlantListItem {
  if (seesFull(a, row.farmId)) return { ...row, full: true };
  return { ...row, lat: approximate(row.lat), lon: approximate(row.lon), bedRow: null, full: false };
}

export async function listForActor(db: Db, a: Actor, f: PlantListFilters) {
  const since = lookbackStart(await healthLookbackMonths(db), new Date());
  const { rows, total } = await listPlants(db, f, visibility(a), since);
  return { items: rows.map((r) => present(a, r)), total };
}

export async function exportRows(db: Db, a: Actor, f: PlantListFilters) {
  const since = lookbackStart(await healthLookbackMonths(db), new Date());
  const rows = await allPlants(db, f, visibility(a), since);
  return rows.map((r) => present(a, r));
}

/** Loads a plant the caller may see at all; others' non-clean plants are "not found". */
export async function visiblePlant(db: DbOrTx, a: Actor, id: string) {
  const plant = await findPlant(db, id);
  if (!plant) throw notFound('That plant');
  if (!seesFull(a, plant.farmId) && plant.healthStatus !== 'clean') throw notFound('That plant');
  return plant;
}

async function checkSpeciesVariety(db: DbOrTx, speciesId: string, varietyId: string | null | undefined) {
  const [s] = await db.select({ id: species.id }).from(species).where(eq(species.id, speciesId));
  if (!s) throw badRequest('Choose a species from the list.', { speciesId: 'unknown species' });
  if (varietyId) {
    const [v] = await db.select({ speciesId: varieties.speciesId }).from(varieties).where(eq(varieties.id, varietyId));
    if (!v) throw badRequest('Choose a variety from the list.', { varietyId: 'unknown variety' });
    if (v.speciesId !== speciesId) throw badRequest('That variety belongs to another species.', { varietyId: 'not a variety of this species' });
  }
}

async function checkParent(db: DbOrTx, parentPlantId: string | null | undefined, selfId?: string) {
  if (!parentPlantId) return;
  if (parentPlantId === selfId) throw badRequest('A plant cannot be its own parent.', { parentPlantId: 'is this plant' });
  const parent = await findPlant(db, parentPlantId);
  if (!parent) throw badRequest('The parent plant was not found.', { parentPlantId: 'unknown plant' });
}

export async function createPlant(db: Db, a: Actor, input: PlantCreate & { farmId: string; speciesId: string; plantingYear: number }) {
  if (!mayEdit(a, input.farmId)) throw forbidden('Only the people of that farm, or a coordinator, may add plants to it.');
  return db.transaction(async (tx) => {
    const [farm] = await tx.select().from(farms).where(eq(farms.id, input.farmId));
    if (!farm) throw badRequest('Choose a farm from the list.', { farmId: 'unknown farm' });
    await checkSpeciesVariety(tx, input.speciesId, input.varietyId);
    await checkParent(tx, input.parentPlantId);
    let code = input.code;
    if (code) {
      if (!code.startsWith(`${farm.code}-`)) throw badRequest(`Codes on this farm start with ${farm.code}-.`, { code: `must start with ${farm.code}-` });
    } else {
      code = `${farm.code}-${String(await nextPlantNumber(tx, farm.code)).padStart(4, '0')}`;
    }
    const [clash] = await tx.select({ id: motherPlants.id }).from(motherPlants).where(eq(motherPlants.code, code));
    if (clash) throw conflict(`The code ${code} is taken.`, { code: 'already used' });
    const row = await insertPlant(tx, {
      code,
      farmId: input.farmId,
      speciesId: input.speciesId,
      varietyId: input.varietyId ?? null,
      plantingYear: input.plantingYear,
      role: input.role,
      provenance: input.provenance,
      parentPlantId: input.parentPlantId ?? null,
      supplier: input.supplier ?? null,
      lat: input.lat ?? null,
      lon: input.lon ?? null,
      bedRow: input.bedRow ?? '',
      notes: input.notes ?? '',
      createdBy: a.id,
    });
    await writeAudit(tx, { actorId: a.id, entity: 'mother_plant', entityId: row.id, action: 'create', after: { code, farmId: input.farmId, role: input.role } });
    return row;
  });
}

export async function editPlant(db: Db, a: Actor, id: string, patch: PlantUpdate) {
  return db.transaction(async (tx) => {
    const before = await findPlant(tx, id);
    if (!before) throw notFound('That plant');
    if (!mayEdit(a, before.farmId)) {
      if (!seesFull(a, before.farmId) && before.healthStatus !== 'clean') throw notFound('That plant');
      throw forbidden('Only the people of that farm, or a coordinator, may edit this plant.');
    }
    if (before.healthStatus === 'retired') throw conflict('A retired plant is kept as history and cannot be edited.');
    const { reason, ...fields } = patch;
    if (fields.farmId && fields.farmId !== before.farmId && !isCoordinator(a)) {
      throw forbidden('Only a coordinator moves a plant to another farm.');
    }
    const speciesId = fields.speciesId ?? before.speciesId;
    if (fields.speciesId !== undefined || fields.varietyId !== undefined) {
      await checkSpeciesVariety(tx, speciesId, fields.varietyId === undefined ? before.varietyId : fields.varietyId);
    }
    if (fields.parentPlantId) await checkParent(tx, fields.parentPlantId, id);
    const provenance = fields.provenance ?? before.provenance;
    const parent = fields.parentPlantId === undefined ? before.parentPlantId : fields.parentPlantId;
    if (provenance === 'exchange' && !parent) {
      throw badRequest('A plant received through an exchange names its parent plant.', { parentPlantId: 'required for exchange' });
    }
    const after = await updatePlant(tx, id, fields);
    if (fields.role && fields.role !== before.role) {
      await writeAudit(tx, { actorId: a.id, entity: 'mother_plant', entityId: id, action: 'role', reason, before: { role: before.role }, after: { role: fields.role } });
    }
    if (fields.farmId && fields.farmId !== before.farmId) {
      await writeAudit(tx, { actorId: a.id, entity: 'mother_plant', entityId: id, action: 'transfer', reason, before: { farmId: before.farmId }, after: { farmId: fields.farmId } });
    }
    const changed = Object.keys(fields).filter((k) => k !== 'role' && k !== 'farmId');
    if (changed.length) {
      await writeAudit(tx, { actorId: a.id, entity: 'mother_plant', entityId: id, action: 'edit', reason, after: { fields: changed } });
    }
    return after;
  });
}

export async function retirePlant(db: Db, a: Actor, id: string, reason: string) {
  return db.transaction(async (tx) => {
    const before = await findPlant(tx, id);
    if (!before) throw notFound('That plant');
    if (!mayRetire(a, before.farmId)) {
      // As for editing: a plant the caller may not see at all is "not found", not "forbidden".
      if (!seesFull(a, before.farmId) && before.healthStatus !== 'clean') throw notFound('That plant');
      throw forbidden('Only the farm lead or a coordinator retires a plant.');
    }
    if (before.healthStatus === 'retired') throw conflict('The plant is already retired.');
    const after = await updatePlant(tx, id, { healthStatus: 'retired', retiredAt: new Date() });
    await writeAudit(tx, { actorId: a.id, entity: 'mother_plant', entityId: id, action: 'status', reason, before: { healthStatus: before.healthStatus }, after: { healthStatus: 'retired' } });
    return after;
  });
}

export async function liftHold(db: Db, a: Actor, id: string, to: 'clean' | 'watch', reason: string) {
  if (!isCoordinator(a)) throw forbidden('Only a coordinator lifts a hold.');
  return db.transaction(async (tx) => {
    const before = await findPlant(tx, id);
    if (!before) throw notFound('That plant');
    if (before.healthStatus !== 'hold') throw conflict(`The plant is not on hold (it is ${before.healthStatus}).`, { to: 'plant is not on hold' });
    const after = await updatePlant(tx, id, { healthStatus: to });
    await writeAudit(tx, { actorId: a.id, entity: 'mother_plant', entityId: id, action: 'lift_hold', reason, before: { healthStatus: 'hold' }, after: { healthStatus: to } });
    return after;
  });
}

// Detail ---------------------------------------------------------------------------

export function photoView(p: typeof photos.$inferSelect): PhotoView {
  return {
    id: p.id,
    url: `/api/photos/${p.id}/image`,
    thumbUrl: `/api/photos/${p.id}/thumb`,
    caption: p.caption,
    width: p.width,
    height: p.height,
    gps: p.gpsLat != null && p.gpsLon != null ? { lat: p.gpsLat, lon: p.gpsLon } : null,
    createdAt: p.createdAt.toISOString(),
    findingId: p.findingId,
  };
}

async function inspectionsOf(db: DbOrTx, plantId: string): Promise<InspectionView[]> {
  const rows = await db
    .select({ id: inspections.id, inspectedOn: inspections.inspectedOn, notes: inspections.notes, inspectorName: user.name })
    .from(inspections)
    .leftJoin(user, eq(user.id, inspections.inspectorId))
    .where(eq(inspections.plantId, plantId))
    .orderBy(desc(inspections.inspectedOn), desc(inspections.createdAt));
  if (!rows.length) return [];
  const f = await db
    .select({
      id: findings.id,
      inspectionId: findings.inspectionId,
      pestId: findings.pestId,
      pestName: pests.name,
      travelsInWood: pests.travelsInWood,
      severity: findings.severity,
      notes: findings.notes,
    })
    .from(findings)
    .innerJoin(pests, eq(pests.id, findings.pestId))
    .where(inArray(findings.inspectionId, rows.map((r) => r.id)));
  return rows.map((r) => ({ ...r, findings: f.filter((x) => x.inspectionId === r.id).map(({ inspectionId: _i, ...rest }) => rest) }));
}

async function woodHistoryOf(db: DbOrTx, plantId: string): Promise<WoodHistoryItem[]> {
  const offers = await db
    .select({ seasonId: seasons.id, seasonName: seasons.name, offered: woodOffers.offered, start: seasons.collectionStart })
    .from(woodOffers)
    .innerJoin(seasons, eq(seasons.id, woodOffers.seasonId))
    .where(eq(woodOffers.plantId, plantId));
  const b = await db
    .select({
      id: bundles.id,
      code: bundles.code,
      cuttings: bundles.cuttings,
      status: bundles.status,
      growerName: user.name,
      seasonId: seasons.id,
      seasonName: seasons.name,
      start: seasons.collectionStart,
    })
    .from(bundles)
    .innerJoin(allocationRounds, eq(allocationRounds.id, bundles.roundId))
    .innerJoin(seasons, eq(seasons.id, allocationRounds.seasonId))
    .innerJoin(user, eq(user.id, bundles.growerId))
    .where(and(eq(bundles.plantId, plantId), inArray(allocationRounds.status, ['approved', 'notified'])));
  const bySeason = new Map<string, WoodHistoryItem & { start: string }>();
  for (const o of offers) bySeason.set(o.seasonId, { seasonId: o.seasonId, seasonName: o.seasonName, offered: o.offered, bundles: [], start: o.start });
  for (const x of b) {
    const item = bySeason.get(x.seasonId) ?? { seasonId: x.seasonId, seasonName: x.seasonName, offered: null, bundles: [], start: x.start };
    item.bundles.push({ id: x.id, code: x.code, cuttings: x.cuttings, status: x.status, growerName: x.growerName });
    bySeason.set(x.seasonId, item);
  }
  return [...bySeason.values()].sort((p, q) => q.start.localeCompare(p.start)).map(({ start: _s, ...rest }) => rest);
}

async function auditOf(db: DbOrTx, plantId: string): Promise<AuditItem[]> {
  const rows = await db
    .select({ id: auditLog.id, at: auditLog.at, actorName: user.name, action: auditLog.action, reason: auditLog.reason, before: auditLog.before, after: auditLog.after })
    .from(auditLog)
    .leftJoin(user, eq(user.id, auditLog.actorId))
    .where(and(eq(auditLog.entity, 'mother_plant'), eq(auditLog.entityId, plantId)))
    .orderBy(desc(auditLog.at));
  return rows.map((r) => ({ ...r, at: r.at.toISOString() }));
}

export async function plantDetail(db: Db, a: Actor, id: string): Promise<PlantDetail> {
  const plant = await visiblePlant(db, a, id);
  const row = (await findPlantRow(db, id))!;
  const full = seesFull(a, plant.farmId);
  const [sp] = await db.select({ restrictionNote: species.restrictionNote }).from(species).where(eq(species.id, plant.speciesId));
  const parent = plant.parentPlantId
    ? ((await db.select({ id: motherPlants.id, code: motherPlants.code }).from(motherPlants).where(eq(motherPlants.id, plant.parentPlantId)))[0] ?? null)
    : null;
  const sourceBundle = plant.sourceBundleId
    ? ((
        await db
          .select({ id: bundles.id, code: bundles.code, seasonName: seasons.name })
          .from(bundles)
          .innerJoin(allocationRounds, eq(allocationRounds.id, bundles.roundId))
          .innerJoin(seasons, eq(seasons.id, allocationRounds.seasonId))
          .where(eq(bundles.id, plant.sourceBundleId))
      )[0] ?? null)
    : null;
  const children = await db
    .select({ id: motherPlants.id, code: motherPlants.code, farmName: farms.name })
    .from(motherPlants)
    .innerJoin(farms, eq(farms.id, motherPlants.farmId))
    .where(eq(motherPlants.parentPlantId, id))
    .orderBy(asc(motherPlants.code));
  const photoRows = await db.select().from(photos).where(eq(photos.plantId, id)).orderBy(desc(photos.createdAt));
  return {
    ...present(a, row),
    supplier: full ? plant.supplier : null,
    notes: full ? plant.notes : null,
    parent,
    sourceBundle,
    children,
    restrictionNote: sp?.restrictionNote ?? null,
    createdAt: plant.createdAt.toISOString(),
    updatedAt: plant.updatedAt.toISOString(),
    retiredAt: plant.retiredAt?.toISOString() ?? null,
    photos: full ? photoRows.filter((p) => !p.findingId).map(photoView) : photoRows.filter((p) => !p.findingId).slice(0, 3).map(photoView),
    inspections: full ? await inspectionsOf(db, id) : [],
    woodHistory: full ? await woodHistoryOf(db, id) : [],
    audit: full ? await auditOf(db, id) : [],
    can: {
      edit: mayEdit(a, plant.farmId) && plant.healthStatus !== 'retired',
      inspect: mayInspect(a, plant.farmId) && plant.healthStatus !== 'retired',
      retire: mayRetire(a, plant.farmId) && plant.healthStatus !== 'retired',
      liftHold: isCoordinator(a) && plant.healthStatus === 'hold',
      transfer: isCoordinator(a) && plant.healthStatus !== 'retired',
    },
  };
}

// The rules of strike reports: who reports on which bundle and when, plants raised from a
// bundle's rooted cuttings, and the strike-rate table the planner's numbers come from.
import { and, asc, desc, eq, inArray } from 'drizzle-orm';
import { TREATMENTS, type Treatment } from '../../../shared/domain.js';
import type {
  MyBundle,
  MyBundles,
  RaisePlantsInput,
  RaisedPlant,
  StrikeRateRow,
  StrikeRatesQuery,
  StrikeReportCreate,
  StrikeReportView,
} from '../../../shared/schemas/strike-reports.js';
import { strikeReportDateErrors } from '../../../shared/schemas/strike-reports.js';
import { priorRate, strikeRateFor } from '../../../shared/strike-rate.js';
import type { Actor } from '../../auth/guards.js';
import type { Db, DbOrTx, Tx } from '../../db/client.js';
import {
  allocationRounds,
  bundles,
  farmMemberships,
  farms,
  motherPlants,
  requestLines,
  seasons,
  species,
  varieties,
} from '../../db/schema/index.js';
import { badRequest, conflict, forbidden, notFound } from '../../lib/http-error.js';
import { writeAudit } from '../audit/audit.repo.js';
import { insertPlant, nextPlantNumber } from '../mother-plants/mother-plants.repo.js';
import { isCoordinator } from '../mother-plants/plant-access.js';
import { photosOfReports } from '../photos/photos.repo.js';
import { removePhotoFiles, reportPhotoView, seesReportPhotos } from '../photos/photos.service.js';
import { localDate, reportDueOn } from '../reminders/report-due.js';
import {
  bundleReportSums,
  deleteStrikeReport,
  findStrikeReport,
  insertStrikeReport,
  plantsFromBundles,
  reportsOfBundles,
  strikeReportGroups,
  sumGroups,
} from './strike-reports.repo.js';

/** A bundle with what the rules need, locked for the rest of the transaction. */
async function lockBundle(tx: Tx, bundleId: string) {
  const [row] = await tx
    .select({
      b: bundles,
      timezone: farms.timezone,
      farmName: farms.name,
      plannedTreatment: requestLines.treatment,
      speciesId: motherPlants.speciesId,
      varietyId: motherPlants.varietyId,
      plantCode: motherPlants.code,
    })
    .from(bundles)
    .innerJoin(farms, eq(farms.id, bundles.farmId))
    .innerJoin(requestLines, eq(requestLines.id, bundles.lineId))
    .innerJoin(motherPlants, eq(motherPlants.id, bundles.plantId))
    .where(eq(bundles.id, bundleId))
    .for('update', { of: bundles });
  return row;
}

type LockedBundle = NonNullable<Awaited<ReturnType<typeof lockBundle>>>;

function checkGrowerOrCoordinator(a: Actor, bundle: LockedBundle, doing: string) {
  if (bundle.b.growerId !== a.id && !isCoordinator(a)) throw forbidden(`Only the grower who collected this bundle, or a coordinator, ${doing}.`);
}

function checkCollected(bundle: LockedBundle): Date {
  if (bundle.b.status !== 'collected' || !bundle.b.collectedAt) {
    throw badRequest('This bundle has not been collected yet: report on it once it is collected.', { bundleId: 'not collected yet' });
  }
  return bundle.b.collectedAt;
}

type ReportInput = Omit<StrikeReportCreate, 'notes'> & { notes: string };

export async function fileStrikeReport(db: Db, a: Actor, bundleId: string, input: ReportInput, now = new Date()): Promise<StrikeReportView> {
  return db.transaction(async (tx) => {
    const bundle = await lockBundle(tx, bundleId);
    if (!bundle) throw notFound('That bundle');
    checkGrowerOrCoordinator(a, bundle, 'reports how it rooted');
    const collectedAt = checkCollected(bundle);
    const sums = await bundleReportSums(tx, bundleId);
    const fields: Record<string, string> = {};
    const left = bundle.b.cuttings - sums.stuck;
    if (input.stuck > left) {
      fields.stuck =
        sums.stuck > 0
          ? `At most ${left}: the bundle had ${bundle.b.cuttings} cuttings and ${sums.stuck} are already in a report`
          : `At most ${bundle.b.cuttings}: the bundle had ${bundle.b.cuttings} cuttings`;
    }
    Object.assign(
      fields,
      strikeReportDateErrors({
        assessedOn: input.assessedOn,
        collectedOn: localDate(collectedAt, bundle.timezone),
        today: localDate(now, bundle.timezone),
      }),
    );
    if (Object.keys(fields).length) throw badRequest('Check the report.', fields);
    const row = await insertStrikeReport(tx, {
      bundleId,
      reporterId: a.id,
      stuck: input.stuck,
      rooted: input.rooted,
      assessedOn: input.assessedOn,
      treatment: input.treatment ?? bundle.plannedTreatment,
      notes: input.notes,
    });
    await writeAudit(tx, {
      actorId: a.id,
      entity: 'bundle',
      entityId: bundleId,
      action: 'strike_report',
      after: { reportId: row.id, stuck: row.stuck, rooted: row.rooted, assessedOn: row.assessedOn, treatment: row.treatment },
    });
    const { reporterId: _reporter, ...view } = row;
    return { ...view, reporterName: a.name, createdAt: row.createdAt.toISOString(), mine: true, photos: [] };
  });
}

/**
 * A report filed by mistake: its reporter or a coordinator removes it, unless plants raised
 * depend on it. Its photo rows go with it (ON DELETE CASCADE); their files are removed once the
 * transaction has committed, so a rolled-back removal never leaves rows without files.
 */
export async function removeStrikeReport(db: Db, photoDir: string, a: Actor, reportId: string): Promise<void> {
  const files = await db.transaction(async (tx) => {
    const report = await findStrikeReport(tx, reportId);
    if (!report) throw notFound('That strike report');
    const bundle = await lockBundle(tx, report.bundleId);
    if (!bundle) throw notFound('That bundle');
    checkGrowerOrCoordinator(a, bundle, 'removes its reports');
    const sums = await bundleReportSums(tx, report.bundleId);
    if (sums.rooted - report.rooted < sums.raised) {
      throw conflict(`${sums.raised} plants are registered as raised from this bundle; the remaining reports would count fewer rooted cuttings than that.`);
    }
    const photos = await photosOfReports(tx, [reportId]);
    await deleteStrikeReport(tx, reportId);
    await writeAudit(tx, {
      actorId: a.id,
      entity: 'bundle',
      entityId: report.bundleId,
      action: 'strike_report_removed',
      before: { reportId, stuck: report.stuck, rooted: report.rooted, assessedOn: report.assessedOn, treatment: report.treatment },
    });
    return photos.flatMap((p) => [p.fileName, p.thumbName]);
  });
  await removePhotoFiles(photoDir, files);
}

/** The caller's collected bundles across seasons, newest first, with their reports. */
export async function myBundles(db: DbOrTx, a: Actor): Promise<MyBundles> {
  const rows = await db
    .select({
      b: bundles,
      seasonId: seasons.id,
      seasonName: seasons.name,
      seasonKind: seasons.kind,
      hemisphere: seasons.hemisphere,
      plannedTreatment: requestLines.treatment,
      plantCode: motherPlants.code,
      farmName: farms.name,
      timezone: farms.timezone,
      speciesId: species.id,
      speciesName: species.commonName,
      varietyId: varieties.id,
      varietyName: varieties.name,
    })
    .from(bundles)
    .innerJoin(allocationRounds, eq(allocationRounds.id, bundles.roundId))
    .innerJoin(seasons, eq(seasons.id, allocationRounds.seasonId))
    .innerJoin(requestLines, eq(requestLines.id, bundles.lineId))
    .innerJoin(motherPlants, eq(motherPlants.id, bundles.plantId))
    .innerJoin(species, eq(species.id, motherPlants.speciesId))
    .leftJoin(varieties, eq(varieties.id, motherPlants.varietyId))
    .innerJoin(farms, eq(farms.id, bundles.farmId))
    .where(and(eq(bundles.growerId, a.id), eq(bundles.status, 'collected')))
    .orderBy(desc(bundles.collectedAt), asc(bundles.code));
  const ids = rows.map((r) => r.b.id);
  const reports = await reportsOfBundles(db, ids);
  // Photos of reports the caller filed (a coordinator sees all): the files answer them alone.
  const photoRows = await photosOfReports(
    db,
    reports.filter((x) => seesReportPhotos(a, x)).map((x) => x.id),
  );
  const raised = await plantsFromBundles(db, ids);
  const farmNames = new Map(
    raised.length
      ? (await db.select({ id: farms.id, name: farms.name }).from(farms).where(inArray(farms.id, [...new Set(raised.map((p) => p.farmId))]))).map((f) => [f.id, f.name])
      : [],
  );
  const items: MyBundle[] = rows.map((r) => {
    const mine: StrikeReportView[] = reports
      .filter((x) => x.bundleId === r.b.id)
      .map(({ reporterId, ...x }) => ({
        ...x,
        mine: reporterId === a.id,
        photos: photoRows.filter((p) => p.strikeReportId === x.id).map(reportPhotoView),
      }));
    const reported = { stuck: mine.reduce((s, x) => s + x.stuck, 0), rooted: mine.reduce((s, x) => s + x.rooted, 0) };
    const plants = raised.filter((p) => p.sourceBundleId === r.b.id).map((p) => ({ id: p.id, code: p.code, farmName: farmNames.get(p.farmId) ?? '' }));
    const collectedOn = localDate(r.b.collectedAt!, r.timezone);
    return {
      id: r.b.id,
      code: r.b.code,
      status: r.b.status,
      seasonId: r.seasonId,
      seasonName: r.seasonName,
      seasonKind: r.seasonKind,
      hemisphere: r.hemisphere,
      collectedAt: r.b.collectedAt!.toISOString(),
      collectedOn,
      reportDueOn: reportDueOn(r.seasonKind, r.hemisphere, collectedOn),
      cuttings: r.b.cuttings,
      plannedTreatment: r.plannedTreatment,
      plant: { id: r.b.plantId, code: r.plantCode },
      farm: { id: r.b.farmId, name: r.farmName },
      species: { id: r.speciesId, name: r.speciesName },
      variety: r.varietyId && r.varietyName ? { id: r.varietyId, name: r.varietyName } : null,
      reports: mine,
      reported,
      unreported: Math.max(0, r.b.cuttings - reported.stuck),
      raisedPlants: plants,
      mayRaise: Math.max(0, reported.rooted - plants.length),
    };
  });
  const farmRows = a.farms.length
    ? await db.select({ id: farms.id, name: farms.name, code: farms.code }).from(farms).where(inArray(farms.id, a.farms.map((f) => f.farmId))).orderBy(asc(farms.name))
    : [];
  return {
    items,
    total: items.length,
    farms: farmRows.map((f) => ({ ...f, farmRole: a.farms.find((x) => x.farmId === f.id)!.farmRole })),
  };
}

type RaiseInput = Omit<RaisePlantsInput, 'bedRow'> & { bedRow: string };

/**
 * Rooted cuttings of a bundle registered as new mother plants on a farm of the bundle's
 * grower: provenance 'exchange', parent = the plant the wood came from, source = the bundle,
 * codes numbered on from the farm's highest. All or nothing, one audit row per plant.
 */
export async function raisePlants(db: Db, a: Actor, bundleId: string, input: RaiseInput, now = new Date()): Promise<{ items: RaisedPlant[]; total: number }> {
  return db.transaction(async (tx) => {
    const bundle = await lockBundle(tx, bundleId);
    if (!bundle) throw notFound('That bundle');
    checkGrowerOrCoordinator(a, bundle, 'registers plants raised from it');
    const collectedAt = checkCollected(bundle);
    // The farm row is locked so two registrations on the same farm number one after the other.
    const [farm] = await tx.select().from(farms).where(eq(farms.id, input.farmId)).for('update');
    if (!farm) throw badRequest('Choose a farm from the list.', { farmId: 'unknown farm' });
    const [member] = await tx
      .select({ role: farmMemberships.farmRole })
      .from(farmMemberships)
      .where(and(eq(farmMemberships.farmId, input.farmId), eq(farmMemberships.userId, bundle.b.growerId)));
    if (!member) throw badRequest('Plants raised from a bundle go on a farm where its grower is farm lead or farm hand.', { farmId: 'the grower does not work on this farm' });
    const sums = await bundleReportSums(tx, bundleId);
    const fields: Record<string, string> = {};
    const mayRaise = sums.rooted - sums.raised;
    if (sums.reports === 0) fields.count = 'Report how many cuttings rooted first';
    else if (input.count > mayRaise) {
      fields.count = `At most ${Math.max(0, mayRaise)}: ${sums.rooted} rooted in the reports${sums.raised ? `, ${sums.raised} already registered` : ''}`;
    }
    const collectionYear = Number(localDate(collectedAt, bundle.timezone).slice(0, 4));
    if (input.plantingYear < collectionYear) fields.plantingYear = `Cannot be before the wood was collected (${collectionYear})`;
    if (Object.keys(fields).length) throw badRequest('Check the plants to register.', fields);

    const first = await nextPlantNumber(tx, farm.code);
    const notes = input.notes ?? `Raised from bundle ${bundle.b.code ?? bundle.b.id} of ${bundle.plantCode} (${bundle.farmName}).`;
    const items: RaisedPlant[] = [];
    for (let i = 0; i < input.count; i++) {
      const code = `${farm.code}-${String(first + i).padStart(4, '0')}`;
      const row = await insertPlant(tx, {
        code,
        farmId: farm.id,
        speciesId: bundle.speciesId,
        varietyId: bundle.varietyId,
        plantingYear: input.plantingYear,
        role: input.role,
        provenance: 'exchange',
        parentPlantId: bundle.b.plantId,
        sourceBundleId: bundle.b.id,
        bedRow: input.bedRow,
        notes,
        createdBy: a.id,
        createdAt: now,
        updatedAt: now,
      });
      await writeAudit(tx, {
        actorId: a.id,
        entity: 'mother_plant',
        entityId: row.id,
        action: 'create',
        after: { code, farmId: farm.id, role: input.role, provenance: 'exchange', parentPlantId: bundle.b.plantId, sourceBundleId: bundle.b.id },
      });
      items.push({ id: row.id, code, farmId: farm.id, parentPlantId: bundle.b.plantId, sourceBundleId: bundle.b.id });
    }
    await writeAudit(tx, { actorId: a.id, entity: 'bundle', entityId: bundle.b.id, action: 'raise_plants', after: { farmId: farm.id, codes: items.map((p) => p.code) } });
    return { items, total: items.length };
  });
}

// The strike-rate table -----------------------------------------------------------------

/**
 * Estimates for each species and treatment (always: the prior alone when nothing is
 * reported), and for each variety and treatment that has reports (or the variety asked for).
 * Reports are pooled by strikeReportGroups, the same pooling the planner uses.
 */
export async function strikeRateTable(db: DbOrTx, q: StrikeRatesQuery): Promise<StrikeRateRow[]> {
  let speciesId = q.speciesId;
  if (q.varietyId) {
    const [v] = await db.select({ speciesId: varieties.speciesId }).from(varieties).where(eq(varieties.id, q.varietyId));
    if (!v) throw badRequest('Choose a variety from the list.', { varietyId: 'unknown variety' });
    if (speciesId && v.speciesId !== speciesId) throw badRequest('That variety belongs to another species.', { varietyId: 'not a variety of this species' });
    speciesId = v.speciesId;
  }
  const speciesRows = await db
    .select({ id: species.id, name: species.commonName, strikeRatePrior: species.strikeRatePrior, priorStrength: species.priorStrength })
    .from(species)
    .where(speciesId ? eq(species.id, speciesId) : undefined)
    .orderBy(asc(species.commonName));
  if (speciesId && !speciesRows.length) throw badRequest('Choose a species from the list.', { speciesId: 'unknown species' });
  const varietyNames = new Map(
    (await db.select({ id: varieties.id, name: varieties.name }).from(varieties).where(speciesId ? eq(varieties.speciesId, speciesId) : undefined)).map((v) => [v.id, v.name]),
  );
  const treatments: readonly Treatment[] = q.treatment ? [q.treatment] : TREATMENTS;
  const groups = await strikeReportGroups(db, { speciesId, treatment: q.treatment });

  const out: StrikeRateRow[] = [];
  for (const s of speciesRows) {
    const row = (t: Treatment, varietyId: string | null, level: StrikeRateRow['level']): StrikeRateRow => {
      const mine = groups.filter((g) => g.speciesId === s.id && g.treatment === t && (level === 'species' || g.varietyId === varietyId));
      const est = strikeRateFor(s, t, sumGroups(mine));
      return {
        speciesId: s.id,
        speciesName: s.name,
        varietyId,
        varietyName: varietyId ? (varietyNames.get(varietyId) ?? null) : null,
        level,
        treatment: t,
        prior: { untreated: s.strikeRatePrior, rate: priorRate(s.strikeRatePrior, t), strength: s.priorStrength },
        reports: est.reports,
        stuck: est.stuck,
        rooted: est.rooted,
        rate: est.rate,
        low: est.low,
        high: est.high,
        source: est.source,
      };
    };
    if (!q.varietyId) for (const t of treatments) out.push(row(t, null, 'species'));
    const varietyIds = q.varietyId
      ? [q.varietyId]
      : [...new Set(groups.filter((g) => g.speciesId === s.id && g.varietyId).map((g) => g.varietyId!))].sort((x, y) =>
          (varietyNames.get(x) ?? '').localeCompare(varietyNames.get(y) ?? ''),
        );
    for (const v of varietyIds) {
      for (const t of treatments) {
        const has = groups.some((g) => g.speciesId === s.id && g.varietyId === v && g.treatment === t);
        if (has || q.varietyId) out.push(row(t, v, 'variety'));
      }
    }
  }
  return out;
}

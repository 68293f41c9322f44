// Trace rules: who sees which part of a lineage, what counts as exposed after a finding that
// travels in wood, and health notices to the growers who received that wood (once per
// finding and grower, by the e-mail log's dedupe key).
import type { Exposure, ExposedBundle, NoticeOutcome, Trace, TraceBundle, TraceNode } from '../../../shared/schemas/trace.js';
import type { Actor } from '../../auth/guards.js';
import { farmRoleOf } from '../../auth/guards.js';
import type { AppContext } from '../../context.js';
import type { Db, DbOrTx } from '../../db/client.js';
import { conflict, notFound } from '../../lib/http-error.js';
import { writeAudit } from '../audit/audit.repo.js';
import { visiblePlant } from '../mother-plants/mother-plants.service.js';
import { isCoordinator, seesFull } from '../mother-plants/plant-access.js';
import { healthNoticeMail, noticeKey } from './notice-mail.js';
import {
  ancestors,
  type BundleRow,
  descendants,
  exposedBundles,
  exposedPlants,
  lastCleanBefore,
  lineageBundles,
  type NodeRow,
  selfNode,
  sentKeys,
  travellingFinding,
} from './trace.repo.js';

const iso = (d: Date | string | null) => (d == null ? null : new Date(d).toISOString());

function node(r: NodeRow, full: boolean): TraceNode {
  return {
    id: r.id,
    code: r.code,
    farmId: r.farm_id,
    farmName: r.farm_name,
    speciesName: r.species_name,
    varietyName: r.variety_name,
    healthStatus: r.health_status,
    depth: Number(r.depth),
    parentId: r.parent_id,
    via:
      r.via_bundle_id && r.via_season_id && r.via_season_name
        ? { bundleId: r.via_bundle_id, code: r.via_code, seasonId: r.via_season_id, seasonName: r.via_season_name, growerName: full ? r.via_grower_name : null }
        : null,
    full,
  };
}

function traceBundle(b: BundleRow): TraceBundle {
  return {
    id: b.id,
    code: b.code,
    status: b.status,
    cuttings: Number(b.cuttings),
    collectedAt: iso(b.collected_at),
    seasonId: b.season_id,
    seasonName: b.season_name,
    growerId: b.grower_id,
    growerName: b.grower_name,
    fromPlantId: b.plant_id,
    fromPlantCode: b.plant_code,
    farmName: b.farm_name,
    raised: Number(b.raised),
  };
}

/**
 * The plant's ancestors, descendants and every bundle taken from it and its descendants.
 * Coordinators and the people of the plant's farm see the whole lineage. Anyone else sees
 * clean plants (public fields only) and plants of their own farms, and only the bundles they
 * received or their farms gave; the rest is counted in `hidden`.
 */
export async function traceOf(db: DbOrTx, a: Actor, plantId: string): Promise<Trace> {
  const plant = await visiblePlant(db, a, plantId);
  const everything = isCoordinator(a) || farmRoleOf(a, plant.farmId) !== undefined;
  const [self, up, down, bundleRows] = await Promise.all([selfNode(db, plantId), ancestors(db, plantId), descendants(db, plantId), lineageBundles(db, plantId)]);
  if (!self) throw notFound('That plant');
  const visible = (r: NodeRow) => everything || seesFull(a, r.farm_id) || r.health_status === 'clean';
  const full = (r: NodeRow) => everything || seesFull(a, r.farm_id);
  const shown = new Set([self.id, ...up.filter(visible).map((r) => r.id), ...down.filter(visible).map((r) => r.id)]);
  const present = (r: NodeRow) => {
    const n = node(r, full(r));
    return shown.has(n.parentId ?? '') ? n : { ...n, parentId: null };
  };
  const myFarms = new Set(a.farms.map((f) => f.farmId));
  const bundleVisible = (b: BundleRow) => everything || b.grower_id === a.id || myFarms.has(b.farm_id);
  const hiddenPlants = up.filter((r) => !visible(r)).length + down.filter((r) => !visible(r)).length;
  return {
    plant: present(self),
    ancestors: up.filter(visible).map(present),
    descendants: down.filter(visible).map(present),
    bundles: bundleRows.filter(bundleVisible).map(traceBundle),
    hidden: { plants: hiddenPlants, bundles: bundleRows.length - bundleRows.filter(bundleVisible).length },
  };
}

// Exposure and notices --------------------------------------------------------------------

export const EXPOSURE_RULE =
  'Wood that may carry the finding: every bundle collected from this plant on or after the day of its last clean inspection before the finding ' +
  '(an inspection with nothing found; all of its wood when it was never inspected clean), every plant raised from those bundles and every plant ' +
  'descended from them, and every bundle collected from those plants.';

function exposedBundle(b: BundleRow): ExposedBundle {
  return {
    id: b.id,
    code: b.code,
    status: b.status,
    cuttings: Number(b.cuttings),
    collectedAt: iso(b.collected_at),
    collectedOn: b.collected_on,
    seasonName: b.season_name,
    fromPlantId: b.plant_id,
    fromPlantCode: b.plant_code,
    farmName: b.farm_name,
    growerId: b.grower_id,
    growerName: b.grower_name,
  };
}

type ExposureDetail = Exposure & { growerRows: Map<string, { email: string; name: string; bundles: BundleRow[] }> };

async function exposureDetail(db: DbOrTx, plantId: string, findingId?: string): Promise<ExposureDetail> {
  const plant = await selfNode(db, plantId);
  if (!plant) throw notFound('That plant');
  const head = { id: plant.id, code: plant.code, farmName: plant.farm_name, speciesName: plant.species_name, varietyName: plant.variety_name, healthStatus: plant.health_status };
  const finding = await travellingFinding(db, plantId, findingId);
  if (!finding) {
    if (findingId) throw notFound('That finding of a pest that travels in wood, on this plant,');
    return { plant: head, finding: null, since: null, rule: EXPOSURE_RULE, bundles: [], plants: [], growers: [], pending: [], growerRows: new Map() };
  }
  const since = await lastCleanBefore(db, plantId, finding);
  const [collected, pending, plants] = await Promise.all([
    exposedBundles(db, plantId, since, 'collected'),
    exposedBundles(db, plantId, since, 'pending'),
    exposedPlants(db, plantId, since),
  ]);
  const growerRows = new Map<string, { email: string; name: string; bundles: BundleRow[] }>();
  for (const b of collected) {
    const g = growerRows.get(b.grower_id) ?? { email: b.grower_email, name: b.grower_name, bundles: [] };
    g.bundles.push(b);
    growerRows.set(b.grower_id, g);
  }
  const sent = await sentKeys(db, [...growerRows.keys()].map((g) => noticeKey(finding.id, g)));
  return {
    plant: head,
    finding: {
      id: finding.id,
      inspectionId: finding.inspection_id,
      inspectedOn: finding.inspected_on,
      severity: finding.severity,
      notes: finding.notes,
      pest: { id: finding.pest_id, code: finding.pest_code, name: finding.pest_name, scientificName: finding.scientific_name, signs: finding.signs, advice: finding.advice },
    },
    since,
    rule: EXPOSURE_RULE,
    bundles: collected.map(exposedBundle),
    plants: plants.map((p) => ({ id: p.id, code: p.code, farmName: p.farm_name, healthStatus: p.health_status, depth: Number(p.depth), sourceBundleCode: p.source_bundle_code })),
    growers: [...growerRows.entries()]
      .map(([id, g]) => ({ id, name: g.name, email: g.email, bundles: g.bundles.map((b) => b.code ?? b.id), notified: sent.has(noticeKey(finding.id, id)) }))
      .sort((x, y) => x.name.localeCompare(y.name)),
    pending: pending.map(exposedBundle),
    growerRows,
  };
}

export async function exposureOf(db: DbOrTx, plantId: string, findingId?: string): Promise<Exposure> {
  const { growerRows: _g, ...exposure } = await exposureDetail(db, plantId, findingId);
  return exposure;
}

/** E-mails each exposed grower a notice, at most once per finding and grower. */
export async function sendNotices(ctx: AppContext, a: Actor, plantId: string, input: { findingId?: string; note?: string }): Promise<NoticeOutcome> {
  const db: Db = ctx.db;
  const x = await exposureDetail(db, plantId, input.findingId);
  if (!x.finding) throw conflict('This plant has no finding of a pest that travels in wood: there is nothing to notify.', { findingId: 'no finding that travels in wood' });
  const outcome: NoticeOutcome = { sent: 0, duplicate: 0, failed: 0, recipients: x.growerRows.size };
  const raisedBy = new Map<string, typeof x.plants>();
  for (const p of x.plants) {
    const from = x.bundles.find((b) => b.code !== null && b.code === p.sourceBundleCode);
    if (!from) continue;
    raisedBy.set(from.growerId, [...(raisedBy.get(from.growerId) ?? []), p]);
  }
  for (const [growerId, g] of [...x.growerRows.entries()].sort((p, q) => p[1].email.localeCompare(q[1].email))) {
    const r = await ctx.mailer.send(
      healthNoticeMail({
        to: g.email,
        growerId,
        growerName: g.name,
        plant: x.plant,
        finding: x.finding,
        since: x.since,
        bundles: g.bundles.map(exposedBundle),
        raised: raisedBy.get(growerId) ?? [],
        note: input.note,
        publicUrl: ctx.config.publicUrl,
      }),
    );
    outcome[r.status] += 1;
  }
  await writeAudit(db, {
    actorId: a.id,
    entity: 'mother_plant',
    entityId: plantId,
    action: 'health_notice',
    reason: input.note ?? null,
    after: { findingId: x.finding.id, since: x.since, ...outcome },
  });
  return outcome;
}

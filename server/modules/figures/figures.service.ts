// A season's figures, put together from the grouped sums in figures.repo.ts and the strike
// reports pooled by strike-reports.repo.ts. Coordinators see the whole cooperative; a member
// sees the offers of their farms, their own request lines, and the bundles their farms gave
// or they received.
import { eq, inArray, or, type SQL } from 'drizzle-orm';
import { TREATMENTS } from '../../../shared/domain.js';
import type {
  FiguresRow,
  FillSummary,
  GrowerTrip,
  LineFill,
  RaisedFigures,
  SeasonFigures,
  SeasonStrikeRate,
  TravelFigures,
  WoodFigures,
} from '../../../shared/schemas/figures.js';
import { strikeRateFor } from '../../../shared/strike-rate.js';
import { visitingOrder } from '../../../shared/visiting-order.js';
import type { Actor } from '../../auth/guards.js';
import type { DbOrTx } from '../../db/client.js';
import { bundles, seasons, species, varieties } from '../../db/schema/index.js';
import { notFound } from '../../lib/http-error.js';
import { getSetting } from '../cooperative/cooperative.repo.js';
import { isCoordinator } from '../mother-plants/plant-access.js';
import { strikeReportGroups, sumGroups } from '../strike-reports/strike-reports.repo.js';
import { askedBy, bundledBy, type FiguresScope, lineFills, offeredBy, raisedBy, travelRows } from './figures.repo.js';

/** CHECK-VALUES "Value of a raised shrub": about 10 (local currency) — common practice; the cooperative's setting wins. */
export const DEFAULT_VALUE_PER_PLANT = 10;

const zero = (): WoodFigures => ({ offered: 0, asked: 0, allocated: 0, collected: 0, cancelled: 0 });
const add = (t: WoodFigures, x: Partial<WoodFigures>) => {
  for (const k of ['offered', 'asked', 'allocated', 'collected', 'cancelled'] as const) t[k] += Number(x[k] ?? 0);
};
const km = (m: number) => Math.round(m / 100) / 10;

export function scopeOf(a: Actor): FiguresScope {
  return isCoordinator(a) ? { all: true } : { all: false, userId: a.id, farmIds: a.farms.map((f) => f.farmId) };
}

function bundleWhere(s: FiguresScope): SQL | undefined {
  if (s.all) return undefined;
  return s.farmIds.length ? or(inArray(bundles.farmId, s.farmIds), eq(bundles.growerId, s.userId)) : eq(bundles.growerId, s.userId);
}

export function fillSummary(lines: readonly Pick<LineFill, 'asked' | 'allocated' | 'ratio'>[]): FillSummary {
  const ratios = lines.map((l) => l.ratio).sort((a, b) => a - b);
  const asked = lines.reduce((s, l) => s + l.asked, 0);
  const allocated = lines.reduce((s, l) => s + l.allocated, 0);
  const mid = ratios.length >> 1;
  return {
    lines: lines.length,
    fullyMet: lines.filter((l) => l.allocated >= l.asked).length,
    partlyMet: lines.filter((l) => l.allocated > 0 && l.allocated < l.asked).length,
    unmet: lines.filter((l) => l.allocated === 0).length,
    meanRatio: ratios.length ? ratios.reduce((s, r) => s + r, 0) / ratios.length : null,
    medianRatio: ratios.length ? (ratios.length % 2 ? ratios[mid] : (ratios[mid - 1] + ratios[mid]) / 2) : null,
    minRatio: ratios.length ? ratios[0] : null,
    overallRatio: asked > 0 ? allocated / asked : null,
  };
}

export async function seasonFigures(db: DbOrTx, a: Actor, seasonId: string): Promise<SeasonFigures> {
  const [season] = await db.select().from(seasons).where(eq(seasons.id, seasonId));
  if (!season) throw notFound('That season');
  const scope = scopeOf(a);
  const [offered, asked, bundled, lineRows, travel, groups, raised, speciesRows, varietyRows, coop] = await Promise.all([
    offeredBy(db, seasonId, scope),
    askedBy(db, seasonId, scope),
    bundledBy(db, seasonId, scope),
    lineFills(db, seasonId, scope),
    travelRows(db, seasonId, scope),
    strikeReportGroups(db, { seasonId, bundleWhere: bundleWhere(scope) }),
    raisedBy(db, seasonId, scope),
    db.select({ id: species.id, name: species.commonName, strikeRatePrior: species.strikeRatePrior, priorStrength: species.priorStrength }).from(species),
    db.select({ id: varieties.id, name: varieties.name }).from(varieties),
    getSetting<{ valuePerPlant?: number; currency?: string }>(db, 'cooperative'),
  ]);
  const speciesById = new Map(speciesRows.map((s) => [s.id, s]));
  const varietyName = new Map(varietyRows.map((v) => [v.id, v.name]));

  // Wood by species and variety -----------------------------------------------------------
  const byKey = new Map<string, FiguresRow>();
  const rowFor = (speciesId: string, varietyId: string | null) => {
    const key = `${speciesId}|${varietyId ?? ''}`;
    let r = byKey.get(key);
    if (!r) {
      r = {
        speciesId,
        speciesName: speciesById.get(speciesId)?.name ?? '',
        varietyId,
        varietyName: varietyId ? (varietyName.get(varietyId) ?? null) : null,
        ...zero(),
      };
      byKey.set(key, r);
    }
    return r;
  };
  for (const o of offered) add(rowFor(o.species_id, o.variety_id), { offered: o.offered });
  for (const q of asked) add(rowFor(q.species_id, q.variety_id), { asked: q.asked });
  for (const b of bundled) add(rowFor(b.species_id, b.variety_id), b);
  const byVariety = [...byKey.values()].sort(
    (x, y) => x.speciesName.localeCompare(y.speciesName) || (x.varietyName === null ? -1 : y.varietyName === null ? 1 : x.varietyName.localeCompare(y.varietyName)),
  );
  const speciesTotals = new Map<string, FiguresRow>();
  const totals = zero();
  for (const r of byVariety) {
    const s = speciesTotals.get(r.speciesId) ?? { speciesId: r.speciesId, speciesName: r.speciesName, varietyId: null, varietyName: null, ...zero() };
    add(s, r);
    add(totals, r);
    speciesTotals.set(r.speciesId, s);
  }

  // Fill ratios -----------------------------------------------------------------------------
  const lines: LineFill[] = lineRows.map((l) => ({
    lineId: l.line_id,
    growerName: l.grower_name,
    speciesName: l.species_name,
    varietyName: l.variety_name,
    asked: Number(l.asked),
    allocated: Number(l.allocated),
    collected: Number(l.collected),
    ratio: Number(l.asked) > 0 ? Math.min(1, Number(l.allocated) / Number(l.asked)) : 1,
  }));

  // Travel ----------------------------------------------------------------------------------
  const trips = new Map<string, { name: string; start: { lat: number; lon: number } | null; farms: Map<string, { id: string; lat: number; lon: number }>; bundles: number }>();
  let bundleM = 0;
  for (const t of travel) {
    bundleM += Number(t.distance_m ?? 0);
    // A member sees their own round trip only, not other growers' (where they live).
    if (!scope.all && t.grower_id !== scope.userId) continue;
    const g = trips.get(t.grower_id) ?? {
      name: t.grower_name,
      start: t.start_lat != null && t.start_lon != null ? { lat: Number(t.start_lat), lon: Number(t.start_lon) } : null,
      farms: new Map(),
      bundles: 0,
    };
    g.farms.set(t.farm_id, { id: t.farm_id, lat: Number(t.farm_lat), lon: Number(t.farm_lon) });
    g.bundles += 1;
    trips.set(t.grower_id, g);
  }
  const growers: GrowerTrip[] = [...trips.entries()].map(([growerId, g]) => ({
    growerId,
    growerName: g.name,
    farms: g.farms.size,
    bundles: g.bundles,
    roundTripKm: g.start ? km(visitingOrder(g.start, [...g.farms.values()]).totalM) : null,
  }));
  const travelFigures: TravelFigures = {
    bundles: travel.length,
    bundleKm: km(bundleM),
    growers,
    roundTripKm: Math.round(growers.reduce((s, g) => s + (g.roundTripKm ?? 0), 0) * 10) / 10,
  };

  // Strike rates from this season's reports -------------------------------------------------
  const strikeRates: SeasonStrikeRate[] = [];
  const rate = (level: SeasonStrikeRate['level'], speciesId: string, varietyId: string | null, treatment: (typeof TREATMENTS)[number], gs: typeof groups) => {
    const sp = speciesById.get(speciesId);
    if (!sp) return;
    const totals = sumGroups(gs);
    if (!totals.reports) return;
    const est = strikeRateFor(sp, treatment, totals);
    strikeRates.push({
      level,
      speciesId,
      speciesName: sp.name,
      varietyId,
      varietyName: varietyId ? (varietyName.get(varietyId) ?? null) : null,
      treatment,
      reports: totals.reports,
      stuck: totals.stuck,
      rooted: totals.rooted,
      observed: totals.rooted / totals.stuck,
      rate: est.rate,
      low: est.low,
      high: est.high,
    });
  };
  const speciesWithReports = [...new Set(groups.map((g) => g.speciesId))].sort((x, y) => (speciesById.get(x)?.name ?? '').localeCompare(speciesById.get(y)?.name ?? ''));
  for (const s of speciesWithReports) {
    for (const t of TREATMENTS) rate('species', s, null, t, groups.filter((g) => g.speciesId === s && g.treatment === t));
    const vs = [...new Set(groups.filter((g) => g.speciesId === s && g.varietyId).map((g) => g.varietyId!))].sort((x, y) =>
      (varietyName.get(x) ?? '').localeCompare(varietyName.get(y) ?? ''),
    );
    for (const v of vs) for (const t of TREATMENTS) rate('variety', s, v, t, groups.filter((g) => g.speciesId === s && g.varietyId === v && g.treatment === t));
  }

  // Value of plants raised --------------------------------------------------------------------
  const valuePerPlant = typeof coop?.valuePerPlant === 'number' && coop.valuePerPlant >= 0 ? coop.valuePerPlant : DEFAULT_VALUE_PER_PLANT;
  const bySpecies = raised.map((r) => {
    const rooted = Number(r.rooted);
    const firstCropYears = Number(r.first_crop_years);
    const collectionYear = Number(r.collection_year);
    return { speciesId: r.species_id, speciesName: r.species_name, collectionYear, firstCropYears, firstCropYear: collectionYear + firstCropYears, rooted, value: rooted * valuePerPlant };
  });
  const byYear = new Map<number, { year: number; rooted: number; value: number }>();
  for (const r of bySpecies) {
    const y = byYear.get(r.firstCropYear) ?? { year: r.firstCropYear, rooted: 0, value: 0 };
    y.rooted += r.rooted;
    y.value += r.value;
    byYear.set(r.firstCropYear, y);
  }
  const rootedTotal = bySpecies.reduce((s, r) => s + r.rooted, 0);
  const raisedFigures: RaisedFigures = {
    valuePerPlant,
    currency: coop?.currency ?? null,
    rooted: rootedTotal,
    value: rootedTotal * valuePerPlant,
    bySpecies,
    byFirstCropYear: [...byYear.values()].sort((x, y) => x.year - y.year),
  };

  return {
    season: { id: season.id, name: season.name, kind: season.kind, hemisphere: season.hemisphere, stage: season.stage },
    scope: scope.all ? 'cooperative' : 'member',
    totals,
    bySpecies: [...speciesTotals.values()],
    byVariety,
    fill: fillSummary(lines),
    lines,
    travel: travelFigures,
    strikeRates,
    raised: raisedFigures,
  };
}

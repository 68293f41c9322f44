// The pickup slip: for one grower and one season, which farms to visit, when, which bundles
// to collect there, in which order, and the cautions. The same data makes the e-mail, the
// printable page and the calendar attachments.
import { and, asc, eq, inArray } from 'drizzle-orm';
import { createEvents } from 'ics';
import { distanceM } from '../../../shared/geo.js';
import { safetyCautions, seasonGuidance } from '../../../shared/planner.js';
import type { FarmCollection, PickupSlip } from '../../../shared/schemas/allocation.js';
import { visitingOrder } from '../../../shared/visiting-order.js';
import type { DbOrTx } from '../../db/client.js';
import {
  allocationRounds,
  bundles,
  farms,
  motherPlants,
  pickupWindows,
  seasons,
  species,
  user,
  varieties,
  woodRequests,
} from '../../db/schema/index.js';

const LIVE_ROUNDS = ['approved', 'notified'] as const;

export async function pickupSlip(db: DbOrTx, growerId: string, seasonId: string): Promise<PickupSlip | null> {
  const [season] = await db.select().from(seasons).where(eq(seasons.id, seasonId));
  if (!season) return null;
  const rows = await db
    .select({
      id: bundles.id,
      code: bundles.code,
      cuttings: bundles.cuttings,
      status: bundles.status,
      plantCode: motherPlants.code,
      speciesName: species.commonName,
      varietyName: varieties.name,
      restrictionNote: species.restrictionNote,
      farm: farms,
    })
    .from(bundles)
    .innerJoin(allocationRounds, eq(allocationRounds.id, bundles.roundId))
    .innerJoin(motherPlants, eq(motherPlants.id, bundles.plantId))
    .innerJoin(species, eq(species.id, motherPlants.speciesId))
    .leftJoin(varieties, eq(varieties.id, motherPlants.varietyId))
    .innerJoin(farms, eq(farms.id, bundles.farmId))
    .where(and(eq(bundles.growerId, growerId), eq(allocationRounds.seasonId, seasonId), inArray(allocationRounds.status, [...LIVE_ROUNDS])))
    .orderBy(asc(farms.name), asc(motherPlants.code));
  if (!rows.length) return null;
  const [grower] = await db.select({ name: user.name, homeLat: user.homeLat, homeLon: user.homeLon, placeName: user.placeName }).from(user).where(eq(user.id, growerId));
  const [req] = await db
    .select()
    .from(woodRequests)
    .where(and(eq(woodRequests.growerId, growerId), eq(woodRequests.seasonId, seasonId)));
  const start = req
    ? { lat: req.destinationLat, lon: req.destinationLon, label: req.destinationLabel || 'your place' }
    : { lat: grower.homeLat ?? rows[0].farm.lat, lon: grower.homeLon ?? rows[0].farm.lon, label: grower.placeName ?? 'your place' };
  const farmIds = [...new Set(rows.map((r) => r.farm.id))];
  const windows = await db
    .select()
    .from(pickupWindows)
    .where(and(eq(pickupWindows.seasonId, seasonId), inArray(pickupWindows.farmId, farmIds)))
    .orderBy(asc(pickupWindows.startsAt));
  const stops = farmIds.map((id) => {
    const farmRows = rows.filter((r) => r.farm.id === id);
    const f = farmRows[0].farm;
    return {
      farmId: f.id,
      farmName: f.name,
      address: f.address,
      directions: f.directions,
      lat: f.lat,
      lon: f.lon,
      timezone: f.timezone,
      windows: windows.filter((w) => w.farmId === id).map((w) => ({ startsAt: w.startsAt.toISOString(), endsAt: w.endsAt.toISOString(), note: w.note })),
      bundles: farmRows.map((r) => ({ id: r.id, code: r.code, speciesName: r.speciesName, varietyName: r.varietyName, plantCode: r.plantCode, cuttings: r.cuttings, status: r.status })),
      distanceKm: Math.round(distanceM(start, f) / 100) / 10,
    };
  });
  const order = visitingOrder(start, stops.map((s) => ({ id: s.farmId, lat: s.lat, lon: s.lon })));
  const notes = [...new Set(rows.map((r) => r.restrictionNote).filter((n): n is string => !!n))];
  return {
    seasonId,
    seasonName: season.name,
    seasonKind: season.kind,
    growerName: grower.name,
    start,
    stops: order.order.map((id) => stops.find((s) => s.farmId === id)!),
    visitingOrder: order.order,
    roundTripKm: Math.round(order.totalM / 100) / 10,
    cautions: [
      'Keep cuttings cool and moist from the moment they are cut: wrap bundles in damp cloth or a closed bag, out of sun and wind, and stick them the same day if you can.',
      ...seasonGuidance(season.kind),
      ...safetyCautions({ hormone: true }),
      ...notes,
    ],
  };
}

function fmt(iso: string, timezone: string) {
  return new Date(iso).toLocaleString('en-GB', { timeZone: timezone, weekday: 'short', day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' });
}

export function slipText(slip: PickupSlip): string {
  const lines = [`Hello ${slip.growerName},`, '', `Your wood for ${slip.seasonName} is reserved. Visit the farms in this order (round trip about ${slip.roundTripKm} km from ${slip.start.label}):`, ''];
  slip.stops.forEach((s, i) => {
    lines.push(`${i + 1}. ${s.farmName} — ${s.address} (${s.distanceKm} km)`);
    if (s.directions) lines.push(`   How to find it: ${s.directions}`);
    lines.push(s.windows.length ? `   Pickup windows: ${s.windows.map((w) => `${fmt(w.startsAt, s.timezone)}–${fmt(w.endsAt, s.timezone).split(', ').pop()}`).join('; ')}` : '   Pickup window: the farm will contact you.');
    for (const b of s.bundles) lines.push(`   - Bundle ${b.code ?? '(pending)'}: ${b.cuttings} cuttings of ${b.speciesName}${b.varietyName ? ` '${b.varietyName}'` : ''} from plant ${b.plantCode}`);
    lines.push('');
  });
  lines.push('Handling and safety:', ...slip.cautions.map((c) => `- ${c}`), '', 'A calendar file for each pickup window is attached.', '', '— Heelwood, for your fruit-growing cooperative');
  return lines.join('\n');
}

/** One .ics per farm visit (RFC 5545), each with every window offered at that farm. */
export function slipCalendars(slip: PickupSlip, roundId: string): { filename: string; content: string }[] {
  const out: { filename: string; content: string }[] = [];
  for (const s of slip.stops) {
    if (!s.windows.length) continue;
    const { error, value } = createEvents(
      s.windows.map((w, i) => ({
        uid: `${roundId}-${s.farmId}-${i}@heelwood`,
        start: new Date(w.startsAt).getTime(),
        end: new Date(w.endsAt).getTime(),
        startInputType: 'utc' as const,
        startOutputType: 'utc' as const,
        endInputType: 'utc' as const,
        endOutputType: 'utc' as const,
        title: `Collect cutting wood at ${s.farmName}`,
        description: s.bundles.map((b) => `${b.code}: ${b.cuttings} x ${b.speciesName}${b.varietyName ? ` '${b.varietyName}'` : ''}`).join('\n') + (w.note ? `\n${w.note}` : ''),
        location: s.address,
        geo: { lat: s.lat, lon: s.lon },
      })),
      { productId: 'heelwood/pickup-slip', calName: `Heelwood pickups ${slip.seasonName}` },
    );
    if (error || !value) throw error ?? new Error('calendar could not be made');
    out.push({ filename: `pickup-${s.farmName.toLowerCase().replace(/[^a-z0-9]+/g, '-')}.ics`, content: value });
  }
  return out;
}

export async function farmCollections(db: DbOrTx, farmId: string, seasonId: string): Promise<FarmCollection[]> {
  const rows = await db
    .select({
      bundleId: bundles.id,
      code: bundles.code,
      growerName: user.name,
      growerEmail: user.email,
      plantCode: motherPlants.code,
      speciesName: species.commonName,
      varietyName: varieties.name,
      cuttings: bundles.cuttings,
      status: bundles.status,
      startsAt: pickupWindows.startsAt,
      endsAt: pickupWindows.endsAt,
    })
    .from(bundles)
    .innerJoin(allocationRounds, eq(allocationRounds.id, bundles.roundId))
    .innerJoin(user, eq(user.id, bundles.growerId))
    .innerJoin(motherPlants, eq(motherPlants.id, bundles.plantId))
    .innerJoin(species, eq(species.id, motherPlants.speciesId))
    .leftJoin(varieties, eq(varieties.id, motherPlants.varietyId))
    .leftJoin(pickupWindows, eq(pickupWindows.id, bundles.pickupWindowId))
    .where(and(eq(bundles.farmId, farmId), eq(allocationRounds.seasonId, seasonId), inArray(allocationRounds.status, [...LIVE_ROUNDS])))
    .orderBy(asc(user.name), asc(motherPlants.code));
  return rows.map(({ startsAt, endsAt, ...r }) => ({
    ...r,
    window: startsAt && endsAt ? { startsAt: startsAt.toISOString(), endsAt: endsAt.toISOString() } : null,
  }));
}

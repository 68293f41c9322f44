// Builds the allocation model's arcs from offers and request lines: which wood may go to which
// line, how much at most, and the distances the travel goal needs. No solver here.
//
// Offers are pooled into lots: the offers of one farm with the same species and variety
// that every line sees alike (same compatibility, same distance limit verdict, no lock between
// them). Offers in a lot are interchangeable for every constraint and every goal, so one
// variable per (lot, line) is an exact reformulation of one per (offer, line): any lot flow
// can be split back over the lot's offers (a transportation problem whose supply covers its
// demand, always solvable in whole cuttings). The split is done by `splitLots` after solving.
import { distanceM } from '../../../shared/geo.js';
import type { AllocInput, AllocLine, AllocOffer } from './allocation-model.js';

/** Why a line could be given nothing, before any sharing: decided from the offers alone. */
export type LineReach = 'no_compatible_offer' | 'variety_not_offered' | 'beyond_distance' | 'in_reach';

export type Lot = { farm: number; offers: number[]; cap: number };

export type Prepared = {
  offers: AllocOffer[];
  lines: AllocLine[];
  farmIds: string[];
  /** The farm's place: the first of its offers by id (offers of a farm normally share it). */
  farmAt: { lat: number; lon: number }[];
  offerFarm: Int32Array;
  growerIds: string[];
  /** A grower's trips start and end at the destination of the grower's first line by id. */
  growerAt: { lat: number; lon: number }[];
  lineGrower: Int32Array;
  lots: Lot[];
  /** Arc k joins lot arcLot[k] to line arcLine[k]; at most arcUb[k] cuttings. Arcs of a line are contiguous. */
  arcLot: Int32Array;
  arcLine: Int32Array;
  arcUb: Float64Array;
  /** Metres from the line's destination to the lot's farm, for the per-cutting tie-break. */
  arcDistM: Float64Array;
  /** True when the arc gives another variety than the one asked for (a substitute). */
  arcSubstitute: Uint8Array;
  /** (grower, farm) pair of each arc, an index into gfGrower/gfFarm. */
  arcGf: Int32Array;
  gfGrower: Int32Array;
  gfFarm: Int32Array;
  /** Round trip in km from the grower's place to the farm. */
  gfRoundTripKm: Float64Array;
  /** Cuttings a grower may still take from the farm (Infinity without a limit). */
  gfLimit: Float64Array;
  /** Cuttings already locked from the farm to the grower. */
  gfLocked: Float64Array;
  /** Cuttings a line may still be given on top of its locked bundles. */
  lineNeed: Float64Array;
  lineLocked: Float64Array;
  lineReach: LineReach[];
  /** Valid locks, summed per (offer, line), in offer/line index terms. */
  locks: { offer: number; line: number; cuttings: number; distanceM: number }[];
};

const WGS84_A = 6_378_137;
// Shortest metres in one degree of latitude (on the equator): a latitude gap of d degrees means
// at least d * this many metres between two points, whatever their longitudes.
const MIN_M_PER_DEG_LAT = 110_574;

const byId = <T extends { id: string }>(a: T, b: T) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0);
const whole = (n: number) => (Number.isFinite(n) ? Math.max(0, Math.floor(n)) : 0);

/** Largest latitude gap and longitude gap (degrees) that can lie within `radiusM` of `lat`. */
function boxAround(lat: number, radiusM: number): { dLat: number; dLon: number } {
  const dLat = (radiusM / MIN_M_PER_DEG_LAT) * 1.001 + 1e-9;
  const highest = Math.abs(lat) + dLat;
  // Along any path that stays below `highest` degrees of latitude, a radian of longitude costs
  // at least a * cos(highest) metres, so the box is safe; near a pole it gives up.
  if (highest >= 89.9) return { dLat, dLon: 360 };
  const dLon = ((radiusM / (WGS84_A * Math.cos((highest * Math.PI) / 180))) * 180) / Math.PI * 1.001 + 1e-9;
  return { dLat, dLon };
}

function lonGap(a: number, b: number) {
  const d = Math.abs(a - b) % 360;
  return d > 180 ? 360 - d : d;
}

export function prepare(input: AllocInput): Prepared {
  const offers = [...input.offers].sort(byId);
  const lines = [...input.lines].sort(byId);
  for (let i = 1; i < offers.length; i++) if (offers[i].id === offers[i - 1].id) throw new Error(`Offer ${offers[i].id} is listed twice`);
  for (let i = 1; i < lines.length; i++) if (lines[i].id === lines[i - 1].id) throw new Error(`Request line ${lines[i].id} is listed twice`);
  for (const l of lines) {
    if (!(l.priority > 0) || !Number.isFinite(l.priority)) throw new Error(`Request line ${l.id}: priority must be a positive number`);
    if (!(l.maxDistanceKm >= 0)) throw new Error(`Request line ${l.id}: the distance limit must be zero or more`);
  }

  // Farms and growers, numbered in id order of their first offer/line.
  const farmIndex = new Map<string, number>();
  const farmIds: string[] = [];
  const farmAt: { lat: number; lon: number }[] = [];
  const offerFarm = new Int32Array(offers.length);
  offers.forEach((o, i) => {
    let f = farmIndex.get(o.farmId);
    if (f === undefined) {
      f = farmIds.length;
      farmIndex.set(o.farmId, f);
      farmIds.push(o.farmId);
      farmAt.push({ lat: o.lat, lon: o.lon });
    }
    offerFarm[i] = f;
  });
  const growerIndex = new Map<string, number>();
  const growerIds: string[] = [];
  const growerAt: { lat: number; lon: number }[] = [];
  const lineGrower = new Int32Array(lines.length);
  lines.forEach((l, i) => {
    let g = growerIndex.get(l.growerId);
    if (g === undefined) {
      g = growerIds.length;
      growerIndex.set(l.growerId, g);
      growerIds.push(l.growerId);
      growerAt.push({ lat: l.lat, lon: l.lon });
    }
    lineGrower[i] = g;
  });

  // Locks: only those whose offer and line are both here. A lock on an offer the caller left
  // out (a plant put on hold since) is dropped: that plant can give nothing, so the line is
  // served as if the bundle were not there, and the caller shows the bundle as a problem.
  const offerIndex = new Map(offers.map((o, i) => [o.id, i]));
  const lineIndex = new Map(lines.map((l, i) => [l.id, i]));
  const lockSum = new Map<number, { offer: number; line: number; cuttings: number }>();
  for (const k of input.locked ?? []) {
    const o = offerIndex.get(k.offerId);
    const l = lineIndex.get(k.lineId);
    const c = whole(k.cuttings);
    if (o === undefined || l === undefined || c <= 0) continue;
    const key = o * lines.length + l;
    const e = lockSum.get(key) ?? { offer: o, line: l, cuttings: 0 };
    e.cuttings += c;
    lockSum.set(key, e);
  }
  const locks = [...lockSum.values()]
    .sort((a, b) => a.offer - b.offer || a.line - b.line)
    .map((k) => ({ ...k, distanceM: distanceM(lines[k.line], offers[k.offer]) }));
  const offerLocked = new Float64Array(offers.length);
  const lineLocked = new Float64Array(lines.length);
  const lockedPairs = new Set<number>();
  for (const k of locks) {
    offerLocked[k.offer] += k.cuttings;
    lineLocked[k.line] += k.cuttings;
    lockedPairs.add(k.offer * lines.length + k.line);
  }
  const lineNeed = new Float64Array(lines.length);
  lines.forEach((l, i) => (lineNeed[i] = Math.max(0, whole(l.cuttings) - lineLocked[i])));
  const offerLeft = offers.map((o, i) => Math.max(0, whole(o.available) - offerLocked[i]));

  // Base lots: farm x species x variety. Each keeps how far its offers lie from the farm's
  // place, so one distance from a line's destination to the farm decides most offers at once.
  const baseKey = new Map<string, number>();
  const base: { farm: number; species: string; variety: string | null; offers: number[]; spreadM: number[]; maxSpreadM: number }[] = [];
  offers.forEach((o, i) => {
    const key = `${offerFarm[i]}\u0000${o.speciesId}\u0000${o.varietyId ?? ''}`;
    let b = baseKey.get(key);
    if (b === undefined) {
      b = base.length;
      baseKey.set(key, b);
      base.push({ farm: offerFarm[i], species: o.speciesId, variety: o.varietyId, offers: [], spreadM: [], maxSpreadM: 0 });
    }
    const at = farmAt[offerFarm[i]];
    const spread = at.lat === o.lat && at.lon === o.lon ? 0 : distanceM(at, o);
    base[b].offers.push(i);
    base[b].spreadM.push(spread);
    base[b].maxSpreadM = Math.max(base[b].maxSpreadM, spread);
  });
  // Index the lots by species and by variety, each list sorted by latitude for the box search.
  const bySpecies = new Map<string, number[]>();
  const byVariety = new Map<string, number[]>();
  base.forEach((b, i) => {
    (bySpecies.get(b.species) ?? bySpecies.set(b.species, []).get(b.species)!).push(i);
    if (b.variety !== null) {
      const k = `${b.species}\u0000${b.variety}`;
      (byVariety.get(k) ?? byVariety.set(k, []).get(k)!).push(i);
    }
  });
  const latOf = (b: number) => farmAt[base[b].farm].lat;
  for (const list of [...bySpecies.values(), ...byVariety.values()]) list.sort((a, b) => latOf(a) - latOf(b) || a - b);
  const lowerLat = (list: number[], lat: number) => {
    let lo = 0;
    let hi = list.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (latOf(list[mid]) < lat) lo = mid + 1;
      else hi = mid;
    }
    return lo;
  };

  // Distances from a destination to farms and offers, computed once per distinct pair of places:
  // lines are taken a destination at a time, with a scratch array of farm distances.
  const farmDist = new Float64Array(farmIds.length).fill(Number.NaN);
  let touched: number[] = [];
  const offerDist = new Map<number, number>();
  const byDestination = new Map<string, number[]>();
  lines.forEach((l, i) => {
    const key = `${l.lat},${l.lon}`;
    (byDestination.get(key) ?? byDestination.set(key, []).get(key)!).push(i);
  });

  // Per line: base lots it may take whole, and base lots it may take only some offers of.
  const fullLots: number[][] = lines.map(() => []);
  const fullDist: number[][] = lines.map(() => []);
  const partial: { line: number; base: number; distM: number; offers: Set<number> }[] = [];
  const lineReach: LineReach[] = new Array(lines.length);
  const widestOf = new Map<number[], number>();
  for (const group of byDestination.values()) {
    for (const f of touched) farmDist[f] = Number.NaN;
    touched = [];
    offerDist.clear();
    const here = lines[group[0]];
    for (const li of group) {
      const l = lines[li];
      const speciesLots = bySpecies.get(l.speciesId) ?? [];
      const varietyLots = l.varietyId === null ? speciesLots : (byVariety.get(`${l.speciesId}\u0000${l.varietyId}`) ?? []);
      const candidates = l.varietyId === null || l.substitutesAllowed ? speciesLots : varietyLots;
      if (speciesLots.length === 0) {
        lineReach[li] = 'no_compatible_offer';
        continue;
      }
      if (candidates.length === 0) {
        lineReach[li] = 'variety_not_offered';
        continue;
      }
      const limitM = l.maxDistanceKm * 1000;
      let inReach = false;
      // The box must cover the farm's place plus the spread of the farthest offer from it.
      let widest = widestOf.get(candidates);
      if (widest === undefined) {
        widest = 0;
        for (const b of candidates) widest = Math.max(widest, base[b].maxSpreadM);
        widestOf.set(candidates, widest);
      }
      const { dLat, dLon } = boxAround(here.lat, limitM + widest);
      const myLots = fullLots[li];
      const myDist = fullDist[li];
      for (let k = lowerLat(candidates, here.lat - dLat); k < candidates.length; k++) {
        const b = candidates[k];
        const lot = base[b];
        const at = farmAt[lot.farm];
        if (at.lat > here.lat + dLat) break;
        if (lonGap(at.lon, here.lon) > dLon) continue;
        let d = farmDist[lot.farm];
        if (Number.isNaN(d)) {
          d = farmDist[lot.farm] = distanceM(here, at);
          touched.push(lot.farm);
        }
        // Triangle inequality with exact geodesic distances: offer o lies within d +/- spread(o).
        if (d - lot.maxSpreadM > limitM) continue;
        let locked = false;
        if (lockedPairs.size) for (const o of lot.offers) if (lockedPairs.has(o * lines.length + li)) locked = true;
        if (d + lot.maxSpreadM <= limitM && !locked) {
          inReach = true;
          myLots.push(b);
          myDist.push(d);
          continue;
        }
        const ok = new Set<number>();
        let anyInRange = false;
        lot.offers.forEach((o, j) => {
          let inRange: boolean;
          if (d + lot.spreadM[j] <= limitM) inRange = true;
          else if (d - lot.spreadM[j] > limitM) inRange = false;
          else {
            let e = offerDist.get(o);
            if (e === undefined) offerDist.set(o, (e = distanceM(here, offers[o])));
            inRange = e <= limitM;
          }
          anyInRange ||= inRange;
          // A locked (offer, line) pair is fixed at its locked cuttings: no more on top.
          if (inRange && !lockedPairs.has(o * lines.length + li)) ok.add(o);
        });
        if (anyInRange) inReach = true;
        if (ok.size === lot.offers.length) {
          myLots.push(b);
          myDist.push(d);
        } else if (ok.size > 0) partial.push({ line: li, base: b, distM: d, offers: ok });
      }
      lineReach[li] = inReach ? 'in_reach' : 'beyond_distance';
    }
  }

  // Split base lots that some line sees only in part, by which of those lines see each offer.
  const lots: Lot[] = [];
  const lotsOfBase: { lot: number; members: Set<number> | null }[][] = base.map(() => []);
  const partialsOfBase = new Map<number, number[]>();
  partial.forEach((p, i) => (partialsOfBase.get(p.base) ?? partialsOfBase.set(p.base, []).get(p.base)!).push(i));
  base.forEach((b, bi) => {
    const ps = partialsOfBase.get(bi);
    if (!ps) {
      lots.push({ farm: b.farm, offers: b.offers, cap: b.offers.reduce((s, o) => s + offerLeft[o], 0) });
      lotsOfBase[bi].push({ lot: lots.length - 1, members: null });
      return;
    }
    const groups = new Map<string, { offers: number[]; members: Set<number> }>();
    for (const o of b.offers) {
      const members = ps.filter((p) => partial[p].offers.has(o));
      const key = members.join(',');
      const g = groups.get(key) ?? groups.set(key, { offers: [], members: new Set(members) }).get(key)!;
      g.offers.push(o);
    }
    for (const g of groups.values()) {
      lots.push({ farm: b.farm, offers: g.offers, cap: g.offers.reduce((s, o) => s + offerLeft[o], 0) });
      lotsOfBase[bi].push({ lot: lots.length - 1, members: g.members });
    }
  });
  const partialOfLine = new Map<number, number[]>();
  partial.forEach((p, i) => (partialOfLine.get(p.line) ?? partialOfLine.set(p.line, []).get(p.line)!).push(i));

  // (grower, farm) pairs, numbered as first met; a flat table when it fits, else a map.
  const F = farmIds.length;
  const G = growerIds.length;
  const table = G * F <= 20_000_000 ? new Int32Array(G * F).fill(-1) : null;
  const gfMap = new Map<number, number>();
  const gfGrowerA: number[] = [];
  const gfFarmA: number[] = [];
  const gfDistA: number[] = [];
  const gfFind = (g: number, f: number) => (table ? table[g * F + f] : (gfMap.get(g * F + f) ?? -1));
  const gfOf = (g: number, f: number) => {
    let i = gfFind(g, f);
    if (i < 0) {
      i = gfGrowerA.length;
      if (table) table[g * F + f] = i;
      else gfMap.set(g * F + f, i);
      gfGrowerA.push(g);
      gfFarmA.push(f);
      gfDistA.push(Number.NaN);
    }
    return i;
  };
  // Locked wood counts against the farm's per-grower limit.
  const gfLockedA: number[] = [];
  for (const k of locks) {
    const gf = gfOf(lineGrower[k.line], offerFarm[k.offer]);
    gfLockedA[gf] = (gfLockedA[gf] ?? 0) + k.cuttings;
  }
  const limits = input.farmLimits ?? {};
  const farmLimit = farmIds.map((id) => {
    const v = limits[id];
    return v === undefined || v === null ? Infinity : whole(v);
  });

  // Arcs, line by line, each line's lots in the order they were found (deterministic).
  const aLot: number[] = [];
  const aLine: number[] = [];
  const aUb: number[] = [];
  const aDist: number[] = [];
  const aGf: number[] = [];
  const addArc = (li: number, lot: number, distM: number, atHome: boolean) => {
    const f = lots[lot].farm;
    const g = lineGrower[li];
    const existing = gfFind(g, f);
    const lockedHere = existing < 0 ? 0 : (gfLockedA[existing] ?? 0);
    const ub = Math.min(lots[lot].cap, lineNeed[li], Math.max(0, farmLimit[f] - lockedHere));
    if (ub < 1) return;
    const gf = gfOf(g, f);
    // The line's destination is the grower's place: its distance to the farm is the visit's.
    if (atHome && Number.isNaN(gfDistA[gf])) gfDistA[gf] = distM;
    aLot.push(lot);
    aLine.push(li);
    aUb.push(ub);
    aDist.push(distM);
    aGf.push(gf);
  };
  for (let li = 0; li < lines.length; li++) {
    const fl = fullLots[li];
    const fd = fullDist[li];
    const home = growerAt[lineGrower[li]];
    const atHome = home.lat === lines[li].lat && home.lon === lines[li].lon;
    for (let i = 0; i < fl.length; i++) {
      const subs = lotsOfBase[fl[i]];
      for (let j = 0; j < subs.length; j++) addArc(li, subs[j].lot, fd[i], atHome);
    }
    for (const pi of partialOfLine.get(li) ?? []) {
      const p = partial[pi];
      for (const s2 of lotsOfBase[p.base]) if (s2.members?.has(pi)) addArc(li, s2.lot, p.distM, atHome);
    }
  }
  const n = aLot.length;
  const arcLot = Int32Array.from(aLot);
  const arcLine = Int32Array.from(aLine);
  const arcUb = Float64Array.from(aUb);
  const arcDistM = Float64Array.from(aDist);
  const arcGf = Int32Array.from(aGf);
  const arcSubstitute = new Uint8Array(n);
  for (let k = 0; k < n; k++) {
    const l = lines[arcLine[k]];
    arcSubstitute[k] = l.varietyId !== null && offers[lots[arcLot[k]].offers[0]].varietyId !== l.varietyId ? 1 : 0;
  }

  const m = gfGrowerA.length;
  const gfGrower = Int32Array.from(gfGrowerA);
  const gfFarm = Int32Array.from(gfFarmA);
  const gfRoundTripKm = new Float64Array(m);
  const gfLimit = new Float64Array(m);
  const gfLocked = new Float64Array(m);
  for (let i = 0; i < m; i++) {
    const d = Number.isNaN(gfDistA[i]) ? distanceM(growerAt[gfGrower[i]], farmAt[gfFarm[i]]) : gfDistA[i];
    gfRoundTripKm[i] = (2 * d) / 1000;
    gfLocked[i] = gfLockedA[i] ?? 0;
    gfLimit[i] = Math.max(0, farmLimit[gfFarm[i]] - gfLocked[i]);
  }

  return {
    offers,
    lines,
    farmIds,
    farmAt,
    offerFarm,
    growerIds,
    growerAt,
    lineGrower,
    lots,
    arcLot,
    arcLine,
    arcUb,
    arcDistM,
    arcSubstitute,
    arcGf,
    gfGrower,
    gfFarm,
    gfRoundTripKm,
    gfLimit,
    gfLocked,
    lineNeed,
    lineLocked,
    lineReach,
    locks,
  };
}

/**
 * Spreads each lot's cuttings per line back over the lot's offers, offers in id order, lines in
 * id order (a north-west corner fill: deterministic, and few pieces). Returns offer x line
 * amounts keyed `offer * lines + line`.
 */
export function splitLots(p: Prepared, arcValue: ArrayLike<number>): Map<number, number> {
  const out = new Map<number, number>();
  const byLot = new Map<number, number[]>();
  for (let k = 0; k < p.arcLot.length; k++) {
    if (arcValue[k] <= 0) continue;
    (byLot.get(p.arcLot[k]) ?? byLot.set(p.arcLot[k], []).get(p.arcLot[k])!).push(k);
  }
  const L = p.lines.length;
  const lockedOn = new Float64Array(p.offers.length);
  for (const k of p.locks) lockedOn[k.offer] += k.cuttings;
  for (const [lot, arcs] of [...byLot.entries()].sort((a, b) => a[0] - b[0])) {
    const offers = p.lots[lot].offers;
    const left = offers.map((o) => Math.max(0, whole(p.offers[o].available) - lockedOn[o]));
    let i = 0;
    for (const k of arcs) {
      let need = arcValue[k];
      while (need > 0) {
        if (i >= offers.length) throw new Error('Allocation model: a lot gave more than its offers hold');
        const take = Math.min(need, left[i]);
        if (take > 0) {
          const key = offers[i] * L + p.arcLine[k];
          out.set(key, (out.get(key) ?? 0) + take);
          left[i] -= take;
          need -= take;
        }
        if (left[i] <= 0) i++;
      }
    }
  }
  return out;
}

import GLPK, { type LP } from 'glpk.js/node';
import { beforeAll, describe, expect, it } from 'vitest';
import { destination, distanceM, type LatLon } from '../../../../shared/geo.js';
import {
  type AllocInput,
  type AllocLine,
  type AllocOffer,
  type AllocResult,
  greedyAllocation,
  SUBSTITUTE_KM,
  solveAllocation,
} from '../allocation-model.js';
import { prng } from '../../../../tests/fixtures/prng.js';

type Glpk = Awaited<ReturnType<typeof GLPK>>;
let glpk: Glpk;
beforeAll(async () => {
  glpk = await GLPK();
});

const home: LatLon = { lat: 47.2, lon: 8.6 };
const place = (azimuth: number, km: number) => destination(home, azimuth, km * 1000);

function offer(id: string, farmId: string, at: LatLon, speciesId: string, varietyId: string | null, available: number): AllocOffer {
  return { id, plantId: `plant-${id}`, farmId, speciesId, varietyId, available, lat: at.lat, lon: at.lon };
}
function line(id: string, growerId: string, at: LatLon, speciesId: string, varietyId: string | null, cuttings: number, more: Partial<AllocLine> = {}): AllocLine {
  return { id, growerId, speciesId, varietyId, cuttings, substitutesAllowed: false, priority: 1, maxDistanceKm: 50, lat: at.lat, lon: at.lon, ...more };
}
const byLine = (r: AllocResult, id: string) => r.lines.find((l) => l.lineId === id)!;
const from = (r: AllocResult, lineId: string) => r.assignments.filter((a) => a.lineId === lineId);
/** Everything except wall-clock times. */
const timeless = (r: AllocResult) => ({ ...r, stats: { ...r.stats, seconds: 0, stages: r.stats.stages.map((s) => ({ ...s, seconds: 0 })) } });

describe('allocation model: small cases worked by hand', () => {
  it('shares scarce wood: two growers ask 8 each of a variety with 10 on offer get 5 and 5', async () => {
    const input: AllocInput = {
      offers: [offer('o1', 'farmA', place(0, 5), 'apple', 'bramley', 10)],
      lines: [line('l1', 'g1', place(90, 3), 'apple', 'bramley', 8), line('l2', 'g2', place(270, 3), 'apple', 'bramley', 8)],
    };
    const r = await solveAllocation(input);
    expect(byLine(r, 'l1')).toMatchObject({ allocated: 5, reason: 'partly' });
    expect(byLine(r, 'l2')).toMatchObject({ allocated: 5, reason: 'partly' });
    expect(r.stats.minFill).toBeCloseTo(5 / 8, 12);
    expect(r.stats.optimal).toBe(true);
    // First come, first served gives the first line all it asked for.
    const g = greedyAllocation(input);
    expect(byLine(g, 'l1').allocated).toBe(8);
    expect(byLine(g, 'l2').allocated).toBe(2);
  });

  it('weights the share by priority', async () => {
    const input: AllocInput = {
      offers: [offer('o1', 'farmA', place(0, 5), 'apple', 'bramley', 12)],
      lines: [line('l1', 'g1', home, 'apple', 'bramley', 8, { priority: 2 }), line('l2', 'g2', home, 'apple', 'bramley', 8, { priority: 1 })],
    };
    const r = await solveAllocation(input);
    // t * 8 for l1 and t * 4 for l2 with 12 cuttings: t = 1 -> 8 and 4.
    expect(byLine(r, 'l1').allocated).toBe(8);
    expect(byLine(r, 'l2').allocated).toBe(4);
  });

  it('gives a substitute only where the line allows it', async () => {
    const offers = [offer('o1', 'farmA', place(0, 5), 'pear', 'conference', 100)];
    const strict = await solveAllocation({ offers, lines: [line('l1', 'g1', home, 'pear', 'comice', 10)] });
    expect(byLine(strict, 'l1')).toMatchObject({ allocated: 0, reason: 'variety_not_offered' });
    expect(strict.assignments).toEqual([]);
    const loose = await solveAllocation({ offers, lines: [line('l1', 'g1', home, 'pear', 'comice', 10, { substitutesAllowed: true })] });
    expect(byLine(loose, 'l1')).toMatchObject({ allocated: 10, reason: 'filled' });
    const any = await solveAllocation({ offers, lines: [line('l1', 'g1', home, 'pear', null, 10)] });
    expect(byLine(any, 'l1').allocated).toBe(10);
  });

  it('prefers the asked-for variety over a substitute when both are at hand', async () => {
    const offers = [offer('o1', 'farmA', place(0, 5), 'pear', 'conference', 100), offer('o2', 'farmA', place(0, 5), 'pear', 'comice', 100)];
    const r = await solveAllocation({ offers, lines: [line('l1', 'g1', home, 'pear', 'comice', 10, { substitutesAllowed: true })] });
    expect(from(r, 'l1')).toEqual([expect.objectContaining({ offerId: 'o2', cuttings: 10 })]);
    expect(SUBSTITUTE_KM).toBeGreaterThan(0);
  });

  it('never assigns an offer the caller left out (a plant on hold): eligibility is the caller’s job', async () => {
    const near = offer('near', 'farmA', place(0, 2), 'plum', 'victoria', 50);
    const far = offer('far', 'farmB', place(180, 20), 'plum', 'victoria', 50);
    const lines = [line('l1', 'g1', home, 'plum', 'victoria', 10)];
    const all = await solveAllocation({ offers: [near, far], lines });
    expect(from(all, 'l1').map((a) => a.offerId)).toEqual(['near']);
    // The caller filters out the plant put on hold; the model cannot see it, so never uses it,
    // even with a lock that still names it.
    const held = await solveAllocation({ offers: [far], lines, locked: [{ offerId: 'near', lineId: 'l1', cuttings: 4 }] });
    expect(held.assignments.map((a) => a.offerId)).toEqual(['far']);
    expect(byLine(held, 'l1').allocated).toBe(10);
  });

  it('keeps distance limits: an offer 30 km away is out of reach at 25 km', async () => {
    const offers = [offer('o1', 'farmA', place(45, 30), 'fig', 'brown-turkey', 20)];
    const d = distanceM(home, offers[0]);
    expect(d).toBeCloseTo(30_000, 0);
    const r = await solveAllocation({ offers, lines: [line('l1', 'g1', home, 'fig', 'brown-turkey', 5, { maxDistanceKm: 25 })] });
    expect(byLine(r, 'l1')).toMatchObject({ allocated: 0, reason: 'beyond_distance' });
    expect(r.stats.arcs).toBe(0);
    const ok = await solveAllocation({ offers, lines: [line('l1', 'g1', home, 'fig', 'brown-turkey', 5, { maxDistanceKm: 31 })] });
    expect(byLine(ok, 'l1').allocated).toBe(5);
    expect(from(ok, 'l1')[0].distanceM).toBeCloseTo(d, 6);
  });

  it('says why a line got nothing', async () => {
    const r = await solveAllocation({
      offers: [offer('o1', 'farmA', place(0, 5), 'apple', 'bramley', 1)],
      lines: [
        line('a', 'g1', home, 'cherry', null, 5),
        line('b', 'g1', home, 'apple', 'cox', 5),
        line('c', 'g2', home, 'apple', 'bramley', 1),
        line('d', 'g3', home, 'apple', 'bramley', 1),
      ],
    });
    expect(byLine(r, 'a').reason).toBe('no_compatible_offer');
    expect(byLine(r, 'b').reason).toBe('variety_not_offered');
    // One cutting for two equal lines: one gets it, the other has it shared out.
    expect([byLine(r, 'c').reason, byLine(r, 'd').reason].sort()).toEqual(['filled', 'shared_out']);
  });

  it('prefers one farm visit to two at equal fill', async () => {
    const both = place(0, 8); // one farm with both varieties, 16 km there and back
    const input: AllocInput = {
      offers: [
        offer('a1', 'farmA', both, 'currant', 'ben-sarek', 30),
        offer('a2', 'farmA', both, 'currant', 'ben-lomond', 30),
        offer('b1', 'farmB', place(90, 5), 'currant', 'ben-sarek', 30),
        offer('c1', 'farmC', place(270, 5), 'currant', 'ben-lomond', 30),
      ],
      lines: [line('l1', 'g1', home, 'currant', 'ben-sarek', 10), line('l2', 'g1', home, 'currant', 'ben-lomond', 10)],
    };
    const r = await solveAllocation(input);
    expect(new Set(r.assignments.map((a) => a.offerId))).toEqual(new Set(['a1', 'a2']));
    expect(r.stats.travelKm).toBeCloseTo(16, 3);
    // Nearest-first takes the two nearer farms: 20 km.
    expect(greedyAllocation(input).stats.travelKm).toBeCloseTo(20, 3);
    // With a fixed cost per visit the single farm wins all the more.
    const fixed = await solveAllocation({ ...input, farmVisitKm: 10 });
    expect(new Set(fixed.assignments.map((a) => a.offerId))).toEqual(new Set(['a1', 'a2']));
  });

  it('respects a farm’s per-grower limit', async () => {
    const input: AllocInput = {
      offers: [offer('a1', 'farmA', place(0, 2), 'gooseberry', 'invicta', 100), offer('b1', 'farmB', place(0, 15), 'gooseberry', 'invicta', 100)],
      lines: [line('l1', 'g1', home, 'gooseberry', 'invicta', 8), line('l2', 'g1', home, 'gooseberry', 'invicta', 8), line('l3', 'g2', home, 'gooseberry', 'invicta', 8)],
      farmLimits: { farmA: 10 },
    };
    const r = await solveAllocation(input);
    const g1FromA = r.assignments.filter((a) => a.offerId === 'a1' && a.lineId !== 'l3').reduce((s, a) => s + a.cuttings, 0);
    expect(g1FromA).toBeLessThanOrEqual(10);
    expect(r.lines.every((l) => l.reason === 'filled')).toBe(true);
    expect(from(r, 'l3')).toEqual([expect.objectContaining({ offerId: 'a1', cuttings: 8 })]);
    expect(greedyAllocation(input).assignments.filter((a) => a.offerId === 'a1' && a.lineId !== 'l3').reduce((s, a) => s + a.cuttings, 0)).toBeLessThanOrEqual(10);
  });

  it('keeps locked bundles: they use capacity, count for their line, and nothing is added on top', async () => {
    const input: AllocInput = {
      offers: [offer('x', 'farmA', place(0, 3), 'elder', 'haschberg', 5), offer('y', 'farmB', place(0, 20), 'elder', 'haschberg', 50)],
      lines: [line('l1', 'g1', home, 'elder', 'haschberg', 6), line('l2', 'g2', home, 'elder', 'haschberg', 5)],
      locked: [{ offerId: 'x', lineId: 'l1', cuttings: 3 }],
    };
    const r = await solveAllocation(input);
    expect(r.assignments.filter((a) => a.offerId === 'x' && a.lineId === 'l1')).toEqual([expect.objectContaining({ cuttings: 3 })]);
    expect(r.assignments.filter((a) => a.offerId === 'x').reduce((s, a) => s + a.cuttings, 0)).toBeLessThanOrEqual(5);
    expect(byLine(r, 'l1').allocated).toBe(6);
    expect(byLine(r, 'l2').allocated).toBe(5);
  });

  it('gives the same result for the same input, in any order', async () => {
    const input = randomInstance(4242);
    const a = await solveAllocation(input);
    const b = await solveAllocation(input);
    expect(timeless(b)).toEqual(timeless(a));
    const shuffled = { ...input, offers: [...input.offers].reverse(), lines: [...input.lines].reverse() };
    const c = await solveAllocation(shuffled);
    expect(c.assignments).toEqual(a.assignments);
    expect(c.stats.stages.map((s) => s.objective)).toEqual(a.stats.stages.map((s) => s.objective));
  });
});

// --- Independent cross-check with glpk.js --------------------------------------------------

/** 5-30 offers, 5-20 lines on a few farms, with limits, locks and scattered plants at times. */
function randomInstance(seed: number): AllocInput {
  const rnd = prng(seed);
  const int = (lo: number, hi: number) => lo + Math.floor(rnd() * (hi - lo + 1));
  const pick = <T>(xs: readonly T[]) => xs[Math.floor(rnd() * xs.length)];
  const farms = Array.from({ length: int(2, 6) }, (_, i) => ({ id: `f${i}`, at: place(rnd() * 360, 20 * Math.sqrt(rnd())) }));
  const varieties = [
    ['s1', 'v1'],
    ['s1', 'v2'],
    ['s1', 'v3'],
    ['s2', 'w1'],
    ['s2', 'w2'],
  ] as const;
  // Half the instances place each plant up to ~600 m from its farm's first plant.
  const scatter = rnd() < 0.5;
  const offers = Array.from({ length: int(5, 30) }, (_, i) => {
    const f = pick(farms);
    const [s, v] = pick(varieties);
    const at = scatter ? destination(f.at, rnd() * 360, rnd() * 600) : f.at;
    return offer(`o${String(i).padStart(2, '0')}`, f.id, at, s, rnd() < 0.1 ? null : v, int(0, 12));
  });
  const growers = Array.from({ length: int(2, 6) }, (_, i) => ({ id: `g${i}`, at: place(rnd() * 360, 20 * Math.sqrt(rnd())) }));
  const lines = Array.from({ length: int(5, 20) }, (_, i) => {
    const g = pick(growers);
    const [s, v] = pick(varieties);
    const any = rnd() < 0.25;
    return line(`l${String(i).padStart(2, '0')}`, g.id, g.at, rnd() < 0.05 ? 's3' : s, any ? null : v, int(1, 15), {
      substitutesAllowed: !any && rnd() < 0.4,
      priority: pick([1, 1, 1, 2, 0.5]),
      maxDistanceKm: pick([8, 15, 25, 40]),
    });
  });
  const farmLimits: Record<string, number> = {};
  for (const f of farms) if (rnd() < 0.3) farmLimits[f.id] = int(3, 15);
  const locked: AllocInput['locked'] = [];
  if (rnd() < 0.3) {
    for (let k = 0; k < 2; k++) {
      const o = pick(offers);
      const l = lines.find((x) => x.speciesId === o.speciesId);
      if (l) locked.push({ offerId: o.id, lineId: l.id, cuttings: int(1, 3) });
    }
  }
  return { offers, lines, farmLimits, locked, farmVisitKm: rnd() < 0.2 ? pick([5, 12]) : undefined };
}

/**
 * The same three stages written out plainly, one variable per (offer, line) pair and one visit
 * variable per (grower, farm), solved by glpk: nothing shared with the model's code but the
 * geodesic distance and the documented definitions (farm place = its first offer by id,
 * grower place = the destination of the grower's first line by id).
 */
function glpkStages(input: AllocInput): { fairness: number; volume: number; travel: number } | null {
  const offers = [...input.offers].sort((a, b) => (a.id < b.id ? -1 : 1));
  const lines = [...input.lines].sort((a, b) => (a.id < b.id ? -1 : 1));
  const farmAt = new Map<string, LatLon>();
  for (const o of offers) if (!farmAt.has(o.farmId)) farmAt.set(o.farmId, o);
  const growerAt = new Map<string, LatLon>();
  for (const l of lines) if (!growerAt.has(l.growerId)) growerAt.set(l.growerId, l);
  const offerIds = new Set(offers.map((o) => o.id));
  const lineIds = new Set(lines.map((l) => l.id));
  const locks = (input.locked ?? []).filter((k) => offerIds.has(k.offerId) && lineIds.has(k.lineId) && k.cuttings > 0);
  const sumBy = <T>(xs: T[], key: (x: T) => string, val: (x: T) => number) => {
    const m = new Map<string, number>();
    for (const x of xs) m.set(key(x), (m.get(key(x)) ?? 0) + val(x));
    return m;
  };
  const lockedOffer = sumBy(locks, (k) => k.offerId, (k) => k.cuttings);
  const lockedLine = sumBy(locks, (k) => k.lineId, (k) => k.cuttings);
  const growerOf = new Map(lines.map((l) => [l.id, l.growerId]));
  const farmOf = new Map(offers.map((o) => [o.id, o.farmId]));
  const lockedGf = sumBy(locks, (k) => `${growerOf.get(k.lineId)}|${farmOf.get(k.offerId)}`, (k) => k.cuttings);
  const lockedPair = new Set(locks.map((k) => `${k.offerId}|${k.lineId}`));
  const offerLeft = (o: AllocOffer) => Math.max(0, o.available - (lockedOffer.get(o.id) ?? 0));
  const need = (l: AllocLine) => Math.max(0, l.cuttings - (lockedLine.get(l.id) ?? 0));
  const gfLeft = (g: string, f: string) => {
    const lim = input.farmLimits?.[f];
    return lim === undefined ? Infinity : Math.max(0, lim - (lockedGf.get(`${g}|${f}`) ?? 0));
  };
  type Arc = { name: string; o: AllocOffer; l: AllocLine; gf: string; km: number; sub: boolean };
  const arcs: Arc[] = [];
  for (const l of lines) {
    for (const o of offers) {
      if (o.speciesId !== l.speciesId) continue;
      if (l.varietyId !== null && !l.substitutesAllowed && o.varietyId !== l.varietyId) continue;
      if (distanceM(l, o) > l.maxDistanceKm * 1000) continue;
      if (lockedPair.has(`${o.id}|${l.id}`)) continue;
      if (offerLeft(o) < 1 || need(l) < 1 || gfLeft(l.growerId, o.farmId) < 1) continue;
      arcs.push({
        name: `x_${o.id}_${l.id}`,
        o,
        l,
        gf: `${l.growerId}|${o.farmId}`,
        km: distanceM(l, farmAt.get(o.farmId)!) / 1000,
        sub: l.varietyId !== null && o.varietyId !== l.varietyId,
      });
    }
  }
  if (arcs.length === 0) return null;
  const fair = lines.filter((l) => l.cuttings > 0 && arcs.some((a) => a.l === l));
  const pmax = Math.max(...fair.map((l) => l.priority));
  const weight = (l: AllocLine) => (l.priority / pmax) * l.cuttings;
  const lockedTotal = locks.reduce((s, k) => s + k.cuttings, 0);
  const GLP = glpk;

  const capacityRows = () => {
    const rows: LP['subjectTo'] = [];
    for (const o of offers) {
      const vars = arcs.filter((a) => a.o === o).map((a) => ({ name: a.name, coef: 1 }));
      if (vars.length) rows.push({ name: `offer_${o.id}`, vars, bnds: { type: GLP.GLP_UP, lb: 0, ub: offerLeft(o) } });
    }
    for (const l of lines) {
      const vars = arcs.filter((a) => a.l === l).map((a) => ({ name: a.name, coef: 1 }));
      if (vars.length) rows.push({ name: `line_${l.id}`, vars, bnds: { type: GLP.GLP_UP, lb: 0, ub: need(l) } });
    }
    for (const gf of new Set(arcs.map((a) => a.gf))) {
      const [g, f] = gf.split('|');
      const lim = gfLeft(g, f);
      if (!Number.isFinite(lim)) continue;
      const vars = arcs.filter((a) => a.gf === gf).map((a) => ({ name: a.name, coef: 1 }));
      rows.push({ name: `limit_${gf}`, vars, bnds: { type: GLP.GLP_UP, lb: 0, ub: lim } });
    }
    return rows;
  };
  const solve = (lp: LP) => {
    const r = glpk.solve(lp, { msglev: GLP.GLP_MSG_OFF, presol: true });
    expect(r.result.status).toBe(GLP.GLP_OPT);
    return r.result;
  };
  const generals = arcs.map((a) => a.name);

  const solveStatus = (lp: LP) => glpk.solve(lp, { msglev: GLP.GLP_MSG_OFF, presol: true }).result;
  const floorRows = (t: number) =>
    fair.map((l) => {
      const want = t * weight(l);
      const floor = Math.min(l.cuttings, Math.ceil(want - 1e-9 * Math.max(1, want))) - (lockedLine.get(l.id) ?? 0);
      return { name: `floor_${l.id}`, vars: arcs.filter((a) => a.l === l).map((a) => ({ name: a.name, coef: 1 })), bnds: { type: GLP.GLP_LO, lb: floor, ub: 0 } };
    });
  const volumeLp = (t: number): LP => ({
    name: 'volume',
    objective: { direction: GLP.GLP_MAX, name: 'cuttings', vars: arcs.map((a) => ({ name: a.name, coef: 1 })) },
    subjectTo: [...capacityRows(), ...floorRows(t)],
    generals,
  });

  // 1. Fairness. Branch and bound on max t with t continuous can stall in glpk, so: the LP
  // bound on t, then every share value a line can reach (k / weight) from that bound down,
  // until one whose whole-cutting floors an integer program can meet.
  const lpBound = solve({
    name: 'fairness-lp',
    objective: { direction: GLP.GLP_MAX, name: 'share', vars: [{ name: 't', coef: 1 }] },
    subjectTo: [
      ...capacityRows(),
      ...fair.map((l) => ({
        name: `fair_${l.id}`,
        vars: [...arcs.filter((a) => a.l === l).map((a) => ({ name: a.name, coef: 1 })), { name: 't', coef: -weight(l) }],
        bnds: { type: GLP.GLP_LO, lb: -(lockedLine.get(l.id) ?? 0), ub: 0 },
      })),
    ],
    bounds: [{ name: 't', type: GLP.GLP_DB, lb: 0, ub: 1 }],
  }).z;
  const shares = [...new Set(fair.flatMap((l) => Array.from({ length: l.cuttings + 1 }, (_, k) => Math.min(1, k / weight(l)))))]
    .filter((v) => v <= lpBound + 1e-9)
    .sort((x, y) => y - x);
  let t = 0;
  let volumeArcs = 0;
  for (const candidate of shares) {
    const r = solveStatus(volumeLp(candidate));
    if (r.status === GLP.GLP_OPT) {
      t = candidate;
      volumeArcs = r.z;
      break;
    }
    expect(r.status).toBe(GLP.GLP_NOFEAS);
  }

  // 2. Volume, with each line of L* kept at its whole-cutting fair share (solved just above).
  const volume = Math.round(volumeArcs) + lockedTotal;

  // 3. Travel: visits at their cost plus the per-cutting tie-break, totals kept.
  const visitCost = (gf: string) => {
    const [g, f] = gf.split('|');
    return input.farmVisitKm ?? (2 * distanceM(growerAt.get(g)!, farmAt.get(f)!)) / 1000;
  };
  const pairs = new Set([...arcs.map((a) => a.gf), ...lockedGf.keys()]);
  const cheapest = Math.min(...[...pairs].map(visitCost).filter((c) => c > 0));
  const perCutting = Math.max(...arcs.map((a) => a.km + (a.sub ? SUBSTITUTE_KM : 0)));
  const needAll = lines.reduce((s, l) => s + need(l), 0);
  const tau = Number.isFinite(cheapest) ? (0.5 * Math.max(cheapest, 0.1)) / (1 + needAll * perCutting) : 1;
  const visits = [...new Set(arcs.map((a) => a.gf))].filter((gf) => !lockedGf.has(gf));
  const yName = (gf: string) => `y_${gf.replace('|', '_')}`;
  const lockedVisits = [...lockedGf.keys()].reduce((s, gf) => s + visitCost(gf), 0);
  const s3 = solve({
    name: 'travel',
    objective: {
      direction: GLP.GLP_MIN,
      name: 'travel',
      vars: [...arcs.map((a) => ({ name: a.name, coef: tau * (a.km + (a.sub ? SUBSTITUTE_KM : 0)) })), ...visits.map((gf) => ({ name: yName(gf), coef: visitCost(gf) }))],
    },
    subjectTo: [
      ...capacityRows(),
      ...floorRows(t),
      { name: 'volume', vars: arcs.map((a) => ({ name: a.name, coef: 1 })), bnds: { type: GLP.GLP_LO, lb: volume - lockedTotal, ub: 0 } },
      // A plain big-M per arc: not the model's linking rows, the same integer optimum.
      ...arcs
        .filter((a) => !lockedGf.has(a.gf))
        .map((a) => ({
          name: `visit_${a.name}`,
          vars: [
            { name: a.name, coef: 1 },
            { name: yName(a.gf), coef: -Math.min(offerLeft(a.o), need(a.l), gfLeft(a.l.growerId, a.o.farmId)) },
          ],
          bnds: { type: GLP.GLP_UP, lb: 0, ub: 0 },
        })),
    ],
    binaries: visits.map(yName),
    generals,
  });
  return { fairness: t, volume, travel: s3.z + lockedVisits };
}

describe('allocation model against glpk.js on 50 random instances', () => {
  const close = (a: number, b: number) => Math.abs(a - b) <= 1e-6 * Math.max(1, Math.abs(a), Math.abs(b));
  it('reaches the same optimum at every stage', { timeout: 600_000 }, async () => {
    let compared = 0;
    for (let seed = 1; seed <= 50; seed++) {
      const input = randomInstance(seed);
      const r = await solveAllocation(input, { travelGap: 0 });
      const g = glpkStages(input);
      const stage = (name: string) => r.stats.stages.find((s) => s.name === name)!;
      // Capacities hold in the answer itself (locked bundles are kept even beyond them).
      const lockedOn = (key: 'offerId' | 'lineId', id: string) => (input.locked ?? []).filter((k) => k[key] === id).reduce((s, k) => s + k.cuttings, 0);
      const givenByOffer = new Map<string, number>();
      for (const a of r.assignments) givenByOffer.set(a.offerId, (givenByOffer.get(a.offerId) ?? 0) + a.cuttings);
      for (const o of input.offers) expect(givenByOffer.get(o.id) ?? 0, `seed ${seed} offer ${o.id}`).toBeLessThanOrEqual(Math.max(o.available, lockedOn('offerId', o.id)));
      for (const l of r.lines) {
        expect(l.allocated, `seed ${seed} line ${l.lineId}`).toBeLessThanOrEqual(Math.max(input.lines.find((x) => x.id === l.lineId)!.cuttings, lockedOn('lineId', l.lineId)));
      }
      if (!g) {
        expect(r.stats.modelArcs, `seed ${seed}`).toBe(0);
        continue;
      }
      compared++;
      expect(r.stats.optimal, `seed ${seed}`).toBe(true);
      expect(close(stage('fairness').objective, g.fairness), `seed ${seed} fairness ${stage('fairness').objective} vs ${g.fairness}`).toBe(true);
      expect(close(stage('volume').objective, g.volume), `seed ${seed} volume ${stage('volume').objective} vs ${g.volume}`).toBe(true);
      expect(close(stage('travel').objective, g.travel), `seed ${seed} travel ${stage('travel').objective} vs ${g.travel}`).toBe(true);
    }
    expect(compared).toBeGreaterThan(40);
  });
});

describe('allocation model with column generation', () => {
  it('proves the same fairness and volume from a grown subset of arcs, and reports an honest travel gap', { timeout: 600_000 }, async () => {
    for (let seed = 101; seed <= 115; seed++) {
      const input = randomInstance(seed);
      const all = await solveAllocation(input, { travelGap: 0 });
      const grown = await solveAllocation(input, { travelGap: 0, allArcsUpTo: 0 });
      const objective = (r: AllocResult, name: string) => r.stats.stages.find((s) => s.name === name)?.objective ?? Number.NaN;
      if (all.stats.modelArcs === 0) continue;
      expect(grown.stats.optimal, `seed ${seed}`).toBe(true);
      expect(objective(grown, 'fairness'), `seed ${seed}`).toBeCloseTo(objective(all, 'fairness'), 9);
      expect(objective(grown, 'volume'), `seed ${seed}`).toBe(objective(all, 'volume'));
      const best = objective(all, 'travel');
      const found = objective(grown, 'travel');
      expect(found, `seed ${seed}`).toBeGreaterThanOrEqual(best - 1e-6 * Math.max(1, best));
      // The gap claimed is never smaller than the true distance from the optimum.
      expect(grown.stats.gap, `seed ${seed}`).toBeGreaterThanOrEqual((found - best) / found - 1e-6);
    }
  });
});

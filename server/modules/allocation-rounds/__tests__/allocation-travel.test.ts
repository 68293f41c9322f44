// The travel stage's parts that work without the solver (local search, set-cover bound) and the
// column-generation bound, checked on hand-worked cases and against glpk.js on random instances.
import GLPK, { type LP } from 'glpk.js/node';
import { beforeAll, describe, expect, it } from 'vitest';
import { destination, type LatLon } from '../../../../shared/geo.js';
import { prepare } from '../allocation-arcs.js';
import { highs, runStage } from '../allocation-highs.js';
import type { AllocInput, AllocLine, AllocOffer } from '../allocation-model.js';
import { buildMaster, type Ctx, context, type StageSpec, travelLowerBound } from '../allocation-stages.js';
import { coverBound, improveTravel } from '../allocation-travel.js';
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

/** 8-30 offers on 3-7 farms, 3-5 growers with 6-18 lines: several farms per grower to choose from. */
function randomInstance(seed: number): AllocInput {
  const rnd = prng(seed);
  const int = (lo: number, hi: number) => lo + Math.floor(rnd() * (hi - lo + 1));
  const pick = <T>(xs: readonly T[]) => xs[Math.floor(rnd() * xs.length)];
  const farms = Array.from({ length: int(3, 7) }, (_, i) => ({ id: `f${i}`, at: place(rnd() * 360, 15 * Math.sqrt(rnd())) }));
  const varieties = [
    ['s1', 'v1'],
    ['s1', 'v2'],
    ['s1', 'v3'],
    ['s2', 'w1'],
    ['s2', 'w2'],
  ] as const;
  const offers = Array.from({ length: int(8, 30) }, (_, i) => {
    const f = pick(farms);
    const [s, v] = pick(varieties);
    return offer(`o${String(i).padStart(2, '0')}`, f.id, f.at, s, rnd() < 0.1 ? null : v, int(1, 12));
  });
  const growers = Array.from({ length: int(3, 5) }, (_, i) => ({ id: `g${i}`, at: place(rnd() * 360, 15 * Math.sqrt(rnd())) }));
  const lines = Array.from({ length: int(6, 18) }, (_, i) => {
    const g = pick(growers);
    const [s, v] = pick(varieties);
    const any = rnd() < 0.25;
    return line(`l${String(i).padStart(2, '0')}`, g.id, g.at, s, any ? null : v, int(1, 15), { substitutesAllowed: !any && rnd() < 0.4, maxDistanceKm: pick([15, 25, 40]) });
  });
  const farmLimits: Record<string, number> = {};
  for (const f of farms) if (rnd() < 0.3) farmLimits[f.id] = int(4, 15);
  const locked: AllocInput['locked'] = [];
  if (rnd() < 0.3) {
    const o = pick(offers);
    const l = lines.find((x) => x.speciesId === o.speciesId);
    if (l) locked.push({ offerId: o.id, lineId: l.id, cuttings: 1 });
  }
  return { offers, lines, farmLimits, locked, farmVisitKm: rnd() < 0.2 ? 10 : undefined };
}

/** A feasible start: lines in order, each from its arcs in order, as much as capacities allow. */
function fill(c: Ctx): Float64Array {
  const { p } = c;
  const x = new Float64Array(c.n);
  const lot = p.lots.map((l) => l.cap);
  const gf = Float64Array.from(p.gfLimit);
  for (let l = 0; l < p.lines.length; l++) {
    let need = p.lineNeed[l];
    for (let k = c.lineStart[l]; k < c.lineStart[l + 1] && need > 0; k++) {
      const take = Math.min(need, p.arcUb[k], lot[p.arcLot[k]], gf[p.arcGf[k]]);
      if (take <= 0) continue;
      x[k] = take;
      need -= take;
      lot[p.arcLot[k]] -= take;
      gf[p.arcGf[k]] -= take;
    }
  }
  return x;
}

const amounts = (c: Ctx, x: ArrayLike<number>) => {
  const a = new Float64Array(c.p.lines.length);
  for (let k = 0; k < c.n; k++) a[c.p.arcLine[k]] += x[k];
  return a;
};

/** Visits (locked ones included) plus the per-cutting tie-break, as the model counts them. */
function travelCost(c: Ctx, x: ArrayLike<number>): number {
  const { p } = c;
  const visited = new Uint8Array(p.gfGrower.length);
  let v = 0;
  for (let k = 0; k < c.n; k++) {
    if (x[k] <= 0) continue;
    v += c.travelCost[k] * x[k];
    visited[p.arcGf[k]] = 1;
  }
  for (let gf = 0; gf < visited.length; gf++) if (visited[gf] || p.gfLocked[gf] > 0) v += c.visitCost[gf];
  return v;
}

/** Capacities, floors and the total, all in whole cuttings. */
function expectFeasible(c: Ctx, x: Float64Array, floors: Float64Array, total: number, what: string) {
  const { p } = c;
  const lot = new Float64Array(p.lots.length);
  const gf = new Float64Array(p.gfGrower.length);
  let sum = 0;
  for (let k = 0; k < c.n; k++) {
    expect(Number.isInteger(x[k]) && x[k] >= 0 && x[k] <= p.arcUb[k], `${what} arc ${k}`).toBe(true);
    lot[p.arcLot[k]] += x[k];
    gf[p.arcGf[k]] += x[k];
    sum += x[k];
  }
  p.lots.forEach((l, i) => expect(lot[i], `${what} lot ${i}`).toBeLessThanOrEqual(l.cap));
  gf.forEach((v, i) => expect(v, `${what} limit ${i}`).toBeLessThanOrEqual(p.gfLimit[i]));
  amounts(c, x).forEach((a, l) => {
    expect(a, `${what} line ${l}`).toBeLessThanOrEqual(p.lineNeed[l]);
    expect(a, `${what} line ${l} floor`).toBeGreaterThanOrEqual(floors[l]);
  });
  expect(sum, `${what} total`).toBe(total);
}

/**
 * The travel stage over the model's arcs written out for glpk: whole cuttings per arc, a visit
 * per (grower, farm) with a plain big-M per arc, floors, capacities and the total kept.
 */
function glpkTravel(c: Ctx, floors: Float64Array, total: number): number {
  const { p } = c;
  const G = glpk;
  const xs = Array.from({ length: c.n }, (_, k) => `x${k}`);
  const rows: LP['subjectTo'] = [];
  const sumRow = (name: string, ks: number[], bnds: { type: number; lb: number; ub: number }) => rows.push({ name, vars: ks.map((k) => ({ name: xs[k], coef: 1 })), bnds });
  const by = (key: (k: number) => number) => {
    const m = new Map<number, number[]>();
    for (let k = 0; k < c.n; k++) (m.get(key(k)) ?? m.set(key(k), []).get(key(k))!).push(k);
    return m;
  };
  for (const [lot, ks] of by((k) => p.arcLot[k])) sumRow(`lot${lot}`, ks, { type: G.GLP_UP, lb: 0, ub: p.lots[lot].cap });
  for (const [l, ks] of by((k) => p.arcLine[k])) sumRow(`line${l}`, ks, floors[l] > 0 ? { type: G.GLP_DB, lb: floors[l], ub: p.lineNeed[l] } : { type: G.GLP_UP, lb: 0, ub: p.lineNeed[l] });
  for (const [gf, ks] of by((k) => p.arcGf[k])) if (Number.isFinite(p.gfLimit[gf])) sumRow(`limit${gf}`, ks, { type: G.GLP_UP, lb: 0, ub: p.gfLimit[gf] });
  sumRow('total', xs.map((_, k) => k), { type: G.GLP_LO, lb: total, ub: 0 });
  const ys = new Set<number>();
  for (let k = 0; k < c.n; k++) {
    const gf = p.arcGf[k];
    if (p.gfLocked[gf] > 0) continue;
    ys.add(gf);
    rows.push({ name: `link${k}`, vars: [{ name: xs[k], coef: 1 }, { name: `y${gf}`, coef: -p.arcUb[k] }], bnds: { type: G.GLP_UP, lb: 0, ub: 0 } });
  }
  let locked = 0;
  for (let gf = 0; gf < p.gfGrower.length; gf++) if (p.gfLocked[gf] > 0) locked += c.visitCost[gf];
  const r = glpk.solve(
    {
      name: 'travel',
      objective: {
        direction: G.GLP_MIN,
        name: 'cost',
        vars: [...xs.map((name, k) => ({ name, coef: c.travelCost[k] })), ...[...ys].map((gf) => ({ name: `y${gf}`, coef: c.visitCost[gf] }))],
      },
      subjectTo: rows,
      bounds: xs.map((name, k) => ({ name, type: G.GLP_DB, lb: 0, ub: p.arcUb[k] })),
      generals: xs,
      binaries: [...ys].map((gf) => `y${gf}`),
    },
    { msglev: G.GLP_MSG_OFF, presol: true },
  );
  expect(r.result.status).toBe(G.GLP_OPT);
  return r.result.z + locked;
}

describe('travel local search: cases worked by hand', () => {
  it('closes the second farm when the first can serve both lines of a grower', () => {
    // Farm A (3 km) has both varieties; the start takes one line from B (4 km) instead.
    const input: AllocInput = {
      offers: [offer('a1', 'A', place(0, 3), 'currant', 'ben-sarek', 20), offer('a2', 'A', place(0, 3), 'currant', 'ben-lomond', 20), offer('b1', 'B', place(180, 4), 'currant', 'ben-lomond', 20)],
      lines: [line('l1', 'g1', home, 'currant', 'ben-sarek', 10), line('l2', 'g1', home, 'currant', 'ben-lomond', 10)],
    };
    const p = prepare(input);
    const c = context(p, undefined);
    const start = new Float64Array(c.n);
    for (let k = 0; k < c.n; k++) {
      const farm = p.farmIds[p.lots[p.arcLot[k]].farm];
      // l1 from A, l2 from B.
      if ((p.lines[p.arcLine[k]].id === 'l1' && farm === 'A') || (p.lines[p.arcLine[k]].id === 'l2' && farm === 'B')) start[k] = 10;
    }
    const floors = new Float64Array(2).fill(10);
    const x = improveTravel(c, start, floors);
    expectFeasible(c, x, floors, 20, 'hand');
    const farmsUsed = new Set<string>();
    for (let k = 0; k < c.n; k++) if (x[k] > 0) farmsUsed.add(p.farmIds[p.lots[p.arcLot[k]].farm]);
    expect([...farmsUsed]).toEqual(['A']);
    // One round trip of 6 km instead of 6 + 8; the per-cutting tie-break adds less than half
    // the cheapest visit in all (how the model sets tau).
    expect(travelCost(c, x)).toBeLessThan(6 + 3);
    expect(travelCost(c, start)).toBeGreaterThan(6 + 8);
  });

  it('swaps a far farm for a nearer one the grower does not visit yet, moving another grower’s wood to make room', () => {
    // g1 takes from far farm F (20 km); near farm N (2 km) is full with g2's cuttings, and g2
    // already visits M, which has wood to spare: the path N -> g2 -> M frees N for g1.
    const input: AllocInput = {
      offers: [offer('n1', 'N', place(0, 2), 'plum', 'victoria', 10), offer('m1', 'M', place(90, 3), 'plum', 'victoria', 30), offer('f1', 'F', place(180, 20), 'plum', 'victoria', 30)],
      lines: [line('l1', 'g1', home, 'plum', 'victoria', 10), line('l2', 'g2', place(45, 2), 'plum', 'victoria', 15)],
    };
    const p = prepare(input);
    const c = context(p, undefined);
    const start = new Float64Array(c.n);
    const arc = (lineId: string, farm: string) => {
      for (let k = 0; k < c.n; k++) if (p.lines[p.arcLine[k]].id === lineId && p.farmIds[p.lots[p.arcLot[k]].farm] === farm) return k;
      throw new Error(`no arc ${lineId} ${farm}`);
    };
    start[arc('l1', 'F')] = 10;
    start[arc('l2', 'N')] = 10;
    start[arc('l2', 'M')] = 5;
    const floors = Float64Array.from([10, 15]);
    const x = improveTravel(c, start, floors);
    expectFeasible(c, x, floors, 25, 'swap');
    expect(x[arc('l1', 'F')]).toBe(0);
    expect(x[arc('l1', 'N')]).toBe(10);
    expect(x[arc('l2', 'M')]).toBe(15);
    expect(travelCost(c, x)).toBeLessThan(travelCost(c, start) - 30);
  });
});

describe('travel local search and bounds against glpk.js on random instances', () => {
  it('keeps every capacity, floor and the total, never costs more, repeats itself, and stays between the bounds and glpk’s optimum', { timeout: 600_000 }, async () => {
    const h = await highs();
    let compared = 0;
    let improved = 0;
    for (let seed = 1; seed <= 40; seed++) {
      const input = randomInstance(seed);
      const p = prepare(input);
      const c = context(p, input.farmVisitKm);
      if (c.n === 0) continue;
      const start = fill(c);
      const total = start.reduce((s, v) => s + v, 0);
      // Floors: half of what each line got at the start, so that some lines may lose wood.
      const floors = Float64Array.from(amounts(c, start), (a) => Math.floor(a / 2));
      const x = improveTravel(c, start, floors);
      expectFeasible(c, x, floors, total, `seed ${seed}`);
      expect(travelCost(c, x), `seed ${seed}`).toBeLessThanOrEqual(travelCost(c, start) + 1e-9);
      if (travelCost(c, x) < travelCost(c, start) - 1e-9) improved++;
      expect(Array.from(improveTravel(c, start, floors)), `seed ${seed} repeat`).toEqual(Array.from(x));

      const best = glpkTravel(c, floors, total);
      const tol = 1e-6 * Math.max(1, best);
      expect(travelCost(c, x), `seed ${seed}`).toBeGreaterThanOrEqual(best - tol);
      expect(coverBound(c, floors), `seed ${seed} cover bound`).toBeLessThanOrEqual(best + tol);

      // The bound from any subset's duals never passes the LP over every arc, and that LP
      // never passes glpk's integer optimum. Subsets: the start's arcs plus every other arc.
      const spec: StageSpec = { kind: 'travel', integer: false, floors, volume: total + p.locks.reduce((s, k) => s + k.cuttings, 0) };
      const every = Array.from({ length: c.n }, (_, k) => k);
      const full = runStage(h, buildMaster(c, every, spec).model, { timeLimit: 60 });
      expect(full.status).toBe('optimal');
      expect(full.objective, `seed ${seed} LP`).toBeLessThanOrEqual(best + tol);
      for (const keepEvery of [2, 3]) {
        const arcs = every.filter((k) => start[k] > 0 || k % keepEvery === 0);
        const inSubset = new Uint8Array(c.n);
        for (const k of arcs) inSubset[k] = 1;
        const m = buildMaster(c, arcs, spec);
        const run = runStage(h, m.model, { timeLimit: 60 });
        expect(run.status).toBe('optimal');
        const lb = travelLowerBound(c, m, run.objective, run.rowDual, run.colDual, inSubset);
        expect(lb, `seed ${seed} subset 1/${keepEvery}: ${lb} vs LP ${full.objective}`).toBeLessThanOrEqual(full.objective + 1e-6 * Math.max(1, full.objective));
      }
      // Over every arc the bound is the LP itself.
      const mAll = buildMaster(c, every, spec);
      const all = runStage(h, mAll.model, { timeLimit: 60 });
      expect(travelLowerBound(c, mAll, all.objective, all.rowDual, all.colDual, new Uint8Array(c.n).fill(1))).toBeCloseTo(full.objective, 6);
      compared++;
    }
    expect(compared).toBeGreaterThan(30);
    // The search does something on these instances, not only keep the start.
    expect(improved).toBeGreaterThan(10);
  });
});

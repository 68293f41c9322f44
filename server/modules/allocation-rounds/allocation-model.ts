// The allocation model: which offered wood goes to which request line, as an integer program
// solved by HiGHS. Pure: no database. Eligibility is the caller's job: it passes only offers
// that may give wood (clean plants, not withdrawn, something left); an offer that is not in
// the input is never assigned.
//
// Variables: cuttings x(o, l) >= 0, whole, only on compatible arcs: the line's variety; any
// variety of the species when the line asks for no variety or allows substitutes; and the
// offer's farm within the line's distance (geodesic, WGS84). Capacities: an offer's available
// cuttings; a farm's per-grower limit; a line's request. Locked bundles are fixed: they use
// capacity and count for their line, and no more is added on a locked (offer, line) pair.
//
// Goals, each stage keeping the optimum of the stages before it:
//  1. Fairness. Let L* be the lines with at least one arc that can carry wood (a line nobody can
//     serve is left out, or it would hold everyone at zero), and pmax the highest priority in
//     L*. Maximise t in [0, 1] subject to
//        allocated(l) >= t * (priority(l) / pmax) * cuttings(l)   for every l in L*,
//     where allocated(l) counts locked bundles. So the top-priority lines get the share t of
//     their request and a line of half that priority at least t/2 of its own.
//  2. Volume. With t* the stage-1 optimum, maximise the total cuttings subject to
//        allocated(l) >= ceil(t* * priority(l) / pmax * cuttings(l) - 1e-9)   for l in L*.
//     As allocations are whole numbers this is exactly "allocated(l) >= t* ...": no tolerance
//     that could let a line slip below the fair share, and the stage-1 solution stays feasible.
//  3. Travel. With t* and the total V* kept, minimise
//        sum over (grower g, farm f) visited of  c(g, f)
//      + tau * sum over cuttings of (km from the line's destination to the farm
//                                    + SUBSTITUTE_KM if it is another variety than asked)
//     where c(g, f) = farmVisitKm if given, else the round trip in km from the grower's place to
//     the farm, and a visit is y(g, f) in {0, 1} with x(o, l) summed over the farm's offers for
//     a line <= min(request, wood, limit) * y(g, f). tau is set so that the whole tie-break is
//     worth less than half the cheapest visit: it only orders solutions with the same visits.
//     travelKm reports the round trips of the farms visited, whatever farmVisitKm says.
//
// How it is solved (measured on this machine's WebAssembly HiGHS, see the benchmark):
//  - Interchangeable offers (same farm, species, variety, reach) are pooled into lots, one
//    column per (lot, line): exact, see allocation-arcs.ts.
//  - Each stage's LP is solved by column generation over a growing subset of the arcs
//    (allocation-stages.ts); small problems (ALL_ARCS_UP_TO) use every arc from the start.
//  - Fairness: the LP bound t_LP, then the largest share value a line can reach (k / weight)
//    at or below it whose whole-cutting floors can be met, checked by the volume LP with a
//    slack on each floor. Without per-grower farm limits the model is a transportation
//    problem (totally unimodular), so the simplex vertex is whole and the LP answers the
//    integer question; with limits a fractional vertex goes to the MIP. The volume optimum
//    then comes out of the same solve. Both are proven optimal when the LPs converged
//    (stats.optimal).
//  - Travel: a local search without the solver (allocation-travel.ts: close visits while the
//    others can carry their wood) gives a first answer; the LP bound (with "visit at least
//    one farm" rows for lines that must get wood) by column generation, each round giving a
//    valid bound over all arcs even when cut short (travelLowerBound); a rounding that keeps
//    the LP's visits and re-solves the flow, and the local search again from there (the
//    LP's visits guide it to much better answers than the volume solution does); then, only
//    when the subset is every arc, the MIP from the best so far, stopped within `travelGap`
//    of the bound. stats.gap is measured against a bound valid for the whole problem, never
//    the subset's. On large problems the LP relaxation itself is the limit: its bound lies
//    far below the best known answers (see DEVELOPERS.md, "Allocation").
//
// Reproducible: offers and lines are sorted by id before anything is built, HiGHS runs with a
// fixed seed on one thread, and lots are split over offers in id order. A time limit that cuts
// a stage short can make the result depend on the machine's speed; the stats say so.
//
// HEELWOOD_HIGHS_LOG=1 prints HiGHS's log and HEELWOOD_ALLOC_TRACE=1 each LP round, to stderr.
import { distanceM } from '../../../shared/geo.js';
import { type Prepared, prepare, splitLots } from './allocation-arcs.js';
import { highs, runStage, type StageRun } from './allocation-highs.js';
import { coverBound, improveTravel } from './allocation-travel.js';
import { buildMaster, carryBasis, type Ctx, context, type Master, price, pricingSlack, type StageSpec, travelLowerBound, wholeCuttings } from './allocation-stages.js';

export type AllocOffer = { id: string; plantId: string; farmId: string; speciesId: string; varietyId: string | null; available: number; lat: number; lon: number };
export type AllocLine = {
  id: string;
  growerId: string;
  speciesId: string;
  /** null = any variety of the species. */
  varietyId: string | null;
  cuttings: number;
  substitutesAllowed: boolean;
  /** > 0; 1 is normal. */
  priority: number;
  maxDistanceKm: number;
  /** The grower's destination. */
  lat: number;
  lon: number;
};
export type AllocInput = {
  offers: AllocOffer[];
  lines: AllocLine[];
  /** farmId -> the most cuttings one grower may take from that farm. */
  farmLimits?: Record<string, number>;
  locked?: { offerId: string; lineId: string; cuttings: number }[];
  /** Fixed cost of each farm a grower visits, in km; default: the round trip to the farm. */
  farmVisitKm?: number;
};
export type LineOutcome = 'filled' | 'partly' | 'no_compatible_offer' | 'beyond_distance' | 'variety_not_offered' | 'shared_out';
export type AllocResult = {
  assignments: { offerId: string; lineId: string; cuttings: number; distanceM: number }[];
  lines: { lineId: string; allocated: number; fill: number; reason: LineOutcome }[];
  stats: {
    /** Compatible (offer, line) pairs within distance, counted over the lots that can carry wood. */
    arcs: number;
    /** Columns HiGHS saw for them, after pooling interchangeable offers (see allocation-arcs.ts). */
    modelArcs: number;
    /** Lowest fill (allocated / asked) among the lines with at least one arc; 1 if there are none. */
    minFill: number;
    totalCuttings: number;
    travelKm: number;
    stages: { name: string; objective: number; status: string; seconds: number }[];
    /** Fairness and volume stages proven optimal. */
    optimal: boolean;
    /** Relative gap HiGHS proved on the travel stage. */
    gap: number;
    seconds: number;
  };
};

export { SUBSTITUTE_KM } from './allocation-stages.js';

/** Problems with at most this many arcs are solved over all arcs from the start (exact MIPs). */
export const ALL_ARCS_UP_TO = 3000;

function lineTotals(c: Ctx, arcs: ArrayLike<number>): Float64Array {
  const alloc = Float64Array.from(c.p.lineLocked);
  for (let k = 0; k < c.n; k++) alloc[c.p.arcLine[k]] += arcs[k];
  return alloc;
}

/** The fair share a solution reaches: min over L* of allocated / weight, at most 1. */
function shareOf(c: Ctx, alloc: Float64Array): number {
  let t = 1;
  for (const l of c.fairLines) t = Math.min(t, alloc[l] / c.fairWeight[l]);
  return t;
}

/** Largest share value a line of L* can reach (k / weight, k whole) not above t. */
function candidateAtMost(c: Ctx, t: number): number {
  if (t >= 1 - 1e-12) return 1;
  let best = 0;
  for (const l of c.fairLines) best = Math.max(best, Math.floor(t * c.fairWeight[l] + 1e-9) / c.fairWeight[l]);
  return best;
}

/** Largest share value a line of L* can reach strictly below t. */
function candidateBelow(c: Ctx, t: number): number {
  let best = 0;
  for (const l of c.fairLines) best = Math.max(best, (Math.ceil(t * c.fairWeight[l] - 1e-9) - 1) / c.fairWeight[l]);
  return Math.max(0, best);
}

/** Whole cuttings each line of L* must get on top of its locks for a fair share t. */
export function fairFloors(c: Ctx, t: number): Float64Array {
  const floors = new Float64Array(c.p.lines.length);
  for (const l of c.fairLines) {
    const want = t * c.fairWeight[l];
    const floor = Math.min(wholeCuttings(c.p, l), Math.ceil(want - 1e-9 * Math.max(1, want)));
    floors[l] = Math.max(0, floor - c.p.lineLocked[l]);
  }
  return floors;
}

function isWhole(x: ArrayLike<number>, upto: number) {
  for (let j = 0; j < upto; j++) if (Math.abs(x[j] - Math.round(x[j])) > 1e-6) return false;
  return true;
}

/** Full-length arc vector (whole cuttings) from a master's solution. */
function arcValues(c: Ctx, m: Master, x: ArrayLike<number>): Float64Array {
  const out = new Float64Array(c.n);
  m.arcs.forEach((k, j) => (out[k] = Math.max(0, Math.round(x[j]))));
  return out;
}

function checkFeasible(c: Ctx, arcs: Float64Array, floors: Float64Array | null): boolean {
  const { p, n } = c;
  const lot = new Float64Array(p.lots.length);
  const gf = new Float64Array(p.gfGrower.length);
  const line = new Float64Array(p.lines.length);
  for (let k = 0; k < n; k++) {
    if (arcs[k] > p.arcUb[k]) return false;
    lot[p.arcLot[k]] += arcs[k];
    gf[p.arcGf[k]] += arcs[k];
    line[p.arcLine[k]] += arcs[k];
  }
  for (let i = 0; i < lot.length; i++) if (lot[i] > p.lots[i].cap) return false;
  for (let i = 0; i < gf.length; i++) if (gf[i] > p.gfLimit[i]) return false;
  for (let i = 0; i < line.length; i++) if (line[i] > p.lineNeed[i] || (floors && line[i] < floors[i])) return false;
  return true;
}

function travelObjective(c: Ctx, arcs: Float64Array): number {
  const { p } = c;
  let v = 0;
  const visited = new Uint8Array(p.gfGrower.length);
  for (let gf = 0; gf < visited.length; gf++) if (p.gfLocked[gf] > 0) visited[gf] = 1;
  for (let k = 0; k < c.n; k++) {
    if (arcs[k] <= 0) continue;
    v += c.travelCost[k] * arcs[k];
    visited[p.arcGf[k]] = 1;
  }
  for (let gf = 0; gf < visited.length; gf++) if (visited[gf]) v += c.visitCost[gf];
  return v;
}

function outcome(p: Prepared, l: number, allocated: number): LineOutcome {
  const asked = wholeCuttings(p, l);
  if (allocated >= asked) return 'filled';
  if (allocated > 0) return 'partly';
  const reach = p.lineReach[l];
  return reach === 'in_reach' ? 'shared_out' : reach;
}

/** Assignments (locked bundles merged in), per-line outcomes and the common stats. */
function finish(
  c: Ctx,
  input: AllocInput,
  amounts: Map<number, number>,
  stats: Pick<AllocResult['stats'], 'stages' | 'optimal' | 'gap'>,
  started: number,
): AllocResult {
  const { p } = c;
  const L = p.lines.length;
  for (const k of p.locks) {
    const key = k.offer * L + k.line;
    amounts.set(key, (amounts.get(key) ?? 0) + k.cuttings);
  }
  const allocated = new Float64Array(L);
  const visited = new Set<string>();
  let travelKm = 0;
  const assignments: AllocResult['assignments'] = [];
  for (const [key, cuttings] of [...amounts.entries()].sort((a, b) => a[0] - b[0])) {
    if (cuttings <= 0) continue;
    const o = Math.floor(key / L);
    const l = key % L;
    allocated[l] += cuttings;
    const g = p.lineGrower[l];
    const f = p.offerFarm[o];
    const visit = `${g}:${f}`;
    if (!visited.has(visit)) {
      visited.add(visit);
      travelKm += (2 * distanceM(p.growerAt[g], p.farmAt[f])) / 1000;
    }
    assignments.push({ offerId: p.offers[o].id, lineId: p.lines[l].id, cuttings, distanceM: distanceM(p.lines[l], p.offers[o]) });
  }
  let minFill = 1;
  for (const l of c.fairLines) minFill = Math.min(minFill, allocated[l] / wholeCuttings(p, l));
  const byId = new Map(p.lines.map((line, i) => [line.id, i]));
  const lines = input.lines.map((line) => {
    const l = byId.get(line.id)!;
    const asked = wholeCuttings(p, l);
    return { lineId: line.id, allocated: allocated[l], fill: asked > 0 ? allocated[l] / asked : 1, reason: outcome(p, l, allocated[l]) };
  });
  let arcs = 0;
  for (let k = 0; k < c.n; k++) arcs += p.lots[p.arcLot[k]].offers.length;
  return {
    assignments,
    lines,
    stats: {
      arcs,
      modelArcs: c.n,
      minFill,
      totalCuttings: allocated.reduce((s, v) => s + v, 0),
      travelKm,
      ...stats,
      seconds: (performance.now() - started) / 1000,
    },
  };
}

/** The first arcs a line works with: its nearest, until they could carry three times its request. */
function startingArcs(c: Ctx, allArcsUpTo: number): number[] {
  const { p } = c;
  if (c.n <= allArcsUpTo) return Array.from({ length: c.n }, (_, k) => k);
  const out: number[] = [];
  for (let l = 0; l < p.lines.length; l++) {
    const ks: number[] = [];
    for (let k = c.lineStart[l]; k < c.lineStart[l + 1]; k++) ks.push(k);
    ks.sort((a, b) => p.arcDistM[a] - p.arcDistM[b] || a - b);
    let carried = 0;
    for (const k of ks) {
      if (carried >= 3 * p.lineNeed[l] && out.length > 0) break;
      out.push(k);
      carried += p.arcUb[k];
    }
  }
  return out.sort((a, b) => a - b);
}

/**
 * Solves the three stages in turn with HiGHS. `timeLimitSeconds` (default 60) bounds the whole
 * solve; `travelGap` (default 0.005) is the relative gap at which the travel stage may stop.
 * Fairness and volume are solved to proven optimality unless the time limit cuts them short
 * (then `stats.optimal` is false and the best solution found is kept).
 */
export async function solveAllocation(
  input: AllocInput,
  opts: {
    timeLimitSeconds?: number;
    travelGap?: number;
    /** Solve over all arcs from the start up to this many (default ALL_ARCS_UP_TO); 0 always grows a subset. */
    allArcsUpTo?: number;
  } = {},
): Promise<AllocResult> {
  const started = performance.now();
  const limit = opts.timeLimitSeconds ?? 60;
  const travelGap = opts.travelGap ?? 0.005;
  const left = () => limit - (performance.now() - started) / 1000;
  const h = await highs();
  const p = prepare(input);
  const c = context(p, input.farmVisitKm);
  const { n } = c;
  const stages: AllocResult['stats']['stages'] = [];
  if (n === 0) {
    stages.push({ name: 'fairness', objective: 1, status: 'empty', seconds: 0 });
    return finish(c, input, new Map(), { stages, optimal: true, gap: 0 }, started);
  }

  // The working subset of arcs, only ever grown.
  const subset = startingArcs(c, opts.allArcsUpTo ?? ALL_ARCS_UP_TO);
  const inSubset = new Uint8Array(n);
  for (const k of subset) inSubset[k] = 1;
  const everyArc = () => subset.length === n;
  const grow = (ks: number[]) => {
    for (const k of ks) {
      inSubset[k] = 1;
      subset.push(k);
    }
    subset.sort((a, b) => a - b);
  };
  /**
   * LP over the subset, grown until no arc prices out, each round warm-started from the last
   * basis. Stops growing at `deadline` (seconds left); `good` is the last optimal round.
   */
  const solveLp = (spec: StageSpec, deadline = 0) => {
    let seconds = 0;
    let rounds = 0;
    let prev: { m: Master; basis: { colStatus: Int32Array; rowStatus: Int32Array } } | null = null;
    let good: { m: Master; run: StageRun } | null = null;
    // Travel: the best lower bound over all arcs any round's duals give (see travelLowerBound).
    let lower = Number.NEGATIVE_INFINITY;
    for (;;) {
      const m = buildMaster(c, [...subset], spec);
      const run = runStage(h, m.model, { timeLimit: left() }, undefined, prev ? carryBasis(prev.m, prev.basis, m) : undefined);
      seconds += run.seconds;
      rounds++;
      if (run.status === 'optimal' && spec.kind === 'travel') lower = Math.max(lower, everyArc() ? run.objective : travelLowerBound(c, m, run.objective, run.rowDual, run.colDual, inSubset));
      if (process.env.HEELWOOD_ALLOC_TRACE === '1') console.error(`  ${spec.kind} LP round ${rounds}: ${m.arcs.length} arcs, ${m.model.rowLower.length} rows, ${run.status}, ${run.seconds.toFixed(2)} s, objective ${run.objective}${spec.kind === 'travel' ? `, bound ${lower}` : ''}`);
      if (run.status !== 'optimal') return { m, run, seconds, converged: false, rounds, good, lower };
      good = { m, run };
      if (run.basis) prev = { m, basis: run.basis };
      const more = everyArc() ? [] : price(c, m, spec, run.rowDual, run.colDual, inSubset);
      if (more.length === 0) return { m, run, seconds, converged: true, rounds, good, lower };
      if (left() <= deadline) return { m, run, seconds, converged: false, rounds, good, lower };
      grow(more);
    }
  };

  // 1. Fairness: the LP bound t_LP over all arcs, then the largest share value a line can
  // reach at or below it whose whole-cutting floors can be met. Each check is the volume LP
  // with slacks on the floors (no slack left = the floors can be met); on these transport-like
  // models its optimal vertex is normally whole, and when it is not a MIP settles it.
  const fairLp = solveLp({ kind: 'fairness', integer: false });
  const tLp = fairLp.run.status === 'optimal' ? Math.min(1, -fairLp.run.objective) : 0;
  let fairProven = fairLp.converged;
  let volProven = false;
  // A hair above the LP bound, in case pricing tolerances left it a little low; a candidate
  // that is not feasible is simply stepped down from.
  let t = candidateAtMost(c, tLp + 1e-6);
  let floors = fairFloors(c, t);
  let arcs: Float64Array | null = null;
  let volSeconds = 0;
  let volStatus = 'not_run';
  const slackOf = (m: Master, x: Float64Array) => {
    let s = 0;
    for (const col of m.colSlack) if (col >= 0) s += x[col];
    return s;
  };
  for (let step = 0; step < 50 && left() > 0; step++) {
    floors = fairFloors(c, t);
    const spec: StageSpec = { kind: 'volume', integer: false, floors };
    const lp = solveLp(spec);
    volSeconds += lp.seconds;
    volStatus = lp.run.status;
    if (lp.run.status !== 'optimal') break;
    if (slackOf(lp.m, lp.run.x) > 1e-6) {
      // The floors cannot be met even fractionally over the arcs priced so far: lower t.
      if (!lp.converged) fairProven = false;
      t = candidateBelow(c, t);
      continue;
    }
    if (isWhole(lp.run.x, lp.m.arcs.length)) {
      arcs = arcValues(c, lp.m, lp.run.x);
      volProven = lp.converged;
      break;
    }
    // A fractional vertex (per-grower farm limits make the model less than a network): MIP.
    const mm = buildMaster(c, [...subset], { ...spec, integer: true });
    const mip = runStage(h, mm.model, { timeLimit: left(), relGap: 0, absGap: 0.999 });
    volSeconds += mip.seconds;
    volStatus = mip.status;
    if (mip.feasible && slackOf(mm, mip.x) < 0.5) {
      arcs = arcValues(c, mm, mip.x);
      // Proven when the MIP is optimal and meets the LP bound over all arcs (rounded down).
      const vol = arcs.reduce((s, v) => s + v, 0);
      volProven = lp.converged && mip.status === 'optimal' && vol >= Math.floor(-lp.run.objective - c.lockedTotal + 1e-6) - 1e-9;
      if (!everyArc() && !volProven) volProven = false;
      break;
    }
    if (!everyArc() || mip.status !== 'optimal') fairProven = false;
    t = candidateBelow(c, t);
  }
  if (!arcs || !checkFeasible(c, arcs, floors)) {
    // Out of time or steps: keep a floor-free solution (t = 0 is always possible).
    arcs = arcs && checkFeasible(c, arcs, null) ? arcs : new Float64Array(n);
    floors = new Float64Array(p.lines.length);
    fairProven = false;
    volProven = false;
  }
  const alloc = lineTotals(c, arcs);
  // 'optimal' only when proven over every arc; 'feasible' when time or steps ran out first.
  const proven = (ok: boolean, status: string) => (ok ? 'optimal' : status === 'optimal' ? 'feasible' : status);
  stages.push({ name: 'fairness', objective: shareOf(c, alloc), status: proven(fairProven, fairLp.run.status), seconds: round3(fairLp.seconds) });
  const volume = alloc.reduce((s, v) => s + v, 0);
  stages.push({ name: 'volume', objective: volume, status: proven(volProven, volStatus), seconds: round3(volSeconds) });

  // 3. Travel: see the notes at the top. Over a subset a MIP's own bound says nothing about
  // the whole problem, and HiGHS's search there took minutes for a fraction of a per cent
  // (measured on the benchmark), so large problems end with the search and the LP bound.
  const travelSpec: StageSpec = { kind: 'travel', integer: false, floors, volume };
  const trace = process.env.HEELWOOD_ALLOC_TRACE === '1' ? (msg: string) => console.error(`  ${msg}`) : () => {};
  let best = travelObjective(c, arcs);
  const travStarted = performance.now();
  /** Keeps `next` when it is whole, within every capacity, keeps floors and total, and is cheaper. */
  const offer = (next: Float64Array, what: string) => {
    const obj = travelObjective(c, next);
    const ok = checkFeasible(c, next, floors) && next.reduce((s, v) => s + v, 0) + c.lockedTotal === volume;
    trace(`travel ${what}: ${obj.toFixed(3)}${ok ? '' : ' (refused: not feasible)'}, best ${best.toFixed(3)}`);
    if (ok && obj < best - 1e-9) {
      arcs = next;
      best = obj;
    }
  };
  // The search runs to its end unless the time limit comes first, so that its result does not
  // depend on the machine's speed; when the limit cuts it short the stage says 'time_limit'.
  let cut = false;
  const search = (from: Float64Array, what: string, more: { priority?: Float64Array; consolidate?: boolean }) => {
    const t0 = performance.now();
    const next = improveTravel(c, from, floors, { stop: () => left() <= 0, ...more, trace: (m) => trace(`  ${m}`) });
    if (left() <= 0) cut = true;
    trace(`travel search took ${((performance.now() - t0) / 1000).toFixed(2)} s`);
    offer(next, what);
  };
  // A quick first answer, in case the LP does not finish in time.
  search(arcs, 'search from the volume solution', { consolidate: false });
  // The subset holds the best solution's arcs: the LP starts near it, the MIP can start from it.
  const missing: number[] = [];
  for (let k = 0; k < n; k++) if (arcs[k] > 0 && !inSubset[k]) missing.push(k);
  if (missing.length) grow(missing);
  // The LP may use at most about half the time left, so that the rest and the MIP get theirs.
  const travLp = solveLp(travelSpec, left() / 2);
  const bound = Math.max(travLp.lower, travLp.converged ? travLp.run.objective - (everyArc() ? 0 : pricingSlack(c, inSubset, 'travel')) : Number.NEGATIVE_INFINITY);
  trace(`travel LP bound ${bound}`);
  const within = (lower: number) => Number.isFinite(lower) && best <= lower + travelGap * Math.abs(best) + 1e-9;
  // From the LP: keep every visit it makes, route the cheapest whole flow through them (an LP
  // again; on these models its vertex is normally whole), then close visits as above, those
  // the LP makes least first.
  if (travLp.good && left() > 0 && !within(bound)) {
    const lp = travLp.good;
    const open = new Uint8Array(p.gfGrower.length);
    const yLp = new Float64Array(p.gfGrower.length).fill(1);
    lp.m.colVisit.forEach((col, gf) => {
      if (col >= 0) yLp[gf] = lp.run.x[col];
      if (col >= 0 && lp.run.x[col] > 1e-9) open[gf] = 1;
    });
    const kept = subset.filter((k) => open[p.arcGf[k]] || p.gfLocked[p.arcGf[k]] > 0);
    const mr = buildMaster(c, kept, travelSpec);
    for (const col of mr.colVisit) if (col >= 0) mr.model.colLower[col] = 1;
    const run = runStage(h, mr.model, { timeLimit: left() });
    if (run.status === 'optimal' && isWhole(run.x, mr.arcs.length)) {
      const rounded = arcValues(c, mr, run.x);
      offer(rounded, 'LP rounding');
      if (left() > 0 && checkFeasible(c, rounded, floors)) search(rounded, 'search from the LP rounding', { priority: yLp });
    }
  }
  let travStatus = within(bound) ? 'optimal_within_gap' : travLp.converged && !cut ? 'feasible' : 'time_limit';
  let mipBound = Number.NEGATIVE_INFINITY;
  if (left() > 0 && !within(bound) && everyArc()) {
    const mipMaster = buildMaster(c, [...subset], { ...travelSpec, integer: true });
    const start = new Float64Array(mipMaster.model.colCost.length);
    const incumbent = arcs;
    mipMaster.arcs.forEach((k, j) => (start[j] = incumbent[k]));
    for (let j = 0; j < mipMaster.arcs.length; j++) {
      const gf = p.arcGf[mipMaster.arcs[j]];
      if (start[j] > 0 && mipMaster.colVisit[gf] >= 0) start[mipMaster.colVisit[gf]] = 1;
    }
    const target = Number.isFinite(bound) ? bound + travelGap * Math.abs(bound) : undefined;
    const mip = runStage(h, mipMaster.model, { timeLimit: left(), relGap: travelGap, absGap: 1e-6, target }, start);
    travStatus = mip.status;
    if (mip.feasible) offer(arcValues(c, mipMaster, mip.x), 'MIP');
    // Over every arc HiGHS's own bound holds for the whole problem.
    if (Number.isFinite(mip.dualBound)) mipBound = mip.dualBound;
  }
  // The set-cover bound needs no solver and holds even when the LP gave nothing.
  const cover = coverBound(c, floors);
  const lower = Math.max(bound, mipBound, cover);
  trace(`travel lower bounds: LP ${bound}, MIP ${mipBound}, cover ${cover}`);
  const gap = Number.isFinite(lower) && best > 0 ? Math.max(0, (best - lower) / Math.abs(best)) : best === 0 ? 0 : 1;
  stages.push({ name: 'travel', objective: best, status: travStatus, seconds: round3((performance.now() - travStarted) / 1000) });

  return finish(c, input, splitLots(p, arcs), { stages, optimal: fairProven && volProven, gap }, started);
}

const round3 = (x: number) => Math.round(x * 1000) / 1000;

/**
 * First come, first served, for comparison: lines in the order given, each taking from its
 * nearest compatible offers first (ties by offer id) as much as the offer, the farm's
 * per-grower limit and the request allow. Locked bundles are honoured first.
 */
export function greedyAllocation(input: AllocInput): AllocResult {
  const started = performance.now();
  const p = prepare(input);
  const c = context(p, input.farmVisitKm);
  const L = p.lines.length;
  const offerLeft = new Float64Array(p.offers.length);
  const lockedOn = new Float64Array(p.offers.length);
  for (const k of p.locks) lockedOn[k.offer] += k.cuttings;
  p.offers.forEach((o, i) => (offerLeft[i] = Math.max(0, Math.floor(o.available) - lockedOn[i])));
  const gfLeft = Float64Array.from(p.gfLimit);
  const amounts = new Map<number, number>();
  const lineIndex = new Map(p.lines.map((l, i) => [l.id, i]));
  for (const line of input.lines) {
    const l = lineIndex.get(line.id)!;
    let need = p.lineNeed[l];
    const ks = Array.from({ length: c.lineStart[l + 1] - c.lineStart[l] }, (_, i) => c.lineStart[l] + i);
    const options: { k: number; o: number }[] = [];
    for (const k of ks) for (const o of p.lots[p.arcLot[k]].offers) options.push({ k, o });
    options.sort((x, y) => p.arcDistM[x.k] - p.arcDistM[y.k] || x.o - y.o);
    for (const { k, o } of options) {
      if (need <= 0) break;
      const take = Math.min(need, offerLeft[o], gfLeft[p.arcGf[k]]);
      if (take <= 0) continue;
      need -= take;
      offerLeft[o] -= take;
      gfLeft[p.arcGf[k]] -= take;
      amounts.set(o * L + l, (amounts.get(o * L + l) ?? 0) + take);
    }
  }
  return finish(c, input, amounts, { stages: [], optimal: false, gap: Number.NaN }, started);
}

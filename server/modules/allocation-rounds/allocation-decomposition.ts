// A stronger, slower lower bound on the travel stage, for studies of the solver (the
// `bench:allocate-bound` script); allocation rounds do not use it.
//
// The travel stage couples growers only through the wood they share (each lot's capacity) and
// the total to keep (the volume row). Everything else belongs to one grower: its lines' floors
// and requests, its per-farm limits, and its visits. So the stage can be written as a choice of
// one plan per grower (Dantzig-Wolfe): a plan is whole cuttings on the grower's arcs that meet
// its lines' floors, with the farms it visits; the master LP mixes plans under the lot and
// volume rows. Plans are generated as needed: with the master's duals, each grower's cheapest
// plan is a small MIP (HiGHS). After every round
//     master optimum + sum over growers of min(0, cheapest plan's reduced cost)
// is a lower bound on the whole stage (the Lagrangian bound), whether or not the rounds have
// converged. It is never weaker than the LP relaxation the solver uses, because each grower's
// visits must be whole inside a plan. Finally the master is solved with whole plans over the
// plans generated (a feasible answer, often a good one).
import type { AllocInput, AllocResult } from './allocation-model.js';
import { fairFloors } from './allocation-model.js';
import { prepare } from './allocation-arcs.js';
import { compressRows, highs, runStage, type StageModel } from './allocation-highs.js';
import { context } from './allocation-stages.js';

export type DecompositionResult = {
  /** Best Lagrangian bound over the rounds (travel objective units, as `stats.stages[2]`). */
  bound: number;
  /** Master LP optimum of the last round (equals the bound once converged). */
  masterLp: number;
  /** The incumbent the plans started from, and the best whole-plan master found. */
  incumbent: number;
  restrictedBest: number;
  rounds: number;
  plans: number;
  growers: number;
  converged: boolean;
  seconds: number;
};

type Plan = { grower: number; cost: number; volume: number; lots: Map<number, number> };

/**
 * The bound for the travel stage of `result`, which must come from `solveAllocation(input)`
 * with fairness and volume proven (then its fair share is the exact t the stage kept).
 */
export async function decompositionBound(
  input: AllocInput,
  result: AllocResult,
  opts: { maxRounds?: number; progress?: (line: string) => void } = {},
): Promise<DecompositionResult> {
  if (!result.stats.optimal) throw new Error('The decomposition bound needs fairness and volume proven optimal');
  const started = performance.now();
  const h = await highs();
  const p = prepare(input);
  const c = context(p, input.farmVisitKm);
  const L = p.lines.length;
  const G = p.growerIds.length;
  const floors = fairFloors(c, result.stats.stages[0].objective);
  const volume = result.stats.totalCuttings - c.lockedTotal;
  // Visits a locked bundle makes anyway are paid once, outside the plans (as in the solver).
  let offset = 0;
  for (let gf = 0; gf < p.gfGrower.length; gf++) if (p.gfLocked[gf] > 0) offset += c.visitCost[gf];

  const growerLines: number[][] = Array.from({ length: G }, () => []);
  for (let l = 0; l < L; l++) growerLines[p.lineGrower[l]].push(l);
  const planOf = (g: number, x: (k: number) => number): Plan => {
    const lots = new Map<number, number>();
    const visits = new Set<number>();
    let cost = 0;
    let vol = 0;
    for (const l of growerLines[g]) {
      for (let k = c.lineStart[l]; k < c.lineStart[l + 1]; k++) {
        const v = x(k);
        if (v <= 0) continue;
        lots.set(p.arcLot[k], (lots.get(p.arcLot[k]) ?? 0) + v);
        cost += c.travelCost[k] * v;
        vol += v;
        if (p.gfLocked[p.arcGf[k]] === 0) visits.add(p.arcGf[k]);
      }
    }
    for (const gf of visits) cost += c.visitCost[gf];
    return { grower: g, cost, volume: vol, lots };
  };

  // The incumbent, back on the arcs: its cuttings per (lot, line), locked bundles taken off.
  const offerIndex = new Map(p.offers.map((o, i) => [o.id, i]));
  const lineIndex = new Map(p.lines.map((l, i) => [l.id, i]));
  const lotOf = new Int32Array(p.offers.length).fill(-1);
  p.lots.forEach((lot, i) => lot.offers.forEach((o) => (lotOf[o] = i)));
  const perPair = new Map<number, number>();
  for (const a of result.assignments) {
    const key = offerIndex.get(a.offerId)! * L + lineIndex.get(a.lineId)!;
    perPair.set(key, (perPair.get(key) ?? 0) + a.cuttings);
  }
  for (const k of p.locks) perPair.set(k.offer * L + k.line, (perPair.get(k.offer * L + k.line) ?? 0) - k.cuttings);
  const incumbentArcs = new Float64Array(c.n);
  for (const [key, cuttings] of perPair) {
    if (cuttings <= 0) continue;
    const o = Math.floor(key / L);
    const l = key % L;
    let k = c.lineStart[l];
    while (k < c.lineStart[l + 1] && p.arcLot[k] !== lotOf[o]) k++;
    if (k === c.lineStart[l + 1]) throw new Error(`No arc carries offer ${p.offers[o].id} to line ${p.lines[l].id}`);
    incumbentArcs[k] += cuttings;
  }
  const plans: Plan[] = [];
  for (let g = 0; g < G; g++) plans.push(planOf(g, (k) => incumbentArcs[k]));
  const incumbent = plans.reduce((s, pl) => s + pl.cost, offset);

  const nLots = p.lots.length;
  const master = (): StageModel => {
    const rowLower: number[] = [];
    const rowUpper: number[] = [];
    for (const lot of p.lots) {
      rowLower.push(-Infinity);
      rowUpper.push(lot.cap);
    }
    rowLower.push(volume);
    rowUpper.push(Infinity);
    for (let g = 0; g < G; g++) {
      rowLower.push(1);
      rowUpper.push(1);
    }
    const entries: [number, number, number][] = [];
    plans.forEach((pl, j) => {
      for (const [lot, v] of pl.lots) entries.push([lot, j, v]);
      entries.push([nLots, j, pl.volume]);
      entries.push([nLots + 1 + pl.grower, j, 1]);
    });
    return {
      sense: 'min',
      offset,
      colCost: Float64Array.from(plans, (pl) => pl.cost),
      colLower: new Float64Array(plans.length),
      colUpper: new Float64Array(plans.length).fill(Infinity),
      integrality: new Int32Array(plans.length),
      rowLower: Float64Array.from(rowLower),
      rowUpper: Float64Array.from(rowUpper),
      ...compressRows(rowLower.length, entries.map((e) => e[0]), entries.map((e) => e[1]), entries.map((e) => e[2])),
    };
  };

  /** The grower's cheapest plan at these duals: its cost net of the lot and volume prices. */
  const pricing = (g: number, lotDual: Float64Array, volumeDual: number) => {
    const arcs: number[] = [];
    for (const l of growerLines[g]) for (let k = c.lineStart[l]; k < c.lineStart[l + 1]; k++) arcs.push(k);
    if (arcs.length === 0) return { value: 0, bound: 0, plan: planOf(g, () => 0) };
    const visitCol = new Map<number, number>();
    const cost: number[] = arcs.map((k) => c.travelCost[k] - lotDual[p.arcLot[k]] - volumeDual);
    const upper: number[] = arcs.map((k) => p.arcUb[k]);
    for (const k of arcs) {
      const gf = p.arcGf[k];
      if (p.gfLocked[gf] > 0 || visitCol.has(gf)) continue;
      visitCol.set(gf, cost.length);
      cost.push(c.visitCost[gf]);
      upper.push(1);
    }
    const rowLower: number[] = [];
    const rowUpper: number[] = [];
    const entries: [number, number, number][] = [];
    const row = (lo: number, up: number) => (rowLower.push(lo), rowUpper.push(up), rowLower.length - 1);
    const lineRow = new Map<number, number>();
    const linkRow = new Map<number, number>();
    const limitRow = new Map<number, number>();
    arcs.forEach((k, j) => {
      const l = p.arcLine[k];
      const gf = p.arcGf[k];
      if (!lineRow.has(l)) lineRow.set(l, row(floors[l], p.lineNeed[l]));
      entries.push([lineRow.get(l)!, j, 1]);
      if (visitCol.has(gf)) {
        const link = c.arcLink[k];
        if (!linkRow.has(link)) {
          linkRow.set(link, row(-Infinity, 0));
          entries.push([linkRow.get(link)!, visitCol.get(gf)!, -c.linkM[link]]);
        }
        entries.push([linkRow.get(link)!, j, 1]);
      }
      if (Number.isFinite(p.gfLimit[gf])) {
        if (!limitRow.has(gf)) limitRow.set(gf, row(-Infinity, p.gfLimit[gf]));
        entries.push([limitRow.get(gf)!, j, 1]);
      }
    });
    const model: StageModel = {
      sense: 'min',
      offset: 0,
      colCost: Float64Array.from(cost),
      colLower: new Float64Array(cost.length),
      colUpper: Float64Array.from(upper),
      integrality: new Int32Array(cost.length).fill(1),
      rowLower: Float64Array.from(rowLower),
      rowUpper: Float64Array.from(rowUpper),
      ...compressRows(rowLower.length, entries.map((e) => e[0]), entries.map((e) => e[1]), entries.map((e) => e[2])),
    };
    const run = runStage(h, model, { timeLimit: 60, relGap: 1e-9, absGap: 1e-9 });
    if (!run.feasible) throw new Error(`Grower ${p.growerIds[g]} has no plan that meets its floors (${run.status})`);
    const x = new Map(arcs.map((k, j) => [k, Math.round(run.x[j])]));
    return { value: run.objective, bound: run.dualBound, plan: planOf(g, (k) => x.get(k) ?? 0) };
  };

  let bound = Number.NEGATIVE_INFINITY;
  let masterLp = Number.NaN;
  let rounds = 0;
  let converged = false;
  const maxRounds = opts.maxRounds ?? 100;
  while (rounds < maxRounds) {
    rounds++;
    const run = runStage(h, master(), { timeLimit: 600 });
    if (run.status !== 'optimal') throw new Error(`Master LP: ${run.status}`);
    masterLp = run.objective;
    const lotDual = run.rowDual.subarray(0, nLots);
    const volumeDual = run.rowDual[nLots];
    let lagrangian = run.objective;
    let added = 0;
    for (let g = 0; g < G; g++) {
      const convexityDual = run.rowDual[nLots + 1 + g];
      const best = pricing(g, lotDual, volumeDual);
      lagrangian += Math.min(0, best.bound - convexityDual);
      if (best.value - convexityDual < -1e-7 * Math.max(1, Math.abs(convexityDual))) {
        plans.push(best.plan);
        added++;
      }
    }
    bound = Math.max(bound, lagrangian);
    opts.progress?.(`round ${rounds}: master LP ${run.objective.toFixed(3)}, bound ${bound.toFixed(3)}, ${added} plans added, ${((performance.now() - started) / 1000).toFixed(1)} s`);
    // Converged: nothing prices out, or the bound has met the master (degenerate masters can
    // keep taking plans whose reduced cost is a rounding crumb).
    if (added === 0 || run.objective - bound <= 1e-6 * Math.max(1, Math.abs(run.objective))) {
      converged = true;
      break;
    }
  }

  const whole = master();
  whole.integrality.fill(1);
  whole.colUpper.fill(1);
  const mip = runStage(h, whole, { timeLimit: 120, relGap: 1e-6 }, Float64Array.from(plans, (_, j) => (j < G ? 1 : 0)));
  const restrictedBest = mip.feasible ? Math.min(mip.objective, incumbent) : incumbent;
  return { bound, masterLp, incumbent, restrictedBest, rounds, plans: plans.length, growers: G, converged, seconds: (performance.now() - started) / 1000 };
}

// The three stage models of the allocation, built over a working subset of the arcs and grown
// by column generation: solve the LP on the subset, price every other arc with the LP's duals,
// add those that could improve it, repeat. When nothing prices out, the subset's LP optimum is
// the LP optimum over all arcs, a bound that holds for the whole integer program. Small
// problems start from all arcs, so there the integer stages are exact outright.
import type { Prepared } from './allocation-arcs.js';
import { compressRows, type StageModel } from './allocation-highs.js';

/** In the travel tie-break a substitute cutting counts as this many km farther. */
export const SUBSTITUTE_KM = 1000;

export type Ctx = {
  p: Prepared;
  n: number;
  /** Arcs of line l are lineStart[l] .. lineStart[l + 1] - 1. */
  lineStart: Int32Array;
  /** L*: lines with at least one arc, and their fair-share weight priority / pmax * cuttings. */
  fairLines: number[];
  fairWeight: Float64Array;
  /** (line, farm) group of each arc, for the visit linking rows; M is its big-M. */
  arcLink: Int32Array;
  linkLine: Int32Array;
  linkGf: Int32Array;
  linkM: Float64Array;
  visitCost: Float64Array;
  tau: number;
  /** Travel tie-break cost of one cutting on each arc. */
  travelCost: Float64Array;
  lockedTotal: number;
  /** The line has an arc to a farm its grower visits anyway for a locked bundle. */
  lineVisitLocked: Uint8Array;
};

export const wholeCuttings = (p: Prepared, l: number) => Math.max(0, Math.floor(p.lines[l].cuttings));

export function context(p: Prepared, farmVisitKm: number | undefined): Ctx {
  const n = p.arcLot.length;
  const L = p.lines.length;
  const lineStart = new Int32Array(L + 1);
  for (let k = 0; k < n; k++) lineStart[p.arcLine[k] + 1]++;
  for (let l = 0; l < L; l++) lineStart[l + 1] += lineStart[l];
  const fairLines: number[] = [];
  let pmax = 0;
  for (let l = 0; l < L; l++) {
    if (lineStart[l + 1] > lineStart[l] && wholeCuttings(p, l) > 0) {
      fairLines.push(l);
      pmax = Math.max(pmax, p.lines[l].priority);
    }
  }
  const fairWeight = new Float64Array(L);
  for (const l of fairLines) fairWeight[l] = (p.lines[l].priority / pmax) * wholeCuttings(p, l);

  // Linking groups: the arcs of one line at one farm (contiguous per line, grouped by farm).
  const arcLink = new Int32Array(n);
  const linkLineA: number[] = [];
  const linkGfA: number[] = [];
  const linkMA: number[] = [];
  for (let l = 0; l < L; l++) {
    const seen = new Map<number, number>();
    for (let k = lineStart[l]; k < lineStart[l + 1]; k++) {
      const gf = p.arcGf[k];
      let id = seen.get(gf);
      if (id === undefined) {
        id = linkLineA.length;
        seen.set(gf, id);
        linkLineA.push(l);
        linkGfA.push(gf);
        linkMA.push(0);
      }
      arcLink[k] = id;
      linkMA[id] += p.arcUb[k];
    }
  }
  const linkM = Float64Array.from(linkMA, (m, id) => Math.min(m, p.lineNeed[linkLineA[id]], p.gfLimit[linkGfA[id]]));

  const visitCost = Float64Array.from(p.gfRoundTripKm, (km) => farmVisitKm ?? km);
  // Weight of the per-cutting tie-break: all of it together stays below half the cheapest visit.
  let cheapest = Infinity;
  for (const c of visitCost) if (c > 0) cheapest = Math.min(cheapest, c);
  let perCutting = 0;
  for (let k = 0; k < n; k++) perCutting = Math.max(perCutting, p.arcDistM[k] / 1000 + (p.arcSubstitute[k] ? SUBSTITUTE_KM : 0));
  let need = 0;
  for (const v of p.lineNeed) need += v;
  const tau = Number.isFinite(cheapest) ? (0.5 * Math.max(cheapest, 0.1)) / (1 + need * perCutting) : 1;
  const travelCost = new Float64Array(n);
  for (let k = 0; k < n; k++) travelCost[k] = tau * (p.arcDistM[k] / 1000 + (p.arcSubstitute[k] ? SUBSTITUTE_KM : 0));
  const lockedTotal = p.locks.reduce((s, k) => s + k.cuttings, 0);
  const lineVisitLocked = new Uint8Array(L);
  for (let k = 0; k < n; k++) if (p.gfLocked[p.arcGf[k]] > 0) lineVisitLocked[p.arcLine[k]] = 1;
  return {
    p,
    n,
    lineStart,
    fairLines,
    fairWeight,
    arcLink,
    linkLine: Int32Array.from(linkLineA),
    linkGf: Int32Array.from(linkGfA),
    linkM,
    visitCost,
    tau,
    travelCost,
    lockedTotal,
    lineVisitLocked,
  };
}

export type StageKind = 'fairness' | 'volume' | 'travel';

export type StageSpec = {
  kind: StageKind;
  integer: boolean;
  /** Whole cuttings each line must get on top of its locked ones (volume, travel). */
  floors?: Float64Array;
  /** Total cuttings to keep, locked ones included (travel). */
  volume?: number;
};

/** A stage model over a subset of the arcs, with where each arc's rows and extra columns are. */
export type Master = {
  model: StageModel;
  arcs: number[];
  rowLot: Int32Array;
  rowLine: Int32Array;
  rowGf: Int32Array;
  /** Fairness row (fairness) or floor row (volume) of each line. */
  rowShare: Int32Array;
  rowVolume: number;
  rowLink: Int32Array;
  /** Travel: per line with a floor, "visit at least one of its farms". */
  rowCover: Int32Array;
  colT: number;
  colSlack: Int32Array;
  colVisit: Int32Array;
  /** Stable identities of columns and rows across grown masters (for warm starts). */
  colKey: Float64Array;
  rowKey: Float64Array;
};

/**
 * Arcs whose reduced cost is above -PRICE_TOL[kind] are left out: the LP bound may then be
 * off by at most that times the capacities of the arcs left out, which `pricingSlack` adds
 * up. Travel costs are in km (a visit is tens of km), so 1e-7 there is far below anything
 * that counts, and it stops the column generation from chasing tie-break crumbs.
 */
/** Arcs added per line and pricing round. */
const PER_LINE = 8;

export const PRICE_TOL: Record<StageKind, number> = { fairness: 1e-10, volume: 1e-9, travel: 1e-7 };

export function pricingSlack(c: Ctx, inSubset: Uint8Array, kind: StageKind): number {
  let s = 0;
  for (let k = 0; k < c.n; k++) if (!inSubset[k]) s += c.p.arcUb[k];
  return PRICE_TOL[kind] * s;
}

/**
 * A lower bound on the travel LP over every arc from the duals of a master over a subset (the
 * Lagrangian bound of column generation), valid after any round, converged or not, so that an
 * LP cut short by the time limit still gives an honest gap. The rows of the master are priced
 * by its duals; what the master lacks is solved exactly on its own: an arc whose (line, farm)
 * linking row is in the master adds its reduced cost times its capacity when negative; the arcs
 * of a (line, farm) with no linking row yet need their visit, so per visit the best of "not
 * made" (0) and "made" (the visit's reduced cost plus, per line, the cheapest fill of that
 * line's link capacity from those arcs) replaces the visit column's own term.
 */
export function travelLowerBound(c: Ctx, m: Master, objective: number, rowDual: Float64Array, colDual: Float64Array, inSubset: Uint8Array): number {
  const { p } = c;
  const d = (row: number) => (row >= 0 ? rowDual[row] : 0);
  let bound = objective;
  // Per visit: the reduced cost of its column (in the master or not) and what the arcs of
  // missing linking rows can gain when it is made.
  const gain = new Float64Array(p.gfGrower.length);
  const touched = new Uint8Array(p.gfGrower.length);
  const coverOf = new Float64Array(p.gfGrower.length);
  const groups = new Map<number, { rc: number; ub: number }[]>();
  for (let l = 0; l < p.lines.length; l++) {
    groups.clear();
    for (let k = c.lineStart[l]; k < c.lineStart[l + 1]; k++) {
      if (inSubset[k]) continue;
      const gf = p.arcGf[k];
      const link = c.arcLink[k];
      const rc = c.travelCost[k] - d(m.rowLot[p.arcLot[k]]) - d(m.rowLine[l]) - d(m.rowGf[gf]) - d(m.rowVolume) - d(m.rowLink[link]);
      if (p.gfLocked[gf] > 0 || m.rowLink[link] >= 0) {
        // No visit needed (locked) or its linking row is priced by the master.
        if (rc < 0) bound += rc * p.arcUb[k];
        continue;
      }
      (groups.get(link) ?? groups.set(link, []).get(link)!).push({ rc, ub: p.arcUb[k] });
    }
    for (const [link, arcs] of groups) {
      const gf = c.linkGf[link];
      if (!touched[gf]) {
        touched[gf] = 1;
        gain[gf] = 0;
      }
      // A new visit column enters the cover row of every line of the grower at that farm.
      if (m.colVisit[gf] < 0) coverOf[gf] += Math.max(0, d(m.rowCover[l]));
      arcs.sort((a, b) => a.rc - b.rc);
      let room = c.linkM[link];
      for (const a of arcs) {
        if (a.rc >= 0 || room <= 0) break;
        const take = Math.min(room, a.ub);
        gain[gf] += a.rc * take;
        room -= take;
      }
    }
  }
  for (let gf = 0; gf < gain.length; gf++) {
    if (!touched[gf]) continue;
    const inMaster = m.colVisit[gf] >= 0;
    const rcY = inMaster ? colDual[m.colVisit[gf]] : c.visitCost[gf] - coverOf[gf];
    // The master already counted min(0, rcY) for a visit column it has.
    bound += Math.min(0, rcY + gain[gf]) - (inMaster ? Math.min(0, rcY) : 0);
  }
  return bound;
}

/** Cost of one volume slack cutting: more than any volume can be worth. */
export const slackCost = (c: Ctx) => 1 + c.p.lineNeed.reduce((s, v) => s + v, 0);

// Every stage is posed as a minimisation, so that one pricing rule serves all.
export function buildMaster(c: Ctx, arcs: number[], spec: StageSpec): Master {
  const { p } = c;
  const L = p.lines.length;
  const rowLot = new Int32Array(p.lots.length).fill(-1);
  const rowLine = new Int32Array(L).fill(-1);
  const rowGf = new Int32Array(p.gfGrower.length).fill(-1);
  const rowShare = new Int32Array(L).fill(-1);
  const rowLink = new Int32Array(c.linkLine.length).fill(-1);
  const rowCover = new Int32Array(L).fill(-1);
  const colSlack = new Int32Array(L).fill(-1);
  const colVisit = new Int32Array(p.gfGrower.length).fill(-1);
  const rLo: number[] = [];
  const rUp: number[] = [];
  const rKey: number[] = [];
  // Row identities: lots, lines, (grower, farm) limits, shares, the volume row, links, covers.
  const nLots = p.lots.length;
  const nGf = p.gfGrower.length;
  const nLinks = c.linkLine.length;
  const R = { lot: 0, line: nLots, gf: nLots + L, share: nLots + L + nGf, volume: nLots + 2 * L + nGf, link: nLots + 2 * L + nGf + 1, cover: nLots + 2 * L + nGf + 1 + nLinks };
  const newRow = (lo: number, up: number, key: number) => {
    rLo.push(lo);
    rUp.push(up);
    rKey.push(key);
    return rLo.length - 1;
  };
  const cost: number[] = [];
  const cLo: number[] = [];
  const cUp: number[] = [];
  const cInt: number[] = [];
  const cKey: number[] = [];
  // Column identities: arcs, then t, then slacks per line, then visits per (grower, farm).
  const newCol = (cc: number, lo: number, up: number, int: boolean, key: number) => {
    cKey.push(key);
    cost.push(cc);
    cLo.push(lo);
    cUp.push(up);
    cInt.push(int ? 1 : 0);
    return cost.length - 1;
  };
  const eRow: number[] = [];
  const eCol: number[] = [];
  const eVal: number[] = [];
  const entry = (r: number, col: number, v: number) => {
    eRow.push(r);
    eCol.push(col);
    eVal.push(v);
  };

  // Arc columns first, so that column j is arcs[j].
  for (const k of arcs) {
    const cc = spec.kind === 'fairness' ? 0 : spec.kind === 'volume' ? -1 : c.travelCost[k];
    newCol(cc, 0, p.arcUb[k], spec.integer, k);
  }
  let colT = -1;
  if (spec.kind === 'fairness') colT = newCol(-1, 0, 1, false, c.n);

  arcs.forEach((k, j) => {
    const lot = p.arcLot[k];
    const l = p.arcLine[k];
    const gf = p.arcGf[k];
    if (rowLot[lot] < 0) rowLot[lot] = newRow(-Infinity, p.lots[lot].cap, R.lot + lot);
    if (rowLine[l] < 0) rowLine[l] = newRow(spec.kind === 'travel' && spec.floors![l] > 0 ? spec.floors![l] : -Infinity, p.lineNeed[l], R.line + l);
    entry(rowLot[lot], j, 1);
    entry(rowLine[l], j, 1);
    if (Number.isFinite(p.gfLimit[gf])) {
      if (rowGf[gf] < 0) rowGf[gf] = newRow(-Infinity, p.gfLimit[gf], R.gf + gf);
      entry(rowGf[gf], j, 1);
    }
  });

  let rowVolume = -1;
  if (spec.kind === 'fairness') {
    // allocated(l) >= t * weight(l): sum of arcs - weight * t >= -locked.
    for (const l of c.fairLines) {
      rowShare[l] = newRow(-p.lineLocked[l], Infinity, R.share + l);
      entry(rowShare[l], colT, -c.fairWeight[l]);
    }
    arcs.forEach((k, j) => {
      const r = rowShare[p.arcLine[k]];
      if (r >= 0) entry(r, j, 1);
    });
  } else if (spec.kind === 'volume') {
    // Floors with a slack each, priced above any volume: the LP then says whether the floors
    // can be met at all (no slack left) over every arc, not just those in the subset.
    const big = slackCost(c);
    for (let l = 0; l < L; l++) {
      if (!(spec.floors![l] > 0)) continue;
      rowShare[l] = newRow(spec.floors![l], Infinity, R.share + l);
      colSlack[l] = newCol(big, 0, Infinity, false, c.n + 1 + l);
      entry(rowShare[l], colSlack[l], 1);
    }
    arcs.forEach((k, j) => {
      const r = rowShare[p.arcLine[k]];
      if (r >= 0) entry(r, j, 1);
    });
    // Lines with a floor but no arc in the subset yet still need their line row for pricing.
  } else {
    rowVolume = newRow(spec.volume! - c.lockedTotal, Infinity, R.volume);
    arcs.forEach((_, j) => entry(rowVolume, j, 1));
    // A visit per (grower, farm) unless a locked bundle already takes the grower there.
    arcs.forEach((k, j) => {
      const gf = p.arcGf[k];
      if (p.gfLocked[gf] > 0) return;
      if (colVisit[gf] < 0) colVisit[gf] = newCol(c.visitCost[gf], 0, 1, spec.integer, c.n + 1 + L + gf);
      const link = c.arcLink[k];
      if (rowLink[link] < 0) {
        rowLink[link] = newRow(-Infinity, 0, R.link + link);
        entry(rowLink[link], colVisit[gf], -c.linkM[link]);
      }
      entry(rowLink[link], j, 1);
    });
    // A line that must get at least one more cutting needs at least one of its farms visited:
    // the whole-number rounding of the linking rows, which the LP relaxation alone misses
    // badly for lines that get only part of their request.
    for (let l = 0; l < L; l++) {
      if (!(spec.floors![l] >= 1) || c.lineVisitLocked[l]) continue;
      const ys = new Set<number>();
      for (let k = c.lineStart[l]; k < c.lineStart[l + 1]; k++) {
        const y = colVisit[p.arcGf[k]];
        if (y >= 0) ys.add(y);
      }
      rowCover[l] = newRow(1, Infinity, R.cover + l);
      for (const y of [...ys].sort((a, b) => a - b)) entry(rowCover[l], y, 1);
    }
  }

  let offset = 0;
  if (spec.kind === 'volume') offset = -c.lockedTotal;
  if (spec.kind === 'travel') for (let gf = 0; gf < p.gfGrower.length; gf++) if (p.gfLocked[gf] > 0) offset += c.visitCost[gf];

  const { rowStarts, rowIndex, rowValue } = compressRows(rLo.length, eRow, eCol, eVal);
  return {
    model: {
      sense: 'min',
      offset,
      colCost: Float64Array.from(cost),
      colLower: Float64Array.from(cLo),
      colUpper: Float64Array.from(cUp),
      integrality: Int32Array.from(cInt),
      rowLower: Float64Array.from(rLo),
      rowUpper: Float64Array.from(rUp),
      rowStarts,
      rowIndex,
      rowValue,
    },
    arcs,
    rowLot,
    rowLine,
    rowGf,
    rowShare,
    rowVolume,
    rowLink,
    rowCover,
    colT,
    colSlack,
    colVisit,
    colKey: Float64Array.from(cKey),
    rowKey: Float64Array.from(rKey),
  };
}

/** A warm start for a grown master from the basis of the previous one: new columns at zero, new rows basic. */
export function carryBasis(prev: Master, basis: { colStatus: Int32Array; rowStatus: Int32Array }, next: Master) {
  const cols = new Map<number, number>();
  prev.colKey.forEach((key, j) => cols.set(key, basis.colStatus[j]));
  const rows = new Map<number, number>();
  prev.rowKey.forEach((key, i) => rows.set(key, basis.rowStatus[i]));
  return {
    colStatus: Int32Array.from(next.colKey, (key) => cols.get(key) ?? 0),
    rowStatus: Int32Array.from(next.rowKey, (key) => rows.get(key) ?? 1),
  };
}

/**
 * Arcs outside the subset whose reduced cost in the LP just solved is negative, that is, which
 * could improve it. For a (line, farm) with no linking row yet, the visit it would need is
 * priced in: a new row x <= M * y can only make the arc dearer by y's reduced cost over M.
 */
export function price(c: Ctx, m: Master, spec: StageSpec, rowDual: Float64Array, colDual: Float64Array, inSubset: Uint8Array): number[] {
  const { p } = c;
  const d = (row: number) => (row >= 0 ? rowDual[row] : 0);
  const out: number[] = [];
  // A new visit column would enter the cover rows of its grower's lines at that farm; counting
  // all the grower's cover duals makes the estimate low, never high, so no column is missed.
  const growerCover = new Float64Array(p.growerIds.length);
  if (spec.kind === 'travel') for (let l = 0; l < p.lines.length; l++) if (m.rowCover[l] >= 0) growerCover[p.lineGrower[l]] += Math.max(0, rowDual[m.rowCover[l]]);
  const tol = PRICE_TOL[spec.kind];
  // Arcs of a line are contiguous: keep each line's most attractive few per round (nearest
  // first among equals), so that the subset grows where it matters and stays small.
  let lineAt = -1;
  const pending: { k: number; rc: number }[] = [];
  const flush = (next: number) => {
    pending.sort((a, b) => a.rc - b.rc || p.arcDistM[a.k] - p.arcDistM[b.k] || a.k - b.k);
    for (let i = 0; i < pending.length && i < PER_LINE; i++) out.push(pending[i].k);
    pending.length = 0;
    lineAt = next;
  };
  for (let k = 0; k < c.n; k++) {
    if (inSubset[k]) continue;
    const l = p.arcLine[k];
    const gf = p.arcGf[k];
    let rc = spec.kind === 'fairness' ? 0 : spec.kind === 'volume' ? -1 : c.travelCost[k];
    rc -= d(m.rowLot[p.arcLot[k]]) + d(m.rowLine[l]) + d(m.rowGf[gf]);
    if (spec.kind !== 'travel') rc -= d(m.rowShare[l]);
    else {
      rc -= d(m.rowVolume);
      const link = c.arcLink[k];
      if (m.rowLink[link] >= 0) rc -= rowDual[m.rowLink[link]];
      else if (p.gfLocked[gf] === 0) {
        const yCost = m.colVisit[gf] >= 0 ? colDual[m.colVisit[gf]] : c.visitCost[gf] - growerCover[p.gfGrower[gf]];
        rc += Math.max(0, yCost) / c.linkM[link];
      }
    }
    if (rc < -tol) {
      if (l !== lineAt) flush(l);
      pending.push({ k, rc });
    }
  }
  flush(-1);
  return out;
}

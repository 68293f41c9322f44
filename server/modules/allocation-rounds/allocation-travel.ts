// The travel stage without the solver: a local search over visits, and a bound that needs no
// LP. Pure: no database, no solver; whole cuttings throughout; deterministic (fixed orders,
// ties broken by index), so the same input gives the same answer whenever it runs to its end.
//
// The search starts from a solution that meets the fair-share floors and the stage-2 total,
// and closes (grower, farm) visits one at a time ("drop", the classic move for fixed-charge
// problems). Closing a visit takes its cuttings away; the lines that lose them are topped up
// by augmenting paths: wood goes from a lot with cuttings to spare to a line, possibly by
// moving another line's cuttings from that lot to another lot (lot -> line -> lot -> ... ->
// line). The cheapest path is found first (Dijkstra): over visits already made a path costs
// nothing, a visit not made yet costs its visit, and all the visits a close opens must cost
// less than the visit closed. Lines below their floor are served first, then lines with room,
// so the total is kept; when that fails the close is undone. "Consolidate" then opens, for one
// grower, a farm it does not visit and closes as many of its visits as the wood allows, kept
// when the visits cost less in all. Visits emptied along the way are closed too.
import type { Ctx } from './allocation-stages.js';

/** Farms tried per grower and consolidation pass, cheapest first. */
const CONSOLIDATE_TRIES = 20;
/** A consolidation pass that saves less than this share of the visits' cost is the last. */
const MIN_PASS_GAIN = 0.002;

type TravelState = {
  x: Float64Array;
  lotUse: Float64Array;
  lineAmt: Float64Array;
  gfUse: Float64Array;
  open: Uint8Array;
};

type Index = {
  /** Arcs of each (grower, farm) pair: gfArcs[gfStart[i] .. gfStart[i + 1]). */
  gfStart: Int32Array;
  gfArcs: Int32Array;
  /** Arcs of each lot. */
  lotStart: Int32Array;
  lotArcs: Int32Array;
  /** (grower, farm) pairs of each grower. */
  growerStart: Int32Array;
  growerGf: Int32Array;
};

function bucket(n: number, keys: ArrayLike<number>, count: number): { start: Int32Array; items: Int32Array } {
  const start = new Int32Array(count + 1);
  for (let i = 0; i < n; i++) start[keys[i] + 1]++;
  for (let i = 0; i < count; i++) start[i + 1] += start[i];
  const fill = start.slice(0, count);
  const items = new Int32Array(n);
  for (let i = 0; i < n; i++) items[fill[keys[i]]++] = i;
  return { start, items };
}

function buildIndex(c: Ctx): Index {
  const { p, n } = c;
  const gf = bucket(n, p.arcGf, p.gfGrower.length);
  const lot = bucket(n, p.arcLot, p.lots.length);
  const gr = bucket(p.gfGrower.length, p.gfGrower, p.growerIds.length);
  return { gfStart: gf.start, gfArcs: gf.items, lotStart: lot.start, lotArcs: lot.items, growerStart: gr.start, growerGf: gr.items };
}

function stateOf(c: Ctx, arcs: Float64Array): TravelState {
  const { p, n } = c;
  const s: TravelState = {
    x: Float64Array.from(arcs),
    lotUse: new Float64Array(p.lots.length),
    lineAmt: new Float64Array(p.lines.length),
    gfUse: new Float64Array(p.gfGrower.length),
    open: new Uint8Array(p.gfGrower.length),
  };
  for (let k = 0; k < n; k++) {
    const v = arcs[k];
    if (v <= 0) continue;
    s.lotUse[p.arcLot[k]] += v;
    s.lineAmt[p.arcLine[k]] += v;
    s.gfUse[p.arcGf[k]] += v;
  }
  for (let gf = 0; gf < s.open.length; gf++) s.open[gf] = s.gfUse[gf] > 0 || p.gfLocked[gf] > 0 ? 1 : 0;
  return s;
}

/**
 * Improves `arcs` (whole cuttings meeting `floors` and the stage-2 total) by closing visits.
 * Returns a new arc vector that meets the same floors and capacities with the same total and
 * whose visits cost no more. `stop()` is asked between moves; when it says so the best so far
 * is returned.
 */
export function improveTravel(
  c: Ctx,
  arcs: Float64Array,
  floors: Float64Array,
  opts: {
    stop?: () => boolean;
    /** Per (grower, farm): visits with the lowest value are tried first (e.g. the LP's visit share). */
    priority?: Float64Array;
    /** Also try opening a farm to close others (slower, finds more); default true. */
    consolidate?: boolean;
    trace?: (msg: string) => void;
  } = {},
): Float64Array {
  const stop = opts.stop ?? (() => false);
  const priority = opts.priority;
  const { p } = c;
  const ix = buildIndex(c);
  const s = stateOf(c, arcs);
  const L = p.lines.length;
  const nLots = p.lots.length;

  // Undo logs: arc and the amount added (negative = removed); visit and its previous flag.
  const log: number[] = [];
  const flags: number[] = [];
  const change = (k: number, d: number) => {
    s.x[k] += d;
    s.lotUse[p.arcLot[k]] += d;
    s.lineAmt[p.arcLine[k]] += d;
    s.gfUse[p.arcGf[k]] += d;
    log.push(k, d);
  };
  // What the open visits cost (locked ones aside): the objective, but for the tie-break.
  let openCost = 0;
  for (let gf = 0; gf < s.open.length; gf++) if (s.open[gf] && p.gfLocked[gf] === 0) openCost += c.visitCost[gf];
  const setOpen = (gf: number, v: 0 | 1) => {
    if (s.open[gf] === v) return;
    flags.push(gf, s.open[gf]);
    s.open[gf] = v;
    if (p.gfLocked[gf] === 0) openCost += v ? c.visitCost[gf] : -c.visitCost[gf];
  };
  const mark = () => ({ x: log.length, f: flags.length });
  const undo = (m: { x: number; f: number }) => {
    while (log.length > m.x) {
      const d = log.pop()!;
      const k = log.pop()!;
      s.x[k] -= d;
      s.lotUse[p.arcLot[k]] -= d;
      s.lineAmt[p.arcLine[k]] -= d;
      s.gfUse[p.arcGf[k]] -= d;
    }
    while (flags.length > m.f) {
      const v = flags.pop()!;
      const gf = flags.pop()!;
      if (p.gfLocked[gf] === 0 && s.open[gf] !== v) openCost += v ? c.visitCost[gf] : -c.visitCost[gf];
      s.open[gf] = v;
    }
  };
  const forget = () => {
    log.length = 0;
    flags.length = 0;
  };

  // Augmenting paths, searched backwards from the lines that should get more: a line takes a
  // cutting from a lot over an arc with room; a full lot passes the request on to a line that
  // takes from it and could take from another lot instead. An arc of a visit not made yet costs
  // that visit; the cheapest path is found first (Dijkstra), within a budget.
  const lineSeen = new Int32Array(L);
  const lotSeen = new Int32Array(nLots);
  const lineDist = new Float64Array(L);
  const lotDist = new Float64Array(nLots);
  const viaArcToLine = new Int32Array(L); // the decrease arc by which the search reached the line (-1 at a target)
  const viaArcToLot = new Int32Array(nLots); // the increase arc by which the search reached the lot
  let stamp = 0;
  const banned = new Uint8Array(p.gfGrower.length);
  // A binary heap of (cost, node): lines are 0 .. L - 1, lots L + lot.
  let heapD = new Float64Array(1024);
  let heapN = new Int32Array(1024);
  let heapSize = 0;
  const heapPush = (d: number, node: number) => {
    if (heapSize === heapD.length) {
      const d2 = new Float64Array(heapSize * 2);
      d2.set(heapD);
      heapD = d2;
      const n2 = new Int32Array(heapSize * 2);
      n2.set(heapN);
      heapN = n2;
    }
    let i = heapSize++;
    while (i > 0) {
      const up = (i - 1) >> 1;
      if (heapD[up] < d || (heapD[up] === d && heapN[up] < node)) break;
      heapD[i] = heapD[up];
      heapN[i] = heapN[up];
      i = up;
    }
    heapD[i] = d;
    heapN[i] = node;
  };
  const heapPop = (): number => {
    const top = heapN[0];
    const d = heapD[--heapSize];
    const node = heapN[heapSize];
    let i = 0;
    for (;;) {
      let cI = 2 * i + 1;
      if (cI >= heapSize) break;
      if (cI + 1 < heapSize && (heapD[cI + 1] < heapD[cI] || (heapD[cI + 1] === heapD[cI] && heapN[cI + 1] < heapN[cI]))) cI++;
      if (d < heapD[cI] || (d === heapD[cI] && node < heapN[cI])) break;
      heapD[i] = heapD[cI];
      heapN[i] = heapN[cI];
      i = cI;
    }
    heapD[i] = d;
    heapN[i] = node;
    return top;
  };
  let pathOpened = 0;

  /**
   * The cheapest augmenting path into one of `targets` (lines) whose visits not made yet cost at
   * most `budget`; pushes up to `want` along it and returns the amount (0 when there is none).
   */
  const augment = (targets: number[], want: number, roomOf: (l: number) => number, budget: number): number => {
    stamp++;
    heapSize = 0;
    for (const l of targets) {
      if (lineSeen[l] === stamp || roomOf(l) <= 0) continue;
      lineSeen[l] = stamp;
      lineDist[l] = 0;
      viaArcToLine[l] = -1;
      heapPush(0, l);
    }
    while (heapSize > 0) {
      const d = heapD[0];
      const node = heapPop();
      if (node < L) {
        const l = node;
        if (d > lineDist[l]) continue;
        for (let k = c.lineStart[l]; k < c.lineStart[l + 1]; k++) {
          const gf = p.arcGf[k];
          if (banned[gf] || s.x[k] >= p.arcUb[k] || s.gfUse[gf] >= p.gfLimit[gf]) continue;
          const dk = d + (s.open[gf] ? 0 : c.visitCost[gf]);
          if (dk > budget) continue;
          const lot = p.arcLot[k];
          if (lotSeen[lot] === stamp && lotDist[lot] <= dk) continue;
          lotSeen[lot] = stamp;
          lotDist[lot] = dk;
          viaArcToLot[lot] = k;
          heapPush(dk, L + lot);
        }
      } else {
        const lot = node - L;
        if (d > lotDist[lot]) continue;
        if (s.lotUse[lot] < p.lots[lot].cap) return push(lot, want, roomOf);
        // A full lot: another line taking from it may take from elsewhere.
        for (let a = ix.lotStart[lot]; a < ix.lotStart[lot + 1]; a++) {
          const j = ix.lotArcs[a];
          if (s.x[j] <= 0) continue;
          const l2 = p.arcLine[j];
          if (lineSeen[l2] === stamp && lineDist[l2] <= d) continue;
          lineSeen[l2] = stamp;
          lineDist[l2] = d;
          viaArcToLine[l2] = j;
          heapPush(d, l2);
        }
      }
    }
    return 0;
  };

  const push = (lot: number, want: number, roomOf: (l: number) => number): number => {
    // Walk the path from the lot with spare back to the target line and find the bottleneck.
    let amount = Math.min(want, p.lots[lot].cap - s.lotUse[lot]);
    const steps: { inc: number; dec: number }[] = [];
    let at = lot;
    for (;;) {
      const k = viaArcToLot[at];
      const l = p.arcLine[k];
      const j = viaArcToLine[l];
      steps.push({ inc: k, dec: j });
      amount = Math.min(amount, p.arcUb[k] - s.x[k]);
      if (j < 0) {
        amount = Math.min(amount, roomOf(l));
        break;
      }
      amount = Math.min(amount, s.x[j]);
      at = p.arcLot[j];
    }
    // Per-grower farm limits: net change per (grower, farm) along the path.
    const net = new Map<number, number>();
    for (const { inc, dec } of steps) {
      net.set(p.arcGf[inc], (net.get(p.arcGf[inc]) ?? 0) + 1);
      if (dec >= 0) net.set(p.arcGf[dec], (net.get(p.arcGf[dec]) ?? 0) - 1);
    }
    for (const [gf, d] of net) if (d > 0) amount = Math.min(amount, Math.floor((p.gfLimit[gf] - s.gfUse[gf]) / d));
    amount = Math.floor(amount);
    if (amount <= 0) return 0;
    for (const { inc, dec } of steps) {
      const gf = p.arcGf[inc];
      if (!s.open[gf]) {
        setOpen(gf, 1);
        pathOpened += c.visitCost[gf];
      }
      change(inc, amount);
      if (dec >= 0) change(dec, -amount);
    }
    return amount;
  };

  const floorRoom = (l: number) => floors[l] - s.lineAmt[l];
  const needRoom = (l: number) => p.lineNeed[l] - s.lineAmt[l];
  // Lines with room, for putting the total back: kept as a list, filtered when used.
  const roomy = () => {
    const out: number[] = [];
    for (let l = 0; l < L; l++) if (needRoom(l) > 0) out.push(l);
    return out;
  };

  /**
   * Brings every line back to its floor and the total back up by `deficit`, opening visits that
   * cost less than `budget` in all; false if it cannot.
   */
  const repair = (hurt: number[], deficit: number, budget: number): boolean => {
    const left = () => budget - pathOpened - 1e-9;
    for (const l of hurt) {
      let guard = 0;
      while (floorRoom(l) > 0) {
        const got = augment([l], floorRoom(l), floorRoom, left());
        if (got <= 0 || ++guard > 1000) return false;
        deficit -= got;
      }
    }
    if (deficit <= 0) return true;
    // First the lines that lost wood, then any line with room.
    let targets = hurt.filter((l) => needRoom(l) > 0);
    let widened = false;
    let guard = 0;
    while (deficit > 0) {
      if (++guard > 10_000) return false;
      let got = targets.length ? augment(targets, deficit, needRoom, left()) : 0;
      if (got <= 0) {
        if (widened) return false;
        widened = true;
        targets = roomy();
        got = augment(targets, deficit, needRoom, left());
        if (got <= 0) return false;
      }
      deficit -= got;
      targets = targets.filter((l) => needRoom(l) > 0);
    }
    return true;
  };

  /**
   * Closes visit gf, sending its wood by other visits, some of them perhaps new ones that cost
   * less together than gf (`budget`, its cost by default). True when done (state changed).
   */
  const close = (gf: number, budget = c.visitCost[gf]): boolean => {
    if (p.gfLocked[gf] > 0 || !s.open[gf]) return false;
    const m = mark();
    setOpen(gf, 0);
    banned[gf] = 1;
    pathOpened = 0;
    const hurt: number[] = [];
    let removed = 0;
    for (let a = ix.gfStart[gf]; a < ix.gfStart[gf + 1]; a++) {
      const k = ix.gfArcs[a];
      if (s.x[k] <= 0) continue;
      removed += s.x[k];
      hurt.push(p.arcLine[k]);
      change(k, -s.x[k]);
    }
    const ok = repair([...new Set(hurt)].sort((a, b) => a - b), removed, budget);
    banned[gf] = 0;
    if (ok) {
      // Visits the paths emptied are no longer made: close them too, so that no later path
      // puts wood back on them without paying for the visit.
      for (let i = m.x; i < log.length; i += 2) {
        const g2 = p.arcGf[log[i]];
        if (s.gfUse[g2] <= 0 && p.gfLocked[g2] === 0) setOpen(g2, 0);
      }
      return true;
    }
    undo(m);
    return false;
  };

  // Drop: visits in order of cost per cutting carried, dearest first; repeat while any closes.
  const drop = () => {
    for (let pass = 0; pass < 5 && !stop(); pass++) {
      const order: number[] = [];
      for (let gf = 0; gf < s.open.length; gf++) if (s.open[gf] && p.gfLocked[gf] === 0) order.push(gf);
      order.sort((a, b) => (priority ? priority[a] - priority[b] : 0) || c.visitCost[b] / s.gfUse[b] - c.visitCost[a] / s.gfUse[a] || a - b);
      let closed = 0;
      for (const gf of order) {
        if (stop()) break;
        forget();
        if (close(gf)) closed++;
      }
      if (closed === 0) break;
    }
  };

  // Consolidate: for a grower, open a farm it does not visit yet and close as many of its
  // visits as the wood allows, dearest first; kept when the visits closed cost more than the
  // one opened.
  const consolidate = (maxTries: number) => {
    let improved = 0;
    for (let g = 0; g < p.growerIds.length && !stop(); g++) {
      const mine: number[] = [];
      const others: number[] = [];
      for (let a = ix.growerStart[g]; a < ix.growerStart[g + 1]; a++) {
        const gf = ix.growerGf[a];
        if (p.gfLocked[gf] > 0) continue;
        if (s.open[gf]) mine.push(gf);
        else others.push(gf);
      }
      if (mine.length === 0) continue;
      mine.sort((a, b) => c.visitCost[b] - c.visitCost[a] || a - b);
      let total = 0;
      for (const gf of mine) total += c.visitCost[gf];
      others.sort((a, b) => c.visitCost[a] - c.visitCost[b] || a - b);
      // Lines (bits, by position among the grower's lines) each farm could serve, and those the
      // open visits serve now: a farm that serves none of the latter cannot replace a visit.
      const bitOf = new Map<number, number>();
      const linesOf = (gf: number, used: boolean) => {
        let mask = 0;
        for (let b = ix.gfStart[gf]; b < ix.gfStart[gf + 1]; b++) {
          const k = ix.gfArcs[b];
          if (used && s.x[k] <= 0) continue;
          const l = p.arcLine[k];
          let bit = bitOf.get(l);
          if (bit === undefined) bitOf.set(l, (bit = bitOf.size < 31 ? 1 << bitOf.size : 0x7fffffff));
          mask |= bit;
        }
        return mask;
      };
      const servedBy = mine.map((gf) => linesOf(gf, true));
      let served = 0;
      for (const mask of servedBy) served |= mask;
      let tries = 0;
      for (const inn of others) {
        if (c.visitCost[inn] >= total) break;
        const could = linesOf(inn, false);
        if ((could & served) === 0) continue;
        if (++tries > maxTries) break;
        forget();
        const m = mark();
        const before = openCost;
        setOpen(inn, 1);
        // Only visits with a line the new farm could take over.
        mine.forEach((out, i) => {
          if (servedBy[i] & could) close(out);
        });
        if (s.gfUse[inn] <= 0) setOpen(inn, 0);
        if (openCost < before - 1e-9) {
          improved++;
          break;
        }
        undo(m);
      }
    }
    return improved;
  };

  const trace = opts.trace ?? (() => {});
  drop();
  trace(`drop: visits cost ${openCost.toFixed(1)}`);
  // Consolidation passes while a pass still saves a fifth of a per cent: the later passes cost
  // as much as the first and find little (measured on the benchmark's cooperative).
  for (let pass = 0; pass < 10 && opts.consolidate !== false && !stop(); pass++) {
    const before = openCost;
    if (consolidate(CONSOLIDATE_TRIES) === 0) break;
    drop();
    trace(`consolidate and drop: visits cost ${openCost.toFixed(1)}`);
    if (openCost > before * (1 - MIN_PASS_GAIN)) break;
  }
  return s.x;
}

/**
 * A lower bound on the travel objective that needs no solver: every line that must get at least
 * one more cutting needs a visit to some farm that can give it one. Per grower that is a set
 * cover of its lines by farms, solved exactly over subsets of the lines (a grower has a handful).
 * Capacities, limits and amounts beyond one cutting are left out, so it is weaker than the LP,
 * but it always holds and takes milliseconds. Includes the locked visits (always made).
 */
export function coverBound(c: Ctx, floors: Float64Array): number {
  const { p } = c;
  const ix = buildIndex(c);
  let total = 0;
  for (let gf = 0; gf < p.gfGrower.length; gf++) if (p.gfLocked[gf] > 0) total += c.visitCost[gf];
  // Lines of each grower that need a visit (at least one cutting more, no locked visit to rely on).
  const linesOf = new Map<number, number[]>();
  for (let l = 0; l < p.lines.length; l++) {
    if (!(floors[l] >= 1)) continue;
    const g = p.lineGrower[l];
    (linesOf.get(g) ?? linesOf.set(g, []).get(g)!).push(l);
  }
  for (const [g, lines] of linesOf) {
    const bit = new Map<number, number>();
    // A line served by a farm visited anyway (a locked bundle) needs nothing more.
    const need: number[] = [];
    for (const l of lines) {
      let free = false;
      for (let k = c.lineStart[l]; k < c.lineStart[l + 1]; k++) if (p.gfLocked[p.arcGf[k]] > 0) free = true;
      if (!free) need.push(l);
    }
    if (need.length === 0) continue;
    if (need.length > 16) {
      // Too many lines for subsets: one visit at least, the cheapest that serves any of them.
      let cheapest = Infinity;
      for (const l of need) for (let k = c.lineStart[l]; k < c.lineStart[l + 1]; k++) cheapest = Math.min(cheapest, c.visitCost[p.arcGf[k]]);
      total += Number.isFinite(cheapest) ? cheapest : 0;
      continue;
    }
    need.forEach((l, i) => bit.set(l, 1 << i));
    const masks: { mask: number; cost: number }[] = [];
    for (let a = ix.growerStart[g]; a < ix.growerStart[g + 1]; a++) {
      const gf = ix.growerGf[a];
      if (p.gfLocked[gf] > 0) continue;
      let mask = 0;
      for (let b = ix.gfStart[gf]; b < ix.gfStart[gf + 1]; b++) mask |= bit.get(p.arcLine[ix.gfArcs[b]]) ?? 0;
      if (mask) masks.push({ mask, cost: c.visitCost[gf] });
    }
    const full = (1 << need.length) - 1;
    const best = new Float64Array(full + 1).fill(Infinity);
    best[0] = 0;
    for (let m = 0; m <= full; m++) {
      if (!Number.isFinite(best[m])) continue;
      for (const f of masks) {
        const to = m | f.mask;
        if (to !== m && best[m] + f.cost < best[to]) best[to] = best[m] + f.cost;
      }
    }
    // A line with no farm at all cannot be covered: the problem would be infeasible; count what can be.
    let reach = 0;
    for (const f of masks) reach |= f.mask;
    total += best[reach];
  }
  return total;
}

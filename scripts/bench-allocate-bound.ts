// How far the travel stage's reported gap is from what any answer could reach: solves the
// benchmark cooperative as bench:allocate does, then computes the per-grower decomposition
// bound (allocation-decomposition.ts), which is much slower but much stronger than the LP
// bound the solver reports against.
//   npm run bench:allocate-bound -- --offers 1000 --lines 400 [--seed 1] [--rounds 100]
// Prints progress to stderr and one JSON line last on stdout (travel objective units: km of
// visits plus the tie-break, as stats.stages[2]).
import { arg, cooperative } from './bench-allocate.js';
import { solveAllocation } from '../server/modules/allocation-rounds/allocation-model.js';
import { decompositionBound } from '../server/modules/allocation-rounds/allocation-decomposition.js';

const offers = arg('offers', 1000);
const lines = arg('lines', 400);
const seed = arg('seed', 1);
const input = cooperative(offers, lines, seed);
const solved = await solveAllocation(input, { timeLimitSeconds: arg('time-limit', 60) });
const travel = solved.stats.stages.find((s) => s.name === 'travel')!;
const reportedBound = travel.objective * (1 - solved.stats.gap);
console.error(`solver: travel ${travel.objective.toFixed(3)}, gap ${(100 * solved.stats.gap).toFixed(1)} % (bound ${reportedBound.toFixed(3)}), ${solved.stats.seconds.toFixed(1)} s`);
const d = await decompositionBound(input, solved, { maxRounds: arg('rounds', 100), progress: (m) => console.error(`  ${m}`) });
const best = Math.min(travel.objective, d.restrictedBest);
const gap = (x: number) => Math.round(((best - x) / best) * 1e6) / 1e6;
const round3 = (x: number) => Math.round(x * 1000) / 1000;
console.log(
  JSON.stringify({
    offers,
    lines,
    growers: d.growers,
    solver: { travel: round3(travel.objective), bound: round3(reportedBound), gap: solved.stats.gap, seconds: round3(solved.stats.seconds) },
    decomposition: { bound: round3(d.bound), converged: d.converged, rounds: d.rounds, plans: d.plans, restrictedBest: round3(d.restrictedBest), seconds: round3(d.seconds) },
    best: round3(best),
    gapAgainstDecomposition: gap(d.bound),
  }),
);

// The per-grower decomposition bound of the travel stage (a study tool behind
// bench:allocate-bound): valid (never above a proven optimum), never weaker than the LP
// relaxation, and exact on a hand-worked case where the LP relaxation is not.
import { describe, expect, it } from 'vitest';
import { destination, type LatLon } from '../../../../shared/geo.js';
import { cooperative } from '../../../../scripts/bench-allocate.js';
import { prepare } from '../allocation-arcs.js';
import { decompositionBound } from '../allocation-decomposition.js';
import { highs, runStage } from '../allocation-highs.js';
import { type AllocInput, type AllocResult, fairFloors, solveAllocation } from '../allocation-model.js';
import { buildMaster, context } from '../allocation-stages.js';

/** The travel stage's LP relaxation over every arc, as the solver poses it. */
async function travelLp(input: AllocInput, result: AllocResult): Promise<number> {
  const c = context(prepare(input), input.farmVisitKm);
  const floors = fairFloors(c, result.stats.stages[0].objective);
  const m = buildMaster(c, Array.from({ length: c.n }, (_, k) => k), { kind: 'travel', integer: false, floors, volume: result.stats.totalCuttings });
  const run = runStage(await highs(), m.model, { timeLimit: 60 });
  expect(run.status).toBe('optimal');
  return run.objective;
}

const home: LatLon = { lat: 47.2, lon: 8.6 };
const at = (azimuth: number, km: number) => destination(home, azimuth, km * 1000);

describe('decomposition bound', () => {
  it('is exact where the LP relaxation splits visits in halves (worked by hand)', async () => {
    // One grower asks 5 cuttings each of a, b and c. Farm 1 has a and c, farm 2 a and b, farm 3
    // b and c, 10 of each; every visit costs 10 km (farmVisitKm). Any whole answer visits two
    // farms (20 km); the LP visits each farm half (15 km), each line taking half from each of
    // its two farms.
    const farms = [
      { id: 'f1', at: at(0, 3), varieties: ['a', 'c'] },
      { id: 'f2', at: at(120, 3), varieties: ['a', 'b'] },
      { id: 'f3', at: at(240, 3), varieties: ['b', 'c'] },
    ];
    const input: AllocInput = {
      offers: farms.flatMap((f) => f.varieties.map((v) => ({ id: `${f.id}-${v}`, plantId: `p-${f.id}-${v}`, farmId: f.id, speciesId: 's', varietyId: v, available: 10, lat: f.at.lat, lon: f.at.lon }))),
      lines: ['a', 'b', 'c'].map((v) => ({ id: `line-${v}`, growerId: 'g', speciesId: 's', varietyId: v, cuttings: 5, substitutesAllowed: false, priority: 1, maxDistanceKm: 20, lat: home.lat, lon: home.lon })),
      farmVisitKm: 10,
    };
    const solved = await solveAllocation(input, { travelGap: 0 });
    const travel = solved.stats.stages[2].objective;
    expect(solved.stats.totalCuttings).toBe(15);
    // Every farm is 3 km from the grower, so the tie-break is the same 15 cuttings x 3 km x tau
    // (under 5 km, half the cheapest visit) in both, and they differ by exactly half a visit.
    expect(travel).toBeGreaterThan(20);
    expect(travel).toBeLessThan(25);
    const lp = await travelLp(input, solved);
    expect(travel - lp).toBeCloseTo(5, 6);
    const d = await decompositionBound(input, solved);
    expect(d.converged).toBe(true);
    expect(d.bound).toBeCloseTo(travel, 6);
    expect(d.restrictedBest).toBeCloseTo(travel, 6);
  });

  // Small cooperatives from the benchmark's generator, solved to a proven optimum (gap 0).
  it.each([1, 2, 3])('lies between the LP relaxation and the proven optimum (benchmark cooperative, seed %i)', async (seed) => {
    const input = cooperative(40, 16, seed);
    const solved = await solveAllocation(input, { travelGap: 0, timeLimitSeconds: 60 });
    expect(solved.stats.gap).toBeLessThan(1e-6);
    const travel = solved.stats.stages[2].objective;
    const lp = await travelLp(input, solved);
    const d = await decompositionBound(input, solved);
    expect(d.converged).toBe(true);
    expect(d.bound).toBeGreaterThanOrEqual(lp - 1e-6 * Math.max(1, lp));
    expect(d.bound).toBeLessThanOrEqual(travel + 1e-6 * Math.max(1, travel));
    expect(d.restrictedBest).toBeGreaterThanOrEqual(travel - 1e-6 * Math.max(1, travel));
  });
});

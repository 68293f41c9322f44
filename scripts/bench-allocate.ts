// Benchmark of the allocation model on a made-up cooperative, reproducible from its seed.
//   npm run bench:allocate -- --offers 5000 --lines 2000 [--seed 1] [--time-limit 60] [--gap 0.005]
// Prints progress to stderr and one JSON line last on stdout.
import { loadavg } from 'node:os';
import { pathToFileURL } from 'node:url';
import { destination, type LatLon } from '../shared/geo.js';
import { type AllocInput, type AllocLine, type AllocOffer, greedyAllocation, solveAllocation } from '../server/modules/allocation-rounds/allocation-model.js';
import { prng } from '../tests/fixtures/prng.js';

/** A numeric `--name value` from the command line, or the fallback. */
export function arg(name: string, fallback: number): number {
  const i = process.argv.indexOf(`--${name}`);
  if (i < 0) return fallback;
  const v = Number(process.argv[i + 1]);
  if (!Number.isFinite(v)) throw new Error(`--${name} needs a number`);
  return v;
}

/**
 * A cooperative in a region 60 km across: about 25 offers per farm, 12 species with varieties
 * in proportion to the offers' number, popular varieties offered (and asked) more, but the
 * asking skewed differently from the offering so some varieties run short; growers with 1-7
 * lines each, a quarter of lines for any variety, a third allowing substitutes, a few with
 * higher or lower priority, distance limits of 10-40 km, and per-grower limits on some farms.
 */
export function cooperative(offerCount: number, lineCount: number, seed: number): AllocInput {
  const rnd = prng(seed);
  const int = (lo: number, hi: number) => lo + Math.floor(rnd() * (hi - lo + 1));
  const pick = <T>(xs: readonly T[]) => xs[Math.floor(rnd() * xs.length)];
  const centre: LatLon = { lat: 47.2, lon: 8.6 };
  const somewhere = () => destination(centre, rnd() * 360, 30_000 * Math.sqrt(rnd()));
  const pad = (i: number, w = 6) => String(i).padStart(w, '0');

  const farmCount = Math.max(5, Math.round(offerCount / 25));
  const farms = Array.from({ length: farmCount }, (_, i) => ({ id: `farm-${pad(i)}`, at: somewhere(), size: 0.3 + rnd() * 1.7 }));
  const farmWeights = farms.map((f) => f.size);

  const speciesCount = 12;
  const perSpecies = Math.max(3, Math.round(10 * Math.sqrt(offerCount / 5000)));
  type Variety = { species: string; id: string; supply: number; demand: number };
  const varieties: Variety[] = [];
  const species = Array.from({ length: speciesCount }, (_, s) => `species-${pad(s, 2)}`);
  const speciesWeight = species.map(() => 0.4 + rnd());
  for (const s of species) {
    for (let v = 0; v < perSpecies; v++) {
      // Zipf-like supply, and a demand that favours some rarely offered varieties.
      const supply = 1 / (v + 1);
      const demand = rnd() < 0.2 ? 2 / (v + 1) + 0.5 : 1 / (v + 1) ** 0.7;
      varieties.push({ species: s, id: `${s}-v${pad(v, 3)}`, supply, demand });
    }
  }
  const weighted = <T>(xs: T[], w: (x: T) => number) => {
    const cum: number[] = [];
    let s = 0;
    for (const x of xs) cum.push((s += w(x)));
    return () => {
      const r = rnd() * s;
      let lo = 0;
      let hi = cum.length - 1;
      while (lo < hi) {
        const mid = (lo + hi) >> 1;
        if (cum[mid] < r) lo = mid + 1;
        else hi = mid;
      }
      return xs[lo];
    };
  };
  const farmOf = weighted(farms, (f) => f.size);
  void farmWeights;
  const offeredVariety = weighted(varieties, (v) => v.supply * speciesWeight[species.indexOf(v.species)]);
  const askedVariety = weighted(varieties, (v) => v.demand * speciesWeight[species.indexOf(v.species)]);

  const offers: AllocOffer[] = Array.from({ length: offerCount }, (_, i) => {
    const farm = farmOf();
    const v = offeredVariety();
    return {
      id: `offer-${pad(i)}`,
      plantId: `plant-${pad(i)}`,
      farmId: farm.id,
      speciesId: v.species,
      varietyId: rnd() < 0.04 ? null : v.id,
      available: int(4, 40),
      lat: farm.at.lat,
      lon: farm.at.lon,
    };
  });

  const lines: AllocLine[] = [];
  let g = 0;
  while (lines.length < lineCount) {
    const home = rnd() < 0.5 ? pick(farms).at : somewhere();
    const n = Math.min(lineCount - lines.length, int(1, 7));
    const limitKm = pick([10, 15, 20, 25, 30, 40]);
    for (let j = 0; j < n; j++) {
      const v = askedVariety();
      const any = rnd() < 0.25;
      const r = rnd();
      lines.push({
        id: `line-${pad(lines.length)}`,
        growerId: `grower-${pad(g)}`,
        speciesId: v.species,
        varietyId: any ? null : v.id,
        cuttings: int(5, 40),
        substitutesAllowed: !any && rnd() < 0.35,
        priority: r < 0.08 ? 2 : r < 0.12 ? 0.5 : 1,
        maxDistanceKm: rnd() < 0.8 ? limitKm : pick([10, 20, 30]),
        lat: home.lat,
        lon: home.lon,
      });
    }
    g++;
  }
  const farmLimits: Record<string, number> = {};
  for (const f of farms) if (rnd() < 0.3) farmLimits[f.id] = pick([20, 30, 50, 80]);
  return { offers, lines, farmLimits };
}

async function main() {
  const offers = arg('offers', 5000);
  const lines = arg('lines', 2000);
  const seed = arg('seed', 1);
  const timeLimitSeconds = arg('time-limit', 60);
  const travelGap = arg('gap', 0.005);
  const input = cooperative(offers, lines, seed);
  const wood = input.offers.reduce((s, o) => s + o.available, 0);
  const asked = input.lines.reduce((s, l) => s + l.cuttings, 0);
  console.error(`cooperative: ${offers} offers (${wood} cuttings), ${lines} lines (${asked} cuttings asked), seed ${seed}`);
  // The machine is shared: the load average and this process's CPU time go with the wall time.
  const load = loadavg()[0];
  const cpu0 = process.cpuUsage();
  const result = await solveAllocation(input, { timeLimitSeconds, travelGap });
  const cpu = process.cpuUsage(cpu0);
  for (const s of result.stats.stages) console.error(`  ${s.name}: ${s.status}, objective ${s.objective}, ${s.seconds} s`);
  const greedy = greedyAllocation(input);
  console.error(`solved in ${result.stats.seconds.toFixed(2)} s; greedy in ${greedy.stats.seconds.toFixed(2)} s`);
  const round = (x: number, d = 4) => Math.round(x * 10 ** d) / 10 ** d;
  console.log(
    JSON.stringify({
      offers,
      lines,
      arcs: result.stats.arcs,
      seconds: round(result.stats.seconds, 3),
      optimal: result.stats.optimal,
      gap: round(result.stats.gap, 6),
      minFill: round(result.stats.minFill),
      totalCuttings: result.stats.totalCuttings,
      travelKm: round(result.stats.travelKm, 1),
      greedy: { minFill: round(greedy.stats.minFill), totalCuttings: greedy.stats.totalCuttings, travelKm: round(greedy.stats.travelKm, 1) },
      cpuSeconds: round((cpu.user + cpu.system) / 1e6, 3),
      loadAvg: round(load, 2),
    }),
  );
}

// Run only when started as a script, so the generator can be imported elsewhere.
if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) await main();

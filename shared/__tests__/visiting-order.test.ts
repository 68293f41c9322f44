import { describe, expect, it } from 'vitest';
import { destination, distanceM, type LatLon } from '../geo.js';
import { visitingOrder } from '../visiting-order.js';

const home: LatLon = { lat: 47.2, lon: 8.6 };
const at = (id: string, azimuth: number, km: number) => ({ id, ...destination(home, azimuth, km * 1000) });

// Memoised: brute force over 8 farms walks 40,320 round trips.
const memo = new Map<string, number>();
function dist(a: LatLon, b: LatLon) {
  const key = `${a.lat},${a.lon},${b.lat},${b.lon}`;
  let m = memo.get(key);
  if (m === undefined) memo.set(key, (m = distanceM(a, b)));
  return m;
}

function tripM(start: LatLon, stops: LatLon[]) {
  let s = 0;
  let from = start;
  for (const p of stops) {
    s += dist(from, p);
    from = p;
  }
  return s + dist(from, start);
}

function permutations<T>(xs: T[]): T[][] {
  if (xs.length <= 1) return [xs];
  return xs.flatMap((x, i) => permutations([...xs.slice(0, i), ...xs.slice(i + 1)]).map((rest) => [x, ...rest]));
}

describe('visiting order', () => {
  const six = [at('f1', 10, 12), at('f2', 200, 8), at('f3', 95, 20), at('f4', 300, 15), at('f5', 150, 5), at('f6', 45, 25)];

  it('on 6 farms equals the brute-force shortest round trip', () => {
    const r = visitingOrder(home, six);
    expect(r.exact).toBe(true);
    expect(r.order).toHaveLength(6);
    expect(new Set(r.order)).toEqual(new Set(six.map((f) => f.id)));
    const best = Math.min(...permutations(six).map((p) => tripM(home, p)));
    expect(r.totalM).toBeCloseTo(best, 3);
    const byId = new Map(six.map((f) => [f.id, f]));
    expect(tripM(home, r.order.map((id) => byId.get(id)!))).toBeCloseTo(r.totalM, 3);
  });

  it('beats a worse order', () => {
    const r = visitingOrder(home, six);
    // Zig-zag across the grower's place: clearly longer.
    const zigzag = ['f1', 'f2', 'f6', 'f5', 'f4', 'f3'].map((id) => six.find((f) => f.id === id)!);
    expect(tripM(home, zigzag)).toBeGreaterThan(r.totalM + 1000);
  });

  it('does not depend on the order farms are given in', () => {
    const a = visitingOrder(home, six);
    const b = visitingOrder(home, [...six].reverse());
    expect(b).toEqual(a);
  });

  it('handles no farm and one farm', () => {
    expect(visitingOrder(home, [])).toEqual({ order: [], totalM: 0, exact: true });
    const one = at('only', 90, 10);
    const r = visitingOrder(home, [one]);
    expect(r.order).toEqual(['only']);
    expect(r.totalM).toBeCloseTo(2 * distanceM(home, one), 6);
  });

  it('beyond 8 farms uses nearest neighbour with 2-opt: a full round trip, no worse than random orders', () => {
    const many = Array.from({ length: 14 }, (_, i) => at(`g${String(i).padStart(2, '0')}`, (i * 137) % 360, 3 + ((i * 7) % 25)));
    const r = visitingOrder(home, many);
    expect(r.exact).toBe(false);
    expect(new Set(r.order).size).toBe(14);
    const byId = new Map(many.map((f) => [f.id, f]));
    expect(tripM(home, r.order.map((id) => byId.get(id)!))).toBeCloseTo(r.totalM, 3);
    let seed = 7;
    const rnd = () => ((seed = (seed * 48271) % 2147483647) / 2147483647);
    for (let k = 0; k < 50; k++) {
      const shuffled = [...many].sort(() => rnd() - 0.5);
      expect(r.totalM).toBeLessThanOrEqual(tripM(home, shuffled) + 1e-6);
    }
  });

  it('exact up to 8 farms', () => {
    const eight = Array.from({ length: 8 }, (_, i) => at(`h${i}`, (i * 97) % 360, 4 + ((i * 11) % 17)));
    const r = visitingOrder(home, eight);
    expect(r.exact).toBe(true);
    const best = Math.min(...permutations(eight).map((p) => tripM(home, p)));
    expect(r.totalM).toBeCloseTo(best, 3);
  });
});

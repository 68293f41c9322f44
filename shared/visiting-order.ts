// The order in which a grower visits the farms of a pickup: the shortest round trip from the
// grower's place through every farm and back. Exact for up to EXACT_LIMIT farms (every order
// is considered, with pruning); beyond that nearest neighbour improved by 2-opt, which is
// usually within a few per cent. Distances are geodesic (shared/geo.ts), straight lines rather
// than roads: a good order on the map, not a road route.
import { distanceM, type LatLon } from './geo.js';

export const EXACT_LIMIT = 8;

export type VisitingOrder = { order: string[]; totalM: number; exact: boolean };

export function visitingOrder(start: LatLon, farms: readonly { id: string; lat: number; lon: number }[]): VisitingOrder {
  // Sorted by id so that the same farms in any order give the same answer.
  const stops = [...farms].sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
  const n = stops.length;
  if (n === 0) return { order: [], totalM: 0, exact: true };
  // Node 0 is the start, node i + 1 is stops[i]; the matrix is made symmetric on purpose.
  const places: LatLon[] = [start, ...stops];
  const size = n + 1;
  const d = new Float64Array(size * size);
  for (let i = 0; i < size; i++) {
    for (let j = i + 1; j < size; j++) {
      const m = distanceM(places[i], places[j]);
      d[i * size + j] = m;
      d[j * size + i] = m;
    }
  }
  const tourLength = (tour: readonly number[]) => {
    let s = d[tour[0]] + d[tour[tour.length - 1] * size];
    for (let i = 1; i < tour.length; i++) s += d[tour[i - 1] * size + tour[i]];
    return s;
  };
  const ids = (tour: readonly number[]) => tour.map((i) => stops[i - 1].id);

  if (n <= EXACT_LIMIT) {
    const tour = exactTour(d, size);
    return { order: ids(tour), totalM: tourLength(tour), exact: true };
  }
  const tour = twoOpt(nearestNeighbour(d, size), d, size);
  return { order: ids(tour), totalM: tourLength(tour), exact: false };
}

// Depth-first over all orders in lexicographic order, cutting branches already longer than the
// best round trip; a later order replaces the best only when shorter by more than a micrometre,
// so ties (a trip and its reverse) resolve to the first in that order.
function exactTour(d: Float64Array, size: number): number[] {
  const n = size - 1;
  let best = Infinity;
  let bestTour: number[] = [];
  const path: number[] = [];
  const used = new Uint8Array(size);
  const visit = (last: number, length: number) => {
    if (length >= best - 1e-6) return;
    if (path.length === n) {
      const total = length + d[last * size];
      if (total < best - 1e-6) {
        best = total;
        bestTour = [...path];
      }
      return;
    }
    for (let next = 1; next <= n; next++) {
      if (used[next]) continue;
      used[next] = 1;
      path.push(next);
      visit(next, length + d[last * size + next]);
      path.pop();
      used[next] = 0;
    }
  };
  visit(0, 0);
  return bestTour;
}

function nearestNeighbour(d: Float64Array, size: number): number[] {
  const used = new Uint8Array(size);
  const tour: number[] = [];
  let at = 0;
  for (let step = 1; step < size; step++) {
    let next = -1;
    for (let j = 1; j < size; j++) if (!used[j] && (next < 0 || d[at * size + j] < d[at * size + next])) next = j;
    used[next] = 1;
    tour.push(next);
    at = next;
  }
  return tour;
}

// Reverse a stretch of the trip whenever that shortens it, until no reversal does. The start
// (node 0) stays fixed at both ends.
function twoOpt(tour: number[], d: Float64Array, size: number): number[] {
  const t = [0, ...tour, 0];
  let improved = true;
  while (improved) {
    improved = false;
    for (let i = 1; i < t.length - 2; i++) {
      for (let k = i + 1; k < t.length - 1; k++) {
        const before = d[t[i - 1] * size + t[i]] + d[t[k] * size + t[k + 1]];
        const after = d[t[i - 1] * size + t[k]] + d[t[i] * size + t[k + 1]];
        if (after < before - 1e-6) {
          for (let a = i, b = k; a < b; a++, b--) [t[a], t[b]] = [t[b], t[a]];
          improved = true;
        }
      }
    }
  }
  return t.slice(1, -1);
}

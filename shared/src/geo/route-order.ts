// Orders the stops of a day to keep driving short: a closed tour that starts and ends at the shop.
// Point 0 of the matrix is the shop; an order is a permutation of the stops 1..n-1. Symmetric
// distances are assumed (great-circle distances are).

/** Up to this many stops the order is exact (dynamic programming over subsets); above it, heuristic. */
export const EXACT_ORDER_MAX_STOPS = 10;

const pointCount = (matrix: Float64Array) => Math.round(Math.sqrt(matrix.length));

/** Length of the tour shop → order… → shop. */
export function tourLength(matrix: Float64Array, order: readonly number[]): number {
  const n = pointCount(matrix);
  let length = 0;
  let previous = 0;
  for (const stop of order) {
    length += matrix[previous * n + stop];
    previous = stop;
  }
  return length + matrix[previous * n];
}

/** Nearest neighbour: from the shop, always drive to the closest stop not yet visited (ties: lower index). */
export function nearestNeighbourOrder(matrix: Float64Array): number[] {
  const n = pointCount(matrix);
  const visited = new Uint8Array(n);
  const order: number[] = [];
  let current = 0;
  for (let step = 1; step < n; step++) {
    let best = -1;
    let bestDistance = Infinity;
    for (let candidate = 1; candidate < n; candidate++) {
      if (visited[candidate]) continue;
      const d = matrix[current * n + candidate];
      if (d < bestDistance) {
        bestDistance = d;
        best = candidate;
      }
    }
    visited[best] = 1;
    order.push(best);
    current = best;
  }
  return order;
}

/**
 * 2-opt: reverses a stretch of the tour whenever that shortens it, until no reversal does. The shop
 * stays first and last. Answers a new order, never longer than the one given.
 */
export function improveByTwoOpt(matrix: Float64Array, order: readonly number[]): number[] {
  const n = pointCount(matrix);
  const tour = [0, ...order, 0];
  const last = tour.length - 2;
  let improved = true;
  while (improved) {
    improved = false;
    for (let i = 1; i < last; i++) {
      const a = tour[i - 1];
      const b = tour[i];
      for (let k = i + 1; k <= last; k++) {
        const c = tour[k];
        const d = tour[k + 1];
        const delta = matrix[a * n + c] + matrix[b * n + d] - matrix[a * n + b] - matrix[c * n + d];
        if (delta < -1e-9) {
          for (let lo = i, hi = k; lo < hi; lo++, hi--) [tour[lo], tour[hi]] = [tour[hi], tour[lo]];
          improved = true;
          break;
        }
      }
    }
  }
  return tour.slice(1, -1);
}

/** The shortest tour by dynamic programming over subsets (Held–Karp); for EXACT_ORDER_MAX_STOPS stops at most. */
export function exactOrder(matrix: Float64Array): number[] {
  const n = pointCount(matrix);
  const stops = n - 1;
  if (stops <= 1) return stops === 1 ? [1] : [];
  const full = (1 << stops) - 1;
  // cost[mask * stops + j]: shortest path from the shop through the stops of mask, ending at stop j (in mask).
  const cost = new Float64Array((full + 1) * stops).fill(Infinity);
  const parent = new Int8Array((full + 1) * stops).fill(-1);
  for (let j = 0; j < stops; j++) cost[(1 << j) * stops + j] = matrix[j + 1];
  for (let mask = 1; mask <= full; mask++) {
    for (let j = 0; j < stops; j++) {
      const here = cost[mask * stops + j];
      if (!(mask & (1 << j)) || here === Infinity) continue;
      for (let k = 0; k < stops; k++) {
        if (mask & (1 << k)) continue;
        const next = mask | (1 << k);
        const through = here + matrix[(j + 1) * n + k + 1];
        if (through < cost[next * stops + k] - 1e-12) {
          cost[next * stops + k] = through;
          parent[next * stops + k] = j;
        }
      }
    }
  }
  let end = 0;
  let best = Infinity;
  for (let j = 0; j < stops; j++) {
    const total = cost[full * stops + j] + matrix[(j + 1) * n];
    if (total < best - 1e-12) {
      best = total;
      end = j;
    }
  }
  const order: number[] = [];
  let mask = full;
  for (let j = end; j !== -1; ) {
    order.push(j + 1);
    const previous = parent[mask * stops + j];
    mask &= ~(1 << j);
    j = previous;
  }
  return order.reverse();
}

/**
 * The day's order of stops: exact up to EXACT_ORDER_MAX_STOPS stops, otherwise nearest neighbour
 * improved by 2-opt. Never longer than the order the stops were given in (1, 2, … n-1).
 */
export function orderStops(matrix: Float64Array): number[] {
  const n = pointCount(matrix);
  if (n - 1 <= EXACT_ORDER_MAX_STOPS) return exactOrder(matrix);
  const given = Array.from({ length: n - 1 }, (_, i) => i + 1);
  const improved = improveByTwoOpt(matrix, nearestNeighbourOrder(matrix));
  return tourLength(matrix, improved) <= tourLength(matrix, given) ? improved : improveByTwoOpt(matrix, given);
}

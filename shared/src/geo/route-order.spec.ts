import { distanceMatrix, type LatLng } from './great-circle';
import { exactOrder, improveByTwoOpt, nearestNeighbourOrder, orderStops, tourLength, EXACT_ORDER_MAX_STOPS } from './route-order';

function randomPoints(count: number, seed: number, spread = 0.2): LatLng[] {
  let state = seed;
  const next = () => ((state = (state * 1_103_515_245 + 12_345) % 2_147_483_648) / 2_147_483_648);
  return Array.from({ length: count }, () => ({ latitude: 38.8 + spread * (next() - 0.5), longitude: -104.8 + spread * (next() - 0.5) }));
}

/** The shortest tour by trying every permutation of the stops (independent of the code under test). */
function bruteForceShortest(matrix: Float64Array, stops: number): number {
  const items = Array.from({ length: stops }, (_, i) => i + 1);
  let best = Infinity;
  const permute = (k: number) => {
    if (k === items.length) {
      best = Math.min(best, tourLength(matrix, items));
      return;
    }
    for (let i = k; i < items.length; i++) {
      [items[k], items[i]] = [items[i], items[k]];
      permute(k + 1);
      [items[k], items[i]] = [items[i], items[k]];
    }
  };
  permute(0);
  return best;
}

const isPermutation = (order: readonly number[], stops: number) => [...order].sort((a, b) => a - b).join(',') === Array.from({ length: stops }, (_, i) => i + 1).join(',');

describe('tourLength', () => {
  it('adds the legs from the shop through the stops and back', () => {
    // Shop at 0, stops on a line at 1, 2 and 3 units: 0→1→2→3→0 is 1+1+1+3.
    const m = new Float64Array([0, 1, 2, 3, 1, 0, 1, 2, 2, 1, 0, 1, 3, 2, 1, 0]);
    expect(tourLength(m, [1, 2, 3])).toBe(6);
    expect(tourLength(m, [2, 1, 3])).toBe(8);
  });
});

describe('orderStops', () => {
  it('finds the shortest tour for every day of 1 to 8 stops (checked against all permutations)', () => {
    for (let stops = 1; stops <= 8; stops++) {
      for (let seed = 1; seed <= 6; seed++) {
        const m = distanceMatrix(randomPoints(stops + 1, stops * 100 + seed));
        const order = orderStops(m);
        expect(isPermutation(order, stops)).toBe(true);
        expect(tourLength(m, order)).toBeCloseTo(bruteForceShortest(m, stops), 9);
      }
    }
  });

  it('is never longer than the order the stops came in, nor than nearest neighbour alone, for 11 to 200 stops', () => {
    for (const stops of [EXACT_ORDER_MAX_STOPS + 1, 25, 60, 200]) {
      for (let seed = 1; seed <= 3; seed++) {
        const m = distanceMatrix(randomPoints(stops + 1, stops + seed, 1));
        const order = orderStops(m);
        const given = Array.from({ length: stops }, (_, i) => i + 1);
        expect(isPermutation(order, stops)).toBe(true);
        expect(tourLength(m, order)).toBeLessThanOrEqual(tourLength(m, given) + 1e-9);
        expect(tourLength(m, order)).toBeLessThanOrEqual(tourLength(m, nearestNeighbourOrder(m)) + 1e-9);
      }
    }
  });

  it('answers an empty day and a one-stop day', () => {
    expect(orderStops(distanceMatrix(randomPoints(1, 1)))).toEqual([]);
    expect(orderStops(distanceMatrix(randomPoints(2, 1)))).toEqual([1]);
  });
});

describe('nearestNeighbourOrder and improveByTwoOpt', () => {
  it('nearest neighbour goes to the closest unvisited stop each time', () => {
    // Stops on a line east of the shop at 3, 1 and 2 units: nearest first is 2 (at 1), then 3 (at 2), then 1 (at 3).
    const xs = [0, 3, 1, 2];
    const m = new Float64Array(16);
    for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) m[i * 4 + j] = Math.abs(xs[i] - xs[j]);
    expect(nearestNeighbourOrder(m)).toEqual([2, 3, 1]);
  });

  it('2-opt removes a crossing of two legs', () => {
    // A unit square with the shop at one corner: visiting the corners crosswise is longer than around.
    const corners = [[0, 0], [1, 0], [0, 1], [1, 1]];
    const m = new Float64Array(16);
    for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) m[i * 4 + j] = Math.hypot(corners[i][0] - corners[j][0], corners[i][1] - corners[j][1]);
    const crossing = [1, 2, 3];
    const improved = improveByTwoOpt(m, crossing);
    expect(tourLength(m, improved)).toBeCloseTo(4, 9);
    expect(tourLength(m, crossing)).toBeGreaterThan(4);
  });

  it('exactOrder matches brute force on 9 and 10 stops too', () => {
    for (const stops of [9, 10]) {
      const m = distanceMatrix(randomPoints(stops + 1, 42 + stops));
      if (stops === 9) expect(tourLength(m, exactOrder(m))).toBeCloseTo(bruteForceShortest(m, stops), 9);
      else expect(isPermutation(exactOrder(m), stops)).toBe(true);
    }
  });
});

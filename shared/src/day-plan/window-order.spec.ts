import { distanceMatrix, type LatLng } from '../geo/great-circle';
import { exactOrder, tourLength } from '../geo/route-order';
import { orderCost, orderWithinWindows, type WindowedStop } from './window-order';

function randomPoints(count: number, seed: number): LatLng[] {
  let state = seed;
  const next = () => ((state = (state * 1_103_515_245 + 12_345) % 2_147_483_648) / 2_147_483_648);
  return Array.from({ length: count }, () => ({ latitude: 38.8 + 0.2 * (next() - 0.5), longitude: -104.8 + 0.2 * (next() - 0.5) }));
}

/** Drive minutes at 30 mph with roads 1.3 times the line (fractions kept, as the planner keeps them). */
const minutesMatrix = (km: Float64Array) => km.map((d) => ((d / 1.609344) * 1.3 * 60) / 30);

function permutations(n: number): number[][] {
  if (n === 0) return [[]];
  return permutations(n - 1).flatMap((p) => Array.from({ length: n }, (_, i) => [...p.slice(0, i), n, ...p.slice(i)]));
}

const DAY_START = 450; // 07:30

describe('orderWithinWindows', () => {
  it('is the shortest drive when every window is open all day', () => {
    for (let stops = 2; stops <= 7; stops++) {
      const km = distanceMatrix(randomPoints(stops + 1, 900 + stops));
      const open: WindowedStop[] = Array.from({ length: stops }, () => ({ onSiteMinutes: 45, windowFrom: 0, windowTo: 24 * 60 }));
      const order = orderWithinWindows(minutesMatrix(km), open, DAY_START, Array.from({ length: stops }, (_, i) => i + 1));
      expect(tourLength(km, order)).toBeCloseTo(tourLength(km, exactOrder(km)), 9);
    }
  });

  it('keeps a promised window even when a shorter drive would be late for it', () => {
    // Four stops; the one farthest along the shortest loop was promised 08:00–09:00.
    const km = distanceMatrix(randomPoints(5, 77));
    const minutes = minutesMatrix(km);
    const shortest = exactOrder(km);
    const last = shortest[shortest.length - 1];
    const stops: WindowedStop[] = [1, 2, 3, 4].map((i) => (i === last ? { onSiteMinutes: 60, windowFrom: 480, windowTo: 540 } : { onSiteMinutes: 60, windowFrom: 0, windowTo: 1440 }));
    expect(orderCost(minutes, stops, shortest, DAY_START).lateMinutes).toBeGreaterThan(0);
    const order = orderWithinWindows(minutes, stops, DAY_START, shortest);
    expect(orderCost(minutes, stops, order, DAY_START).lateMinutes).toBe(0);
  });

  it('finds the best order by lateness, then return time, then drive (checked against every order up to 7 stops)', () => {
    for (let stops = 2; stops <= 7; stops++) {
      for (let seed = 1; seed <= 3; seed++) {
        const minutes = minutesMatrix(distanceMatrix(randomPoints(stops + 1, stops * 31 + seed)));
        const windows: WindowedStop[] = Array.from({ length: stops }, (_, i) => {
          const from = DAY_START + ((i * 97 + seed * 41) % 300);
          return { onSiteMinutes: 30 + ((i * 13) % 40), windowFrom: from, windowTo: from + 120 };
        });
        const order = orderWithinWindows(minutes, windows, DAY_START, Array.from({ length: stops }, (_, i) => i + 1));
        const got = orderCost(minutes, windows, order, DAY_START);
        for (const p of permutations(stops)) {
          const c = orderCost(minutes, windows, p, DAY_START);
          expect(got.lateMinutes).toBeLessThanOrEqual(c.lateMinutes + 1e-9);
          if (Math.abs(got.lateMinutes - c.lateMinutes) < 1e-9) expect(got.backAt).toBeLessThanOrEqual(c.backAt + 1e-9);
        }
      }
    }
  });

  it('leaves more than 8 stops in the order given', () => {
    const minutes = minutesMatrix(distanceMatrix(randomPoints(10, 5)));
    const stops = Array.from({ length: 9 }, () => ({ onSiteMinutes: 30, windowFrom: 0, windowTo: 1440 }));
    const given = [3, 1, 2, 4, 5, 6, 7, 8, 9];
    expect(orderWithinWindows(minutes, stops, DAY_START, given)).toEqual(given);
  });
});

// Orders a day's stops when each has an arrival window the seller was given: among the orders, the
// one that is late by the fewest minutes, then is back at the shop earliest (driving plus waiting for
// windows), then drives least. With windows open all day this is the shortest drive.

/** Up to this many stops every order is weighed (8! = 40,320); above it the drive order stands. */
export const WINDOW_ORDER_MAX_STOPS = 8;

export interface WindowedStop {
  onSiteMinutes: number;
  /** Minutes of the day. */
  windowFrom: number;
  windowTo: number;
}

/** What an order costs, compared in this order. */
export interface OrderCost {
  lateMinutes: number;
  backAt: number;
  driveMinutes: number;
}

const better = (a: OrderCost, b: OrderCost) =>
  a.lateMinutes !== b.lateMinutes ? a.lateMinutes < b.lateMinutes - 1e-9 : Math.abs(a.backAt - b.backAt) > 1e-9 ? a.backAt < b.backAt : a.driveMinutes < b.driveMinutes - 1e-9;

/**
 * The cost of visiting `order` (indices 1..n of `drive`, index 0 the shop) leaving at `dayStart`.
 * `drive` holds drive minutes between points, row-major (fractions allowed).
 */
export function orderCost(drive: Float64Array, stops: readonly WindowedStop[], order: readonly number[], dayStart: number): OrderCost {
  const n = stops.length + 1;
  let clock = dayStart;
  let late = 0;
  let driving = 0;
  let previous = 0;
  for (const stop of order) {
    const leg = drive[previous * n + stop];
    driving += leg;
    clock += leg;
    const s = stops[stop - 1];
    if (clock > s.windowTo) late += clock - s.windowTo;
    clock = Math.max(clock, s.windowFrom) + s.onSiteMinutes;
    previous = stop;
  }
  const back = drive[previous * n];
  return { lateMinutes: late, backAt: clock + back, driveMinutes: driving + back };
}

/**
 * The best order by OrderCost, searched over every order (depth first, dropping a partial order that
 * is already later than the best whole one). Answers `fallback` for more than WINDOW_ORDER_MAX_STOPS stops.
 */
export function orderWithinWindows(drive: Float64Array, stops: readonly WindowedStop[], dayStart: number, fallback: readonly number[]): number[] {
  const count = stops.length;
  if (count > WINDOW_ORDER_MAX_STOPS || count < 2) return [...fallback];
  const n = count + 1;
  let best = [...fallback];
  let bestCost = orderCost(drive, stops, best, dayStart);
  const path: number[] = [];
  const used = new Uint8Array(n);
  const visit = (previous: number, clock: number, late: number, driving: number) => {
    if (late > bestCost.lateMinutes + 1e-9) return;
    if (path.length === count) {
      const cost = { lateMinutes: late, backAt: clock + drive[previous * n], driveMinutes: driving + drive[previous * n] };
      if (better(cost, bestCost)) {
        bestCost = cost;
        best = [...path];
      }
      return;
    }
    for (let next = 1; next < n; next++) {
      if (used[next]) continue;
      const leg = drive[previous * n + next];
      const arrival = clock + leg;
      const s = stops[next - 1];
      used[next] = 1;
      path.push(next);
      visit(next, Math.max(arrival, s.windowFrom) + s.onSiteMinutes, late + Math.max(0, arrival - s.windowTo), driving + leg);
      path.pop();
      used[next] = 0;
    }
  };
  visit(0, dayStart, 0, 0);
  return best;
}

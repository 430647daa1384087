// Pricing engine benchmark: 10,000 items over 500 visits priced by the pure engine, next to a bare
// loop that only looks up and sums the same numbers. Target: ≤ 20 ms per run and ≤ 5× the bare loop.
//
// Method: every contender gets the same untimed warm-up repetitions (V8 compiles each one). Then
// the contenders take turns in blocks of consecutive repetitions, in an order that turns round
// every block, so a slow stretch of the machine falls on all of them alike; the first repetitions
// of each block are not timed, so each contender is timed with its own data warm in the caches
// (timing the bare loop right after the engine would time it cold and flatter the ratio).
// Reported: the median of each, the ratio of the medians, and the median of the per-block ratios.
// Each result is consumed (summed into a printed checksum) so no work can be dropped as unused.
//
// Besides the bare loop, a third loop measures a floor of the engine's own: it allocates one
// breakdown object per line, with the fields the engine returns, and applies no pricing rule.
import { performance } from 'node:perf_hooks';
import { DEMO_RATE_BOOK, priceQuote, type LineBreakdown, type QuoteToPrice, type RateBook } from '@cc/shared';

const VISITS = 500;
const ITEMS = 10_000;
const WARM_UP_RUNS = 100;
const BLOCKS = 21;
const RUNS_PER_BLOCK = 10;
/** Repetitions at the start of each block that are not timed (caches refilled after the others ran). */
const UNTIMED_PER_BLOCK = 3;
const TARGET_MS = 20;
const TARGET_RATIO = 5;

/** Small deterministic generator (a linear congruential step), so every run prices the same quote. */
function sequence(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (Math.imul(state, 1_664_525) + 1_013_904_223) >>> 0;
    return state / 2 ** 32;
  };
}

function buildQuote(book: RateBook): QuoteToPrice {
  const next = sequence(20_260_105);
  const pick = <T>(list: readonly T[]): T => list[Math.floor(next() * list.length)];
  const lineAdders = book.adders.filter((a) => a.effect.kind !== 'minutes-per-visit').map((a) => a.id);
  const visits = Array.from({ length: VISITS }, (_, v) => ({
    key: `visit-${v}`,
    adderIds: next() < 0.2 ? ['panel-shutoff'] : [],
    hasPermit: next() < 0.1,
  }));
  const lines = Array.from({ length: ITEMS }, (_, i) => {
    const entry = pick(book.entries);
    const adderIds = entry.pricing.mode === 'flat' || next() < 0.6 ? [] : [pick(lineAdders)];
    return { key: `item-${i}`, visitKey: `visit-${i % VISITS}`, entryId: entry.id, quantity: 1 + Math.floor(next() * 4), adderIds };
  });
  return { visits, lines };
}

/** The same per-line look-ups and sums without any pricing rule: the floor an engine cannot go below. */
function bareLoop(book: RateBook, quote: QuoteToPrice): number {
  const entries = new Map(book.entries.map((e) => [e.id, e]));
  let minutes = 0;
  let cents = 0;
  for (const line of quote.lines) {
    const pricing = entries.get(line.entryId)!.pricing;
    if (pricing.mode === 'flat') cents += pricing.firstUnitCents + pricing.additionalUnitCents * (line.quantity - 1);
    else {
      minutes += pricing.labourMinutesPerUnit * line.quantity;
      cents += pricing.materialsCentsPerUnit * line.quantity;
    }
  }
  return minutes + cents;
}

/** The bare loop's look-ups plus one breakdown object per line, as the engine returns them; no rule applied. */
function allocateBreakdowns(book: RateBook, quote: QuoteToPrice): number {
  const entries = new Map(book.entries.map((e) => [e.id, e]));
  const lines: LineBreakdown[] = new Array(quote.lines.length);
  for (let i = 0; i < quote.lines.length; i++) {
    const line = quote.lines[i];
    const entry = entries.get(line.entryId)!;
    const pricing = entry.pricing;
    const isFlat = pricing.mode === 'flat';
    const minutes = isFlat ? 0 : pricing.labourMinutesPerUnit * line.quantity;
    const materials = isFlat ? 0 : pricing.materialsCentsPerUnit * line.quantity;
    lines[i] = {
      key: line.key,
      entryId: entry.id,
      entryName: entry.name,
      code: entry.code,
      mode: pricing.mode,
      quantity: line.quantity,
      labourMinutes: minutes,
      labourCents: 0,
      materialsCostCents: materials,
      materialsMarkupCents: 0,
      materialsCents: materials,
      flatCents: isFlat ? pricing.firstUnitCents + pricing.additionalUnitCents * (line.quantity - 1) : 0,
    };
  }
  return lines.length + lines[lines.length - 1].labourMinutes;
}

function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)];
}

export async function run(): Promise<void> {
  const book = DEMO_RATE_BOOK;
  const quote = buildQuote(book);
  const contenders: { name: string; work: () => number; times: number[] }[] = [
    { name: 'engine (priceQuote)', work: () => priceQuote(book, quote).totalCents, times: [] },
    { name: 'bare summing loop', work: () => bareLoop(book, quote), times: [] },
    { name: 'breakdown allocation alone', work: () => allocateBreakdowns(book, quote), times: [] },
  ];
  let checksum = 0;
  for (const contender of contenders) for (let i = 0; i < WARM_UP_RUNS; i++) checksum += contender.work();
  const blockRatios: number[] = [];
  for (let block = 0; block < BLOCKS; block++) {
    const blockMedians: number[] = [];
    for (let k = 0; k < contenders.length; k++) {
      const contender = contenders[(block + k) % contenders.length];
      const times: number[] = [];
      for (let i = 0; i < RUNS_PER_BLOCK; i++) {
        const start = performance.now();
        checksum += contender.work();
        const ms = performance.now() - start;
        if (i >= UNTIMED_PER_BLOCK) times.push(ms);
      }
      contender.times.push(...times);
      blockMedians[(block + k) % contenders.length] = median(times);
    }
    blockRatios.push(blockMedians[0] / blockMedians[1]);
  }
  const [engine, bare, allocation] = contenders;
  const engineMs = median(engine.times);
  const bareMs = median(bare.times);
  const ratio = engineMs / bareMs;
  const measured = BLOCKS * (RUNS_PER_BLOCK - UNTIMED_PER_BLOCK);
  console.log(`${ITEMS} items over ${VISITS} visits, median of ${measured} runs each (${BLOCKS} alternating blocks) after ${WARM_UP_RUNS} warm-up runs`);
  console.log(`quote total ${priceQuote(book, quote).totalCents} cents; checksum of all runs ${checksum}`);
  for (const c of contenders) console.log(`${`${c.name}:`.padEnd(28)} ${median(c.times).toFixed(3)} ms`);
  console.log(`ratio engine / bare loop: ${ratio.toFixed(1)}× (median of per-block ratios ${median(blockRatios).toFixed(1)}×)`);
  console.log(`allocation alone / bare loop: ${(median(allocation.times) / bareMs).toFixed(1)}×`);
  console.log(
    `target ≤ ${TARGET_MS} ms: ${engineMs <= TARGET_MS ? 'met' : 'NOT met'}; target ≤ ${TARGET_RATIO}× bare loop: ${ratio <= TARGET_RATIO ? 'met' : 'NOT met'}`,
  );
}

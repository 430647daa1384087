// Pricing engine benchmark: 10,000 items over 500 visits priced by the pure engine, next to a bare
// loop that only looks up and sums the same numbers. Target: ≤ 20 ms per run and ≤ 5× the bare loop.
import { performance } from 'node:perf_hooks';
import { DEMO_RATE_BOOK, priceQuote, type QuoteToPrice, type RateBook } from '@cc/shared';

const VISITS = 500;
const ITEMS = 10_000;
const WARM_UP_RUNS = 30;
const MEASURED_RUNS = 101;
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

/** The same look-ups and sums without any pricing rule: the floor an engine cannot go below. */
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

function medianMs(work: () => number): { ms: number; check: number } {
  let check = 0;
  for (let i = 0; i < WARM_UP_RUNS; i++) check = work();
  const times: number[] = [];
  for (let i = 0; i < MEASURED_RUNS; i++) {
    const start = performance.now();
    check = work();
    times.push(performance.now() - start);
  }
  times.sort((a, b) => a - b);
  return { ms: times[Math.floor(times.length / 2)], check };
}

export async function run(): Promise<void> {
  const book = DEMO_RATE_BOOK;
  const quote = buildQuote(book);
  const engine = medianMs(() => priceQuote(book, quote).totalCents);
  const bare = medianMs(() => bareLoop(book, quote));
  const ratio = engine.ms / bare.ms;
  const isFastEnough = engine.ms <= TARGET_MS;
  const isCloseToBare = ratio <= TARGET_RATIO;
  console.log(`${ITEMS} items over ${VISITS} visits, median of ${MEASURED_RUNS} runs after ${WARM_UP_RUNS} warm-up runs`);
  console.log(`engine (priceQuote): ${engine.ms.toFixed(3)} ms  (quote total ${engine.check} cents)`);
  console.log(`bare summing loop:   ${bare.ms.toFixed(3)} ms`);
  console.log(`ratio: ${ratio.toFixed(1)}×`);
  console.log(`target ≤ ${TARGET_MS} ms: ${isFastEnough ? 'met' : 'NOT met'}; target ≤ ${TARGET_RATIO}× bare loop: ${isCloseToBare ? 'met' : 'NOT met'}`);
}

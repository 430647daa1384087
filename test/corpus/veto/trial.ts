// `npx tsx test/corpus/veto/trial.ts [--arrival | --mixed [--with-today]] [--no-words] [--inner K] [--only batch,...]`
//
// Leave-one-batch-out trial of the learned veto over the parser's findings (docs/parser.md, "A learned
// veto"). For each batch of the tuning corpus: train on every other batch, choose the threshold on those
// training batches only (out-of-fold scores from an inner leave-batches-out split), then score the held-out
// batch with and without the veto. Prints totals per batch only.
//
// --arrival: each held-out batch is read by the parser as it was just before that batch joined the tuning
// set (shared/src of that commit, exported with `git archive` into node_modules/.cache/veto/parsers), and
// the veto is trained on that same parser's findings on the other batches: the veto then meets the kind
// of errors a new writer's batch brings, not the tuned parser's few leftovers.
// --mixed: as --arrival for the held-out batch, but the veto is trained on every other batch as read by
// the parser that batch met on arrival (what a veto shipped today could be trained on: each batch's
// untuned errors), so the model meets a parser it was not trained on, as it would on a new batch.
import { BATCHES } from '../corpus-runner';
import {
  bestThreshold,
  corpusCandidates,
  scorer,
  scoreWithVeto,
  train,
  TRAIN_OPTIONS,
  type Candidate,
  type ExcerptRun,
  type Parse,
  type Tally,
} from './veto-data';
import { ARRIVAL_PARSER, parserAt } from './arrival-parsers';

function arg(name: string): string | null {
  const i = process.argv.indexOf(name);
  return i === -1 ? null : process.argv[i + 1];
}

function scoresFor(model: ReturnType<typeof train>, runs: readonly ExcerptRun[], into: Map<Candidate, number>): void {
  const score = scorer(model);
  for (const r of runs) for (const c of r.candidates) into.set(c, score(c.features));
}

/** Area under the ROC curve of the scores for the candidates' labels. */
function auc(cands: readonly Candidate[], scores: ReadonlyMap<Candidate, number>): number {
  const pos = cands.filter((c) => c.positive).map((c) => scores.get(c)!);
  const neg = cands.filter((c) => !c.positive).map((c) => scores.get(c)!);
  let wins = 0;
  for (const p of pos) for (const n of neg) wins += p > n ? 1 : p === n ? 0.5 : 0;
  return pos.length * neg.length === 0 ? NaN : wins / (pos.length * neg.length);
}

const pct = (x: number) => (100 * x).toFixed(1);
const row = (t: Tally) => `${pct(t.precision)} / ${pct(t.recall)} / ${pct(t.f1)} | ${pct(t.quantity)} (${t.qty}/${t.tp})`;

async function main(): Promise<void> {
  const mixed = process.argv.includes('--mixed');
  const withToday = mixed && process.argv.includes('--with-today');
  const arrival = mixed || process.argv.includes('--arrival');
  const innerK = Number(arg('--inner') ?? 9);
  const only = arg('--only')?.split(',').map(Number) ?? null;
  const t0 = Date.now();
  const byCommit = new Map<string | null, ExcerptRun[]>();
  // --no-words: the words of the sentence, of the text before it and of the heading are left out (an ablation).
  const noWords = process.argv.includes('--no-words');
  const structural = (r: ExcerptRun): ExcerptRun => ({
    ...r,
    candidates: r.candidates.map((c) => ({ ...c, features: new Map([...c.features].filter(([name]) => !/^(?:w|prev|head)=/.test(name))) })),
  });
  const runsOf = async (commit: string | null) => {
    if (!byCommit.has(commit)) {
      const runs = await corpusCandidates(await parserAt(commit));
      byCommit.set(commit, noWords ? runs.map(structural) : runs);
    }
    return byCommit.get(commit)!;
  };
  const current = await runsOf(null);
  const all = current.flatMap((r) => r.candidates);
  console.log(`parser ${mixed ? 'as each batch met it, for training too (--mixed)' : arrival ? 'as each batch met it (--arrival)' : 'current'}; ${current.length} excerpts, ${all.length} candidates of today's parser (${all.filter((c) => c.positive).length} positive); options ${JSON.stringify(TRAIN_OPTIONS)}${noWords ? ', no words' : ''}${withToday ? ', training batches also as read by today\'s parser' : ''}; inner folds ${innerK}`);
  console.log('| held-out batch | candidates (neg) | threshold (from training) | AUC | without veto P / R / F1 | qty | with veto P / R / F1 | qty | ΔF1 | hindsight best ΔF1 (not used) |');
  console.log('|---|---|---|---|---|---|---|---|---|---|');
  const deltas: number[] = [];
  const dp: number[] = [];
  const dr: number[] = [];
  const dq: number[] = [];
  for (let b = 0; b < BATCHES.length; b++) {
    if (only && !only.includes(b)) continue;
    const runs = arrival ? await runsOf(ARRIVAL_PARSER[b]) : current;
    const test = runs.filter((r) => r.batch === b);
    const trainRuns: ExcerptRun[] = [];
    for (let k = 0; k < BATCHES.length; k++) {
      if (k !== b) trainRuns.push(...(mixed ? await runsOf(ARRIVAL_PARSER[k]) : runs).filter((r) => r.batch === k));
      // --with-today: the training batches also as today's parser reads them (its right decisions too).
      if (k !== b && withToday && ARRIVAL_PARSER[k] !== null) trainRuns.push(...current.filter((r) => r.batch === k));
    }
    if (test.length === 0) continue;
    // Inner split: the training batches in innerK groups, each scored by a model trained on the others.
    const trainBatches = [...new Set(trainRuns.map((r) => r.batch))].sort((x, y) => x - y);
    const oof = new Map<Candidate, number>();
    for (let k = 0; k < innerK; k++) {
      const held = new Set(trainBatches.filter((_, j) => j % innerK === k));
      if (held.size === 0) continue;
      const m = train(trainRuns.filter((r) => !held.has(r.batch)).flatMap((r) => r.candidates));
      scoresFor(m, trainRuns.filter((r) => held.has(r.batch)), oof);
    }
    const { threshold } = bestThreshold(trainRuns, oof);
    const model = train(trainRuns.flatMap((r) => r.candidates));
    const scores = new Map<Candidate, number>();
    scoresFor(model, test, scores);
    const before = scoreWithVeto(test, null, 0);
    const after = scoreWithVeto(test, scores, threshold);
    const hindsight = bestThreshold(test, scores);
    const cands = test.flatMap((r) => r.candidates);
    deltas.push(after.f1 - before.f1);
    dp.push(after.precision - before.precision);
    dr.push(after.recall - before.recall);
    dq.push(after.quantity - before.quantity);
    console.log(
      `| ${BATCHES[b].name}${arrival ? ` (parser ${ARRIVAL_PARSER[b] ?? 'today'})` : ''} | ${cands.length} (${cands.filter((c) => !c.positive).length}) | ${threshold.toFixed(2)} | ${auc(cands, scores).toFixed(3)} | ${row(before).replace(' | ', ' | ')} | ${row(after)} | ${(100 * (after.f1 - before.f1)).toFixed(1)} | ${(100 * (hindsight.f1 - before.f1)).toFixed(1)} at ${hindsight.threshold.toFixed(2)} |`,
    );
  }
  const mean = (xs: number[]) => xs.reduce((a, x) => a + x, 0) / xs.length;
  const sd = (xs: number[]) => Math.sqrt(xs.reduce((a, x) => a + (x - mean(xs)) ** 2, 0) / Math.max(1, xs.length - 1));
  const fmt = (xs: number[]) => `mean ${(100 * mean(xs)).toFixed(2)}, sd ${(100 * sd(xs)).toFixed(2)}, min ${(100 * Math.min(...xs)).toFixed(1)}, max ${(100 * Math.max(...xs)).toFixed(1)}`;
  console.log(`ΔF1 (points): ${fmt(deltas)}`);
  console.log(`ΔP: ${fmt(dp)}; ΔR: ${fmt(dr)}; Δquantity: ${fmt(dq)}`);
  console.log(`time ${((Date.now() - t0) / 1000).toFixed(0)} s`);
}

void main();

// `npx tsx test/corpus/place/trial.ts [--arrival]`
//
// Leave-one-batch-out trial of a learned place ranker (docs/parser.md, "A learned place ranker"). For each
// batch of the tuning corpus: train a per-candidate logistic score on every other batch's findings (target:
// the room of the labelled finding of the same code, matched as the scorer matches), then let the ranker
// choose the room of every held-out finding and score the held-out batch without and with it. The parser
// read is today's. Prints totals per batch only.
// --arrival: for each held-out batch, every batch is read by the parser as it was just before that batch
// joined the tuning set (the veto trial's arrival parsers, ../veto/arrival-parsers.ts), and the ranker is
// trained on that parser's findings on the other batches: it then learns and meets the room errors of a
// parser that had not been tuned on the batch.
import { readFileSync } from 'node:fs';
import { Matrix } from 'ml-matrix';
import TwoClasses from 'ml-logistic-regression/src/logreg_2classes.js';
import { parseReport, type Finding } from '@cc/shared';
import { BATCHES, CORPUS_LAYOUT } from '../corpus-runner';
import { scoreCorpus, scoreFile, type LabelledFinding } from '../score';
import { corpusPages } from '../veto/pages-cache';
import { ARRIVAL_PARSER, parserAt } from '../veto/arrival-parsers';
import type { Parse } from '../veto/veto-data';
import { findingPlaces, type FindingPlaces, type Features } from './place-candidates';

interface Example {
  readonly places: FindingPlaces;
  /** The labelled room of the finding's matched label, or null when its code has no label left in the excerpt. */
  readonly target: string | null;
}

interface Run {
  readonly file: string;
  readonly batch: number;
  readonly expected: readonly LabelledFinding[];
  readonly examples: Example[];
}

/**
 * Pairs each finding with a label of its code, as the scorer would by code: first the findings whose room
 * equals a label's room, then the others in reading order with the labels left.
 */
function targets(expected: readonly LabelledFinding[], findings: readonly Finding[]): Array<string | null> {
  const out: Array<string | null> = findings.map(() => null);
  const left = [...expected];
  findings.forEach((f, i) => {
    const j = left.findIndex((l) => l.code === f.code && l.room === f.room);
    if (j !== -1) {
      out[i] = left[j].room;
      left.splice(j, 1);
    }
  });
  findings.forEach((f, i) => {
    if (out[i] !== null) return;
    const j = left.findIndex((l) => l.code === f.code);
    if (j !== -1) {
      out[i] = left[j].room;
      left.splice(j, 1);
    }
  });
  return out;
}

async function corpusRuns(parse: Parse = parseReport): Promise<Run[]> {
  const expected = JSON.parse(readFileSync(CORPUS_LAYOUT.expectedFile, 'utf8')) as Record<string, LabelledFinding[]>;
  const runs: Run[] = [];
  for (const { file, pages } of await corpusPages()) {
    if (!(file in expected)) continue;
    const n = Number.parseInt(file, 10);
    const batch = BATCHES.findIndex((b) => n >= b.from && n <= b.to);
    const findings = parse(pages).findings.map((f) => ({ ...f, location: f.location ?? '', confidence: f.confidence ?? 'exact' }));
    const places = findingPlaces(pages.join('\f'), findings);
    const t = targets(expected[file], findings);
    runs.push({ file, batch, expected: expected[file], examples: places.map((p, i) => ({ places: p, target: t[i] })) });
  }
  return runs;
}

/** How often the code is labelled in each room, over the training examples (add-one smoothed). */
function priors(examples: readonly Example[]): (code: string, room: string) => number {
  const byCode = new Map<string, Map<string, number>>();
  for (const e of examples) {
    if (e.target === null) continue;
    const m = byCode.get(e.places.finding.code) ?? new Map<string, number>();
    m.set(e.target, (m.get(e.target) ?? 0) + 1);
    byCode.set(e.places.finding.code, m);
  }
  return (code, room) => {
    const m = byCode.get(code);
    if (!m) return 0;
    const total = [...m.values()].reduce((a, b) => a + b, 0);
    return ((m.get(room) ?? 0) + 0.5) / (total + 8);
  };
}

function featuresOf(e: Example, room: string, f: Features, prior: (code: string, room: string) => number): Features {
  return { ...f, prior: prior(e.places.finding.code, room) };
}

interface Model {
  readonly names: string[];
  readonly weights: number[];
}

const NUM_STEPS = 400;

/** The registry package's two-class logistic regression over (finding, candidate) rows; deterministic (zero start). */
function trainModel(examples: readonly Example[]): Model {
  const prior = priors(examples);
  const rows: Array<{ f: Features; y: number }> = [];
  for (const e of examples) {
    if (e.target === null || e.places.isListed) continue;
    for (const c of e.places.candidates) rows.push({ f: featuresOf(e, c.room, c.features, prior), y: c.room === e.target ? 1 : 0 });
  }
  const names = [...new Set(rows.flatMap((r) => Object.keys(r.f)))].sort();
  const index = new Map(names.map((n, k) => [n, k]));
  const X = Matrix.zeros(rows.length, names.length + 1);
  rows.forEach((r, i) => {
    for (const [k, v] of Object.entries(r.f)) X.set(i, index.get(k)!, v);
    X.set(i, names.length, 1);
  });
  const y = Matrix.columnVector(rows.map((r) => r.y));
  const model = new TwoClasses({ numSteps: NUM_STEPS, learningRate: 4 / rows.length });
  model.train(X, y);
  return { names: [...names, 'bias'], weights: model.weights.to1DArray() as number[] };
}

/** The room the ranker picks: the candidate with the largest score (a dot product over the weights). */
function ranker(model: Model, prior: (code: string, room: string) => number) {
  const w = new Map(model.names.map((n, k) => [n, model.weights[k]]));
  return (e: Example): string => {
    let best = { room: e.places.finding.room as string, z: -Infinity };
    for (const c of e.places.candidates) {
      let z = w.get('bias') ?? 0;
      for (const [k, v] of Object.entries(featuresOf(e, c.room, c.features, prior))) z += (w.get(k) ?? 0) * v;
      if (z > best.z + 1e-12) best = { room: c.room, z };
    }
    return best.room;
  };
}

function tally(runs: readonly Run[], roomOf: ((e: Example) => string) | null) {
  const files = runs.map((r) =>
    scoreFile(
      r.file,
      r.expected,
      r.examples.map((e) => ({ ...e.places.finding, room: roomOf && !e.places.isListed ? roomOf(e) : e.places.finding.room })) as LabelledFinding[],
    ),
  );
  return scoreCorpus(files);
}

const pct = (x: number) => (100 * x).toFixed(1);

async function main(): Promise<void> {
  const t0 = Date.now();
  const arrival = process.argv.includes('--arrival');
  const byCommit = new Map<string | null, Run[]>();
  const runsAt = async (commit: string | null) => {
    if (!byCommit.has(commit)) byCommit.set(commit, await corpusRuns(await parserAt(commit)));
    return byCommit.get(commit)!;
  };
  const runs = await runsAt(null);
  console.log(arrival ? 'parser as each held-out batch met it, for training too (--arrival)' : "today's parser");
  const all = runs.flatMap((r) => r.examples);
  const labelled = all.filter((e) => e.target !== null && !e.places.isListed);
  const inCands = labelled.filter((e) => e.places.candidates.some((c) => c.room === e.target));
  const parserRight = labelled.filter((e) => e.places.finding.room === e.target);
  console.log(`${runs.length} excerpts, ${all.length} findings, ${labelled.length} with a label of their code (listed places excluded: ${all.filter((e) => e.places.isListed).length})`);
  console.log(`parser's room right: ${parserRight.length} (${pct(parserRight.length / labelled.length)} %); labelled room among the candidates (ceiling): ${inCands.length} (${pct(inCands.length / labelled.length)} %); mean candidates ${(labelled.reduce((a, e) => a + e.places.candidates.length, 0) / labelled.length).toFixed(1)}`);
  const wrong = labelled.filter((e) => e.places.finding.room !== e.target);
  console.log(`of the ${wrong.length} wrong rooms, the labelled room is a candidate for ${wrong.filter((e) => e.places.candidates.some((c) => c.room === e.target)).length}`);
  console.log('| held-out batch | findings with a label (parser room wrong / target a candidate) | without P / R / F1 | qty | with ranker P / R / F1 | qty | rooms changed (right→wrong / wrong→right / wrong→wrong) | ΔF1 | oracle ΔF1 |');
  console.log('|---|---|---|---|---|---|---|---|---|');
  const deltas: number[] = [];
  const totals = { rw: 0, wr: 0, ww: 0 };
  for (let b = 0; b < BATCHES.length; b++) {
    const foldRuns = arrival ? await runsAt(ARRIVAL_PARSER[b] ?? null) : runs;
    const held = foldRuns.filter((r) => r.batch === b);
    if (held.length === 0) continue;
    const trainEx = foldRuns.filter((r) => r.batch !== b).flatMap((r) => r.examples);
    const model = trainModel(trainEx);
    const pick = ranker(model, priors(trainEx));
    const before = tally(held, null);
    const after = tally(held, pick);
    const oracle = tally(held, (e) => (e.target !== null && e.places.candidates.some((c) => c.room === e.target) ? e.target : e.places.finding.room));
    const ex = held.flatMap((r) => r.examples).filter((e) => e.target !== null && !e.places.isListed);
    const moves = { rw: 0, wr: 0, ww: 0 };
    for (const e of ex) {
      const p = pick(e);
      if (p === e.places.finding.room) continue;
      if (e.places.finding.room === e.target) moves.rw++;
      else if (p === e.target) moves.wr++;
      else moves.ww++;
    }
    totals.rw += moves.rw;
    totals.wr += moves.wr;
    totals.ww += moves.ww;
    const d = 100 * (after.f1 - before.f1);
    deltas.push(d);
    const wrongHere = ex.filter((e) => e.places.finding.room !== e.target);
    console.log(
      `| ${BATCHES[b].name}${arrival ? ` (${ARRIVAL_PARSER[b] ?? "today's"})` : ''} | ${ex.length} (${wrongHere.length} / ${wrongHere.filter((e) => e.places.candidates.some((c) => c.room === e.target)).length}) | ${pct(before.precision)} / ${pct(before.recall)} / ${pct(before.f1)} | ${pct(before.quantityAccuracy)} | ${pct(after.precision)} / ${pct(after.recall)} / ${pct(after.f1)} | ${pct(after.quantityAccuracy)} | ${moves.rw} / ${moves.wr} / ${moves.ww} | ${d >= 0 ? '+' : ''}${d.toFixed(1)} | +${(100 * (oracle.f1 - before.f1)).toFixed(1)} |`,
    );
  }
  const mean = deltas.reduce((a, b) => a + b, 0) / deltas.length;
  const sd = Math.sqrt(deltas.reduce((a, b) => a + (b - mean) ** 2, 0) / (deltas.length - 1));
  console.log(`ΔF1 mean ${mean.toFixed(2)}, sd ${sd.toFixed(2)}, min ${Math.min(...deltas).toFixed(1)}, max ${Math.max(...deltas).toFixed(1)}; rooms changed right→wrong ${totals.rw}, wrong→right ${totals.wr}, wrong→wrong ${totals.ww}`);
  const full = trainModel(all);
  const top = full.names.map((n, k) => [n, full.weights[k]] as const).sort((a, b) => Math.abs(b[1]) - Math.abs(a[1]));
  console.log(`weights (all batches): ${top.map(([n, w]) => `${n} ${w.toFixed(2)}`).join(', ')}`);
  console.log(`${((Date.now() - t0) / 1000).toFixed(0)} s`);
}

void main();

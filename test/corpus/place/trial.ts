// `npx tsx test/corpus/place/trial.ts [--arrival] [--variants point,pair,pair-np,...] [--weights]`
//
// Leave-one-batch-out trials of a learned place ranker (docs/parser.md, "A learned place ranker" and "A
// learned place ranker, second trial"). For each batch of the tuning corpus: train a ranker on every other
// batch's findings (target: the room of the labelled finding of the same code, matched as the scorer
// matches), let it choose the room of every held-out finding, and score the held-out batch without and
// with it. Prints totals per batch only.
// --arrival: for each held-out batch, every batch is read by the parser as it was just before that batch
// joined the tuning set (../veto/arrival-parsers.ts), and the ranker is trained on that parser's findings
// on the other batches: it then learns and meets the room errors of a parser that had not been tuned on
// the batch.
//
// Variants (`--variants`, comma-separated; all by default):
//   point      the first trial: one logistic row per (finding, candidate), the parser's choice a feature;
//   pair       pairwise: one row per (labelled room, other candidate), their feature difference;
//   point-np   as point without the parser's choice (`parser`, its kinds, `parserLocation`), used only
//              when the best candidate's score beats the parser's room by more than a margin chosen on
//              the training batches (out-of-fold scores of an inner leave-one-batch-out);
//   pair-np    the same with the pairwise model;
//   pair-m     pair (the parser's choice kept as a feature) with the margin of the -np variants (not run
//              unless named: it was tried after the others);
// and each of them with `+more`: the candidates of `findingPlaces(..., { more: true })` (the previous
// block's last place, a table row's cells and column header, a photo caption's place).
import { readFileSync } from 'node:fs';
import { parseReport, type Finding } from '@cc/shared';
import { BATCHES, CORPUS_LAYOUT } from '../corpus-runner';
import { scoreCorpus, scoreFile, type LabelledFinding } from '../score';
import { corpusPages } from '../veto/pages-cache';
import { ARRIVAL_PARSER, parserAt } from '../veto/arrival-parsers';
import type { Parse } from '../veto/veto-data';
import { findingPlaces, type FindingPlaces, type Features } from './place-candidates';

interface Example {
  readonly places: FindingPlaces;
  /** The same finding with the extra candidate sources. */
  readonly more: FindingPlaces;
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
    const joined = pages.join('\f');
    const places = findingPlaces(joined, findings);
    const more = findingPlaces(joined, findings, { more: true });
    const t = targets(expected[file], findings);
    runs.push({ file, batch, expected: expected[file], examples: places.map((p, i) => ({ places: p, more: more[i], target: t[i] })) });
  }
  return runs;
}

type Prior = (code: string, room: string) => number;

/** How often the code is labelled in each room, over the training examples (add-half smoothed). */
function priors(examples: readonly Example[]): Prior {
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

// ---- variants ---------------------------------------------------------------------------------

interface Variant {
  readonly name: string;
  readonly pairwise: boolean;
  /** Without the parser's choice as a feature; then a margin over the parser's room decides. */
  readonly noParser: boolean;
  /** Overrides the parser's room only past a margin chosen on the training batches (always with noParser). */
  readonly margin: boolean;
  readonly more: boolean;
}

const VARIANTS: readonly Variant[] = (['point', 'pair', 'point-np', 'pair-np', 'pair-m'] as const).flatMap((base) =>
  [false, true].map((more) => ({
    name: `${base}${more ? '+more' : ''}`,
    pairwise: base.startsWith('pair'),
    noParser: base.endsWith('-np'),
    margin: base.endsWith('-np') || base.endsWith('-m'),
    more,
  })),
);

const isParserFeature = (k: string) => k === 'parser' || k === 'parserLocation' || k.startsWith('parser:');

function placesOf(e: Example, v: Variant): FindingPlaces {
  return v.more ? e.more : e.places;
}

function featuresOf(v: Variant, e: Example, room: string, f: Features, prior: Prior): Features {
  const out: Features = { prior: prior(e.places.finding.code, room) };
  for (const [k, x] of Object.entries(f)) if (x !== 0 && !(v.noParser && isParserFeature(k))) out[k] = x;
  return out;
}

const hasTarget = (e: Example, v: Variant) => e.target !== null && !e.places.isListed && placesOf(e, v).candidates.some((c) => c.room === e.target);

// ---- the model: a dot product over named weights ----------------------------------------------

interface Model {
  readonly weights: ReadonlyMap<string, number>;
}

const NUM_STEPS = 400;

/**
 * Logistic regression by batch gradient descent from zero weights, 400 steps at learning rate 4 / rows:
 * the update of `ml-logistic-regression`'s two-class model (the first trial's), over sparse rows so that a
 * fold trains in a fraction of a second. Deterministic. `bias` is the intercept's name when one is wanted.
 */
function logistic(rows: ReadonlyArray<{ f: Features; y: number }>, bias: boolean): Model {
  const names = [...new Set(rows.flatMap((r) => Object.keys(r.f)))].sort();
  if (bias) names.push('bias');
  const index = new Map(names.map((n, k) => [n, k]));
  // Rows as one flat sparse matrix (row r's cells are at rowStart[r] .. rowStart[r + 1]).
  const rowStart = new Int32Array(rows.length + 1);
  const cols: number[] = [];
  const vals: number[] = [];
  rows.forEach((r, i) => {
    for (const [k, x] of Object.entries(r.f)) {
      if (x === 0) continue;
      cols.push(index.get(k)!);
      vals.push(x);
    }
    if (bias) {
      cols.push(names.length - 1);
      vals.push(1);
    }
    rowStart[i + 1] = cols.length;
  });
  const col = Int32Array.from(cols);
  const val = Float64Array.from(vals);
  const y = Float64Array.from(rows.map((r) => r.y));
  const w = new Float64Array(names.length);
  const grad = new Float64Array(names.length);
  const rate = 4 / rows.length;
  for (let step = 0; step < NUM_STEPS; step++) {
    grad.fill(0);
    for (let r = 0; r < rows.length; r++) {
      let z = 0;
      for (let j = rowStart[r]; j < rowStart[r + 1]; j++) z += w[col[j]] * val[j];
      const err = y[r] - 1 / (1 + Math.exp(-z));
      for (let j = rowStart[r]; j < rowStart[r + 1]; j++) grad[col[j]] += val[j] * err;
    }
    for (let k = 0; k < w.length; k++) w[k] += rate * grad[k];
  }
  return { weights: new Map(names.map((n, k) => [n, w[k]])) };
}

function trainModel(v: Variant, examples: readonly Example[]): { model: Model; prior: Prior } {
  const prior = priors(examples);
  const rows: Array<{ f: Features; y: number }> = [];
  for (const e of examples) {
    if (e.target === null || e.places.isListed) continue;
    const cands = placesOf(e, v).candidates;
    if (!v.pairwise) {
      for (const c of cands) rows.push({ f: featuresOf(v, e, c.room, c.features, prior), y: c.room === e.target ? 1 : 0 });
      continue;
    }
    // Pairwise: the labelled room against each other candidate (only when the labelled room is one). A
    // row x = f(target) - f(other) with y = 1 and no intercept: the logistic loss of the score difference.
    const t = cands.find((c) => c.room === e.target);
    if (!t) continue;
    const ft = featuresOf(v, e, t.room, t.features, prior);
    for (const c of cands) {
      if (c === t) continue;
      const d: Features = { ...ft };
      for (const [k, x] of Object.entries(featuresOf(v, e, c.room, c.features, prior))) d[k] = (d[k] ?? 0) - x;
      rows.push({ f: d, y: 1 });
    }
  }
  return { model: logistic(rows, !v.pairwise), prior };
}

interface Choice {
  readonly room: string;
  /** The best candidate's score less the parser's room's score (0 when they are the same). */
  readonly margin: number;
}

function chooser(v: Variant, model: Model, prior: Prior): (e: Example) => Choice {
  const w = model.weights;
  return (e) => {
    const parserRoom = e.places.finding.room as string;
    let best = { room: parserRoom, z: -Infinity };
    let parserZ = -Infinity;
    for (const c of placesOf(e, v).candidates) {
      let z = w.get('bias') ?? 0;
      for (const [k, x] of Object.entries(featuresOf(v, e, c.room, c.features, prior))) z += (w.get(k) ?? 0) * x;
      if (c.room === parserRoom) parserZ = z;
      if (z > best.z + 1e-12) best = { room: c.room, z };
    }
    return { room: best.room, margin: best.room === parserRoom ? 0 : best.z - parserZ };
  };
}

/** The training batches are cut into this many groups (every fifth batch in one) to choose a margin. */
const INNER_GROUPS = 5;

/**
 * The margin a `-np` variant must clear, chosen on the training batches only: each group of them is
 * scored by a model trained on the other groups (out of fold), and the margin is the one that gives the most (wrong → right) less
 * (right → wrong) changes over them; ties go to the larger margin.
 */
function chooseMargin(v: Variant, train: readonly Run[]): number {
  const outcomes: Array<{ margin: number; gain: number }> = [];
  const batches = [...new Set(train.map((r) => r.batch))].sort((a, b) => a - b);
  const group = new Map(batches.map((b, i) => [b, i % INNER_GROUPS]));
  for (let g = 0; g < INNER_GROUPS; g++) {
    const inner = train.filter((r) => group.get(r.batch) !== g).flatMap((r) => r.examples);
    const { model, prior } = trainModel(v, inner);
    const pick = chooser(v, model, prior);
    for (const e of train.filter((r) => group.get(r.batch) === g).flatMap((r) => r.examples)) {
      if (e.target === null || e.places.isListed) continue;
      const c = pick(e);
      if (c.room === e.places.finding.room) continue;
      outcomes.push({ margin: c.margin, gain: (c.room === e.target ? 1 : 0) - (e.places.finding.room === e.target ? 1 : 0) });
    }
  }
  // Override when margin > threshold: try every observed margin as the threshold (and 0).
  outcomes.sort((a, b) => b.margin - a.margin);
  let best = { threshold: outcomes.length ? outcomes[0].margin : 0, gain: 0 };
  let gain = 0;
  for (let i = 0; i < outcomes.length; i++) {
    gain += outcomes[i].gain;
    const threshold = i + 1 < outcomes.length ? outcomes[i + 1].margin : 0;
    if (outcomes[i + 1] && outcomes[i + 1].margin === outcomes[i].margin) continue;
    if (gain > best.gain) best = { threshold, gain };
  }
  return best.threshold;
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

const MORE_SOURCES = ['prevBlockLast', 'rowCell', 'columnHeader', 'caption'] as const;

/** Which extra sources brought a wrong room's labelled room into reach (counted per source into `into`). */
function countNewReach(examples: readonly Example[], into: Map<string, number>): void {
  for (const e of examples) {
    if (e.target === null || e.places.isListed || e.places.finding.room === e.target) continue;
    if (e.places.candidates.some((c) => c.room === e.target)) continue;
    const t = e.more.candidates.find((c) => c.room === e.target);
    if (!t) continue;
    for (const s of MORE_SOURCES) if (t.features[s]) into.set(s, (into.get(s) ?? 0) + 1);
  }
}

const sourcesText = (m: ReadonlyMap<string, number>) => MORE_SOURCES.map((s) => `${s} ${m.get(s) ?? 0}`).join(', ');

const pct = (x: number) => (100 * x).toFixed(1);
const signed = (x: number, d = 1) => `${x >= 0 ? '+' : ''}${x.toFixed(d)}`;

function arg(name: string): string | null {
  const i = process.argv.indexOf(name);
  return i === -1 ? null : process.argv[i + 1];
}

async function main(): Promise<void> {
  const t0 = Date.now();
  const arrival = process.argv.includes('--arrival');
  const wanted = arg('--variants')?.split(',') ?? VARIANTS.filter((v) => !v.name.startsWith('pair-m')).map((v) => v.name);
  const variants = wanted.map((n) => {
    const v = VARIANTS.find((x) => x.name === n);
    if (!v) throw new Error(`unknown variant ${n} (${VARIANTS.map((x) => x.name).join(', ')})`);
    return v;
  });
  const byCommit = new Map<string | null, Run[]>();
  const runsAt = async (commit: string | null) => {
    if (!byCommit.has(commit)) byCommit.set(commit, await corpusRuns(await parserAt(commit)));
    return byCommit.get(commit)!;
  };
  const runs = await runsAt(null);
  console.log(arrival ? 'parser as each held-out batch met it, for training too (--arrival)' : "today's parser");
  const all = runs.flatMap((r) => r.examples);
  const labelled = all.filter((e) => e.target !== null && !e.places.isListed);
  const parserRight = labelled.filter((e) => e.places.finding.room === e.target);
  const reach = (e: Example, more: boolean) => (more ? e.more : e.places).candidates.some((c) => c.room === e.target);
  const wrong = labelled.filter((e) => e.places.finding.room !== e.target);
  console.log(`${runs.length} excerpts, ${all.length} findings, ${labelled.length} with a label of their code (listed places excluded: ${all.filter((e) => e.places.isListed).length})`);
  console.log(
    `parser's room right: ${parserRight.length} (${pct(parserRight.length / labelled.length)} %); labelled room among the candidates: ${labelled.filter((e) => reach(e, false)).length}, with more candidates ${labelled.filter((e) => reach(e, true)).length}; mean candidates ${(labelled.reduce((a, e) => a + e.places.candidates.length, 0) / labelled.length).toFixed(1)} / ${(labelled.reduce((a, e) => a + e.more.candidates.length, 0) / labelled.length).toFixed(1)}`,
  );
  const newReach = new Map<string, number>();
  countNewReach(labelled, newReach);
  console.log(`of the ${wrong.length} wrong rooms, the labelled room is a candidate for ${wrong.filter((e) => reach(e, false)).length}, with more candidates ${wrong.filter((e) => reach(e, true)).length} (brought in by ${sourcesText(newReach)})`);

  const summary = new Map<string, number[]>();
  for (const v of variants) {
    console.log(`\n### ${v.name}`);
    console.log('| held-out batch | findings with a label (room wrong / target a candidate) | margin | without P / R / F1 | qty | with ranker P / R / F1 | qty | rooms changed (right→wrong / wrong→right / wrong→wrong) | ΔF1 | oracle ΔF1 |');
    console.log('|---|---|---|---|---|---|---|---|---|---|');
    const deltas: number[] = [];
    const totals = { rw: 0, wr: 0, ww: 0, wrong: 0, reach: 0 };
    const heldNewReach = new Map<string, number>();
    for (let b = 0; b < BATCHES.length; b++) {
      const foldRuns = arrival ? await runsAt(ARRIVAL_PARSER[b] ?? null) : runs;
      const held = foldRuns.filter((r) => r.batch === b);
      if (held.length === 0) continue;
      const trainRuns = foldRuns.filter((r) => r.batch !== b);
      const { model, prior } = trainModel(v, trainRuns.flatMap((r) => r.examples));
      const margin = v.margin ? chooseMargin(v, trainRuns) : 0;
      const choose = chooser(v, model, prior);
      const pick = (e: Example) => {
        const c = choose(e);
        return c.room !== e.places.finding.room && c.margin > margin ? c.room : (e.places.finding.room as string);
      };
      const before = tally(held, null);
      const after = tally(held, pick);
      const oracle = tally(held, (e) => (hasTarget(e, v) ? e.target! : e.places.finding.room));
      const ex = held.flatMap((r) => r.examples).filter((e) => e.target !== null && !e.places.isListed);
      if (v.more) countNewReach(ex, heldNewReach);
      const moves = { rw: 0, wr: 0, ww: 0 };
      for (const e of ex) {
        const p = pick(e);
        if (p === e.places.finding.room) continue;
        if (e.places.finding.room === e.target) moves.rw++;
        else if (p === e.target) moves.wr++;
        else moves.ww++;
      }
      const wrongHere = ex.filter((e) => e.places.finding.room !== e.target);
      const reachHere = wrongHere.filter((e) => hasTarget(e, v)).length;
      totals.rw += moves.rw;
      totals.wr += moves.wr;
      totals.ww += moves.ww;
      totals.wrong += wrongHere.length;
      totals.reach += reachHere;
      const d = 100 * (after.f1 - before.f1);
      deltas.push(d);
      console.log(
        `| ${BATCHES[b].name}${arrival ? ` (${ARRIVAL_PARSER[b] ?? "today's"})` : ''} | ${ex.length} (${wrongHere.length} / ${reachHere}) | ${v.margin ? margin.toFixed(2) : '-'} | ${pct(before.precision)} / ${pct(before.recall)} / ${pct(before.f1)} | ${pct(before.quantityAccuracy)} | ${pct(after.precision)} / ${pct(after.recall)} / ${pct(after.f1)} | ${pct(after.quantityAccuracy)} | ${moves.rw} / ${moves.wr} / ${moves.ww} | ${signed(d)} | ${signed(100 * (oracle.f1 - before.f1))} |`,
      );
    }
    const mean = deltas.reduce((a, b) => a + b, 0) / deltas.length;
    const sd = Math.sqrt(deltas.reduce((a, b) => a + (b - mean) ** 2, 0) / (deltas.length - 1));
    summary.set(v.name, deltas);
    console.log(
      `${v.name}: ΔF1 mean ${signed(mean, 2)}, sd ${sd.toFixed(2)}, min ${signed(Math.min(...deltas))}, max ${signed(Math.max(...deltas))}; rooms changed right→wrong ${totals.rw}, wrong→right ${totals.wr}, wrong→wrong ${totals.ww}; wrong rooms ${totals.wrong}, labelled room a candidate ${totals.reach}${v.more ? ` (brought in by the extra sources: ${sourcesText(heldNewReach)})` : ''}`,
    );
    if (process.argv.includes('--weights')) {
      const { model } = trainModel(v, all);
      const top = [...model.weights].sort((a, b) => Math.abs(b[1]) - Math.abs(a[1]));
      console.log(`weights (all batches, today's parser): ${top.map(([n, w]) => `${n} ${w.toFixed(2)}`).join(', ')}`);
    }
  }
  console.log('\n| variant | ' + BATCHES.map((b) => b.name.split(' ')[0]).join(' | ') + ' | mean | min |');
  console.log('|---|' + BATCHES.map(() => '---|').join('') + '---|---|');
  for (const [name, d] of summary) {
    console.log(`| ${name} | ${d.map((x) => signed(x)).join(' | ')} | ${signed(d.reduce((a, b) => a + b, 0) / d.length, 2)} | ${signed(Math.min(...d))} |`);
  }
  console.log(`${((Date.now() - t0) / 1000).toFixed(0)} s`);
}

void main();

// The veto's data: every finding the parser gives on the corpus, with its generic features and its
// label (kept when it matches a labelled (code, room) pair of its excerpt in the scorer's multiset
// matching, test/corpus/score.ts), and the tools to train the logistic regression and score a veto.
import { readFileSync } from 'node:fs';
import { Matrix } from 'ml-matrix';
import TwoClasses from 'ml-logistic-regression/src/logreg_2classes.js';
import type { Finding, ParseResult } from '@cc/shared';
import { splitBlocks } from '../../../shared/src/findings/block-splitter';
import { findingFeatures, type FeatureVector, type FindingContext } from './features';
import { BATCHES, CORPUS_LAYOUT } from '../corpus-runner';
import { scoreCorpus, scoreFile, type LabelledFinding } from '../score';
import { corpusPages } from './pages-cache';

export function batchOf(file: string): number {
  const n = Number.parseInt(file, 10);
  return BATCHES.findIndex((b) => n >= b.from && n <= b.to);
}

export interface Candidate {
  readonly file: string;
  readonly batch: number;
  readonly finding: Finding;
  readonly features: FeatureVector;
  /** Matched a labelled (code, room) pair of its excerpt. */
  readonly positive: boolean;
}

export interface ExcerptRun {
  readonly file: string;
  readonly batch: number;
  readonly expected: readonly LabelledFinding[];
  readonly candidates: readonly Candidate[];
}

/** Which of `predicted` the scorer matches with a label (same order of matching as scoreFile). */
export function matchedFlags(expected: readonly LabelledFinding[], predicted: readonly LabelledFinding[]): boolean[] {
  const key = (f: LabelledFinding) => `${f.code}@${f.room}`;
  const matched = predicted.map(() => false);
  const unmatched: LabelledFinding[] = [];
  for (const want of expected) {
    const i = predicted.findIndex((p, j) => !matched[j] && key(p) === key(want) && p.quantity === want.quantity);
    if (i === -1) unmatched.push(want);
    else matched[i] = true;
  }
  for (const want of unmatched) {
    const i = predicted.findIndex((p, j) => !matched[j] && key(p) === key(want));
    if (i !== -1) matched[i] = true;
  }
  return matched;
}

/** The section of the block each finding's sentence starts in (title and kind), as the block splitter reads it. */
export function contextsOf(joined: string, findings: readonly Finding[]): FindingContext[] {
  const blocks = splitBlocks(joined).map((b) => {
    const offsets = b.text.offsets;
    return { start: offsets[0] ?? 0, end: offsets[offsets.length - 1] ?? 0, section: b.section };
  });
  return findings.map((f) => {
    const block = blocks.find((b) => b.start <= f.start && f.start <= b.end) ?? [...blocks].reverse().find((b) => b.start <= f.start);
    return block ? { sectionTitle: block.section.title, sectionKind: block.section.kind } : { sectionTitle: null, sectionKind: 'none' };
  });
}

export type Parse = (pages: readonly string[]) => ParseResult;

/** Parses the whole corpus with `parse` and makes a candidate of every finding. */
export async function corpusCandidates(parse: Parse): Promise<ExcerptRun[]> {
  const expected = JSON.parse(readFileSync(CORPUS_LAYOUT.expectedFile, 'utf8')) as Record<string, LabelledFinding[]>;
  const out: ExcerptRun[] = [];
  for (const { file, pages } of await corpusPages()) {
    if (!(file in expected)) continue;
    const joined = pages.join('\f');
    const findings = parse(pages).findings.map(withDefaults);
    const contexts = contextsOf(joined, findings);
    const flags = matchedFlags(expected[file], findings);
    const batch = batchOf(file);
    out.push({
      file,
      batch,
      expected: expected[file],
      candidates: findings.map((finding, i) => ({ file, batch, finding, features: findingFeatures(findings, i, joined, contexts[i]), positive: flags[i] })),
    });
  }
  return out;
}

/** Older parsers gave fewer fields; the features read them as "not given". */
function withDefaults(f: Finding): Finding {
  return { ...f, location: f.location ?? '', confidence: f.confidence ?? 'exact', recommendation: f.recommendation ?? null, computation: f.computation ?? null };
}

// ---- the model -------------------------------------------------------------------------------

export interface VetoModel {
  /** Feature name -> weight; `bias` is the intercept. */
  readonly weights: Record<string, number>;
  readonly bias: number;
  readonly threshold: number;
}

export interface TrainOptions {
  /** A feature is kept when at least this many excerpts have it among their candidates. */
  readonly minExcerpts: number;
  readonly numSteps: number;
  readonly learningRate: number;
}

export const TRAIN_OPTIONS: TrainOptions = { minExcerpts: 16, numSteps: 300, learningRate: 2e-3 };

/** Rows scaled to unit length (binary features of very different counts), then a constant 1 for the intercept. */
export function rowOf(features: FeatureVector, index: ReadonlyMap<string, number>): Array<[number, number]> {
  const cells: Array<[number, number]> = [];
  let norm = 0;
  for (const [name, value] of features) {
    const k = index.get(name);
    if (k === undefined || value === 0) continue;
    cells.push([k, value]);
    norm += value * value;
  }
  const scale = norm > 0 ? 1 / Math.sqrt(norm) : 0;
  return cells.map(([k, v]) => [k, v * scale]);
}

export function vocabulary(train: readonly Candidate[], minExcerpts: number): string[] {
  const excerpts = new Map<string, Set<string>>();
  for (const c of train) {
    for (const name of c.features.keys()) {
      let s = excerpts.get(name);
      if (!s) excerpts.set(name, (s = new Set()));
      s.add(c.file);
    }
  }
  return [...excerpts].filter(([, s]) => s.size >= minExcerpts).map(([name]) => name).sort();
}

/** Trains the registry package's two-class logistic regression (batch gradient descent from zero weights: deterministic). */
export function train(candidates: readonly Candidate[], options: TrainOptions = TRAIN_OPTIONS): Omit<VetoModel, 'threshold'> {
  const names = vocabulary(candidates, options.minExcerpts);
  const index = new Map(names.map((n, k) => [n, k]));
  const X = Matrix.zeros(candidates.length, names.length + 1);
  candidates.forEach((c, i) => {
    for (const [k, v] of rowOf(c.features, index)) X.set(i, k, v);
    X.set(i, names.length, 1);
  });
  const y = Matrix.columnVector(candidates.map((c) => (c.positive ? 1 : 0)));
  const model = new TwoClasses({ numSteps: options.numSteps, learningRate: options.learningRate });
  model.train(X, y);
  const w = model.weights.to1DArray() as number[];
  const weights: Record<string, number> = {};
  names.forEach((n, k) => {
    if (w[k] !== 0) weights[n] = w[k];
  });
  return { weights, bias: w[names.length] };
}

/** The model's probability that a candidate is a labelled finding: the sum the package computes, over the named weights. */
export function scorer(model: Pick<VetoModel, 'weights' | 'bias'>): (features: FeatureVector) => number {
  const names = Object.keys(model.weights);
  const index = new Map(names.map((n, k) => [n, k]));
  const w = names.map((n) => model.weights[n]);
  return (features) => {
    let z = model.bias;
    for (const [k, v] of rowOf(features, index)) z += w[k] * v;
    return 1 / (1 + Math.exp(-z));
  };
}

// ---- scoring a veto --------------------------------------------------------------------------

export interface Tally {
  tp: number;
  fp: number;
  fn: number;
  qty: number;
  precision: number;
  recall: number;
  f1: number;
  quantity: number;
}

/** The scorer's figures for the excerpts when every candidate whose score is below `threshold` is dropped. */
export function scoreWithVeto(runs: readonly ExcerptRun[], scores: ReadonlyMap<Candidate, number> | null, threshold: number): Tally {
  const files = runs.map((r) => {
    const kept = r.candidates.filter((c) => scores === null || (scores.get(c) ?? 1) >= threshold).map((c) => c.finding);
    return scoreFile(r.file, r.expected, kept);
  });
  const s = scoreCorpus(files);
  return { tp: s.truePositives, fp: s.falsePositives, fn: s.falseNegatives, qty: s.quantityCorrect, precision: s.precision, recall: s.recall, f1: s.f1, quantity: s.quantityAccuracy };
}

/** The threshold that gives the best F1 on these excerpts with these scores (candidates of 0..0.95 in steps of 0.01). */
export function bestThreshold(runs: readonly ExcerptRun[], scores: ReadonlyMap<Candidate, number>): { threshold: number; f1: number } {
  let best = { threshold: 0, f1: scoreWithVeto(runs, null, 0).f1 };
  for (let t = 0.01; t < 0.955; t += 0.01) {
    const f1 = scoreWithVeto(runs, scores, t).f1;
    if (f1 > best.f1 + 1e-12) best = { threshold: Number(t.toFixed(2)), f1 };
  }
  return best;
}

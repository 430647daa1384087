import { join } from 'node:path';
import { runBatch, type BatchLayout, type BatchRun } from './batch';
import type { CorpusScore } from './score';

export const CORPUS_DIR = join(__dirname, 'excerpts');

/**
 * The project's corpus: excerpts in test/corpus/excerpts, labels in expected.json, and in
 * manifest.json how each is shown to the parser (text, or a real PDF read back through the
 * project's extraction). Folders named sealed* are never read here.
 */
export const CORPUS_LAYOUT: BatchLayout = {
  excerptDir: CORPUS_DIR,
  expectedFile: join(__dirname, 'expected.json'),
  manifestFile: join(__dirname, 'manifest.json'),
};

/** The corpus's batches by excerpt number, for held-out comparisons (docs/parser.md). */
export const BATCHES: ReadonlyArray<{ name: string; from: number; to: number }> = [
  { name: 'project 01-46', from: 1, to: 99 },
  { name: 'A+B 101-160', from: 101, to: 199 },
  { name: 'tuning 201-255', from: 200, to: 299 },
  { name: 'C 301-360', from: 300, to: 399 },
  { name: 'D 401-460', from: 400, to: 499 },
  { name: 'E 501-566', from: 500, to: 599 },
  { name: 'F 601-666', from: 600, to: 699 },
  { name: 'G 701-766', from: 700, to: 799 },
  { name: 'H 801-866', from: 800, to: 899 },
  { name: 'I 901-966', from: 900, to: 999 },
  { name: 'J 1001-1066', from: 1000, to: 1099 },
  { name: 'K 1101-1166', from: 1100, to: 1199 },
  { name: 'L 1201-1288', from: 1200, to: 1299 },
  { name: 'M 1301-1377', from: 1300, to: 1399 },
  { name: 'N 1401-1466', from: 1400, to: 1499 },
  { name: 'O 1501-1566', from: 1500, to: 1599 },
  { name: 'P 1601-1666', from: 1600, to: 1699 },
];

/** Parses every excerpt as its manifest says and scores it against expected.json. */
export function runCorpus(): Promise<BatchRun> {
  return runBatch(CORPUS_LAYOUT);
}

/** A small fixed-width table: one row per file with errors, then the totals. */
export function formatScoreTable(score: CorpusScore): string {
  const pct = (x: number) => `${(100 * x).toFixed(1)}%`;
  const rows = score.files
    .filter((f) => f.falsePositives + f.falseNegatives > 0 || f.quantityCorrect < f.truePositives)
    .map((f) => `  ${f.file.padEnd(36)} tp ${f.truePositives}  fp ${f.falsePositives}  fn ${f.falseNegatives}  qty ${f.quantityCorrect}/${f.truePositives}${f.missed.length ? `  missed ${f.missed.join(',')}` : ''}${f.extra.length ? `  extra ${f.extra.join(',')}` : ''}`);
  return [
    `Corpus: ${score.files.length} excerpts, ${score.truePositives + score.falseNegatives} labelled findings`,
    ...rows,
    `  precision ${pct(score.precision)}  recall ${pct(score.recall)}  F1 ${pct(score.f1)}  quantity ${pct(score.quantityAccuracy)} (${score.quantityCorrect}/${score.truePositives})`,
  ].join('\n');
}

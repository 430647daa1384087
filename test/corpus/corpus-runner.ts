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

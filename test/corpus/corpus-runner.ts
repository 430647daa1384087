import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseText, type ParseResult } from '@cc/shared';
import { scoreCorpus, scoreFile, type CorpusScore, type LabelledFinding } from './score';

export const CORPUS_DIR = join(__dirname, 'excerpts');

export interface CorpusRun {
  readonly score: CorpusScore;
  /** Parser output and raw text per excerpt file. */
  readonly results: ReadonlyArray<{ file: string; text: string; result: ParseResult }>;
  /** Excerpt files with no entry in expected.json, and entries with no file. */
  readonly unlabelled: string[];
  readonly orphanLabels: string[];
}

/** Parses every excerpt and scores it against expected.json. */
export function runCorpus(): CorpusRun {
  const expected = JSON.parse(readFileSync(join(__dirname, 'expected.json'), 'utf8')) as Record<string, LabelledFinding[]>;
  const files = readdirSync(CORPUS_DIR).filter((f) => f.endsWith('.txt')).sort();
  const results = files.map((file) => {
    const text = readFileSync(join(CORPUS_DIR, file), 'utf8');
    return { file, text, result: parseText(text) };
  });
  const scores = results.map(({ file, result }) => scoreFile(file, expected[file] ?? [], result.findings));
  return {
    score: scoreCorpus(scores),
    results,
    unlabelled: files.filter((f) => !(f in expected)),
    orphanLabels: Object.keys(expected).filter((f) => !files.includes(f)),
  };
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

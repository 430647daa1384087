// Scores a folder of excerpts in the writers' format: NN-name.txt files, expected.json
// ({ file: [{code, room, quantity}] }) and an optional manifest.json ({ file: {render, style} }),
// each excerpt shown to the parser as its manifest `render` says (text when not given).
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { ParseResult } from '@cc/shared';
import { parseRendered, RENDERS, type Render } from './render';
import { scoreCodes, scoreCorpus, scoreFile, type CodeScore, type CorpusScore, type LabelledFinding } from './score';

export interface BatchLayout {
  /** Folder holding the .txt excerpts. */
  readonly excerptDir: string;
  readonly expectedFile: string;
  readonly manifestFile: string;
}

/** The writers' layout: everything in one folder. */
export function flatLayout(dir: string): BatchLayout {
  return { excerptDir: dir, expectedFile: join(dir, 'expected.json'), manifestFile: join(dir, 'manifest.json') };
}

export interface BatchRun {
  readonly score: CorpusScore;
  readonly codes: CodeScore;
  readonly results: ReadonlyArray<{ file: string; text: string; render: Render; pages: string[]; result: ParseResult }>;
  /** Excerpt files with no entry in expected.json, and entries with no file. */
  readonly unlabelled: string[];
  readonly orphanLabels: string[];
  /** Excerpts per render. */
  readonly renders: Readonly<Record<Render, number>>;
}

interface ManifestEntry {
  readonly render?: string;
}

function readJson<T>(file: string, fallback: T): T {
  return existsSync(file) ? (JSON.parse(readFileSync(file, 'utf8')) as T) : fallback;
}

function renderOf(entry: ManifestEntry | undefined, file: string): Render {
  const render = entry?.render ?? 'text';
  if (!(RENDERS as readonly string[]).includes(render)) throw new Error(`${file}: unknown render "${render}"`);
  return render as Render;
}

/** Parses every excerpt of the layout as its manifest says and scores it against the labels. */
export async function runBatch(layout: BatchLayout): Promise<BatchRun> {
  const expected = readJson<Record<string, LabelledFinding[]>>(layout.expectedFile, {});
  const manifest = readJson<Record<string, ManifestEntry>>(layout.manifestFile, {});
  const files = readdirSync(layout.excerptDir).filter((f) => f.endsWith('.txt')).sort();
  const results = [];
  const renders: Record<Render, number> = { text: 0, 'pdf-pages': 0, 'pdf-two-column': 0 };
  for (const file of files) {
    const text = readFileSync(join(layout.excerptDir, file), 'utf8');
    const render = renderOf(manifest[file], file);
    renders[render]++;
    results.push({ file, text, render, ...(await parseRendered(text, render)) });
  }
  const labelled = results.filter((r) => r.file in expected);
  return {
    score: scoreCorpus(labelled.map(({ file, result }) => scoreFile(file, expected[file], result.findings))),
    codes: scoreCodes(labelled.map(({ file, result }) => ({ expected: expected[file], predicted: result.findings }))),
    results,
    unlabelled: files.filter((f) => !(f in expected)),
    orphanLabels: Object.keys(expected).filter((f) => !files.includes(f)),
    renders,
  };
}

const pct = (x: number) => `${(100 * x).toFixed(1)}%`;

/** The totals only: no file names, no per-file detail. */
export function formatTotals(run: BatchRun): string {
  const s = run.score;
  return [
    `excerpts ${run.results.length} (text ${run.renders.text}, pdf-pages ${run.renders['pdf-pages']}, pdf-two-column ${run.renders['pdf-two-column']}); labelled findings ${s.truePositives + s.falseNegatives}; parser findings ${s.truePositives + s.falsePositives}`,
    `(code, room): precision ${pct(s.precision)}  recall ${pct(s.recall)}  F1 ${pct(s.f1)}  (tp ${s.truePositives}, fp ${s.falsePositives}, fn ${s.falseNegatives})`,
    `codes only:   precision ${pct(run.codes.precision)}  recall ${pct(run.codes.recall)}  F1 ${pct(run.codes.f1)}`,
    `quantity accuracy on matched pairs: ${pct(s.quantityAccuracy)} (${s.quantityCorrect}/${s.truePositives})`,
    ...(run.unlabelled.length + run.orphanLabels.length > 0 ? [`excerpts without labels: ${run.unlabelled.length}; labels without excerpt: ${run.orphanLabels.length}`] : []),
  ].join('\n');
}

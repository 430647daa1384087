// `npx tsx test/corpus/import-batch.ts <folder>`: copies a writers' batch (NN-name.txt, expected.json,
// manifest.json) into the project corpus, merging its labels and manifest entries. Run it only after
// the batch's untuned score is recorded in docs/parser.md; folders named sealed* are refused.
import { copyFileSync, existsSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { basename, join, resolve } from 'node:path';
import { CORPUS_LAYOUT } from './corpus-runner';

function readJson(file: string): Record<string, unknown> {
  return existsSync(file) ? (JSON.parse(readFileSync(file, 'utf8')) as Record<string, unknown>) : {};
}

function sorted(record: Record<string, unknown>): Record<string, unknown> {
  return Object.fromEntries(Object.entries(record).sort(([a], [b]) => a.localeCompare(b)));
}

function main(dir: string | undefined): number {
  if (!dir) {
    console.error('Usage: npx tsx test/corpus/import-batch.ts <folder>');
    return 2;
  }
  const from = resolve(dir);
  if (/^sealed/i.test(basename(from))) {
    console.error('A sealed batch is scored with score-batch.ts only; it joins the corpus after its untuned score is recorded and it is renamed.');
    return 2;
  }
  const files = readdirSync(from).filter((f) => f.endsWith('.txt'));
  for (const f of files) copyFileSync(join(from, f), join(CORPUS_LAYOUT.excerptDir, f));
  const expected = { ...readJson(CORPUS_LAYOUT.expectedFile), ...readJson(join(from, 'expected.json')) };
  const manifest = { ...readJson(CORPUS_LAYOUT.manifestFile), ...readJson(join(from, 'manifest.json')) };
  writeFileSync(CORPUS_LAYOUT.expectedFile, `${JSON.stringify(sorted(expected), null, 2)}\n`);
  writeFileSync(CORPUS_LAYOUT.manifestFile, `${JSON.stringify(sorted(manifest), null, 2)}\n`);
  console.log(`${files.length} excerpts copied; corpus has ${Object.keys(expected).length} labelled excerpts`);
  return 0;
}

process.exitCode = main(process.argv[2]);

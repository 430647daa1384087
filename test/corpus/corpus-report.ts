// `npx tsx test/corpus/corpus-report.ts [excerpt-file-name ...]`: the project corpus's score table
// (one row per excerpt with errors), or for the named excerpts every finding the parser gave
// (code, room, quantity, confidence, evidence) beside the hand labels. For working on the parser;
// never point it at a held-out batch (score-batch.ts prints totals only).
import { readFileSync } from 'node:fs';
import { CORPUS_LAYOUT, formatScoreTable } from './corpus-runner';
import { runBatch } from './batch';
import { scoreCodes, scoreCorpus, type LabelledFinding } from './score';

/** The corpus's batches by excerpt number, for held-out comparisons (docs/parser.md). */
const BATCHES: ReadonlyArray<{ name: string; from: number; to: number }> = [
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
];

async function main(names: string[]): Promise<void> {
  const run = await runBatch(CORPUS_LAYOUT);
  if (names.length === 0) {
    console.log(formatScoreTable(run.score));
    console.log(`codes only: F1 ${(100 * run.codes.f1).toFixed(1)}%`);
    const expected = JSON.parse(readFileSync(CORPUS_LAYOUT.expectedFile, 'utf8')) as Record<string, LabelledFinding[]>;
    const pct = (x: number) => `${(100 * x).toFixed(1)}`;
    for (const b of BATCHES) {
      const files = run.score.files.filter((f) => {
        const n = Number.parseInt(f.file, 10);
        return n >= b.from && n <= b.to;
      });
      const s = scoreCorpus(files);
      const inBatch = new Set(files.map((f) => f.file));
      const codes = scoreCodes(run.results.filter((r) => inBatch.has(r.file)).map((r) => ({ expected: expected[r.file], predicted: r.result.findings })));
      console.log(`${b.name.padEnd(16)} P ${pct(s.precision)}  R ${pct(s.recall)}  F1 ${pct(s.f1)}  codes F1 ${pct(codes.f1)}  qty ${pct(s.quantityAccuracy)} (${s.quantityCorrect}/${s.truePositives})`);
    }
    return;
  }
  const expected = JSON.parse(readFileSync(CORPUS_LAYOUT.expectedFile, 'utf8')) as Record<string, LabelledFinding[]>;
  for (const r of run.results.filter((x) => names.some((n) => x.file.startsWith(n)))) {
    console.log(`=== ${r.file} (${r.render})`);
    console.log('expected:', (expected[r.file] ?? []).map((f) => `${f.code}@${f.room}x${f.quantity}`).join('  '));
    for (const f of r.result.findings) {
      console.log(`  ${f.code}@${f.room}x${f.quantity} [${f.confidence ?? ''}] ${JSON.stringify(f.evidence.slice(0, 160))}`);
    }
  }
}

void main(process.argv.slice(2));

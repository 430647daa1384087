// `npx tsx test/corpus/corpus-report.ts [excerpt-file-name ...]`: the project corpus's score table
// (one row per excerpt with errors), or for the named excerpts every finding the parser gave
// (code, room, quantity, confidence, evidence) beside the hand labels. For working on the parser;
// never point it at a held-out batch (score-batch.ts prints totals only).
import { readFileSync } from 'node:fs';
import { BATCHES, CORPUS_LAYOUT, formatScoreTable } from './corpus-runner';
import { runBatch } from './batch';
import { scoreCodes, scoreCorpus, type LabelledFinding } from './score';

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

// `npx tsx test/corpus/score-batch.ts <folder>`: scores a folder of excerpts in the writers' format
// (NN-name.txt, expected.json, manifest.json with each excerpt's `render`) and prints the totals only:
// precision, recall and F1 on (code, room), F1 on codes alone, quantity accuracy, counts. Nothing per
// file is printed, so a held-out batch can be scored without showing its content.
import { existsSync, statSync } from 'node:fs';
import { resolve } from 'node:path';
import { flatLayout, formatTotals, runBatch } from './batch';

async function main(dir: string | undefined): Promise<number> {
  if (!dir || !existsSync(dir) || !statSync(dir).isDirectory()) {
    console.error('Usage: npx tsx test/corpus/score-batch.ts <folder with NN-name.txt, expected.json, manifest.json>');
    return 2;
  }
  const layout = flatLayout(resolve(dir));
  if (!existsSync(layout.expectedFile)) {
    console.error(`${dir}: no expected.json`);
    return 2;
  }
  console.log(formatTotals(await runBatch(layout)));
  return 0;
}

main(process.argv[2]).then(
  (code) => {
    process.exitCode = code;
  },
  (err: unknown) => {
    console.error(err instanceof Error ? err.message : String(err));
    process.exitCode = 1;
  },
);

// `npm run -s parse-report -- <file.pdf|file.txt> [more files]`: prints one JSON object keyed by
// each file's base name, each value the list of electrical findings the report parser reads from
// it. PDFs are read page by page; text files are split into pages on form feeds.
import { readFile } from 'node:fs/promises';
import { basename, extname } from 'node:path';
import { parseReport, parseText, type Finding } from '@cc/shared';
import { extractPdfPages } from '../server/src/integrations/pdf-text';

type PrintedFinding = Pick<Finding, 'code' | 'room' | 'quantity' | 'location' | 'evidence' | 'page'>;

async function findingsOf(file: string): Promise<PrintedFinding[]> {
  const buffer = await readFile(file);
  const result = extname(file).toLowerCase() === '.pdf' ? parseReport((await extractPdfPages(buffer)).pages) : parseText(buffer.toString('utf8'));
  return result.findings.map(({ code, room, quantity, location, evidence, page }) => ({ code, room, quantity, location, evidence, page }));
}

async function main(files: string[]): Promise<number> {
  if (files.length === 0) {
    console.error('Usage: npm run -s parse-report -- <file.pdf|file.txt> [more files]');
    return 2;
  }
  const out: Record<string, PrintedFinding[]> = {};
  let failed = 0;
  for (const file of files) {
    try {
      out[basename(file)] = await findingsOf(file);
    } catch (err) {
      failed++;
      console.error(`${file}: ${err instanceof Error ? err.message : String(err)}`);
    }
  }
  console.log(JSON.stringify(out, null, 2));
  return failed > 0 ? 1 : 0;
}

main(process.argv.slice(2)).then(
  (code) => {
    process.exitCode = code;
  },
  (err: unknown) => {
    console.error(err);
    process.exitCode = 1;
  },
);

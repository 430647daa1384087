// Report parsing speed: a 50-page inspection report PDF is generated with pdfkit from the corpus
// excerpts and written to disk; each repetition reads the same bytes with pdf-parse's full-text
// extraction (timed) and then parses the pages it returned (timed). Both steps get the same
// untimed warm-up repetitions first (pdf.js loads its code, V8 compiles the parser's functions
// and expressions), since a server reads many reports in one process; the cold first repetition
// is printed too. Reported: the median of each step, the parser's share as the ratio of the two
// medians (the target: no more than 25%), and the median of the per-repetition ratios, which
// varies less on a busy machine because both steps of a repetition run back to back.
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import PDFDocument from 'pdfkit';
import { parseReport } from '@cc/shared';
import { extractPdfPages } from '../server/src/integrations/pdf-text';

const PAGES = 50;
const EXCERPTS_PER_PAGE = 2;
const WARM_UP_RUNS = 5;
const RUNS = 21;
const TARGET_SHARE = 0.25;

function corpusExcerpts(): string[] {
  const dir = join(__dirname, '../test/corpus/excerpts');
  return readdirSync(dir)
    .filter((f) => f.endsWith('.txt'))
    .sort()
    .map((f) => readFileSync(join(dir, f), 'utf8').replace(/\f/g, '\n').replace(/\t/g, '    '));
}

function buildReportPdf(excerpts: string[]): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const doc = new PDFDocument({ autoFirstPage: false, size: 'LETTER', margin: 54 });
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    for (let page = 0; page < PAGES; page++) {
      doc.addPage().fontSize(9).text(`Quillmont Home Inspections - 14 Larkspur Lane - Page ${page + 1} of ${PAGES}`);
      doc.moveDown().fontSize(10);
      for (let k = 0; k < EXCERPTS_PER_PAGE; k++) {
        doc.text(excerpts[(page * EXCERPTS_PER_PAGE + k) % excerpts.length]);
        doc.moveDown();
      }
    }
    doc.end();
  });
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}

async function timeAsync<T>(fn: () => Promise<T>): Promise<[number, T]> {
  const t0 = performance.now();
  const value = await fn();
  return [performance.now() - t0, value];
}

export async function run(): Promise<void> {
  const dir = mkdtempSync(join(tmpdir(), 'parse-bench-'));
  try {
    const file = join(dir, 'report-50-pages.pdf');
    writeFileSync(file, await buildReportPdf(corpusExcerpts()));
    const pdf = readFileSync(file);

    const extractMs: number[] = [];
    const parseMs: number[] = [];
    const ratios: number[] = [];
    let cold: { extract: number; parse: number } | null = null;
    let pageCount = 0;
    let findings = 0;
    for (let i = 0; i < WARM_UP_RUNS + RUNS; i++) {
      const [te, pages] = await timeAsync(() => extractPdfPages(pdf));
      const t0 = performance.now();
      const result = parseReport(pages.pages);
      const tp = performance.now() - t0;
      cold ??= { extract: te, parse: tp };
      pageCount = pages.pageCount;
      findings = result.findings.length;
      if (i < WARM_UP_RUNS) continue;
      extractMs.push(te);
      parseMs.push(tp);
      ratios.push(tp / te);
    }
    const extract = median(extractMs);
    const parse = median(parseMs);
    const share = parse / extract;
    const perMinute = (ms: number) => Math.round((pageCount / ms) * 60_000);
    const row = (step: string, ms: number) =>
      console.log(`  ${step.padEnd(22)} ${ms.toFixed(1).padStart(9)} ${String(perMinute(ms)).padStart(11)}`);
    console.log(`pages: ${pageCount}, findings: ${findings}, median of ${RUNS} runs after ${WARM_UP_RUNS} warm-up runs`);
    console.log(`  ${'step'.padEnd(22)} ${'ms'.padStart(9)} ${'pages/min'.padStart(11)}`);
    row('pdf-parse extraction', extract);
    row('report parser', parse);
    row('both', extract + parse);
    if (cold) console.log(`  first (cold) run: extraction ${cold.extract.toFixed(1)} ms, parser ${cold.parse.toFixed(1)} ms`);
    console.log(`  median of per-run ratios: ${(100 * median(ratios)).toFixed(1)}%`);
    console.log(
      `parser adds ${(100 * share).toFixed(1)}% to extraction time: ${share <= TARGET_SHARE ? 'within' : 'OVER'} the ${100 * TARGET_SHARE}% target`,
    );
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

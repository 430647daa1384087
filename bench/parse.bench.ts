// Report parsing speed: a 50-page inspection report PDF is generated with pdfkit from the corpus
// excerpts, then pdf-parse's text extraction and the report parser are timed separately (median
// of several runs). Target: the parser adds no more than 25% to the extraction time.
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import PDFDocument from 'pdfkit';
import { parseReport } from '@cc/shared';
import { extractPdfPages } from '../server/src/integrations/pdf-text';

const PAGES = 50;
const EXCERPTS_PER_PAGE = 2;
const RUNS = 7;
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
    let pageCount = 0;
    let findings = 0;
    await extractPdfPages(pdf); // warm-up: loads pdf.js and its worker
    for (let i = 0; i < RUNS; i++) {
      const [te, pages] = await timeAsync(() => extractPdfPages(pdf));
      const t0 = performance.now();
      const result = parseReport(pages.pages);
      parseMs.push(performance.now() - t0);
      extractMs.push(te);
      pageCount = pages.pageCount;
      findings = result.findings.length;
    }
    const extract = median(extractMs);
    const parse = median(parseMs);
    const share = parse / extract;
    const perMinute = (ms: number) => Math.round((pageCount / ms) * 60_000);
    console.log(`pages: ${pageCount}, findings: ${findings}, runs: ${RUNS} (median)`);
    console.log(`  ${'step'.padEnd(22)} ${'ms'.padStart(9)} ${'pages/min'.padStart(11)}`);
    console.log(`  ${'pdf-parse extraction'.padEnd(22)} ${extract.toFixed(1).padStart(9)} ${String(perMinute(extract)).padStart(11)}`);
    console.log(`  ${'report parser'.padEnd(22)} ${parse.toFixed(1).padStart(9)} ${String(perMinute(parse)).padStart(11)}`);
    console.log(`  ${'both'.padEnd(22)} ${(extract + parse).toFixed(1).padStart(9)} ${String(perMinute(extract + parse)).padStart(11)}`);
    console.log(
      `parser adds ${(100 * share).toFixed(1)}% to extraction time: ${share <= TARGET_SHARE ? 'within' : 'OVER'} the ${100 * TARGET_SHARE}% target`,
    );
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

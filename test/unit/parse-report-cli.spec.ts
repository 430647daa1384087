// Each case starts tsx in a child process: minutes on a loaded machine, so the limits are generous.
jest.setTimeout(300_000);
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import PDFDocument from 'pdfkit';

const ROOT = resolve(__dirname, '../..');

function writePdf(path: string, pages: string[]): Promise<void> {
  return new Promise((done, fail) => {
    const doc = new PDFDocument({ autoFirstPage: false });
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => {
      writeFileSync(path, Buffer.concat(chunks));
      done();
    });
    doc.on('error', fail);
    for (const text of pages) doc.addPage().text(text);
    doc.end();
  });
}

function runCli(files: string[]) {
  return spawnSync('npx', ['tsx', 'scripts/parse-report.ts', ...files], { cwd: ROOT, encoding: 'utf8', timeout: 240_000 });
}

describe('scripts/parse-report.ts', () => {
  let dir: string;

  beforeAll(() => {
    dir = mkdtempSync(join(tmpdir(), 'parse-report-'));
  });
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  describe('with a PDF and a text report', () => {
    it('prints one JSON object keyed by base name with the findings of each', async () => {
      const pdf = join(dir, 'larkspur-lane.pdf');
      await writePdf(pdf, ['ROOF\nShingles are worn.\n\nELECTRICAL\n1. Two breakers are double tapped.', '2. The garage receptacles are not GFCI protected.']);
      const txt = join(dir, 'notes.txt');
      writeFileSync(txt, 'ELECTRICAL\nReversed polarity at the den receptacle.');

      const run = runCli([pdf, txt]);
      expect(run.status).toBe(0);
      const out = JSON.parse(run.stdout) as Record<string, Array<Record<string, unknown>>>;
      expect(Object.keys(out)).toEqual(['larkspur-lane.pdf', 'notes.txt']);
      expect(out['larkspur-lane.pdf']).toEqual([
        { code: 'double-tap', room: 'panel', quantity: 2, location: '', evidence: 'Two breakers are double tapped.', page: 1 },
        {
          code: 'gfci-missing',
          room: 'garage',
          quantity: null,
          location: 'garage receptacles',
          evidence: 'The garage receptacles are not GFCI protected.',
          page: 2,
        },
      ]);
      expect(out['notes.txt'].map((f) => [f.code, f.room])).toEqual([['reversed-polarity', 'living-area']]);
    }, 90_000);
  });

  describe('with a file that is not a PDF', () => {
    it('reports the file on stderr and exits 1', () => {
      const bad = join(dir, 'scan.pdf');
      writeFileSync(bad, 'not a pdf at all');
      const run = runCli([bad]);
      expect(run.status).toBe(1);
      expect(run.stderr).toContain('scan.pdf: The file is not a readable PDF');
      expect(JSON.parse(run.stdout)).toEqual({});
    }, 90_000);
  });
});

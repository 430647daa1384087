import { FindingSchema } from './finding.schema';
import { joinPages, parseReport, parseText } from './report-parser';

describe('parseReport', () => {
  const pages = [
    'ROOF\nShingles are worn.\n\nELECTRICAL\n1. Reversed polarity at the den receptacle.\n2. The garage receptacles are not GFCI',
    'protected; there are (3) of them.\n3. No open grounds observed.',
  ];
  const result = parseReport(pages);
  const joined = joinPages(pages);

  it('reads the electrical findings with codes, rooms and counts', () => {
    expect(result.findings.map((f) => [f.code, f.room, f.quantity])).toEqual([
      ['reversed-polarity', 'living-area', 1],
      ['gfci-missing', 'garage', 3],
    ]);
  });

  it('gives evidence that is the joined text between start and end, across the page break', () => {
    for (const f of result.findings) {
      expect(joined.slice(f.start, f.end)).toBe(f.evidence);
      expect(FindingSchema.safeParse(f).success).toBe(true);
    }
    const gfci = result.findings[1];
    expect(gfci.evidence).toContain('\f');
    expect(gfci.page).toBe(1);
  });

  it('attaches the severity and NEC sections of the code table', () => {
    expect(result.findings[1].severity).toBe('safety');
    expect(result.findings[1].necRefs).toEqual(['210.8(A)', '406.4(D)(3)']);
  });

  it('returns non-electrical and denied text as skipped, with its section', () => {
    expect(result.skipped.map((s) => [s.section, s.reason, s.page])).toEqual([
      ['ROOF', 'non-electrical-section', 1],
      ['ELECTRICAL', 'negated', 2],
    ]);
  });

  it('numbers pages from 1 at the page where the evidence starts', () => {
    const [finding] = parseReport(['ELECTRICAL', 'Double tap at the panel.']).findings;
    expect(finding.page).toBe(2);
  });
});

describe('parseText', () => {
  it('splits pages on form feeds', () => {
    expect(parseText('ELECTRICAL\fOpen ground at the den.').findings[0].page).toBe(2);
  });

  it('gives nothing for an empty report', () => {
    expect(parseText('')).toEqual({ findings: [], skipped: [] });
  });
});

import { FindingSchema } from './finding.schema';
import { joinPages, parseReport, parseText, suggestItem } from './report-parser';

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

describe('suggestItem', () => {
  it('suggests the first electrical thing the passage names, whichever row of the table names it', () => {
    expect(suggestItem('The light by the GFCI flickers.', null)?.code).toBe('light-fixture');
    expect(suggestItem('The GFCI by the light flickers.', null)?.code).toBe('gfci-missing');
  });

  it('takes the row listed first where two begin at the same word', () => {
    // "wire nut" is a junction-box word and "wire" a wiring word: the junction box is listed first.
    expect(suggestItem('Wire nut loose in the attic.', null)).toEqual({ code: 'open-junction-box', room: 'attic' });
  });

  it('suggests nothing for a passage with no electrical word', () => {
    expect(suggestItem('Shingles are worn at the ridge.', null)).toBeNull();
  });
});

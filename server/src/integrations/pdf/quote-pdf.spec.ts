// The quote PDF read back with pdf-parse (through extractPdfPages): the dates as the portal writes
// them, "Page n of N" on every page, an acceptance block, no page left nearly empty, plain words.
import { DEMO_RATE_BOOK, FINDING_CODE_TABLE, priceQuote, type QuoteVersion, type QuoteVersionLine } from '@cc/shared';
import PDFDocument from 'pdfkit';
import { extractPdfPages } from '../pdf-text';
import { MARGIN } from './pdf-layout';
import { formatDay, renderQuotePdf } from './quote-pdf';

const entry = (id: string) => {
  const found = DEMO_RATE_BOOK.entries.find((e) => e.id === id)!;
  return { id: 1, key: found.id, version: 1, name: found.name, unit: found.unit, mode: found.pricing.mode };
};

function quoteWith(lineCount: number): QuoteVersion {
  const picks = ['gfci-receptacle-first-device', 'receptacle-replace', 'double-tap-pigtail'];
  const rooms = ['bedroom', 'kitchen', 'garage'];
  const lines = Array.from({ length: lineCount }, (_, i) => ({ key: `l${i}`, entryId: picks[i % 3], quantity: 1 + (i % 3), visitKey: 'visit-1' }));
  const breakdown = priceQuote(DEMO_RATE_BOOK, { visits: [{ key: 'visit-1' }], lines });
  const quoteLines: QuoteVersionLine[] = lines.map((line, i) => {
    const priced = breakdown.visits[0].lines[i];
    const e = DEMO_RATE_BOOK.entries.find((x) => x.id === line.entryId)!;
    return {
      lineItemId: i + 1,
      kind: 'priced',
      code: e.code!,
      room: rooms[i % 3],
      // The reader often repeats the room as the location ("bedroom, bedroom" before).
      location: i % 3 === 0 ? 'bedroom' : `north wall ${i}`,
      entry: entry(line.entryId),
      quantity: line.quantity,
      isQuantityAssumed: false,
      adders: [],
      visitKey: 'visit-1',
      labourMinutes: priced.labourMinutes,
      labourCents: priced.labourCents,
      materialsCents: priced.materialsCents,
      flatCents: priced.flatCents,
      lineCents: priced.labourCents + priced.materialsCents + priced.flatCents,
      outOfScopeReason: null,
      editionNote: null,
    };
  });
  quoteLines.push({ ...quoteLines[0], lineItemId: 99, kind: 'out-of-scope', code: 'service-equipment', room: 'exterior', location: 'service mast', entry: null, quantity: null, lineCents: 0, outOfScopeReason: 'Utility-side work' });
  return {
    id: 1,
    requestId: 3,
    requestReference: 'CC-00003',
    version: 1,
    isCurrent: true,
    sentAt: '2026-12-02T15:30:00Z',
    sentByName: 'Sam Okafor',
    validUntil: '2027-01-01',
    contractor: { organisationId: 1, name: 'Brightline Electric Co.', licenceNumber: 'EC-1044', licenceState: 'CO', licenceClass: 'Master', phone: '(555) 010-2000', address: '12 Quarry Road, Quarry Bend, CO' },
    property: { street: '1180 Ridgeview Drive', city: 'Marlow Springs', state: 'CO', zip: '81290' },
    lines: quoteLines,
    breakdown,
    cardDepositBp: 5_000,
    warrantyText: DEMO_RATE_BOOK.terms.warrantyText,
    safetyNotice: 'Electrical work is done by licensed electricians under the local code and the permits it requires.',
    note: null,
    changes: null,
    pdfPath: '/api/requests/3/quotes/1.pdf',
  } as QuoteVersion;
}

async function pagesOf(quote: QuoteVersion): Promise<string[]> {
  return (await extractPdfPages(await renderQuotePdf(quote))).pages.map((p) => p.replace(/\s+/g, ' ').trim());
}

describe('renderQuotePdf', () => {
  it('writes dates as the portal does ("Dec 2, 2026"), never in ISO form', async () => {
    const text = (await pagesOf(quoteWith(3))).join(' ');
    expect(formatDay('2026-12-02T15:30:00Z')).toBe('Dec 2, 2026');
    expect(text).toContain('Sent Dec 2, 2026 by Sam Okafor');
    expect(text).toContain('Prices valid until Jan 1, 2027');
    expect(text).not.toMatch(/\d{4}-\d{2}-\d{2}/);
  });

  it.each([14, 22, 30, 38])('numbers every page "Page n of N" and leaves no page nearly empty (%d lines)', async (lineCount) => {
    const pages = await pagesOf(quoteWith(lineCount));
    expect(pages.length).toBeGreaterThanOrEqual(2);
    pages.forEach((text, i) => {
      expect(text).toContain(`Page ${i + 1} of ${pages.length}`);
      // More than the footer and a line or two on every page (a footer alone is ~70 characters).
      expect(text.length).toBeGreaterThan(300);
    });
  });

  it('ends with an acceptance block for the seller: the total, the version, name, signature and date lines', async () => {
    const quote = quoteWith(3);
    const pages = await pagesOf(quote);
    const last = pages.at(-1)!;
    expect(last).toContain('Acceptance');
    expect(last).toContain('The seller accepts the work quoted above, version 1 of quote CC-00003');
    expect(last).toMatch(/Seller’s name .*Date .*Seller’s signature/);
  });

  it('says the room once, pluralises units and names findings in words, not codes', async () => {
    const text = (await pagesOf(quoteWith(6))).join(' ');
    expect(text).not.toMatch(/bedroom, bedroom/i);
    expect(text).toContain('— Bedroom');
    expect(text).toContain('Kitchen, north wall 1');
    expect(text).toMatch(/2 devices|3 devices|2 terminals|3 terminals/);
    expect(text).not.toMatch(/\b1 devices\b/);
    expect(text).toContain(FINDING_CODE_TABLE['service-equipment'].label);
    expect(text).not.toContain('service-equipment');
    expect(text).not.toContain('NaN');
  });

  it.each(Array.from({ length: 31 }, (_, i) => i + 10))('keeps the body above the footer on every page (%d lines)', async (lineCount) => {
    // Each line pdfkit writes (its internal _fragment), with where it ends: the body must stop above
    // the 24-point footer band, also when a long paragraph flows on by itself.
    type Fragmenting = { _fragment(text: string, x: number, y: number, options: object): unknown };
    const proto = PDFDocument.prototype as unknown as Fragmenting;
    const original = proto._fragment;
    const lines: Array<{ text: string; bottom: number; limit: number }> = [];
    proto._fragment = function (this: PDFKit.PDFDocument & Fragmenting, text, x, y, options) {
      lines.push({ text, bottom: y + this.currentLineHeight(false), limit: this.page.height - MARGIN - 24 });
      return original.call(this, text, x, y, options);
    };
    try {
      await renderQuotePdf(quoteWith(lineCount));
    } finally {
      proto._fragment = original;
    }
    const body = lines.filter((l) => !/^Page \d+ of \d+$|quote version/.test(l.text));
    expect(body.length).toBeGreaterThan(50);
    expect(body.filter((l) => l.bottom > l.limit + 0.5).map((l) => l.text)).toEqual([]);
  });
});


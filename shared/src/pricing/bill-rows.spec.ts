// The rows of an invoice or a receipt add up to the subtotal the engine prices (docs/pricing.md,
// "The model": the service call once per visit, the first-hour minimum once per visit and shared by
// the visit's lines by minutes). Figures from the demo rate book, computed by the engine itself: the
// check is that no charge is billed twice or left out.
import { billRows, lineAmountsOf } from './bill-rows';
import { DEMO_RATE_BOOK } from './demo-rate-book';
import { priceQuote } from './price-quote';

const sumOf = (rows: ReturnType<typeof billRows>) => rows.lines.reduce((s, l) => s + l.amountCents, 0) + rows.serviceCallCents + rows.visitConditionsCents + rows.permitCents;

describe('billRows', () => {
  it('bills the first-hour minimum once, inside the lines: lines + service call = subtotal (a GFCI and a polarity fix on one visit)', () => {
    const quote = priceQuote(DEMO_RATE_BOOK, {
      visits: [{ key: 'v1' }],
      lines: [
        { key: '1', visitKey: 'v1', entryId: 'gfci-receptacle-first-device', quantity: 1 },
        { key: '2', visitKey: 'v1', entryId: 'polarity-correct', quantity: 1 },
      ],
    });
    const rows = billRows(quote);
    expect(rows.serviceCallCents).toBe(DEMO_RATE_BOOK.terms.serviceCallCents);
    expect(rows.permitCents).toBe(0);
    expect(sumOf(rows)).toBe(quote.subtotalCents);
    expect(rows.subtotalCents + rows.taxCents).toBe(rows.totalCents);
    // The minimum is not a row of its own: billing it beside the lines would count it twice.
    expect(rows.lines.reduce((s, l) => s + l.amountCents, 0)).toBe(quote.subtotalCents - DEMO_RATE_BOOK.terms.serviceCallCents);
  });

  it('adds per-visit site-condition labour and permits as their own rows, over two visits', () => {
    const quote = priceQuote(DEMO_RATE_BOOK, {
      visits: [{ key: 'v1', adderIds: ['panel-shutoff'], hasPermit: true }, { key: 'v2' }],
      lines: [
        { key: 'a', visitKey: 'v1', entryId: 'double-tap-pigtail', quantity: 1 },
        { key: 'b', visitKey: 'v1', entryId: 'gfci-replace-flat', quantity: 2 },
        { key: 'c', visitKey: 'v2', entryId: 'smoke-alarm-sealed', quantity: 1 },
      ],
    });
    const rows = billRows(quote);
    expect(rows.serviceCallCents).toBe(2 * DEMO_RATE_BOOK.terms.serviceCallCents);
    expect(rows.permitCents).toBe(DEMO_RATE_BOOK.terms.permit.feeCents + DEMO_RATE_BOOK.terms.permit.handlingCents);
    expect(rows.visitConditionsCents).toBeGreaterThan(0);
    expect(sumOf(rows)).toBe(quote.subtotalCents);
    expect([...lineAmountsOf(quote).keys()]).toEqual(['a', 'b', 'c']);
  });

  it('bills nothing for an empty scope', () => {
    expect(billRows(null)).toMatchObject({ lines: [], subtotalCents: 0, totalCents: 0 });
  });
});

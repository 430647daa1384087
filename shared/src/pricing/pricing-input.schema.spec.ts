// Rules of the priced input, as written in docs/pricing.md section 1.2 and 1.4.
import { QuoteSchema, VisitSchema } from './pricing-input.schema';

const line = (key: string, visitKey = 'v1') => ({ key, visitKey, entryId: 'gfci-replace', quantity: 1 });

describe('QuoteSchema', () => {
  it('fills in the defaults of a valid quote', () => {
    const parsed = QuoteSchema.parse({ visits: [{ key: 'v1' }], lines: [line('a')] });
    expect(parsed.visits[0]).toEqual({ key: 'v1', adderIds: [], hasPermit: false });
    expect(parsed.lines[0].adderIds).toEqual([]);
  });

  it.each([
    ['a repeated visit key', { visits: [{ key: 'v1' }, { key: 'v1' }], lines: [line('a')] }, 'Visit "v1" is listed twice'],
    ['a repeated line key', { visits: [{ key: 'v1' }], lines: [line('a'), line('a')] }, 'Line "a" is listed twice'],
    ['a line on a visit that is not there', { visits: [{ key: 'v1' }], lines: [line('a'), line('b', 'v2')] }, 'No visit "v2" in this quote'],
    ['a visit with no items', { visits: [{ key: 'v1' }, { key: 'v2' }], lines: [line('a')] }, 'Visit "v2" has no items'],
    ['a fractional quantity', { visits: [{ key: 'v1' }], lines: [{ ...line('a'), quantity: 1.5 }] }, ''],
    ['a quantity of 0', { visits: [{ key: 'v1' }], lines: [{ ...line('a'), quantity: 0 }] }, ''],
  ])('refuses %s', (_name, quote, message) => {
    const result = QuoteSchema.safeParse(quote);
    expect(result.success).toBe(false);
    expect(result.error?.issues.map((i) => i.message).join('\n')).toContain(message);
  });
});

describe('VisitSchema', () => {
  it('refuses a repeated line key', () => {
    const result = VisitSchema.safeParse({ key: 'v', lines: [line('a'), line('a')] });
    expect(result.error?.issues[0]).toMatchObject({ path: ['lines', 1, 'key'] });
  });
});

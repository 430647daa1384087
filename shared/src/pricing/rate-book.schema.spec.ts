// Invariants of a rate book, as written in docs/pricing.md section 1.1 (the schema's own rules).
import { DEMO_RATE_BOOK } from './demo-rate-book';
import { RateBookSchema, type RateBook } from './rate-book.schema';

const gfci = DEMO_RATE_BOOK.entries.find((e) => e.id === 'gfci-replace')!;

const variants: [string, RateBook, string][] = [
  [
    'a materials list that does not add up to the cost per unit',
    { ...DEMO_RATE_BOOK, entries: [{ ...gfci, pricing: { ...gfci.pricing, materialsCentsPerUnit: 2_401 } as RateBook['entries'][number]['pricing'] }] },
    'Materials list adds up to 2400 cents, not 2401',
  ],
  [
    'easy-site minutes above hard-site minutes',
    { ...DEMO_RATE_BOOK, entries: [{ ...gfci, pricing: { ...gfci.pricing, minutesLow: 30 } as RateBook['entries'][number]['pricing'] }] },
    'Easy-site minutes exceed hard-site minutes',
  ],
  ['an entry id used twice', { ...DEMO_RATE_BOOK, entries: [gfci, gfci] }, 'Entry id "gfci-replace" is used twice'],
  ['an adder id used twice', { ...DEMO_RATE_BOOK, adders: [DEMO_RATE_BOOK.adders[0], DEMO_RATE_BOOK.adders[0]] }, 'is used twice'],
  [
    'a flat entry whose additional unit costs more than the first',
    {
      ...DEMO_RATE_BOOK,
      entries: [{ id: 'x', code: null, name: 'X', unit: 'each', pricing: { mode: 'flat', firstUnitCents: 100, additionalUnitCents: 200, hardSiteMultiplierBp: 10_000 } }],
    },
    'Each additional unit costs more than the first',
  ],
];

describe('RateBookSchema', () => {
  it.each(variants)('refuses %s', (_name, book, message) => {
    const result = RateBookSchema.safeParse(book);
    expect(result.success).toBe(false);
    expect(result.error?.issues.map((i) => i.message).join('\n')).toContain(message);
  });

  it.each([
    ['a fractional cent', { ...DEMO_RATE_BOOK, terms: { ...DEMO_RATE_BOOK.terms, serviceCallCents: 95.5 } }],
    ['a multiplier below ×1', { ...DEMO_RATE_BOOK, adders: [{ ...DEMO_RATE_BOOK.adders[2], effect: { kind: 'labour-multiplier', multiplierBp: 9_000 } }] }],
    ['a billing increment of 0', { ...DEMO_RATE_BOOK, terms: { ...DEMO_RATE_BOOK.terms, billingIncrementMinutes: 0 } }],
  ])('refuses %s', (_name, book) => {
    expect(RateBookSchema.safeParse(book).success).toBe(false);
  });

  it('fills in the first-hour coverage and visit capacity defaults (60 and 480 minutes)', () => {
    const { firstHourCoversMinutes: _f, visitCapacityMinutes: _v, ...terms } = DEMO_RATE_BOOK.terms;
    const parsed = RateBookSchema.parse({ ...DEMO_RATE_BOOK, terms });
    expect(parsed.terms.firstHourCoversMinutes).toBe(60);
    expect(parsed.terms.visitCapacityMinutes).toBe(480);
  });
});

import { FindingSchema, ParseResultSchema } from './finding.schema';

const valid = {
  code: 'gfci-missing',
  room: 'kitchen',
  location: 'kitchen counter',
  quantity: 2,
  evidence: 'No GFCI at kitchen counter.',
  page: 1,
  start: 10,
  end: 37,
  severity: 'safety',
  necRefs: ['210.8(A)'],
  confidence: 'exact',
  recommendation: null,
  computation: null,
};

describe('FindingSchema', () => {
  it('accepts a well-formed finding', () => {
    expect(FindingSchema.parse(valid)).toEqual(valid);
  });

  it('rejects codes and rooms outside the lists', () => {
    expect(FindingSchema.safeParse({ ...valid, code: 'gfci' }).success).toBe(false);
    expect(FindingSchema.safeParse({ ...valid, room: 'den' }).success).toBe(false);
  });

  it('rejects a zero or fractional quantity but accepts null', () => {
    expect(FindingSchema.safeParse({ ...valid, quantity: 0 }).success).toBe(false);
    expect(FindingSchema.safeParse({ ...valid, quantity: 1.5 }).success).toBe(false);
    expect(FindingSchema.safeParse({ ...valid, quantity: null }).success).toBe(true);
  });

  it('rejects offsets that do not span the evidence', () => {
    const result = FindingSchema.safeParse({ ...valid, end: 30 });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0].path).toEqual(['end']);
  });
});

describe('ParseResultSchema', () => {
  it('accepts findings and skipped text', () => {
    const skipped = { section: 'ROOF', sectionKind: 'non-electrical', reason: 'non-electrical-section', text: 'Shingles worn.', page: 1, start: 0, end: 14 };
    expect(ParseResultSchema.safeParse({ findings: [valid], skipped: [skipped] }).success).toBe(true);
  });
});

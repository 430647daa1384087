import { clauseIndexAt, clauseRanges } from './clause-splitter';

describe('clauseRanges', () => {
  it('splits at semicolons and contrast words', () => {
    const text = 'GFCI tripped but would not reset; replace it';
    const parts = clauseRanges(text).map((r) => text.slice(r.start, r.end));
    expect(parts).toEqual(['GFCI tripped', 'would not reset', 'replace it']);
  });

  it('keeps a sentence without breaks whole', () => {
    expect(clauseRanges('Open ground at the den')).toEqual([{ start: 0, end: 22 }]);
  });

  it('finds the clause of a position', () => {
    const clauses = clauseRanges('a; b; c');
    expect(clauseIndexAt(clauses, 0)).toBe(0);
    expect(clauseIndexAt(clauses, 3)).toBe(1);
    expect(clauseIndexAt(clauses, 99)).toBe(2);
  });
});

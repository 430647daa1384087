import { readQuantity, tokenize, TOKEN } from './quantity-reader';

describe('readQuantity', () => {
  // Quantity rules of the project's finding-code list: a whole number when the report gives one,
  // null for "several", "multiple", "various" and "all" without a number.
  it.each([
    ['three receptacles in the garage', 3],
    ['(2) receptacles at the island', 2],
    ['2x open grounds noted', 2],
    ['open grounds x3', 3],
    ['Both exterior receptacles lack covers', 2],
    ['Neither bathroom has GFCI protection', 2],
    ['Two of the countertop receptacles', 2],
    ['all three receptacles', 3],
    ['Open grounds: 2 (bedroom 2, east wall)', 2],
    ['An open junction box', 1],
    ['a 30 amp breaker protects 14 gauge wire', 1],
    ['THE DEAD FRONT IS MISSING TWO SCREWS', 2],
  ])('reads "%s" as %p', (text, expected) => {
    expect(readQuantity(text)).toBe(expected);
  });

  it.each([
    'several receptacles are loose',
    'multiple light fixtures',
    'various outlets',
    'All receptacles in the basement',
    'Missing GFCI protection at kitchen counter',
  ])('reads "%s" as null', (text) => {
    expect(readQuantity(text)).toBeNull();
  });

  it.each(['3-prong receptacle', '20 amp breakers', '14 gauge wire', 'within 6 feet of the sink', 'bedroom 3 receptacles', 'slot 14 filler', 'over ten years old'])(
    'does not take the measure or index in "%s" for a count',
    (text) => expect(readQuantity(text)).toBeNull(),
  );

  it('counts "a"/"an" only before the article limit', () => {
    const text = 'the ceiling fan is mounted to a standard light box';
    expect(readQuantity(text, 10)).toBeNull();
    expect(readQuantity('a loose receptacle', 10)).toBe(1);
  });
});

describe('tokenize', () => {
  const byExpression = (text: string) => [...text.matchAll(new RegExp(TOKEN.source, 'g'))].map((m) => ({ word: m[0].toLowerCase(), index: m.index }));

  it('reads bracketed counts, fractions, words and marks as TOKEN does', () => {
    expect(tokenize('Two (x3) GFCIs, 1/2 of #12 - ( 4 ) (12345) 20% don\'t:')).toEqual([
      { word: 'two', index: 0 },
      { word: '(x3)', index: 4 },
      { word: 'gfcis', index: 9 },
      { word: ',', index: 14 },
      { word: '1/2', index: 16 },
      { word: 'of', index: 20 },
      { word: '#12', index: 23 },
      { word: '-', index: 27 },
      { word: '( 4 )', index: 29 },
      { word: '12345', index: 36 },
      { word: '20%', index: 43 },
      { word: "don't", index: 47 },
      { word: ':', index: 52 },
    ]);
  });

  it('gives the same tokens as TOKEN on random text of its special characters', () => {
    let state = 11;
    const next = () => (state = (state * 1103515245 + 12345) & 0x7fffffff);
    const pieces = ['(', ')', 'x', 'X', ' ', '\u00a0', '1', '23', '4567', '/', '#', "'", '%', '-', '_', 'Ab', ':', ';', ',', '.', 'é', '\n'];
    for (let k = 0; k < 3000; k++) {
      let text = '';
      for (let p = 1 + (next() % 24); p > 0; p--) text += pieces[next() % pieces.length];
      expect(tokenize(text)).toEqual(byExpression(text));
    }
  });
});

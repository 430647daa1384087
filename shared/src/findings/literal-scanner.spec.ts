import { LiteralScanner } from './literal-scanner';

describe('LiteralScanner', () => {
  const scanner = new LiteralScanner(
    [
      { text: 'ground', ids: [0] },
      { text: 'ungrounded', ids: [1] },
      { text: 'open ground', ids: [2, 3] },
      { text: 'gfi', ids: [4] },
    ],
    6,
  );
  const found = (text: string) => [...scanner.scan(text)].flatMap((hit, id) => (hit ? [id] : []));

  it('finds nested and overlapping literals in one pass', () => {
    expect(found('two ungrounded receptacles')).toEqual([0, 1]);
    expect(found('open ground at the gfi')).toEqual([0, 2, 3, 4]);
  });

  it('finds a literal that starts inside a failed longer one', () => {
    expect(found('open grgfi')).toEqual([4]);
    expect(found('opopen ground')).toEqual([0, 2, 3]);
  });

  it('finds nothing in text without the literals, whatever its characters', () => {
    expect(found('reversed polarity — café')).toEqual([]);
    expect(found('')).toEqual([]);
  });

  it('accepts only lower-case ASCII literals', () => {
    expect(() => new LiteralScanner([{ text: 'GFCI', ids: [0] }], 1)).toThrow(RangeError);
    expect(() => new LiteralScanner([{ text: 'café', ids: [0] }], 1)).toThrow(RangeError);
    expect(() => new LiteralScanner([{ text: '', ids: [0] }], 1)).toThrow(RangeError);
  });
});

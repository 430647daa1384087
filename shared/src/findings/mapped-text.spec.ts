import { MappedTextBuilder, sliceMapped, sourceRange } from './mapped-text';

describe('MappedTextBuilder', () => {
  it('collapses spaces and remembers where every character came from', () => {
    const source = 'Open   ground\nat den';
    const b = new MappedTextBuilder();
    b.appendSource(source, 0, 13);
    b.appendSeparator(' ', 13);
    b.appendSource(source, 14, source.length);
    const m = b.build();
    expect(m.text).toBe('Open ground at den');
    expect(m.text.split('').every((ch, i) => ch === ' ' || source[m.offsets[i]] === ch)).toBe(true);
    expect(sourceRange(m)).toEqual({ start: 0, end: source.length });
  });

  it('reads the cells of a tab row on as one line, like a pipe row (the item is read with its condition)', () => {
    const b = new MappedTextBuilder();
    b.appendSource('Garage\tReceptacle cracked', 0, 25);
    const text = b.build();
    expect(text.text).toBe('Garage Receptacle cracked');
    expect(text.offsets[6]).toBe(6);
  });

  it('joins a word wrapped with a hyphen', () => {
    const source = 'recep-\ntacle';
    const b = new MappedTextBuilder();
    b.appendSource(source, 0, 6);
    b.dropTrailingHyphen();
    b.appendSource(source, 7, source.length);
    expect(b.build().text).toBe('receptacle');
  });
});

describe('sliceMapped', () => {
  it('trims and keeps offsets aligned', () => {
    const b = new MappedTextBuilder();
    b.appendSource('ab cd ef', 0, 8);
    const part = sliceMapped(b.build(), 2, 6);
    expect(part.text).toBe('cd');
    expect(sourceRange(part)).toEqual({ start: 3, end: 5 });
  });
});

import { correctSpelling, normaliseText } from './text-normaliser';
import type { MappedText } from './mapped-text';

/** A mapped text whose offsets are its own positions (as a sentence at the start of a report). */
function mapped(text: string): MappedText {
  return { text, offsets: [...text].map((_, i) => i) };
}

/** The original stretch a normalised text covers, as evidence is cut from the report. */
function sourceOf(original: string, m: MappedText): string {
  return original.slice(m.offsets[0], m.offsets[m.offsets.length - 1] + 1);
}

describe('normaliseText', () => {
  it.each([
    ['GFI at vanity no trip', 'GFCI at vanity no trip'],
    ['30A on #12 Cu', '30A on 12 AWG copper'],
    ['12 ga aluminum on 20A', '12 AWG aluminum on 20A'],
    ['K&T in attic', 'knob-and-tube in attic'],
    ['J-box no cvr, bsmt', 'junction box no cover, basement'],
    ['rcpt loose w/o plate', 'receptacle loose without plate'],
    ['two recepts inop.', '2 receptacles inoperative.'],
    ['forty amp brkr', '40 amp breaker'],
  ])('expands inspector shorthand and number words: %s', (written, expected) => {
    expect(normaliseText(mapped(written)).text).toBe(expected);
  });

  it('corrects misspelt trade words of 5+ letters by edit distance, swapped neighbours as one edit', () => {
    expect(normaliseText(mapped('recepticle by the door, junciton box open')).text).toBe('receptacle by the door, junction box open');
    expect(correctSpelling('breker')).toBe('breaker');
    expect(correctSpelling('wobbels')).toBe('wobbles');
    expect(correctSpelling('ungrouded')).toBe('ungrounded');
  });

  it('leaves ordinary words, plurals and short words alone', () => {
    expect(correctSpelling('place')).toBeNull(); // one edit from "plate", but an ordinary word
    expect(correctSpelling('breakers')).toBeNull();
    expect(correctSpelling('cords')).toBeNull();
    expect(normaliseText(mapped('Al Jones inspected the SW corner')).text).toBe('Al Jones inspected the SW corner');
  });

  it('keeps every character mapped to the original, so evidence stays an exact substring', () => {
    const original = 'Two recepticles by the sink, GFI inop';
    const normalised = normaliseText(mapped(original));
    expect(normalised.text).toBe('2 receptacles by the sink, GFCI inoperative');
    expect(sourceOf(original, normalised)).toBe(original);
    expect(normalised.changed.map((c) => normalised.text.slice(c.start, c.end))).toEqual(['2', 'receptacles', 'GFCI', 'inoperative']);
  });

  it('returns unchanged text with no changed stretches', () => {
    const m = mapped('The kitchen receptacle is loose.');
    expect(normaliseText(m)).toEqual({ ...m, changed: [] });
  });
});

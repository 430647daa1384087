import { MappedTextBuilder } from './mapped-text';
import { splitSentences } from './sentence-splitter';

function sentencesOf(text: string): string[] {
  const b = new MappedTextBuilder();
  b.appendSource(text, 0, text.length);
  return splitSentences(b.build()).map((s) => s.text);
}

describe('splitSentences', () => {
  it('splits at a full stop before a capital', () => {
    expect(sentencesOf('Double tap at panel. Open ground at den.')).toEqual(['Double tap at panel.', 'Open ground at den.']);
  });

  it('does not split after inspector abbreviations', () => {
    expect(sentencesOf('Loose recep. In the kitchen. Approx. 6 ft from sink.')).toEqual([
      'Loose recep. In the kitchen.',
      'Approx. 6 ft from sink.',
    ]);
  });

  it('splits ALL CAPS text', () => {
    expect(sentencesOf('THE PANEL IS IN THE GARAGE. ONE CIRCUIT IS DOUBLE TAPPED.')).toHaveLength(2);
  });

  it('splits at a kept line boundary', () => {
    expect(sentencesOf('Kitchen\nCounter receptacles not GFCI protected')).toEqual(['Kitchen', 'Counter receptacles not GFCI protected']);
  });
});

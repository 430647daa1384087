import { negatedSpans } from './negation-detector';

/** Spans of the given phrases in `text`, in order. */
function spansOf(text: string, phrases: string[]) {
  return phrases.map((p) => {
    const start = text.indexOf(p);
    return { start, end: start + p.length };
  });
}

describe('negatedSpans', () => {
  it('denies a phrase after "no" and the phrases listed with it', () => {
    const text = 'No reversed polarity or open grounds observed.';
    expect(negatedSpans(text, spansOf(text, ['reversed polarity', 'open grounds']))).toEqual([true, true]);
  });

  it('denies a phrase followed by "not observed" or a checklist "None"', () => {
    for (const [text, phrase] of [
      ['Reversed polarity was not observed at tested receptacles.', 'Reversed polarity'],
      ['Double taps: None', 'Double taps'],
      ['Reversed polarity: none found', 'Reversed polarity'],
    ]) {
      expect(negatedSpans(text, spansOf(text, [phrase]))).toEqual([true]);
    }
  });

  it('keeps a cue that is part of the defect phrase ("no GFCI", "did not trip")', () => {
    const text = 'There is no GFCI protection at the kitchen and the garage GFCI did not trip.';
    expect(negatedSpans(text, spansOf(text, ['no GFCI protection', 'GFCI did not trip']))).toEqual([false, false]);
  });

  it('does not carry a denial across a clause', () => {
    const text = 'No reversed polarity was found; open ground at the bedroom receptacle.';
    expect(negatedSpans(text, spansOf(text, ['reversed polarity', 'open ground']))).toEqual([true, false]);
  });

  it('does not deny a reported defect listed before a denied one in another clause', () => {
    const text = 'Open ground at the den, but reversed polarity was not observed.';
    expect(negatedSpans(text, spansOf(text, ['Open ground', 'reversed polarity']))).toEqual([false, true]);
  });

  it('treats a conditional as a denial', () => {
    const text = 'If reversed polarity is found, correct it.';
    expect(negatedSpans(text, spansOf(text, ['reversed polarity']))).toEqual([true]);
  });
});

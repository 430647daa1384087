import { negatedSpans, teachesOnly } from './negation-detector';

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

describe('teachesOnly: sentences that teach rather than report', () => {
  it('reads glossary entries, "also called", questions, device definitions and era habits as teaching', () => {
    expect(teachesOnly('Double tap - Two conductors under one terminal designed for one.')).toBe(true);
    expect(teachesOnly('Open ground - A three-slot receptacle with no ground connection.')).toBe(true);
    expect(teachesOnly('Also called a false ground.')).toBe(true);
    expect(teachesOnly('Q: I heard old houses have knob-and-tube.')).toBe(true);
    expect(teachesOnly('A breaker or receptacle that detects arcing and opens the circuit.')).toBe(true);
    expect(teachesOnly('Houses of this era were commonly built with knob-and-tube or cloth-jacketed cable.')).toBe(true);
  });

  it('keeps what reports this house: a place, a count, an observation, a priority word before the dash', () => {
    expect(teachesOnly('Kitchen - A receptacle by the sink is not GFCI protected.')).toBe(false);
    expect(teachesOnly('SAFETY - The service pole leans toward the driveway.')).toBe(false);
    expect(teachesOnly('Safety - The service pole leans toward the driveway.')).toBe(false);
    expect(teachesOnly('Houses of this era commonly have knob-and-tube, and active knob-and-tube was observed in the attic.')).toBe(false);
    expect(teachesOnly('The receptacle that feeds the dishwasher is scorched.')).toBe(false);
  });

  it('denies every phrase of a teaching sentence', () => {
    const text = 'Double tap - Two conductors under one terminal designed for one.';
    expect(negatedSpans(text, [{ start: 0, end: 10 }])).toEqual([true]);
  });
});


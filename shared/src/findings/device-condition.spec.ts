import { matchCodes } from './code-matcher';
import { composeMatches } from './device-condition';
import { parseText } from './report-parser';
import { normaliseText } from './text-normaliser';

/** (code, room, quantity) of every finding. */
function read(text: string) {
  return parseText(text).findings.map((f) => [f.code, f.room, f.quantity]);
}

/** The codes composed from a device and a condition in a one-sentence text (after the phrase table has read it). */
function composed(text: string): string[] {
  const sentence = normaliseText({ text, offsets: Array.from({ length: text.length }, (_, i) => i) });
  return composeMatches(sentence.text, matchCodes(sentence.text)).map((m) => m.rule.code);
}

// Device and condition composition (docs/parser.md, "Device and condition composition"). Each example is
// new text written for this spec, not a sentence of the corpus, and each is one the phrase table does not
// read: the finding comes from the device word and the condition word alone.

describe('device and condition: one example per code', () => {
  const cases: ReadonlyArray<{ text: string; expected: [string, string, number | null]; source: string }> = [
    { text: 'Hall bath GFI refused to trip, two attempts.', expected: ['gfci-inoperative', 'bathroom', 1], source: 'NFPA 70 (NEC) 2023, 406.4(D)(3); a GFCI that does not trip on its test button has failed (common practice)' },
    { text: 'Den outlet behind the recliner wired backwards per the tester.', expected: ['reversed-polarity', 'living-area', 1], source: 'NFPA 70 (NEC) 2023, 200.11; "wired backwards" is inspectors\' shorthand (common practice)' },
    { text: 'Upstairs hall duplex: og per plug tester.', expected: ['open-ground', 'hallway', 1], source: 'NFPA 70 (NEC) 2023, 406.4(D)(2); "OG" is testers\' shorthand for open ground (common practice)' },
    { text: 'Guest room outlet jumpered on the back, neutral to green.', expected: ['false-ground', 'bedroom', 1], source: 'NFPA 70 (NEC) 2023, 250.142(B)' },
    { text: 'Family room receptacle behind the TV: blackened slots, smells of heat.', expected: ['receptacle-damaged', 'living-area', 1], source: 'common practice: a blackened receptacle has overheated and is replaced' },
    { text: 'Pool deck GFCI: in-use cover will not close.', expected: ['weather-cover-missing', 'exterior', 1], source: 'NFPA 70 (NEC) 2023, 406.9(B)(1)' },
    { text: 'Guest bath: the wall plate at the vanity outlet is gone.', expected: ['cover-plate-missing', 'bathroom', 1], source: 'NFPA 70 (NEC) 2023, 406.6' },
    { text: 'Attic over the garage: octagon box, cover off, conductors showing.', expected: ['open-junction-box', 'attic', 1], source: 'NFPA 70 (NEC) 2023, 314.28(C)' },
    { text: 'Basement: NM run across the joist bottoms unsupported for about six feet.', expected: ['exposed-wiring', 'basement', null], source: 'NFPA 70 (NEC) 2023, 334.30 (NM cable secured and supported)' },
    { text: 'Main panel: the 20 amp breaker lug holds two conductors.', expected: ['double-tap', 'panel', 1], source: 'NFPA 70 (NEC) 2023, 110.14(A) and 408.41' },
    { text: 'Load center in the utility room is rusty along the bottom edge.', expected: ['panel-deficiency', 'panel', 1], source: 'NFPA 70 (NEC) 2023, 110.12(B) (no damaged or corroded parts)' },
    { text: 'Basement: water bond dangling.', expected: ['grounding-electrode', 'basement', 1], source: 'NFPA 70 (NEC) 2023, 250.104(A) (metal water piping bonded)' },
    { text: 'Bedroom 2: smoke alarm beeping.', expected: ['smoke-co-alarm', 'bedroom', 1], source: 'common practice (NFPA 72 from memory): a chirping alarm has a failing battery or is at its end of life' },
    { text: 'Bedroom sconce canopy missing.', expected: ['light-fixture', 'bedroom', 1], source: 'NFPA 70 (NEC) 2023, 410.22 (a canopy closes the outlet box of a luminaire; from memory)' },
    { text: 'Bedroom fan/light combination wobbling.', expected: ['fan-support', 'bedroom', 1], source: 'NFPA 70 (NEC) 2023, 314.27(C) and 422.18' },
    { text: 'Kitchen 3-way at the slider works intermittently.', expected: ['switch-issue', 'kitchen', 1], source: 'common practice: a switch that works only some of the time has a worn contact or a loose terminal and is replaced' },
    { text: 'Mast above the roof is bowed toward the street.', expected: ['service-equipment', 'exterior', 1], source: 'NFPA 70 (NEC) 2023, 230.28 (a mast that supports the drop is strong enough or braced)' },
  ];
  it.each(cases)('$expected.0: $text ($source)', ({ text, expected }) => {
    expect(read(text)).toEqual([expected]);
    expect(composed(text)).toEqual([expected[0]]);
  });

  it('reads cords used as wiring (NFPA 70 (NEC) 2023, 400.12)', () => {
    expect(read('Workshop: power strip tacked to the bench leg and daisy chained to a second strip.')).toEqual([['exposed-wiring', 'garage', null]]);
  });

  it('gives the switch, not the light it controls, the condition (common practice)', () => {
    expect(read('Entry: dimmer for the chandelier humming.')).toEqual([['switch-issue', 'hallway', 1]]);
    expect(read('The switch for the hall light is warm.')).toEqual([['switch-issue', 'hallway', 1]]);
  });

  it('marks composed findings with their own confidence', () => {
    expect(parseText('Den outlet behind the recliner wired backwards per the tester.').findings.map((f) => f.confidence)).toEqual(['composed']);
  });
});

describe('device and condition: what it does not read', () => {
  it('follows the denials phrases follow (common practice)', () => {
    expect(read('Kitchen outlets: none sunken or blackened.')).toEqual([]);
    expect(read('Bedroom ceiling fans ran without wobble.')).toEqual([]);
    expect(read('No smoke alarm issues in the bedrooms.')).toEqual([]);
  });

  it('takes no sound condition and no inspector\'s own removal for a defect (common practice)', () => {
    expect(read('Crawl space wiring stapled and supported.')).toEqual([]);
    expect(read('The cover plate was removed to look at the wiring.')).toEqual([]);
  });

  it('adds nothing beside a phrase of the same code in the sentence', () => {
    expect(read('Kitchen: loose receptacle at the island, and the outlet by the sink is sunken.')).toEqual([['receptacle-damaged', 'kitchen', 1]]);
  });
});

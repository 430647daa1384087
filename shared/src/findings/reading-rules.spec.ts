import { parseText } from './report-parser';

/** (code, room, quantity) of every finding. */
function read(text: string) {
  return parseText(text).findings.map((f) => [f.code, f.room, f.quantity]);
}

describe('context: the room of a heading or of a paragraph’s opening sentence', () => {
  it('carries a room heading to the findings under it that name no place', () => {
    expect(read('Laundry Room\nThe cover plate by the back door is cracked.')).toEqual([['cover-plate-missing', 'laundry', 1]]);
  });

  it('takes a short label with shorthand as a room heading', () => {
    expect(read('Prim BR:\n - clg fan wobbles on high')).toEqual([['fan-support', 'bedroom', 1]]);
  });

  it('carries the opening sentence’s place to the paragraph', () => {
    expect(read('We walked through the laundry room last. The receptacle by the back door is loose.')).toEqual([['receptacle-damaged', 'laundry', 1]]);
  });

  it('lets a finding that names its own place keep it', () => {
    expect(read('Laundry Room\nThe receptacle in the garage is loose.')).toEqual([['receptacle-damaged', 'garage', 1]]);
  });
});

describe('grouping: one finding per defect', () => {
  it('attaches a follow-up sentence to the finding as its recommendation', () => {
    const { findings } = parseText('The hall bath receptacle is not GFCI protected. This should be corrected by a licensed electrician.');
    expect(findings.map((f) => [f.code, f.room])).toEqual([['gfci-missing', 'bathroom']]);
    expect(findings[0].recommendation).toBe('This should be corrected by a licensed electrician.');
  });

  it('merges a summary item with the body paragraph that describes the same defect', () => {
    const text = 'SUMMARY\n- Open junction box in the attic.\n\nATTIC\nA junction box above the hall has no cover and splices are visible.';
    expect(read(text)).toEqual([['open-junction-box', 'attic', 1]]);
  });

  it('does not give a general evaluation for advice that points at the items above', () => {
    expect(read('ELECTRICAL\nDouble tap at breaker 12.\n\nItems in this section should be corrected by a licensed electrician.')).toEqual([['double-tap', 'panel', 1]]);
  });
});

describe('polarity: statements that make no finding', () => {
  it.each([
    'No double taps were observed.',
    'Neutrals and grounds are separated as required.',
    'No knob-and-tube wiring was observed.',
    'If a GFCI fails to reset, replace it.',
    'Knob-and-tube wiring was previously present but has been removed.',
    'GFCI protection was present and tested OK.',
  ])('%s', (sentence) => {
    expect(read(`ELECTRICAL\n${sentence}`)).toEqual([]);
  });
});

describe('quantity', () => {
  it.each([
    ['A loose receptacle in the kitchen.', 1],
    ['The cover plate by the back door is cracked.', 1],
    ['Three receptacles in the garage are not GFCI protected.', 3],
    ['Several receptacles in the garage are not GFCI protected.', null],
    ['The garage receptacles are not GFCI protected.', null],
    // Issue 10's rule: one named piece of equipment is 1; a house-wide condition has no count.
    ['The subpanel neutral bar is bonded to the enclosure.', 1],
    ['Knob-and-tube wiring is still in service throughout the house.', null],
  ])('%s → %p', (sentence, quantity) => {
    expect(parseText(sentence).findings[0].quantity).toBe(quantity);
  });
});

describe('confidence', () => {
  it('marks an exact phrase, a normalised match and a room inferred from context', () => {
    const text = 'Kitchen\nReversed polarity at the island receptacle in the kitchen.\nRecepticle by the sink in the kitchen is cracked.\nOne outlet has an open ground.';
    expect(parseText(text).findings.map((f) => [f.code, f.confidence])).toEqual([
      ['reversed-polarity', 'exact'],
      ['receptacle-damaged', 'normalised'],
      ['open-ground', 'inferred'],
    ]);
  });
});

describe('read but not itemised', () => {
  it('lists electrical text that gave no finding with a suggested item', () => {
    const { findings, skipped } = parseText('ELECTRICAL\nThe receptacle behind the washer in the laundry room makes a popping sound when a plug is inserted.');
    expect(findings).toEqual([]);
    expect(skipped.map((s) => [s.reason, s.suggestion])).toEqual([['not-itemised', { code: 'receptacle-damaged', room: 'laundry' }]]);
  });
});

import { parseText } from './report-parser';

/** (code, room, quantity) of every finding. */
function read(text: string) {
  return parseText(text).findings.map((f) => [f.code, f.room, f.quantity]);
}

// Rules of the seventh tuning round (docs/parser.md, "Seventh round (batch H)"). Each example is new
// text written for this spec, not a sentence of the corpus.

describe('places: rooms let to lodgers are bedrooms (common practice in rooming-house and rental reports)', () => {
  it('reads a numbered room, a rented room and a sleeping loft as a bedroom', () => {
    expect(read('Room 7: the ceiling light does not work with a new bulb.')).toEqual([['light-fixture', 'bedroom', 1]]);
    expect(read('rm 12 - receptacle by the desk has a cracked face')).toEqual([['receptacle-damaged', 'bedroom', 1]]);
    expect(read('In the third rented room the switch plate is missing.')).toEqual([['cover-plate-missing', 'bedroom', 1]]);
    expect(read('Sleeping loft: the receptacle at the knee wall shows an open ground.')).toEqual([['open-ground', 'bedroom', 1]]);
  });

  it('takes the number after "rm" as the room\'s name, not a count', () => {
    expect(read('rm 9 recept by the closet is scorched')).toEqual([['receptacle-damaged', 'bedroom', 1]]);
  });
});

describe('insurance checklists: a hazard answered "no" in its Y/N column is no finding (common practice in four-point and underwriting forms)', () => {
  it('reads only the rows of a pipe table answered Y', () => {
    const form = [
      '| Hazard | Hazard present? (Y/N) | Notes |',
      '| Double-tapped breakers | N | |',
      '| Missing GFCI at kitchen counter | Y | none of the counter receptacles trip |',
    ].join('\n');
    expect(read(form)).toEqual([['gfci-missing', 'kitchen', null]]);
  });

  it('reads semicolon rows the same way', () => {
    const form = ['Item;Result;Defect (Y/N);Comment', 'Open splices;none;N;', 'Dining room receptacle reversed polarity;found;Y;'].join('\n');
    expect(read(form)).toEqual([['reversed-polarity', 'dining', 1]]);
  });

  it('reads the answer letter or mark after a leader under a "Y N" heading', () => {
    const form = [
      'Hazards present?                       Y   N',
      '  Double taps at breakers ..........       N',
      '  Exposed splices ..................   Y',
      '  Missing smoke alarms .............       X',
      '',
      'Comments: an open splice hangs in the laundry, no box.',
    ].join('\n');
    // The "Y" row and the comment are one defect told twice (document-merge.ts): the row's finding
    // takes the comment's room and count.
    expect(read(form)).toEqual([['open-junction-box', 'laundry', 1]]);
  });
});

describe('passive report voice: "was found to be", "were observed to be" before the condition (common practice in formal reports)', () => {
  it('reads the condition after a passive verb of finding', () => {
    expect(read('The bathroom exhaust fan switch was found to be broken.')).toEqual([['switch-issue', 'bathroom', 1]]);
    expect(read('The smoke alarm in the upstairs hallway was determined to be inoperative.')).toEqual([['smoke-co-alarm', 'hallway', 1]]);
    expect(read('The garage wall switch was observed to be loose.')).toEqual([['switch-issue', 'garage', 1]]);
  });
});

describe("tables: a pipe row wrapped by a narrow page keeps the table's quantity column (common practice in PDF exports)", () => {
  it('reads the count of the row after a wrapped one', () => {
    const table = [
      '| # | Item | Qty | Comment |',
      '|---|---|---|---|',
      '| 1 | Open junction boxes | 2 | Attic over the garage: covers missing and splices',
      'visible. |',
      '| 2 | Cover plates missing | 3 | basement laundry wall |',
    ].join('\n');
    expect(read(table)).toEqual([
      ['open-junction-box', 'attic', 2],
      ['cover-plate-missing', 'laundry', 3],
    ]);
  });
});

describe('words: old-house and outdoor light names (common practice)', () => {
  it('reads a lantern and a converted gas fixture (gasolier) as light fixtures', () => {
    expect(read('The coach lantern on the front porch hangs by its wires.')).toEqual([['light-fixture', 'exterior', 1]]);
    expect(read('The gasolier in the front parlor is loose at the ceiling.')).toEqual([['light-fixture', 'living-area', 1]]);
  });
});

describe('polarity: what a kind of wiring is known to do in general is background, not a defect seen (common practice)', () => {
  it('reads no finding from a general property, and keeps the defect told beside it', () => {
    expect(read('Switches and receptacles on aluminum branch circuits are known to loosen at their terminals.')).toEqual([]);
    expect(read('The stair switch is cracked; switches of that age are known for it.')).toEqual([['switch-issue', 'hallway', 1]]);
  });
});

describe('places: a side wall under an indoor room heading is that room\'s wall (common practice)', () => {
  it('keeps the heading\'s room for "the back wall", but not for a code that belongs outdoors', () => {
    expect(read('WORKSHOP\nThe receptacle on the back wall has a cracked face.')).toEqual([['receptacle-damaged', 'garage', 1]]);
    expect(read('BASEMENT\nThe receptacle on the rear wall has no in-use cover.')).toEqual([['weather-cover-missing', 'exterior', 1]]);
  });
});

describe('panel wordings: "not one is labeled", a directory described before it is blank, equipment in front of "the unit panel" (NFPA 70 (NEC) 2023, 408.4(A) and 110.26(A))', () => {
  it('reads each as a panel defect', () => {
    expect(read('the breakers are fine but not one is labeled, no directory either')).toEqual([['panel-deficiency', 'panel', 1]]);
    expect(read('The circuit directory on the back of the panel door is blank.')).toEqual([['panel-deficiency', 'panel', 1]]);
    expect(read('A chest freezer is stored directly in front of the main panel.')).toEqual([['panel-deficiency', 'panel', 1]]);
  });

  it('does not take "not one" as a denial of what follows it', () => {
    expect(read('Of the breakers, not one is labeled and there is no directory.')).toEqual([['panel-deficiency', 'panel', 1]]);
  });
});

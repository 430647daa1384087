import { readQuantity } from './quantity-reader';
import { parseText } from './report-parser';
import { findRooms } from './room-lexicon';

/** (code, room, quantity) of every finding. */
function read(text: string) {
  return parseText(text).findings.map((f) => [f.code, f.room, f.quantity]);
}

/** The places of a text that are not reference points. */
function places(text: string) {
  return findRooms(text)
    .filter((r) => !r.isReferencePoint)
    .map((r) => r.room);
}

// Rules of the twelfth tuning round (docs/parser.md, "Twelfth round"), read off batch O's kinds of
// misses (sale papers, specialists' visits, houses of particular eras). Each example is new text
// written for this spec, not a sentence of the corpus.

describe('places', () => {
  it('a wrapped sentence whose first line is all heading words is no heading', () => {
    const text = ['GARDEN SHED', '- The receptacle on the service', '  post is not GFCI protected (no trip with tester).'].join('\n');
    expect(read(text)).toEqual([['gfci-missing', 'exterior', 1]]);
  });

  it('a room the defect only faces is a reference point', () => {
    expect(places('Bar sink receptacle (back side, facing the den) is cracked.')).toEqual([]);
    expect(read('Hall receptacle facing the dining room is cracked.')).toEqual([['receptacle-damaged', 'hallway', 1]]);
  });

  it('coach and carriage lights are outside the house (common practice: wall lanterns beside an outside door)', () => {
    expect(read('Foyer: the left coach light does not come on.')).toEqual([['light-fixture', 'exterior', 1]]);
    expect(read('Carriage light beside the garage door hangs from its wires.')).toEqual([['light-fixture', 'exterior', 1]]);
  });

  it('an appliance named with its room is in that room ("the garage freezer" side: "garage refrigerator")', () => {
    expect(read('The receptacle behind the garage refrigerator has reversed polarity.')).toEqual([['reversed-polarity', 'garage', 1]]);
    expect(read('The receptacle behind the refrigerator has reversed polarity.')).toEqual([['reversed-polarity', 'kitchen', 1]]);
  });

  it('a primary or walk-in closet is in the bedroom (common practice)', () => {
    expect(places('Master closet: switch does nothing')).toEqual(['bedroom']);
    expect(places('Walk-in closet light has no globe')).toEqual(['bedroom']);
  });

  it('"DR" in capitals is the dining room, "Dr." and "Oak Dr" are not', () => {
    expect(places('DR ceiling light dead')).toEqual(['dining']);
    expect(places('Dr. Lee owns the house on Oak Dr')).toEqual([]);
  });

  it('the room an attic hatch is in is where the attic is entered, not the place', () => {
    expect(read('Attic hatch in the guest closet; NM cable lying loose across the joists by the hatch, not stapled.')).toEqual([['exposed-wiring', 'attic', null]]);
  });

  it('places listed after a reference point are reference points too', () => {
    expect(places('Old wiring in the cellar, joists under the LR + DR')).toEqual(['basement']);
    expect(places('splices beneath the kitchen and dining room')).toEqual([]);
  });

  it('an item line naming only a place and its priority heads the lettered items under it', () => {
    const text = ['R-3  Lower level (playroom) - SAFETY', '  a) Receptacle beside the bar sink is not GFCI protected.', '  b) Two junction boxes above the drop ceiling have no covers.'].join('\n');
    expect(read(text)).toEqual([
      ['gfci-missing', 'basement', 1],
      ['open-junction-box', 'basement', 2],
    ]);
  });

  it('a panel named as where the inspector was going leaves a loose rod clamp outdoors (lead convention: the rod is exterior)', () => {
    expect(read('On my way to the panel I saw the ground rod clamp is loose on the rod.')).toEqual([['grounding-electrode', 'exterior', 1]]);
  });
});

describe('recall', () => {
  it('a GFCI that will not stay reset is inoperative (common practice: a worn GFCI trips again at once)', () => {
    expect(read('Garage GFCI trips at the button but will not stay reset.')).toEqual([['gfci-inoperative', 'garage', 1]]);
  });

  it('a capital NO in a table column does not deny a cell that states the lack itself', () => {
    expect(read('Rec room bar     NO     no GFCI protection within 4 ft of sink')).toEqual([['gfci-missing', 'living-area', null]]);
    expect(read('No GFCI protection missing; all tested.')).toEqual([]);
  });
});

describe('counts', () => {
  it('"of the five receptacles, three are loose" counts the part', () => {
    expect(readQuantity('Of the six bedroom receptacles, two are loose in the wall.')).toBe(2);
  });


  it('a page, a price and a time of day count nothing', () => {
    expect(readQuantity('p.12 bath receptacle has no GFCI')).toBeNull();
    expect(readQuantity('replace receptacle ..... $145')).toBeNull();
    expect(readQuantity('Mon 8:14 AM no smoke detectors')).toBeNull();
    expect(readQuantity('2 receptacles have no GFCI')).toBe(2);
  });
});

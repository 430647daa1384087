import { parseText } from './report-parser';
import { evaluationTarget } from './evaluation-target';

/** (code, room, quantity) of every finding. */
function read(text: string) {
  return parseText(text).findings.map((f) => [f.code, f.room, f.quantity]);
}

// Rules of the ninth tuning round (docs/parser.md, "Ninth round (batch J)"). Each example is new
// text written for this spec, not a sentence of the corpus.

describe('outdoor equipment: an oversized device beside an appliance that stands outside is exterior (the lead room convention)', () => {
  it('reads a disconnect named only as "the disconnect" beside a spa nameplate', () => {
    // NFPA 70 (NEC) 2023, 110.3(B): the 40 A breaker exceeds the 30 A maximum the nameplate lists.
    const text = ['ELECTRICAL', 'Spa, side yard', 'The disconnect on the fence post holds a 40 amp two-pole breaker. The spa label lists a maximum overcurrent device of 30 amps.'].join('\n');
    expect(read(text)).toEqual([['overcurrent-mismatch', 'exterior', 1]]);
  });

  it('reads a generator\'s own breaker on small conductors as outside', () => {
    // NFPA 70 (NEC) 2023, 240.4(D)(5): 12 AWG copper is protected at 20 A at most; standby generators stand outside (common practice).
    const text = ['ELECTRICAL', 'The generator output breaker is 30 amps and the conductors from it to the transfer switch are 12 AWG copper.'].join('\n');
    expect(read(text)).toEqual([['overcurrent-mismatch', 'exterior', 1]]);
  });

  it('keeps a breaker in the panel at the panel', () => {
    // NFPA 70 (NEC) 2023, 240.4(D)(7): 14 AWG copper at 15 A at most.
    expect(read('ELECTRICAL\nIn the main panel the freezer circuit has a 20 amp breaker on 14 AWG copper.')).toEqual([['overcurrent-mismatch', 'panel', 1]]);
  });
});

describe('words: a three-way or four-way is a switch, a lamp post is a light (common practice)', () => {
  it('reads "the 3-way" with no other switch word', () => {
    expect(read('ELECTRICAL\nUpper hall: the 3-way at the landing does nothing.')).toEqual([['switch-issue', 'hallway', 1]]);
  });

  it('reads a lamp post that does not light', () => {
    expect(read('EXTERIOR ELECTRICAL\nThe lamp post beside the mailbox does not light.')).toEqual([['light-fixture', 'exterior', 1]]);
  });
});

describe('evaluations: one named device evaluated counts 1 (the lead decision on evaluation counts)', () => {
  it('counts the panel and places it at the panel', () => {
    expect(read('ELECTRICAL\nThe dead front is screwed shut with painted screws. Recommend a licensed electrician remove it and evaluate the panel.')).toEqual([['evaluate-general', 'panel', 1]]);
  });

  it('counts one breaker named with "this"', () => {
    expect(evaluationTarget('An electrician should evaluate this breaker and the wire on it.')).toEqual({ quantity: 1, isPanel: true });
  });

  it('counts an installation named by its parts', () => {
    expect(evaluationTarget('Have an electrician evaluate the generator and transfer switch before closing.')).toEqual({ quantity: 1, isPanel: false });
  });

  it('leaves the system, the wiring and nothing named without a count', () => {
    expect(evaluationTarget('Have a licensed electrician evaluate the entire electrical system.')).toBeNull();
    expect(evaluationTarget('Have an electrician evaluate the wiring in the addition.')).toBeNull();
    expect(evaluationTarget('Further evaluation by a licensed electrician is recommended.')).toBeNull();
    expect(read('ELECTRICAL\nHave a licensed electrician evaluate the entire electrical system.')).toEqual([['evaluate-general', 'whole-house', null]]);
  });
});

describe('polarity: a "not" in a clause of its own before a comma and a new subject does not deny (common practice)', () => {
  it('keeps the recommendation after "could not see inside,"', () => {
    expect(read('ELECTRICAL\nSince we could not open the cover, we recommend that an electrician evaluate the panel.')).toEqual([['evaluate-general', 'panel', 1]]);
  });

  it('still denies within one clause', () => {
    expect(read('ELECTRICAL\nNo reversed polarity was found at the kitchen receptacles.')).toEqual([]);
  });
});

describe('weather covers: said in more ways, and always outside (NFPA 70 (NEC) 2023, 406.9(B)(1))', () => {
  it('reads a kind of cover given with a slash', () => {
    expect(read('ELECTRICAL\nThe two receptacles on the balcony lack weather / in-use covers.')).toEqual([['weather-cover-missing', 'exterior', 2]]);
  });

  it('reads a nickname in brackets after the kind', () => {
    expect(read('ELECTRICAL\nThe patio receptacle lacks an in-use (bubble) cover.')).toEqual([['weather-cover-missing', 'exterior', 1]]);
  });

  it('reads a lid that no longer closes and a lid that is gone', () => {
    expect(read('ELECTRICAL\nGazebo: the flip lid on the receptacle no longer closes.')).toEqual([['weather-cover-missing', 'exterior', 1]]);
    expect(read('ELECTRICAL\nHose bib receptacle: the hinged lid is gone.')).toEqual([['weather-cover-missing', 'exterior', 1]]);
  });

  it('reads a receptacle left open to the weather', () => {
    expect(read('ELECTRICAL\nThe receptacle by the grill sits open to the weather.')).toEqual([['weather-cover-missing', 'exterior', 1]]);
  });

  it('puts a weather cover outside when the place came from an indoor heading', () => {
    expect(read('LAUNDRY\n- washer recept ok\n- back door recept: no in-use cover')).toEqual([['weather-cover-missing', 'exterior', 1]]);
  });
});

describe('layout: verbless capital lines and rated rows are items of their own (common practice in terse reports)', () => {
  it('reads each "LABEL - NOTE" line as its own item', () => {
    const notes = ['ELECTRICAL', 'PNL - DIRECTORY OK', 'LAUNDRY - RECEPT NO GFCI', 'DEN - CEILING FAN WOBBLES ON HIGH', 'HALL - SMOKE ALARM OK'].join('\n');
    expect(read(notes)).toEqual([
      ['gfci-missing', 'laundry', 1],
      ['fan-support', 'living-area', 1],
    ]);
  });

  it('reads each bracketed rating row as its own item', () => {
    const rows = ['Legend: S = Satisfactory  D = Deficient', '[S]  Kitchen receptacles - GFCI tested OK', '[D]  Deck receptacle - no in-use cover', '[S]  Bath - GFCI tested OK'].join('\n');
    expect(read(rows)).toEqual([['weather-cover-missing', 'exterior', 1]]);
  });
});

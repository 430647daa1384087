import { parseText } from './report-parser';

/** (code, room, quantity) of every finding. */
function read(text: string) {
  return parseText(text).findings.map((f) => [f.code, f.room, f.quantity]);
}

// Rules of the eighth tuning round (docs/parser.md, "Eighth round (batch I)"). Each example is new
// text written for this spec, not a sentence of the corpus.

describe('forms: check boxes (common practice in four-point and underwriting forms)', () => {
  it('reads nothing from a hazard whose box is empty, boxes before their labels', () => {
    const form = ['WIRING', '  [X] Copper   [ ] Aluminum   [ ] Knob and tube wiring', '  [ ] Double taps   [ ] Open splices   [X] None of these'].join('\n');
    expect(read(form)).toEqual([]);
  });

  it('reads nothing from a hazard whose box is empty, boxes after their labels', () => {
    expect(read('Hazards: double taps [ ]  exposed wiring [ ]  knob & tube [ ]  other [X]')).toEqual([]);
  });

  it('takes a checked hazard as the summary of the comment that explains it: one finding', () => {
    const form = [
      'Hazards:  [X] Double taps   [ ] Corrosion   [ ] Exposed wiring',
      '',
      'Explanation of checked items:',
      '  Double taps: breaker 12 in the main panel has two conductors under one screw.',
    ].join('\n');
    expect(read(form)).toEqual([['double-tap', 'panel', 1]]);
  });

  it('keeps a checked hazard that nothing else explains', () => {
    expect(read('Hazards:  [X] Double taps   [ ] Corrosion   [ ] Exposed wiring')).toEqual([['double-tap', 'panel', null]]);
  });

  it('leaves columns of boxes with one label per row to the rows (a rated checklist)', () => {
    expect(read('[ ][ ][ ][X]  Kitchen: the receptacle right of the sink is not GFCI protected.')).toEqual([['gfci-missing', 'kitchen', 1]]);
  });
});

describe('forms: a legend of abbreviations defines them, it reports nothing (common practice in tester sweeps)', () => {
  it('reads no defect from the legend, only from the rows', () => {
    const sweep = ['Key:  OK = passed', '      RP = reversed polarity', '      NG = open ground, no ground path', '', 'Den      3 tested     1 RP'].join('\n');
    expect(read(sweep)).toEqual([['reversed-polarity', 'living-area', 1]]);
  });
});

describe('re-inspections: an item whose status says it was put right reports nothing (common practice in re-inspection reports)', () => {
  it('reads a status on the line under the item', () => {
    const list = [
      '1. Electrical - laundry GFCI would not trip.',
      '   > Repaired. New device installed, trips and resets.',
      '2. Electrical - garage ceiling light dangling from its cable.',
      '   > Not done. Still dangling.',
    ].join('\n');
    expect(read(list)).toEqual([['light-fixture', 'garage', 1]]);
  });

  it('reads a status in a column of its own, and keeps "NOT CORRECTED" and "PARTIAL" items', () => {
    const table = [
      'R-1   Open junction box in the crawl space          COMPLETED. Blank cover on.',
      'R-2   Reversed polarity, den receptacle             NOT CORRECTED. Tester still shows it.',
    ].join('\n');
    expect(read(table)).toEqual([['reversed-polarity', 'living-area', 1]]);
  });

  it('keeps an item whose status goes on to say what is still wrong', () => {
    const list = ['4. Exterior receptacle by the hose bib has no GFCI protection.', '   Resolved in part; the cover was replaced but it is still not protected.'].join('\n');
    expect(read(list)).toEqual([['gfci-missing', 'exterior', 1]]);
  });

  it('does not take a wrapped "should be / corrected." for a status', () => {
    const text = 'The kitchen receptacle left of the range is cracked and should be\ncorrected.';
    expect(read(text)).toEqual([['receptacle-damaged', 'kitchen', 1]]);
  });
});

describe('panel covers taken off to look inside are procedure, not a missing cover (common practice)', () => {
  it('reads no panel defect from the inspector removing the dead front', () => {
    expect(read('The dead front was removed and all terminations were examined.')).toEqual([]);
    expect(read('The panel cover is removed only when it is safe to do so.')).toEqual([]);
  });

  it('still reads a dead front that is missing', () => {
    expect(read('The dead front cover is missing from the garage subpanel.')).toEqual([['panel-deficiency', 'panel', 1]]);
  });
});

describe('photo captions that name a defect the text describes point at it (common practice)', () => {
  it('gives one finding for a defect and its photo', () => {
    const text = ['Bathroom: the receptacle left of the sink tests reversed polarity.', '', 'Photos', 'Photo 3: Bathroom receptacle, reversed polarity.'].join('\n');
    expect(read(text)).toEqual([['reversed-polarity', 'bathroom', 1]]);
  });

  it('keeps a caption that is the only mention of its defect', () => {
    expect(read('Photo 7: Open junction box in the attic, no cover.')).toEqual([['open-junction-box', 'attic', 1]]);
  });
});

describe('second-hand text: an e-mail that quotes the report with ">" before each line (common practice in forwarded mail)', () => {
  it('reads quoted sentences wrapped over several lines as the report wrote them', () => {
    const mail = [
      'See the inspector\'s notes below.',
      '',
      '> 5.2 Exterior: the receptacle beside the hose bib has no',
      '> weather cover and is not GFCI protected.',
      '> 5.4 Attic: junction box above the hatch is missing its',
      '> cover.',
      '',
      'Let me know what you want to ask for.',
    ].join('\n');
    expect(read(mail)).toEqual([
      ['weather-cover-missing', 'exterior', 1],
      ['gfci-missing', 'exterior', 1],
      ['open-junction-box', 'attic', 1],
    ]);
  });
});

describe('forms: a Location field places the observation under it (common practice in Location/Observation/Recommendation reports)', () => {
  it('takes the first place of the field, not the reference points after it', () => {
    const item = ['Item 4', 'Location: Basement, under the kitchen and the dining room', 'Observation: Loose NM cable hangs in loops below the joists.'].join('\n');
    expect(read(item)).toEqual([['exposed-wiring', 'basement', null]]);
  });

  it('places an observation whose field is longer than a short label', () => {
    const item = ['Location:    Bedroom 2 (rear), the duplex receptacle behind the dresser', 'Reading:     no thermal anomaly', 'Observation: Receptacle face is cracked and scorched.'].join('\n');
    expect(read(item)).toEqual([['receptacle-damaged', 'bedroom', 1]]);
  });
});

describe('false grounds: a jumper from the neutral to the green screw (NFPA 70 (NEC) 2023, 250.130(C), 406.4(D)(2))', () => {
  it('finds the jumper where the sentence never says "ground"', () => {
    expect(read('In the den someone jumpered the neutral to the green screw so the tester reads correct.')).toEqual([['false-ground', 'living-area', 1]]);
  });
});

describe('wordings of second-hand and cautious reports', () => {
  it('reads an alarm named without "smoke" whose age or chirp is the defect (common practice: smoke alarms are replaced ten years after manufacture)', () => {
    expect(read('The alarm in the guest room is dated 2008 and is past its service life.')).toEqual([['smoke-co-alarm', 'bedroom', 1]]);
    expect(read('The hallway alarm was chirping during the whole visit.')).toEqual([['smoke-co-alarm', 'hallway', 1]]);
  });

  it('leaves a security system\'s alarm alone', () => {
    expect(read('The security alarm panel in the hallway is past its service life.')).toEqual([]);
  });

  it('reads a weather cover named with a nickname in quotes (NFPA 70 (NEC) 2023, 406.9(B)(1))', () => {
    expect(read('The patio receptacle is missing the in-use "bubble" cover.')).toEqual([['weather-cover-missing', 'exterior', 1]]);
  });

  it('reads a repair asked for as a noun ("Installation of GFCI protection at ...") as the missing protection (NFPA 70 (NEC) 2023, 210.8(A))', () => {
    expect(read('Installation of GFCI protection at the three garage receptacles.')).toEqual([['gfci-missing', 'garage', 3]]);
  });
});

describe('summaries: an "EXECUTIVE SUMMARY" heading opens a summary that the body repeats (common practice)', () => {
  it('gives one finding for a summary line and its body paragraph', () => {
    const report = [
      '=== EXECUTIVE SUMMARY ===',
      '  a) Open junction box in the attic',
      '',
      '=== ELECTRICAL ===',
      'Attic: a junction box above the hall ceiling has no cover; splices are exposed.',
    ].join('\n');
    expect(read(report)).toEqual([['open-junction-box', 'attic', 1]]);
  });
});

describe('polarity: old cloth-covered cable that is out of use is history, not a wiring method in service (common practice)', () => {
  it('reads nothing from cable disconnected and abandoned', () => {
    expect(read('The cloth-covered wiring in the attic was disconnected and abandoned during the 2015 rewire.')).toEqual([]);
  });

  it('still reads cloth-covered wiring in use', () => {
    expect(read('Cloth-covered wiring is still in use in the attic.')).toEqual([['knob-and-tube', 'attic', null]]);
  });
});

import { parseText } from './report-parser';

/** (code, room, quantity) of every finding. */
function read(text: string) {
  return parseText(text).findings.map((f) => [f.code, f.room, f.quantity]);
}

// Rules of the sixth tuning round (docs/parser.md, "Sixth round"). Each example is new text
// written for this spec, not a sentence of the corpus.

describe("counts: issue 10's rule, a singular named device or piece of equipment is 1 (common practice)", () => {
  it('counts a defect of the service as one piece of equipment', () => {
    expect(read('The meter socket on the garage gable is pulling off the stucco at its upper corner.')).toEqual([['service-equipment', 'exterior', 1]]);
    expect(read('The service entrance cable jacket is cracked and split two feet under the service head.')).toEqual([['service-equipment', 'exterior', 1]]);
  });

  it('counts a grounding or bonding defect as one, whether a part is loose or missing', () => {
    // A defect at the rod is outdoors (the lead's room convention, seventh round: room-conventions.ts).
    expect(read('The clamp on the ground rod beside the meter has rusted loose.')).toEqual([['grounding-electrode', 'exterior', 1]]);
    expect(read('No bonding jumper was located on the gas line at the furnace in the basement.')).toEqual([['grounding-electrode', 'basement', 1]]);
  });

  it('counts neutrals and grounds together in a subpanel as one subpanel', () => {
    expect(read('The 100 A subpanel in the barn has its grounds and neutrals on one bar, green screw installed.')).toEqual([['subpanel-bonding', 'panel', 1]]);
  });

  it('still gives no count to house-wide conditions (an alarm missing throughout, no AFCI in the house)', () => {
    expect(read('There are no smoke alarms anywhere in the house.')).toEqual([['smoke-co-alarm', 'whole-house', null]]);
    expect(read('Knob-and-tube wiring remains in service throughout the house.')).toEqual([['knob-and-tube', 'whole-house', null]]);
  });
});

describe('counts: a panel defect is counted in the parts it names, else it is the one panel (common practice)', () => {
  it('counts a defect of the panel itself as one (NFPA 70 (NEC) 2023, 408.4(A) directory; 110.26(A) working space)', () => {
    expect(read('The breaker panel in the laundry has no circuit directory; nothing is labeled.')).toEqual([['panel-deficiency', 'panel', 1]]);
    expect(read('Shelves full of paint cans stand right in front of the panel, blocking the working space.')).toEqual([['panel-deficiency', 'panel', 1]]);
  });

  it('counts numbered parts, one named part as one, and parts in the plural with no number as none (NFPA 70 (NEC) 2023, 110.12(A))', () => {
    expect(read('Three open knockouts in the side of the panel.')).toEqual([['panel-deficiency', 'panel', 3]]);
    expect(read('An open breaker space at the top of the panel has no filler plate.')).toEqual([['panel-deficiency', 'panel', 1]]);
    expect(read('The panel dead front is fastened with pointed drywall screws.')).toEqual([['panel-deficiency', 'panel', null]]);
  });

  it('counts a directory that is only partly filled in as one directory, not the unlabeled breakers', () => {
    expect(read('Panel directory is incomplete, several circuits are not labeled.')).toEqual([['panel-deficiency', 'panel', 1]]);
  });
});

describe("terse field notes: inspectors' shorthand (common practice)", () => {
  it('reads "rev pol", "wont reset" written without its apostrophe, and "JB" for a junction box', () => {
    expect(read('Kitchen: recept left of range rev pol.')).toEqual([['reversed-polarity', 'kitchen', 1]]);
    expect(read('Laundry: GFI by washer tripped but wont reset.')).toEqual([['gfci-inoperative', 'laundry', 1]]);
    expect(read('GARAGE: open JB above the opener, splices showing.')).toEqual([['open-junction-box', 'garage', 1]]);
  });

  it('reads a count given as the total ("4 total")', () => {
    expect(read('Bedroom 3: 3-prong recepts show open grnd, 4 total.')).toEqual([['open-ground', 'bedroom', 4]]);
  });

  it('reads "2 cond. under lug" with no article, and counts a double tap in breakers, not in "2x #14" conductors', () => {
    expect(read('Pnl: ckt 9 15A, 2 cond. under lug.')).toEqual([['double-tap', 'panel', 1]]);
    expect(read('Pnl: brkr #7 dbl tap, 2x #14 Cu under 1 lug.')).toEqual([['double-tap', 'panel', 1]]);
  });

  it('reads a bare topic label answered by its absence ("CO: none found")', () => {
    expect(read('CO: none found; gas water heater in garage.')).toEqual([['smoke-co-alarm', 'whole-house', null]]);
  });

  it('reads a nickname in brackets between the kind of cover and "cover" (NFPA 70 (NEC) 2023, 406.9(B)(1))', () => {
    expect(read('The deck receptacle has no weatherproof ("in-use") cover.')).toEqual([['weather-cover-missing', 'exterior', 1]]);
  });

  it('reads a subjectless follow-up ("Does not reset either.") as the same device', () => {
    expect(read('Hall bath: GFCI by the sink will not trip.\nDoes not reset either.')).toEqual([['gfci-inoperative', 'bathroom', 1]]);
  });
});

describe('computed: a panel schedule row and a service clearance in inches', () => {
  it('reads a rating written right before its conductor as a breaker on that conductor (NFPA 70 (NEC) 2023, 240.4(D): 14 AWG copper 15 A, 12 AWG copper 20 A)', () => {
    expect(read('Ckt 5   Office   20A   #14 Cu')).toEqual([['overcurrent-mismatch', 'panel', 1]]);
    expect(read('Ckt 5   Office   20A   #12 Cu')).toEqual([]);
  });

  it('reads a drop that clears a roof by inches as too low (NFPA 70 (NEC) 2023, 230.24(A), from memory: 3 ft over a roof at the least)', () => {
    expect(read('The service drop clears the porch roof by only 10 inches.')).toEqual([['service-equipment', 'exterior', 1]]);
  });
});

describe('evaluations and switches: more wordings (common practice)', () => {
  it('reads a switch that arcs', () => {
    expect(read('The hall switch arcs when it is flipped.')).toEqual([['switch-issue', 'hallway', 1]]);
  });

  it('reads an evaluation named as a noun ("perform a thorough evaluation"), or by an electrician with no article', () => {
    expect(read('We suggest that a licensed electrician perform a thorough evaluation of the wiring.')).toEqual([['evaluate-general', 'whole-house', null]]);
    expect(read('Whole house: full evaluation by licensed electrician.')).toEqual([['evaluate-general', 'whole-house', null]]);
    expect(read('Have repairs made by licensed electrician.')).toEqual([]);
  });

  it('places an evaluation of "this room" at the place of the sentence before', () => {
    expect(read('Sunroom: the addition was wired by an owner, with cords run in the walls.\nRecommend an electrician evaluate this room.')).toEqual([['evaluate-general', 'living-area', null]]);
  });

  it('keeps an evaluation of the entire system house-wide when the rooms it names are only the reasons', () => {
    expect(read('Because of the work seen in the attic and the crawl space, we recommend a licensed electrician perform a full evaluation of the entire electrical system.')).toEqual([['evaluate-general', 'whole-house', null]]);
  });
});

describe('casual and terse wording, and future conditions (common practice)', () => {
  it('reads "doesnt", "didnt" and "wouldnt" written without the apostrophe', () => {
    expect(read('The light over the laundry sink doesnt work with a new bulb.')).toEqual([['light-fixture', 'laundry', 1]]);
  });

  it('reads a splice followed by "no box" (NFPA 70 (NEC) 2023, 300.15)', () => {
    expect(read('- Garage: taped splice on the wall by the door, no box.')).toEqual([['open-junction-box', 'garage', 1]]);
  });

  it('reads a topic label answered by what is needed ("Smoke: need 1 in the guest bedroom"), one alarm', () => {
    expect(read('- Smoke: need 1 in guest bedroom, others ok.')).toEqual([['smoke-co-alarm', 'bedroom', 1]]);
  });

  it('makes no finding of what a future change would need (NFPA 70 (NEC) 2023, 210.12(D) applies to extended or new circuits)', () => {
    expect(read('If the attic is ever finished as a bedroom, the new circuits will need AFCI protection.')).toEqual([]);
    expect(read('The garage receptacles are not GFCI protected.')).toEqual([['gfci-missing', 'garage', null]]);
  });
});

describe('panel rust and corrosion in more word orders (common practice; NFPA 70 (NEC) 2023, 312.2 damp or wet locations)', () => {
  it('reads the enclosure before its rust, "@" for "at", and corrosion on the neutral bar', () => {
    expect(read('The subpanel in the shop is rusted along its lower edge.')).toEqual([['panel-deficiency', 'panel', 1]]);
    expect(read('Sub pnl: rust @ bottom of can.')).toEqual([['panel-deficiency', 'panel', 1]]);
    expect(read('Heavy corrosion on the neutral bar inside the panel.')).toEqual([['panel-deficiency', 'panel', 1]]);
  });

  it("leaves a meter's can to the service", () => {
    expect(read('The meter can is rusted at the bottom.')).toEqual([['service-equipment', 'exterior', 1]]);
  });
});

describe('switches of unknown function or that fail, in more wordings (common practice)', () => {
  it('reads "could not determine what it controls" and "doesnt seem to do anything"', () => {
    expect(read('Study: one switch on the 2-gang plate by the closet - could not determine what it controls.')).toEqual([['switch-issue', 'office', 1]]);
    expect(read('The switch by the back door doesnt seem to do anything.')).toEqual([['switch-issue', 'unknown', 1]]);
  });

  it('reads switches that do not control or turn on their light, and a switch that buzzes', () => {
    expect(read('The 3-way switches at the top and bottom of the stairs do not control the hall light reliably.')).toEqual([['switch-issue', 'hallway', null]]);
    expect(read('The dimmer for the dining chandelier does not turn the chandelier on at any setting.')).toEqual([['switch-issue', 'dining', 1]]);
    expect(read('The bath fan switch buzzes when it is on.')).toEqual([['switch-issue', 'bathroom', 1]]);
  });
});

describe("counts: an alarm named only as a label's topic at one place is one (issue 10's rule; common practice)", () => {
  it('counts "Smoke alarms: missing in the den" and "Den smoke - none" as one alarm', () => {
    expect(read('Smoke alarms: missing in the den.')).toEqual([['smoke-co-alarm', 'living-area', 1]]);
    expect(read('Den smoke - none, bracket only.')).toEqual([['smoke-co-alarm', 'living-area', 1]]);
  });

  it("gives no count when the places are plural, however abbreviated (\"BR's\")", () => {
    expect(read("Smoke detectors: none in BR's.")).toEqual([['smoke-co-alarm', 'bedroom', null]]);
  });
});

describe('heating and cooling sections: the electrical findings inside them (NFPA 70 (NEC) 2023, 110.3(B) and 440.4(B) nameplates)', () => {
  it('reads a nameplate maximum against its breaker under an HVAC heading, not the load current ("MCA 19A")', () => {
    expect(read('HEATING AND COOLING\nThe heat pump nameplate lists MCA 19A, MAX BREAKER 25A. It is fed by a 40A two-pole breaker in the main panel.')).toEqual([['overcurrent-mismatch', 'panel', 1]]);
  });

  it('reads a missing CO alarm under a heating heading, and nothing else there', () => {
    expect(read('HEATING\nThe gas furnace operated. No carbon monoxide alarm was found in the upstairs hall.')).toEqual([['smoke-co-alarm', 'hallway', 1]]);
    expect(read('HEATING\nThe furnace filter is dirty; replace it.')).toEqual([]);
  });

  it('gives the same computation told in a summary and in the HVAC body once', () => {
    const text = '1. Cooling: the condenser breaker is 40 amps; the condenser label lists 25 amps maximum.\n\nCOOLING\nThe condenser label lists "Max Fuse / Breaker 25 A"; the breaker for it in the main panel is 40 A.';
    expect(read(text)).toEqual([['overcurrent-mismatch', 'panel', 1]]);
  });
});

describe('spelling at the end of a sentence, "grd", and words that are not misspellings (normalisation)', () => {
  it('corrects a misspelt trade word right before the full stop, and reads "grd" as ground', () => {
    expect(read('The receptacles in the den all tested as ungroundd.')).toEqual([['open-ground', 'living-area', null]]);
    expect(read('Office: 3-prong rcpts open grd (2).')).toEqual([['open-ground', 'office', 2]]);
  });

  it('leaves ordinary words near trade words as written ("damage" is not "damaged", "connectors" not "conductors")', () => {
    expect(read('The service conductors showed no visible damage.')).toEqual([]);
    expect(read('Crimp connectors on the range cord are in good shape.')).toEqual([]);
  });

  it('reads a severed grounding electrode conductor (NFPA 70 (NEC) 2023, 250.64)', () => {
    expect(read('The ground wire to the rod is severed at grade.')).toEqual([['grounding-electrode', 'panel', 1]]);
  });
});

describe('polarity: what a report lists for information only, and a walk-through by an electrician (common practice)', () => {
  it('makes no finding of an item "noted here for information only, not as a defect"', () => {
    expect(read('Bedrooms: receptacles tested correct; no AFCI protection, noted here for information only, not as a defect.')).toEqual([]);
  });

  it('still reports a wiring method that is only "typical of" its year of construction', () => {
    expect(read('The wiring in this 1974 house is aluminum, typical of 1974 construction.')).toEqual([['aluminum-branch-wiring', 'whole-house', null]]);
  });

  it('reads "have an electrician walk through the entire system" as a general evaluation', () => {
    expect(read('We would have an electrician walk through the entire system before closing.')).toEqual([['evaluate-general', 'whole-house', null]]);
  });
});

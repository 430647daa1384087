import { parseText } from './report-parser';

/** (code, room, quantity) of every finding. */
function read(text: string) {
  return parseText(text).findings.map((f) => [f.code, f.room, f.quantity]);
}

// Rules of the fourth tuning round (docs/parser.md, "Fourth round"). Each example is new text
// written for this spec, not a sentence of the corpus.

describe('grouping: summaries in more shapes (common practice: summary list plus detailed body)', () => {
  it('reads "<word> SUMMARY -- ELECTRICAL" as a summary and merges its item with the body', () => {
    const text = [
      'REPAIR SUMMARY -- ELECTRICAL',
      ' 1. Den receptacle - loose in box.',
      '',
      'DETAIL',
      'Den',
      ' - The receptacle left of the bookcase is loose in its box and pulls out when a plug is removed.',
    ].join('\n');
    expect(read(text)).toEqual([['receptacle-damaged', 'living-area', 1]]);
  });

  it('reads a summary heading with a long note in brackets', () => {
    const text = [
      'SUMMARY OF ELECTRICAL ITEMS (each item is described again in the sections of the report below)',
      '  - Laundry receptacle not GFCI protected.',
      '',
      'ELECTRICAL -- LAUNDRY',
      'The receptacle behind the washer in the laundry room is not GFCI protected.',
    ].join('\n');
    expect(read(text)).toEqual([['gfci-missing', 'laundry', 1]]);
  });

  it('keeps topic headings right under a summary heading in the summary, until a numbered heading', () => {
    const text = [
      'INSPECTION SUMMARY',
      'This summary is not the whole report.',
      '',
      'ELECTRICAL',
      '  1. Office ceiling light inoperative.',
      '',
      'HEATING',
      '  2. Furnace filter dirty.',
      '',
      '7.2 Office',
      'The ceiling light in the office did not come on with its switch; a new bulb was tried.',
    ].join('\n');
    expect(read(text)).toEqual([['light-fixture', 'office', 1]]);
  });

  it('reads bracketed item numbers ("[2]") as items of their own', () => {
    const text = ['SUMMARY -- ELECTRICAL ITEMS', '  [1] Loose switch (hall).', '  [2] Ceiling fan wobbles (den).'].join('\n');
    expect(read(text)).toEqual([
      ['switch-issue', 'hallway', 1],
      ['fan-support', 'living-area', 1],
    ]);
  });

  it('reads "SERVICE ENTRANCE" and "FUSE PANEL" as electrical headings that end the summary', () => {
    const text = [
      'SUMMARY',
      '  - Drip loop missing at the service mast.',
      '',
      'SERVICE ENTRANCE',
      'The service mast on the east wall has no drip loop; water can follow the conductors into the mast.',
      '',
      'FUSE PANEL',
      'Fuses were the correct size for the wire.',
    ].join('\n');
    expect(read(text)).toEqual([['service-equipment', 'exterior', 1]]);
  });
});

describe('computed: overcurrent devices in shorthand (NFPA 70 (NEC) 2023, 240.4(D) and 110.3(B))', () => {
  it('reads "12 ga Al" as 12 AWG aluminum, allowed 15 A (240.4(D))', () => {
    expect(read('Panel\n- Slot 7: 20A SP brkr on 12 ga Al (den ckt).')).toEqual([['overcurrent-mismatch', 'panel', 1]]);
  });

  it('reads a pole mark ("2P") as a breaker and "guage" as gauge (240.4(D): 10 AWG copper 30 A)', () => {
    expect(read('- 40A 2P to the dryer, cond 10 guage Cu.')).toEqual([['overcurrent-mismatch', 'panel', 1]]);
  });

  it('compares an "Installed:" rating with the nameplate maximum of the sentence before (110.3(B))', () => {
    expect(read('- Heat pump nameplate max fuse/brkr 30A. Installed: 2P 40A.')).toEqual([['overcurrent-mismatch', 'panel', 1]]);
  });

  it('carries no nameplate that was already compared in its own sentence', () => {
    const text = 'The condenser is on a 20 amp breaker and its nameplate lists 20 amp maximum. The dryer is on a 30 amp breaker with 10 AWG copper.';
    expect(read(text)).toEqual([]);
  });
});

describe('polarity: a defect an earlier inspection reported (common practice: history is no finding)', () => {
  it('denies a defect an earlier inspection report noted', () => {
    expect(read('A 2021 inspection report from the seller noted a double-tapped breaker, which an electrician has since corrected.')).toEqual([]);
  });
});

describe('counts: numbers and singular devices on unseen wording (common practice: a singular device is one)', () => {
  it('reads the count after a room named twice ("In the den, the two hearth receptacles")', () => {
    expect(read('In the den, the two hearth receptacles beside the fireplace have reversed polarity.')).toEqual([['reversed-polarity', 'living-area', 2]]);
  });

  it('reads "bedroom two receptacles" as a count of two, not bedroom 2', () => {
    expect(read('In the north bedroom two receptacles tested with an open ground.')).toEqual([['open-ground', 'bedroom', 2]]);
  });

  it('reads "any of the three bedrooms" as three', () => {
    expect(read('No smoke alarms in any of the three bedrooms.')).toEqual([['smoke-co-alarm', 'bedroom', 3]]);
  });

  it('counts the subject of the clause for a second defect that names no device', () => {
    expect(read('The receptacle on the garage wall is cracked and is not GFCI protected.')).toEqual([
      ['receptacle-damaged', 'garage', 1],
      ['gfci-missing', 'garage', 1],
    ]);
  });

  it('reads a misspelt singular receptacle as one device', () => {
    expect(read('No GFCI protection at the laundry recepticle.')).toEqual([['gfci-missing', 'laundry', 1]]);
  });
});

describe('exposed wiring in shorthand (NFPA 70 (NEC) 2023, 400.12: flexible cord is no substitute for fixed wiring)', () => {
  it('reads "ext. cord" and "perm. wiring" mid-sentence as the words they stand for', () => {
    expect(read('Laundry\n - Freezer fed by ext. cord through the wall, used as perm. wiring.')).toEqual([['exposed-wiring', 'laundry', 1]]);
  });

  it('reads a pool equipment pad as outside', () => {
    expect(read('Pump timer | Equipment pad | Conduit pulled loose from the box; conductors exposed.')).toEqual([['exposed-wiring', 'exterior', null]]);
  });
});

describe('bonding at the service is correct (NFPA 70 (NEC) 2023, 250.24(A)(5) and 250.142(B))', () => {
  it('reads neutrals and grounds together at the panel that is the service disconnect as no defect', () => {
    expect(read('Panel\nNeutrals and grounds share one bar in this panel, which serves as the service disconnect.')).toEqual([]);
  });

  it('reads "correctly combined" and "like they should be" as no defect', () => {
    expect(read('Neutrals and grounds are correctly combined at the main panel.')).toEqual([]);
    expect(read('Basement panel, neutrals and grounds together like they should be at the main.')).toEqual([]);
  });

  it('reads a bonding screw that has not been installed in a subpanel as no defect', () => {
    expect(read('The garage subpanel keeps neutrals on their own bar, and the bonding screw has not been installed.')).toEqual([]);
  });
});

describe('service: more conditions (NFPA 70 (NEC) 2023, 230.24 clearances, 230.50 protection; common practice)', () => {
  it('reads limbs resting on the conductors and a drop running right through a tree', () => {
    expect(read('The service drop runs right through the crown of the maple, and the limbs are resting on the conductors.')).toEqual([['service-equipment', 'exterior', 1]]);
  });

  it('reads a mast that leans or has a bend in it', () => {
    expect(read('The mast on the gable end has a visible bend in it and the whole mast leans toward the yard.')).toEqual([['service-equipment', 'exterior', 1]]);
  });

  it('reads service entrance cable that has lost its sheathing', () => {
    expect(read('The service entrance cable along the porch roof edge has lost most of its outer sheathing.')).toEqual([['service-equipment', 'exterior', 1]]);
  });

  it('computes a measured clearance stated after the surface (230.24(B): 10 ft over a deck)', () => {
    expect(read('The drop crosses the patio. Measured clearance above the deck at the stairs is about 7 ft.')).toEqual([['service-equipment', 'exterior', 1]]);
    expect(read('Measured clearance above the deck at the stairs is about 12 ft.')).toEqual([]);
  });

  it('reads a meter pedestal that is leaning, but not a pedestal sink', () => {
    expect(read('The meter pedestal at the lot line is leaning toward the drive.')).toEqual([['service-equipment', 'exterior', 1]]);
    expect(read('The pedestal sink in the powder room is leaning; the plumber should reset it.')).toEqual([]);
  });
});

describe('spelling: another form of a word is no misspelling (common practice)', () => {
  it('leaves "correctly" as written', () => {
    expect(read('The switch in the den is correctly wired but loose in the box.')).toEqual([['switch-issue', 'living-area', 1]]);
  });
});

describe('smoke and CO alarms (NFPA 72 (2022) 29.8.1 for placement outside sleeping rooms, from memory; common practice)', () => {
  it('reads "no smoke or carbon monoxide alarms ... in the home" as one house-wide finding', () => {
    expect(read('No smoke or carbon monoxide alarms were found in the home.')).toEqual([['smoke-co-alarm', 'whole-house', null]]);
  });

  it('takes the hallway, not the bedrooms, for an alarm missing "outside the bedrooms"', () => {
    expect(read('There is no CO alarm outside the bedrooms in the second-floor hallway.')).toEqual([['smoke-co-alarm', 'hallway', 1]]);
  });

  it('reads "no smoke alarm issues" as no finding', () => {
    expect(read('No smoke alarm issues; units were present in each bedroom and tested.')).toEqual([]);
  });

  it('reads an alarm that is gone, and "no response" after a shorthand "det."', () => {
    expect(read('The smoke alarm in the den is gone; only the mounting plate remains.')).toEqual([['smoke-co-alarm', 'living-area', 1]]);
    expect(read('Office smoke det. -- no response to test.')).toEqual([['smoke-co-alarm', 'office', 1]]);
  });

  it('reads a sentence about what the law requires as the finding before it, not one of its own', () => {
    const text = 'No CO alarms were present in the home. The house has an attached garage; the state requires CO alarms near sleeping rooms.';
    expect(read(text)).toEqual([['smoke-co-alarm', 'whole-house', null]]);
  });
});

describe('boxes, shops and wrapped table cells (NFPA 70 (NEC) 2023, 314.25: every box has a cover)', () => {
  it('reads a box named by what it feeds as the box with no cover', () => {
    expect(read('Over the bench, a metal junction box feeding the fluorescent lights has no cover plate.')).toEqual([['open-junction-box', 'unknown', 1]]);
  });

  it('reads a box with a long description before its missing cover', () => {
    expect(read('A junction box fastened to the floor joist next to the old oil tank in the cellar has no cover.')).toEqual([['open-junction-box', 'basement', 1]]);
  });

  it('reads a workshop as the garage, and a "basement workshop" as the basement', () => {
    expect(read('In the workshop, the receptacle by the bench is cracked.')).toEqual([['receptacle-damaged', 'garage', 1]]);
    expect(read('In the basement workshop, the receptacle by the bench is cracked.')).toEqual([['receptacle-damaged', 'basement', 1]]);
  });

  it('goes on with a fixed-width row whose last cell wraps onto an indented line', () => {
    const text = [
      'System      Item              Location        Rating  Note',
      'Electrical  Junction box      Attic           D       Box over the hall missing its',
      '                                                      cover, splices exposed',
      'Electrical  Panel             Garage          S       Labeled',
    ].join('\n');
    expect(read(text)).toEqual([['open-junction-box', 'attic', 1]]);
  });

  it('reads "No in-use covers ..., lids broken" as the missing cover, not as denied', () => {
    expect(read('Exterior receptacles: No in-use covers on the two receptacles by the patio, lids broken off.')).toEqual([['weather-cover-missing', 'exterior', 2]]);
  });
});

describe('tables: a pipe row wrapped by a narrow column (common practice: table exports in two-column PDFs)', () => {
  it('reads the lower-case line after a pipe row as the rest of that row', () => {
    const text = ['Item | Location | Condition | Action', 'Receptacle | Guest bedroom, east wall | Reversed', 'polarity | Electrician', 'Light | Garage | Tested', 'ok | None'].join('\n');
    expect(read(text)).toEqual([['reversed-polarity', 'bedroom', 1]]);
  });
});

describe('lights (common practice; NFPA 70 (NEC) 2023, 410.116 for recessed housings near insulation)', () => {
  it('reads a light, a description with commas, and its failure', () => {
    expect(read('One of the four under-cabinet lights, beside the cooktop, does not come on.')).toEqual([['light-fixture', 'kitchen', 1]]);
  });

  it('reads a light strip that is dead', () => {
    expect(read('In the hall closet the light strip over the shelf is dead.')).toEqual([['light-fixture', 'hallway', 1]]);
  });

  it('places recessed lights seen from the attic in the room they light', () => {
    expect(read('From the attic we saw that the recessed lights over the dining room are buried in insulation.')).toEqual([['light-fixture', 'dining', null]]);
  });
});

describe('fans on boxes made for lights (NFPA 70 (NEC) 2023, 314.27(C))', () => {
  it('reads a fan hung from a shallow pancake box with words between', () => {
    expect(read('The ceiling fan in the den is hung from a shallow pancake box nailed to a furring strip.')).toEqual([['fan-support', 'living-area', 1]]);
  });

  it('reads shorthand "clg fan on std pancake box"', () => {
    expect(read('- Office: clg fan on std pancake box, wobbles at high speed')).toEqual([['fan-support', 'office', 1]]);
  });

  it('reads a fan that rocks, and takes a second sentence about the same fan as the same defect', () => {
    const text = 'The ceiling fan in the family room is hung from the original light fixture box. The fan rocks noticeably at high speed.';
    expect(read(text)).toEqual([['fan-support', 'living-area', 1]]);
  });

  it('keeps a second fan that the text says is another one', () => {
    const text = 'The ceiling fan in the family room wobbles at high speed. The other fan also wobbles.';
    expect(read(text)).toEqual([
      ['fan-support', 'living-area', 1],
      ['fan-support', 'living-area', 1],
    ]);
  });
});

describe('AFCI (NFPA 70 (NEC) 2023, 210.12)', () => {
  it('reads "none of the bedroom circuits have arc-fault protection"', () => {
    expect(read('None of the bedroom circuits have arc-fault protection.')).toEqual([['afci-missing', 'bedroom', null]]);
  });

  it('reads AFCI protection that "is recommended" as the recommendation of a missing AFCI', () => {
    const found = parseText('AFCI protection was not required when the house was built and is recommended for the bedroom circuits.').findings;
    expect(found.map((f) => [f.code, f.room])).toEqual([['afci-missing', 'bedroom']]);
  });
});

describe('GFCI missing in more wordings (NFPA 70 (NEC) 2023, 210.8(A))', () => {
  it('reads "isn\'t GFCI protected" and "none GFCI"', () => {
    expect(read('The laundry receptacle next to the utility sink isn\'t GFCI protected.')).toEqual([['gfci-missing', 'laundry', 1]]);
    expect(read('Garage recepticles (3) none GFCI.')).toEqual([['gfci-missing', 'garage', 3]]);
  });

  it('reads "they are not protected" about receptacles tested with a GFCI tester', () => {
    expect(read('In the garage the two bench receptacles are on their own circuit and they are not protected, checked with a GFCI tester.')).toEqual([['gfci-missing', 'garage', 2]]);
  });

  it('takes a sump pit as no place of its own (the section says where it is)', () => {
    expect(read('CRAWL SPACE\nThe receptacle beside the sump pit is not GFCI protected.')).toEqual([['gfci-missing', 'crawl-space', 1]]);
  });
});

describe('switches and dimmers (common practice; NFPA 70 (NEC) 2023, 404.14 for dimmer ratings)', () => {
  it('reads a dimmer named by the light it controls as the switch, not the light', () => {
    expect(read('Switches: the dimmer for the den chandelier is hot to the touch and buzzes.')).toEqual([['switch-issue', 'living-area', 1]]);
  });

  it('reads a switch with a long description that "did not control any light"', () => {
    expect(read('The single switch at the top of the stairs by the linen closet did not control any light.')).toEqual([['switch-issue', 'hallway', 1]]);
  });

  it('reads "doesnt do anything" and a misspelt "swtich"', () => {
    expect(read('Office: the swtich by the closet doesnt do anything I could find.')).toEqual([['switch-issue', 'office', 1]]);
  });
});

describe('exposed cabling and exhaust fans (NFPA 70 (NEC) 2023, 334.15(B) and 334.30; common practice)', () => {
  it('reads loose NM cabling feeding an exhaust fan as exposed wiring, not a ceiling fan defect', () => {
    expect(read('In the attic, the NM cabling feeding the bath exhaust fan lies loose across the joists.')).toEqual([['exposed-wiring', 'attic', null]]);
  });
});

describe('narrow columns, GFCIs that will not reset, what a cord is counted in (common practice)', () => {
  it('does not take a prose line ending in ": no" for a checklist answer', () => {
    const text = 'ELECTRICAL. The main panel is in the utility room and was in good condition: no\ndouble taps, no scorching, no rust.';
    expect(read(text)).toEqual([]);
  });

  it('reads a GFCI that trips but will not reset, leaving receptacles dead, as the GFCI\'s defect', () => {
    expect(read('GFCI receptacle beside the bar sink trips but will not reset -- no power to the receptacles after it.')).toEqual([['gfci-inoperative', 'unknown', 1]]);
  });

  it('counts an extension cord, not the lights it feeds', () => {
    expect(read('Garage: an extension cord is used as permanent wiring to the three lights over the bench.')).toEqual([['exposed-wiring', 'garage', 1]]);
  });
});

describe('casual writing: "too" for two, "isnt", an electrician to go through the system (common practice)', () => {
  it('reads "missing too cover plates" as two missing plates', () => {
    expect(read('The guest bedroom is missing too cover plates.')).toEqual([['cover-plate-missing', 'bedroom', 2]]);
  });

  it('reads "isnt GFCI protected" and counts the one receptacle, whatever a later clause says of every GFCI', () => {
    expect(read('Powder room recepticle isnt GFCI protected, pushed test on every GFI in the house and it stayed hot.')).toEqual([['gfci-missing', 'bathroom', 1]]);
  });

  it('keeps "on any level" a spread, not one device', () => {
    expect(read('No carbon monoxide alarm was found on any level.')).toEqual([['smoke-co-alarm', 'whole-house', null]]);
  });

  it('reads "have a licensed electrician go through the whole system"', () => {
    expect(read('Given the owner work, have a licensed electrician go through the whole system before closing.')).toEqual([['evaluate-general', 'whole-house', null]]);
  });
});

describe('served rooms, service cable, wires of an open box (common practice; NFPA 70 (NEC) 2023, 314.25)', () => {
  it('reads a room a circuit supplies as where it goes, not where the defect is', () => {
    expect(read('ATTIC\nKnob-and-tube wiring is energized and still supplies the bedroom and den circuits.')).toEqual([['knob-and-tube', 'attic', null]]);
  });

  it('keeps a room named with the devices a circuit serves', () => {
    expect(read('The circuit serving the kitchen receptacles is not GFCI protected.')).toEqual([['gfci-missing', 'kitchen', null]]);
  });

  it('reads a cracked service entrance cable jacket as the service, not exposed wiring', () => {
    expect(read('The service entrance cable below the weatherhead has a cracked jacket and is exposed for a foot.')).toEqual([['service-equipment', 'exterior', 1]]);
  });

  it('reads wires hanging from an open box as the box defect only', () => {
    expect(read('Open junction box at the garage ceiling over the bench, wires hanging.')).toEqual([['open-junction-box', 'garage', 1]]);
  });
});

describe('counts from named sides and listed positions (common practice)', () => {
  it('reads "the front and rear exterior receptacles" as two', () => {
    expect(read('The front and rear exterior receptacles have no weatherproof covers.')).toEqual([['weather-cover-missing', 'exterior', 2]]);
  });

  it('reads "breakers at positions 4 and 9" as two', () => {
    expect(read('Double-tapped breakers at positions 4 and 9.')).toEqual([['double-tap', 'panel', 2]]);
  });
});

describe('tables: a quantity column gives the row\'s count (common practice: table exports)', () => {
  it('reads "Qty" in a pipe table, a tab table and a fixed-width table', () => {
    const pipes = ['Item | Location | Qty | Condition', 'Receptacle | Den | 2 | Reversed polarity'].join('\n');
    expect(read(pipes)).toEqual([['reversed-polarity', 'living-area', 2]]);
    const tabs = ['Item\tLocation\tQty\tCondition', 'Cover plate\tHall\t2\tMissing'].join('\n');
    expect(read(tabs)).toEqual([['cover-plate-missing', 'hallway', 2]]);
    const fixed = ['Component          Location        Count   Condition', 'Smoke alarm        Bedrooms        3       Missing'].join('\n');
    expect(read(fixed)).toEqual([['smoke-co-alarm', 'bedroom', 3]]);
  });

  it('gives no count to a condition of the house, and forgets the column after the table', () => {
    const text = ['Item | Location | Qty | Condition', 'Wiring | Attic | 1 | Knob-and-tube in use', '', 'The receptacle by the den door has reversed polarity.'].join('\n');
    expect(read(text)).toEqual([
      ['knob-and-tube', 'attic', null],
      ['reversed-polarity', 'living-area', 1],
    ]);
  });
});

describe('polarity: repairs already made, earlier owners, general advice (common practice: history and advice are no findings)', () => {
  it('denies a defect that "was repaired prior to the inspection" or "has since been corrected"', () => {
    expect(read('Reversed polarity at the office receptacle was repaired prior to the inspection.')).toEqual([]);
    expect(read('The double tap in the garage subpanel has since been corrected.')).toEqual([]);
  });

  it('denies wiring a previous owner replaced', () => {
    expect(read('A previous owner replaced the aluminum wiring with copper in 1998.')).toEqual([]);
  });

  it('denies general advice that starts with "Where"', () => {
    expect(read('Where ungrounded three-prong receptacles exist, GFCI protection may be added as an alternative.')).toEqual([]);
  });
});

describe('terse outbuilding notes (NFPA 70 (NEC) 2023, 250.32(A) and 250.24(A)(5))', () => {
  it('reads a heading with an abbreviation ("DET. GARAGE / SHOP") as the garage', () => {
    expect(read('DET. GARAGE / SHOP\nExt cord used as perm. wiring to the bench, stapled to rafters.')).toEqual([['exposed-wiring', 'garage', 1]]);
  });

  it('reads "N & G on same bar" in a subpanel and "No GES found"', () => {
    expect(read('Subpnl in barn:\n - N & G on same bar, bond screw installed.')).toEqual([['subpanel-bonding', 'panel', 1]]);
    // A barn is outside and a ground rod is outside (the lead room conventions, docs/parser.md; the
    // room lexicon knew no barn before the eleventh round, and the code's default gave the panel).
    expect(read('Barn: no GES found, no rod.')).toEqual([['grounding-electrode', 'exterior', 1]]);
  });

  it('carries the place of the sentence before to "There is also ..."', () => {
    const text = 'In the crawl space the NM cable is newer. There is also an open splice wrapped in tape with no box.';
    expect(read(text)).toEqual([['open-junction-box', 'crawl-space', 1]]);
  });
});

describe('titles, questions, "no ... deficiencies", receptacles dead behind a GFCI (common practice)', () => {
  it('reads a sub-heading that only names the defect as the heading of the paragraph after it', () => {
    const text = ['7.3 Double Tap', 'The 20 amp breaker at position 6 has two conductors under its terminal.'].join('\n');
    expect(read(text)).toEqual([['double-tap', 'panel', 1]]);
  });

  it('reads a defect asked about ("knob-and-tube?") as no finding', () => {
    expect(read('attic: knob-and-tube? not seen, insulation deep')).toEqual([]);
  });

  it('reads "no service entrance deficiencies" as no finding', () => {
    expect(read('No service entrance deficiencies were noted; underground service.')).toEqual([]);
  });

  it('gives receptacles dead downstream of a failed GFCI to the GFCI, counted as one GFCI', () => {
    const text = 'The GFCI at the bar sink will not reset. The two receptacles downstream of it are dead as a result.';
    expect(read(text)).toEqual([['gfci-inoperative', 'unknown', 1]]);
    expect(read("Garage: GFCI rcpt by the door trips, won't reset -- rcpts on that ckt dead (x2).")).toEqual([['gfci-inoperative', 'garage', 1]]);
  });
});

describe('shorthand places and panel parts (NFPA 70 (NEC) 2023, 110.12(A) for unused openings)', () => {
  it('reads "kitch" as the kitchen', () => {
    expect(read('kitch: (2) 3-prong open gnd')).toEqual([['open-ground', 'kitchen', 2]]);
  });

  it('reads an open KO at the side of the can as a panel defect', () => {
    expect(read('PNL:\n  - open KO @ side of can, no plug')).toEqual([['panel-deficiency', 'panel', 1]]);
  });
});

describe('pool and spa sections are places outside, not skipped (NFPA 70 (NEC) 2023, 680.21 and 680.26)', () => {
  it('reads a pump breaker above the motor nameplate under a "Pool Equipment" heading', () => {
    const text = 'Pool Equipment\nThe pump circuit is on a 30 amp breaker; the pump nameplate lists a maximum protective device of 20 amps.';
    expect(read(text)).toEqual([['overcurrent-mismatch', 'panel', 1]]);
  });

  it('reads the pool receptacle under a "POOL / SPA" heading as outside', () => {
    expect(read('POOL / SPA\nThe receptacle at the pump is not GFCI protected.')).toEqual([['gfci-missing', 'exterior', 1]]);
  });
});

describe('outside lights pulled from the wall (common practice)', () => {
  it('reads a light pulled away from the stucco that hangs by its wires as an outside light defect', () => {
    expect(read('The porch-side light fixture is pulled away from the stucco and hangs by its wires.')).toEqual([['light-fixture', 'exterior', 1]]);
  });
});

describe('double taps in shorthand and misspelt (common practice: one conductor per terminal unless listed for two)', () => {
  it('reads "dubble tapped" and "2 cond under 1 lug", counted in breakers', () => {
    expect(read('One breker on the bottom left is dubble tapped.')).toEqual([['double-tap', 'panel', 1]]);
    expect(read('Panel:\n - brkr #9 (20A): 2 cond under 1 lug, brkr not rated for 2.')).toEqual([['double-tap', 'panel', 1]]);
  });
});

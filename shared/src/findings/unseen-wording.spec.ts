import { parseText } from './report-parser';

/** (code, room, quantity) of every finding. */
function read(text: string) {
  return parseText(text).findings.map((f) => [f.code, f.room, f.quantity]);
}

// Rules added while tuning on the writers' batches (docs/parser.md, "Reading rules added for
// reports the parser has never seen"). Each example is new text written for this spec.

describe('smoke and CO alarms', () => {
  it('reads an alarm past its ten-year life as a defect (common practice: replace ten years after manufacture)', () => {
    expect(read('The smoke alarm in the upstairs hallway is stamped 2009, well past the ten-year service life.')).toEqual([['smoke-co-alarm', 'hallway', 1]]);
  });

  it('reads an expired or chirping alarm (common practice: end-of-life chirp)', () => {
    expect(read('The CO alarm in the basement is chirping.')).toEqual([['smoke-co-alarm', 'basement', 1]]);
  });

  it('reads a manufacture date with a replacement word (common practice)', () => {
    expect(read('Smoke: (3) units throughout, mfd 2008 -> replace.')).toEqual([['smoke-co-alarm', 'whole-house', 3]]);
  });

  it('does not read a recent date code that tested fine', () => {
    expect(read('Smoke alarms have 2022 date codes and tested OK.')).toEqual([]);
  });

  it('reads an alarm that did not respond, with words between (common practice)', () => {
    expect(read('The hallway smoke alarm has no cover and did not respond to the test button.')).toEqual([['smoke-co-alarm', 'hallway', 1]]);
  });

  it('reads the shorthand lines of a smoke heading as alarm findings (section subject)', () => {
    expect(read('SMOKE / CO\n - BR2: none\n - hall: mfr 2010 - expired\n - kit: present, tested ok')).toEqual([
      ['smoke-co-alarm', 'bedroom', 1],
      ['smoke-co-alarm', 'hallway', 1],
    ]);
  });

  it('reads a misspelt smoke heading as electrical', () => {
    expect(read('SMOKE DETECTERS\n- None in the bedrms.')).toEqual([['smoke-co-alarm', 'bedroom', null]]);
  });

  it('places "anywhere in the home" house-wide even when a room follows', () => {
    expect(read('No CO alarms were found anywhere in the home, which has an attached garage.')).toEqual([['smoke-co-alarm', 'whole-house', null]]);
  });

  it('keeps "throughout the lower level" in the basement', () => {
    expect(read('Smoke alarms are absent throughout the lower level.')).toEqual([['smoke-co-alarm', 'basement', null]]);
  });
});

describe('flexible cords and cables on the ground', () => {
  it('reads an extension cord stapled along a wall (NFPA 70 (NEC) 2023, 400.12: flexible cord is not a substitute for fixed wiring)', () => {
    expect(read('In the garage an extension cord has been stapled along the wall to the opener.')).toEqual([['exposed-wiring', 'garage', 1]]);
  });

  it('reads "ext cord" as an extension cord, not the exterior (common practice shorthand)', () => {
    expect(read('Gar: ext cord run across ceiling as perm. wiring to opener.')).toEqual([['exposed-wiring', 'garage', 1]]);
  });

  it('reads a cable laid on the ground (NFPA 70 (NEC) 2023, 300.5: direct burial depths)', () => {
    expect(read('The shed is fed by a UF cable that has been laid on the ground across the yard.')).toEqual([['exposed-wiring', 'exterior', 1]]);
  });
});

describe('grounding and bonding', () => {
  it('places a missing electrode conductor "at the panel" at the panel, once per sentence', () => {
    expect(read('No grounding electrode conductor was found at the panel, and no ground rod was found at the exterior.')).toEqual([
      ['grounding-electrode', 'panel', 1],
    ]);
  });

  it('reads a water meter with no jumper around it (NFPA 70 (NEC) 2023, 250.53(D)(1))', () => {
    expect(read('The ground wire clamps to the water pipe on the house side of the meter and there is no jumper around the meter.')).toEqual([
      ['grounding-electrode', 'panel', 1],
    ]);
  });

  it('reads gas piping that has no bonding (NFPA 70 (NEC) 2023, 250.104(B))', () => {
    expect(read('The gas piping at the water heater in the garage has no bonding.')).toEqual([['grounding-electrode', 'garage', 1]]);
  });
});

describe('switches and lights', () => {
  it('reads a switch with no apparent function (common practice: reported for the seller to identify)', () => {
    expect(read('Dining room: the switch by the slider has no apparent function.')).toEqual([['switch-issue', 'dining', 1]]);
  });

  it('reads a switch that does not control anything, with commas in between', () => {
    expect(read('The wall switch for the disposal, right of the sink, is loose in the wall.')).toEqual([['switch-issue', 'kitchen', 1]]);
  });

  it('reads a light that did not light (common practice)', () => {
    expect(read('In the kitchen the recessed fixture over the sink did not light with a new bulb.')).toEqual([['light-fixture', 'kitchen', 1]]);
  });

  it('reads recessed housings buried in insulation (NFPA 70 (NEC) 2023, 410.116(B): non-IC clearance)', () => {
    expect(read('Two recessed light housings in the attic are buried in blown insulation.')).toEqual([['light-fixture', 'attic', 2]]);
  });

  it('reads a bare-bulb lampholder (NFPA 70 (NEC) 2023, 410.16(B): no open lamps in clothes closets)', () => {
    expect(read('Bedroom closet: bare-bulb lampholder, globe missing.')).toEqual([['light-fixture', 'bedroom', 1]]);
  });
});

describe('GFCI wording', () => {
  it('reads "none of the receptacles are GFCI protected" (NFPA 70 (NEC) 2023, 210.8(A)(6))', () => {
    expect(read('Kitchen. None of the counter receptacles are GFCI protected.')).toEqual([['gfci-missing', 'kitchen', null]]);
  });

  it('reads a receptacle that does not trip because it is on no protected circuit as missing, not failed', () => {
    const { findings } = parseText('In the kitchen two counter receptacles did not trip with the tester and are not downstream of any GFCI.');
    expect(findings.map((f) => [f.code, f.room])).toEqual([['gfci-missing', 'kitchen']]);
  });

  it('reads "neither ... nor ... has GFCI protection" with several words between', () => {
    expect(read('Neither the hall bath nor the primary bath has GFCI protection at the vanity.')).toEqual([['gfci-missing', 'bathroom', 2]]);
  });

  it('keeps a recommendation of another defect that names its own place as a finding', () => {
    expect(read('ELECTRICAL\nOne circuit is double tapped. We recommend the kitchen counter receptacles be upgraded to GFCI protection.')).toEqual([
      ['double-tap', 'panel', 1],
      ['gfci-missing', 'kitchen', null],
    ]);
  });
});

describe('general evaluation', () => {
  it('gives no finding for boilerplate about deficient or listed items', () => {
    expect(read('ELECTRICAL\nDouble tap at breaker 12.\n\nDeficient items should be corrected by a licensed electrician.')).toEqual([['double-tap', 'panel', 1]]);
  });

  it('places an evaluation of the system house-wide whatever section it stands in', () => {
    expect(read('BASEMENT\nHave a licensed electrician evaluate the system before closing.')).toEqual([['evaluate-general', 'whole-house', null]]);
  });
});

describe('places', () => {
  it('does not read "outside" as a preposition as the exterior', () => {
    expect(read('There is no CO alarm in the hallway outside the bedrooms.')).toEqual([['smoke-co-alarm', 'hallway', 1]]);
  });

  it('reads a kitchen appliance as the kitchen only when no other room is named with it', () => {
    expect(read('The receptacle behind the refrigerator is cracked.')).toEqual([['receptacle-damaged', 'kitchen', 1]]);
    expect(read('The receptacle behind the refrigerator in the garage is cracked.')).toEqual([['receptacle-damaged', 'garage', 1]]);
  });

  it('takes "by the kitchen pass-through" as a landmark under a room heading', () => {
    expect(read('Dining Room\nThe switch by the kitchen pass-through has no cover plate.')).toEqual([['cover-plate-missing', 'dining', 1]]);
  });

  it('does not read a water entry or an entry door as a hallway', () => {
    expect(read('Water pipe bond | Main water entry, basement | No bonding clamp found at water line')).toEqual([['grounding-electrode', 'basement', 1]]);
  });

  it('keeps a numbered subsection under the room of its numbered parent heading', () => {
    expect(read('6.0 ELECTRICAL - DETACHED GARAGE\n6.3 RECEPTACLES\n 6.3.1 Four receptacles along the bench are not GFCI protected.')).toEqual([
      ['gfci-missing', 'garage', 4],
    ]);
  });
});

describe('polarity', () => {
  it('denies a condition "typical for the age" or "not considered a defect"', () => {
    expect(read('Receptacles are two-slot ungrounded devices, which is typical for the age of the home.')).toEqual([]);
  });

  it('lets a false ground win over the open ground its jumper hides (common practice)', () => {
    expect(read('Kitchen: the receptacle tests grounded but has a neutral-to-ground jumper at the device; there is no ground wire in the box.')).toEqual([
      ['false-ground', 'kitchen', 1],
    ]);
  });

  it('denies abandoned wiring (historical, common practice: only energized knob-and-tube is reported)', () => {
    expect(read('Abandoned knob-and-tube is visible on the basement joists.')).toEqual([]);
  });

  it('denies knob-and-tube that was removed or is not energized (common practice)', () => {
    expect(read('The disclosure states that knob-and-tube wiring was removed from the house during a 2005 renovation.')).toEqual([]);
    expect(read('Remnants of knob-and-tube are visible in the attic; they were cut and were not energized.')).toEqual([]);
  });

  it('places a wiring method where a later clause finds it, and not in the rooms it serves', () => {
    expect(read('Knob-and-tube wiring remains in use for the second floor; it is visible in the attic.')).toEqual([['knob-and-tube', 'attic', null]]);
    expect(read('Energized knob-and-tube wiring was found in the attic, where it still serves the upstairs bedrooms.')).toEqual([
      ['knob-and-tube', 'attic', null],
    ]);
  });

  it('denies a fan that runs without wobble', () => {
    expect(read('Fan rated box confirmed from the attic; the fan operated without wobble.')).toEqual([]);
  });

  it('does not read correct neutral-to-ground bonding at the panel as a false ground', () => {
    expect(read('Neutral-to-ground bonding at the panel was correct.')).toEqual([]);
  });

  it('does not read a feeder with no equipment ground as an open ground', () => {
    expect(read('The garage subpanel is fed by a three-wire feeder with no equipment ground.')).not.toContainEqual(['open-ground', 'garage', null]);
  });
});

describe('service, panel and covers', () => {
  it('reads a service drop low over a deck (NFPA 70 (NEC) 2023, 230.24(B): clearances)', () => {
    expect(read('The service drop crosses over the rear deck about 8 feet above the deck surface.')).toEqual([['service-equipment', 'exterior', 1]]);
  });

  it('reads a meter base pulled away from the siding (common practice)', () => {
    expect(read('The meter base has pulled away from the siding at the bottom.')).toEqual([['service-equipment', 'exterior', 1]]);
  });

  it('reads storage in front of a panel (NFPA 70 (NEC) 2023, 110.26(A): 30 in. wide, 36 in. deep working space)', () => {
    expect(read('Shelving has been placed directly in front of the panel.')).toEqual([['panel-deficiency', 'panel', 1]]);
  });

  it('reads a cracked cover plate on a described receptacle as the plate, not the receptacle', () => {
    expect(read('Laundry: the cover plate on the dryer receptacle is cracked.')).toEqual([['cover-plate-missing', 'laundry', 1]]);
  });

  it('reads missing dead-front screws in shorthand', () => {
    expect(read('Dead front: (2) screws missing.')).toEqual([['panel-deficiency', 'panel', 2]]);
  });

  it('reads an outdoor receptacle with no cover as a missing weatherproof cover (NFPA 70 (NEC) 2023, 406.9(B)(1))', () => {
    expect(read('The receptacle on the rear patio has no cover at all.')).toEqual([['weather-cover-missing', 'exterior', 1]]);
  });

  it('reads a flat cover outdoors as no in-use cover (NFPA 70 (NEC) 2023, 406.9(B)(1))', () => {
    expect(read('Front porch receptacle: flat cover only, no in-use cover.')).toEqual([['weather-cover-missing', 'exterior', 1]]);
  });

  it('reads splices outside of any box (NFPA 70 (NEC) 2023, 300.15)', () => {
    expect(read('In the basement several taped splices hang between the joists outside of any junction box.')).toEqual([['open-junction-box', 'basement', null]]);
  });
});

describe('counts', () => {
  it('counts a double tap in breakers, not in the conductors under one terminal', () => {
    expect(read('The 20 amp breaker has two conductors under its single terminal (double tap).')).toEqual([['double-tap', 'panel', 1]]);
  });

  it('does not take "at all speeds" for a vague count', () => {
    expect(read('The ceiling fan in the family room wobbles at all speeds.')).toEqual([['fan-support', 'living-area', 1]]);
  });

  it('reads "(4 of them)"', () => {
    expect(read('Kitchen: no GFCI protection at the counter receptacles (4 of them).')).toEqual([['gfci-missing', 'kitchen', 4]]);
  });
});

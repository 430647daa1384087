import { parseText } from './report-parser';
import { classifyHeadingLine } from './section-heading';

/** (code, room, quantity) of every finding. */
function read(text: string) {
  return parseText(text).findings.map((f) => [f.code, f.room, f.quantity]);
}

// Rules of the eleventh tuning round (docs/parser.md, "Eleventh round"), read off batch M's kinds of
// documents (forms, other trades' notes). Each example is new text written for this spec, not a
// sentence of the corpus.

describe('a line with rules drawn on both sides is a heading whatever its other words', () => {
  it('reads "-- ELECTRICAL: SERVICE / FEEDER ----" as an electrical heading', () => {
    const line = classifyHeadingLine('-- ELECTRICAL: SERVICE / FEEDER ---------------');
    expect(line).toEqual({ type: 'heading', heading: { kind: 'electrical', title: 'ELECTRICAL: SERVICE / FEEDER', room: null } });
  });

  it('ends a roofing section, so the electrical items after it are read', () => {
    const text = ['-- ROOF ----------', '[X] Valley flashing ..... lifted at the porch roof', '-- ELECTRICAL: BRANCH / DEVICES --------', '[X] Kitchen ........ counter outlet left of range has no GFCI'].join('\n');
    expect(read(text)).toEqual([['gfci-missing', 'kitchen', 1]]);
  });

  it('leaves a ruled line without heading words a label', () => {
    expect(classifyHeadingLine('== PAGE BREAK MARKER ===')).toEqual({ type: 'label' });
  });
});

describe('places', () => {
  it('a place in brackets after another says which one: "Bath 1 (hall)" is a bathroom', () => {
    expect(read('ELECTRICAL\n[X] Bath 1 (hall) ......... GFCI will not reset')).toEqual([['gfci-inoperative', 'bathroom', 1]]);
  });

  it('a bath fan named as a landmark in the attic leaves the attic the place', () => {
    expect(read('ATTIC\nTwo junction boxes without covers next to the bath fan.')).toEqual([['open-junction-box', 'attic', 2]]);
  });

  it('a place label with a bracketed note heads the lines under it', () => {
    const text = ['In crawlspace (entered at the north vent):', ' - splices taped together on a joist, no box'].join('\n');
    expect(read(text)).toEqual([['open-junction-box', 'crawl-space', null]]);
  });

  it('"up here" under a heading is the heading\'s place, though a room the wires feed is named after it', () => {
    const text = ['Attic (through the hall closet)', 'Knob-and-tube is still live up here, on the runs feeding the rear bedroom ceiling light.'].join('\n');
    expect(read(text)).toEqual([['knob-and-tube', 'attic', null]]);
  });
});

describe('shorthand', () => {
  it('reads "NW" as a direction beside a place, and as "not working" after a device word', () => {
    expect(read('ELECTRICAL\nBedroom (NW): cover plate missing at the desk outlet.')).toEqual([['cover-plate-missing', 'bedroom', 1]]);
    expect(read('ELECTRICAL\nDining rm - ceiling lt NW.')).toEqual([['light-fixture', 'dining', 1]]);
  });

  it('reads "jct" as junction', () => {
    expect(read('ATTIC\n(3) jct boxes open, no lids')).toEqual([['open-junction-box', 'attic', 3]]);
  });
});

describe('boxes and counts', () => {
  it('reads a box with no lid when the sentence shows its splices or wire nuts, words between', () => {
    expect(read('BASEMENT\nThe metal box nailed to the joist over the freezer has no lid, wire nuts showing.')).toEqual([['open-junction-box', 'basement', 1]]);
  });

  it('reads a number with an inch or foot mark as a measure, not a count', () => {
    expect(read('GARAGE\nA 4" square box above the opener has no cover; splices visible.')).toEqual([['open-junction-box', 'garage', 1]]);
  });
});

describe('smoke alarms on forms and by their age', () => {
  it('reads a leader of dots up to an answer that states the defect as one sentence', () => {
    expect(read('ELECTRICAL\nSmoke alarms ............ NONE in the den')).toEqual([['smoke-co-alarm', 'living-area', 1]]);
  });

  it('still ends a row at a leader before a rating', () => {
    expect(read('ELECTRICAL\nDryer 30A 2P - #10 Cu ........ OK      Range 50A 2P - #6 Cu ........ OK')).toEqual([]);
  });

  it('keeps "manufacture date" as written, so an old alarm is read (common practice: smoke alarms are replaced ten years after manufacture, NFPA 72 (2022) 14.4.7.1, from memory)', () => {
    expect(read('ELECTRICAL\nSmoke alarm in the hallway, manufacture date 2008, should be replaced.')).toEqual([['smoke-co-alarm', 'hallway', 1]]);
  });
});

describe('item numbers are no counts', () => {
  it('reads a number that opens a row before a capitalised label as the row number', () => {
    expect(read('ELECTRICAL\n100 KITCHEN - NO GFCI AT COUNTER')).toEqual([['gfci-missing', 'kitchen', null]]);
    expect(read('ELECTRICAL\n7 Unit B sunroom - ceiling fan wobbles on high')).toEqual([['fan-support', 'living-area', 1]]);
  });

  it('reads the digits after a dot as part of a section number', () => {
    expect(read('ELECTRICAL\n3 ELEC 4.5 - Hall bath GFCI would not trip with its test button')).toEqual([['gfci-inoperative', 'bathroom', 1]]);
  });

  it('still reads a count that opens a row before the counted thing', () => {
    expect(read('KITCHEN\n2 GFCI receptacles will not reset')).toEqual([['gfci-inoperative', 'kitchen', 2]]);
    expect(read('KITCHEN\nTwo of the counter receptacles have no GFCI protection.')).toEqual([['gfci-missing', 'kitchen', 2]]);
  });
});

describe('outbuildings and crawl spaces named as the trades name them (the lead room convention: barns and sheds are exterior)', () => {
  it('reads a barn, and a level of a barn, as outside', () => {
    expect(read('ELECTRICAL\nBank barn - lower level: outlets by the water trough are not GFCI protected.')).toEqual([['gfci-missing', 'exterior', null]]);
  });

  it('reads a machine shed as outside, and "they shed heat" as no place', () => {
    // A receptacle's missing cover outside is its weather cover (NFPA 70 (NEC) 2023, 406.9(B)(1)).
    expect(read('ELECTRICAL\nMachine shed: the weld outlet has no cover plate.')).toEqual([['weather-cover-missing', 'exterior', 1]]);
    expect(read('ELECTRICAL\nA dimmer that is hot to the touch in the den; they shed heat, but this one is too hot.')[0]?.[1]).toBe('living-area');
  });

  it('reads "subarea" and "on the dirt" as the crawl space', () => {
    expect(read('Subarea access light does not come on.')).toEqual([['light-fixture', 'crawl-space', 1]]);
    expect(read('A grey cable is laying loose on the dirt under the kitchen, not stapled up.')).toEqual([['exposed-wiring', 'crawl-space', 1]]);
  });
});

describe('a repair told as done names a defect that is gone (completion letters, re-inspections)', () => {
  it('reads nothing from a row whose work column opens with a past-tense repair verb', () => {
    expect(read('Main panel, cellar            Removed double tap at the 20A breaker, added a pigtail.')).toEqual([]);
    expect(read('Hall bath (upper)              Replaced GFCI that would not reset.')).toEqual([]);
  });

  it('reads nothing from "... corrected at 2 receptacles"', () => {
    expect(read('Guest room: reversed polarity corrected at 2 receptacles.')).toEqual([]);
  });

  it('still reads a defect that should be corrected, or a replaced device that is loose', () => {
    expect(read('Reversed polarity at the den receptacle should be corrected by an electrician.')).toEqual([['reversed-polarity', 'living-area', 1]]);
    expect(read('KITCHEN\nThe receptacle was replaced but it is loose.')).toEqual([['receptacle-damaged', 'kitchen', 1]]);
  });
});

describe('the panel', () => {
  it('reads rust or flood damage on the breakers and bars inside the panel as the panel\'s defect', () => {
    expect(read('MAIN PANEL\nRust and corrosion on the lower breakers and the neutral bar, water entry from above.')).toEqual([['panel-deficiency', 'panel', 1]]);
  });

});

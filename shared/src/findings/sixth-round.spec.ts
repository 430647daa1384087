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
    // The writers place a defect at the rod at the panel (fifth round).
    expect(read('The clamp on the ground rod beside the meter has rusted loose.')).toEqual([['grounding-electrode', 'panel', 1]]);
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

import { isListItem, listKindOf, mergeDocument, separates, type FindingPlace } from './document-merge';
import type { Finding } from './finding.schema';
import { parseText } from './report-parser';

// Each example is new text written for this spec, not a sentence of the corpus.

let offset = 0;
/** A finding read from `evidence` (offsets in report order). */
function finding(code: Finding['code'], room: Finding['room'], evidence: string, extra: Partial<Finding> = {}): Finding {
  const start = offset;
  offset += evidence.length + 1;
  return {
    code,
    room,
    location: '',
    quantity: null,
    evidence,
    page: 1,
    start,
    end: start + evidence.length,
    severity: 'repair',
    necRefs: [],
    confidence: 'exact',
    recommendation: null,
    computation: null,
    ...extra,
  };
}

describe('mergeDocument: a later finding of the same code and a compatible room is the earlier one told again', () => {
  it('merges a summary line and the body paragraph that repeats it, keeping the earlier evidence', () => {
    const a = finding('gfci-missing', 'kitchen', 'Kitchen counter receptacles lack GFCI protection.');
    const b = finding('gfci-missing', 'kitchen', 'Kitchen: the counter receptacles are not GFCI protected; install GFCI protection.', {
      location: 'Kitchen',
      recommendation: 'install GFCI protection.',
    });
    const merged = mergeDocument([a, b]);
    expect(merged).toHaveLength(1);
    expect(merged[0]).toMatchObject({ evidence: a.evidence, start: a.start, end: a.end, location: 'Kitchen', recommendation: 'install GFCI protection.' });
  });

  it('merges a follow-up sentence with no place of its own (room unknown) into the finding before it', () => {
    const a = finding('exposed-wiring', 'garage', 'An extension cord powers the garage door opener.', { quantity: 1 });
    const b = finding('exposed-wiring', 'unknown', 'Extension cords may not be used as permanent wiring.');
    expect(mergeDocument([a, b])).toEqual([a]);
  });

  it('takes the room, quantity and the strongest confidence from the later telling where the earlier has none', () => {
    const a = finding('switch-issue', 'unknown', 'Switch of unknown function - repair', { confidence: 'inferred' });
    const b = finding('switch-issue', 'bedroom', 'Rear bedroom: the wall switch by the closet controls nothing found.', { quantity: 1, location: 'Rear bedroom', confidence: 'exact' });
    const [m] = mergeDocument([a, b]);
    expect(m).toMatchObject({ room: 'bedroom', location: 'Rear bedroom', quantity: 1, confidence: 'exact', evidence: a.evidence });
  });

  it('keeps findings of another code or another known room', () => {
    const a = finding('gfci-missing', 'kitchen', 'Kitchen receptacles lack GFCI protection.');
    const b = finding('gfci-missing', 'garage', 'Garage receptacles lack GFCI protection.');
    const c = finding('open-ground', 'kitchen', 'Kitchen receptacles have an open ground.');
    expect(mergeDocument([a, b, c])).toEqual([a, b, c]);
  });
});

describe('separates: what makes two findings of one code and room two defects', () => {
  it('a count on either, unless both give the same count', () => {
    const a = finding('open-ground', 'living-area', 'Living room: three receptacles have an open ground.', { quantity: 3 });
    const b = finding('open-ground', 'living-area', 'Living room: one receptacle by the stairs has an open ground.', { quantity: 1 });
    expect(separates(a, b)).toBe('count');
    const c = finding('smoke-co-alarm', 'bedroom', 'No smoke alarms in the two bedrooms.', { quantity: 2 });
    const d = finding('smoke-co-alarm', 'bedroom', 'Bedrooms: neither of the two bedrooms has a smoke alarm.', { quantity: 2 });
    expect(separates(c, d)).toBeNull();
  });

  it('a plural after a single device', () => {
    const a = finding('receptacle-damaged', 'bedroom', 'The receptacle behind the bed is cracked.', { quantity: 1 });
    const b = finding('receptacle-damaged', 'bedroom', 'Worn receptacles in the guest bedroom no longer hold a plug.');
    expect(separates(a, b)).toBe('plural after a count');
  });

  it('another device word (a receptacle and a cover plate)', () => {
    const a = finding('cover-plate-missing', 'garage', 'Garage: the receptacle by the door has no cover.', { quantity: 1 });
    const b = finding('cover-plate-missing', 'garage', 'Garage: switch plate cracked.', { quantity: 1 });
    expect(separates(a, b)).toBe('device');
  });

  it('a later sentence that says it is another one ("also", "another")', () => {
    const a = finding('gfci-missing', 'exterior', 'The hot tub disconnect has no GFCI.');
    const b = finding('gfci-missing', 'exterior', 'The pump receptacle at the pad is also not GFCI protected.', { quantity: 1 });
    expect(separates(a, b)).toBe('another');
  });

  it('another place qualifier: left and right, upstairs and downstairs, second bathroom, a unit number', () => {
    const sides = [finding('open-ground', 'kitchen', 'Receptacle left of the range: open ground.'), finding('open-ground', 'kitchen', 'Receptacle right of the range: open ground.')];
    const levels = [finding('smoke-co-alarm', 'hallway', 'No smoke alarm in the upstairs hall.'), finding('smoke-co-alarm', 'hallway', 'No smoke alarm in the downstairs hall.')];
    const baths = [finding('gfci-missing', 'bathroom', 'Hall bath receptacle: no GFCI.'), finding('gfci-missing', 'bathroom', 'Second bathroom receptacle: no GFCI.')];
    const units = [finding('gfci-missing', 'kitchen', 'Unit 1 kitchen: counter receptacles lack GFCI.'), finding('gfci-missing', 'kitchen', 'Unit 2 kitchen: counter receptacles lack GFCI.')];
    for (const [a, b] of [sides, levels, baths, units]) expect(separates(a, b)).toBe('place');
  });

  it('a circuit or slot number is a place in the panel', () => {
    const a = finding('double-tap', 'panel', 'Slot 9 breaker has two conductors under its screw.');
    const b = finding('double-tap', 'panel', 'Slot 14 breaker has two conductors under its screw.');
    expect(separates(a, b)).toBe('place');
  });

  it('another part of the equipment (service mast and meter base; common practice: each is its own repair)', () => {
    const a = finding('service-equipment', 'exterior', 'The service mast leans away from the wall.');
    const b = finding('service-equipment', 'exterior', 'The meter base has pulled away from the siding.');
    expect(separates(a, b)).toBe('part');
    const c = finding('service-equipment', 'exterior', 'Tree limbs touch the service drop.');
    const d = finding('service-equipment', 'exterior', 'The drip loop is missing.');
    expect(separates(c, d)).toBe('part');
  });

  it('another breaker rating, or another computation, is another breaker', () => {
    const a = finding('overcurrent-mismatch', 'panel', 'Dryer: 40 A breaker on 12 AWG copper.', { computation: '40 A breaker on 12 AWG copper; 240.4(D) allows 20 A' });
    const b = finding('overcurrent-mismatch', 'panel', 'Range: 50 A breaker on 10 AWG copper.', { computation: '50 A breaker on 10 AWG copper; 240.4(D) allows 30 A' });
    expect(separates(a, b)).toBe('part');
  });

  it('both being separate items of one list', () => {
    const a = finding('panel-deficiency', 'panel', 'Rust inside the enclosure.');
    const b = finding('panel-deficiency', 'panel', 'Wasp nest inside the enclosure.');
    const item = (block: number): FindingPlace => ({ block, section: 3, listItem: true });
    expect(separates(a, b, undefined, undefined, item(4), item(6))).toBe('list');
    // The same items in a summary (another section) and in the body are one defect each.
    expect(separates(a, b, undefined, undefined, item(4), { block: 9, section: 5, listItem: true })).toBeNull();
  });
});

describe('isListItem', () => {
  it('knows bullets, numbers, letters and table rows from paragraphs', () => {
    for (const line of ['- Open ground at den.', '3. Loose switch.', '(b) Missing cover.', 'E-4 Double tap', 'Den | open ground', 'Den\topen ground']) expect(isListItem(line)).toBe(true);
    expect(isListItem('The den receptacles have an open ground and\nthe switch is loose.')).toBe(false);
  });
});

describe('parseReport merges across the whole report', () => {
  it('reads a recap at the end as the defect already found', () => {
    const text = [
      'ELECTRICAL',
      'The laundry receptacle behind the washer is not GFCI protected.',
      '',
      'PLUMBING',
      'The water heater is 12 years old.',
      '',
      'CLOSING NOTES',
      'As noted, the washer receptacle lacks GFCI protection.',
    ].join('\n');
    const { findings } = parseText(text);
    expect(findings.map((f) => [f.code, f.room])).toEqual([['gfci-missing', 'laundry']]);
    expect(text.slice(findings[0].start, findings[0].end)).toBe(findings[0].evidence);
    expect(findings[0].evidence).toMatch(/^The laundry receptacle/);
  });

  it('reads a summary table row and the numbered item that describes it after it as one defect (two lists, not two items of one)', () => {
    const text = [
      'ELECTRICAL SUMMARY',
      ' #  | LOCATION   | ITEM                                 | QTY',
      ' 1  | Bedroom 2  | Cover plates missing on receptacles  |  3',
      '',
      '1. Bedroom 2. Three receptacles with no plates, two on the closet wall and one by the window.',
    ].join('\n');
    const { findings } = parseText(text);
    expect(findings.map((f) => [f.code, f.room, f.quantity])).toEqual([['cover-plate-missing', 'bedroom', 3]]);
  });
});

describe('listKindOf', () => {
  it('tells a table row, a numbered item, a lettered item and a bullet apart', () => {
    expect(listKindOf(' 1  | Bedroom 2  | Cover plates missing | 3')).toBe('table');
    expect(listKindOf('1. Bedroom 2. Three receptacles with no plates.')).toBe('numbered');
    expect(listKindOf('b) Garage receptacle is not GFCI.')).toBe('lettered');
    expect(listKindOf('- Garage receptacle is not GFCI.')).toBe('bullet');
    expect(listKindOf('The garage receptacle is not GFCI.')).toBeNull();
  });
});

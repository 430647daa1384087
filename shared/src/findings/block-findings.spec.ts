import { splitBlocks } from './block-splitter';
import { readBlock } from './block-findings';

function findingsOf(text: string) {
  const [block] = splitBlocks(text);
  return readBlock(block.text, block.section).findings.map((f) => [f.code, f.room, f.quantity]);
}

describe('readBlock', () => {
  it('gives no general evaluation when the block has a specific defect', () => {
    expect(findingsOf('Two breakers are double tapped. Recommend evaluation by a licensed electrician.')).toEqual([['double-tap', 'panel', 2]]);
  });

  it('gives a general evaluation when it stands alone', () => {
    expect(findingsOf('Have a qualified electrician evaluate the system.')).toEqual([['evaluate-general', 'whole-house', null]]);
  });

  it('drops a recommendation that repeats a finding of the block', () => {
    expect(findingsOf('The island receptacle is not GFCI protected; recommend GFCI protection.')).toEqual([['gfci-missing', 'kitchen', 1]]);
  });

  it('carries a place to a sentence that refers back to it', () => {
    // "It" stands for the one receptacle: a singular device is one (docs/parser.md, the writers' quantity rule).
    expect(findingsOf('The hall bathroom has one receptacle. It is not GFCI protected.')).toEqual([['gfci-missing', 'bathroom', 1]]);
  });

  it('does not carry a place to an unrelated sentence', () => {
    expect(findingsOf('The hallway smoke alarm is over ten years old. No CO alarm is installed.')).toEqual([
      ['smoke-co-alarm', 'hallway', 1],
      // An alarm missing house-wide gives no number to install (fifth round).
      ['smoke-co-alarm', 'whole-house', null],
    ]);
  });

  it('carries the place of an opening sentence that is not a finding (it names the area)', () => {
    expect(findingsOf('The hall is narrow. No CO alarm is installed.')).toEqual([['smoke-co-alarm', 'hallway', 1]]);
  });

  it('reports a denied phrase as negated rather than found', () => {
    const [block] = splitBlocks('No reversed polarity observed at tested receptacles.');
    expect(readBlock(block.text, block.section)).toEqual({ findings: [], hasNegated: true });
  });
});

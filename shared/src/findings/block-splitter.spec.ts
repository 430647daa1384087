import { splitBlocks } from './block-splitter';

const textsOf = (joined: string) => splitBlocks(joined).map((b) => b.text.text);

describe('splitBlocks', () => {
  it('starts a block at each numbered item and bullet and drops the marker', () => {
    expect(textsOf('1. Double tap at panel.\n2) Open ground.\n- Loose switch.\n• Missing plate.')).toEqual([
      'Double tap at panel.',
      'Open ground.',
      'Loose switch.',
      'Missing plate.',
    ]);
  });

  it('keeps a wrapped sentence together, across a page break and a running header', () => {
    const joined = 'The garage receptacles are not GFCI protected; the inspector counted\n\fAcme Reports   Page 4 of 9\nsix receptacles.';
    expect(textsOf(joined)).toEqual(['The garage receptacles are not GFCI protected; the inspector counted six receptacles.']);
  });

  it('records the section each block sits in', () => {
    const blocks = splitBlocks('ROOF\nShingles worn.\n\nELECTRICAL\nDouble tap at panel.');
    expect(blocks.map((b) => [b.section.kind, b.section.title])).toEqual([
      ['non-electrical', 'ROOF'],
      ['electrical', 'ELECTRICAL'],
    ]);
  });

  it('gives a non-electrical label line its own skipped topic', () => {
    const [block] = splitBlocks('EXTERIOR\nSiding: vinyl, generally serviceable.');
    expect(block.section).toEqual({ kind: 'non-electrical', title: 'Siding', room: null });
  });

  it('keeps short checklist lines as separate sentences', () => {
    const [block] = splitBlocks('GFCI at bathrooms: Yes\nGFCI at exterior: No\nDouble taps: None');
    expect(block.text.text.split('\n')).toHaveLength(3);
  });

  it('joins a hyphenated word wrapped across lines', () => {
    expect(textsOf('The recep-\ntacle is cracked.')).toEqual(['The receptacle is cracked.']);
  });
});

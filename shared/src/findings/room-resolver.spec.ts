import { matchCodes } from './code-matcher';
import { placeMatches, type PlaceContext } from './room-resolver';

const NO_CONTEXT: PlaceContext = { carried: null, sectionRoom: null, sectionTitle: null };

function roomsOf(sentence: string, context = NO_CONTEXT): string[][] {
  return placeMatches(sentence, matchCodes(sentence), context).map((places) => places.map((p) => p.room));
}

describe('placeMatches', () => {
  it('gives each of two defects its own room', () => {
    expect(roomsOf('Missing GFCI protection at the laundry room receptacle and reversed polarity at the hall bath receptacle.')).toEqual([
      ['laundry'],
      ['bathroom'],
    ]);
  });

  it('gives one finding per room of a listed group', () => {
    expect(roomsOf('AFCI protection is not present for the bedroom, dining room and living room circuits.')).toEqual([
      ['bedroom', 'dining', 'living-area'],
    ]);
  });

  it('takes the room named later in the clause when the defect names none', () => {
    expect(roomsOf('Reversed polarity and open grounds at the garage receptacles.')).toEqual([['garage'], ['garage']]);
  });

  it('skips a place named only as a reference point', () => {
    expect(roomsOf('There is an open junction box beneath the kitchen.', { ...NO_CONTEXT, sectionRoom: 'crawl-space', sectionTitle: 'CRAWL SPACE' })).toEqual([
      ['crawl-space'],
    ]);
  });

  it('prefers a room to the panel for non-panel codes', () => {
    expect(roomsOf('Single-strand aluminum wiring was observed at the panel and throughout the home.')).toEqual([['whole-house']]);
  });

  it('always puts panel codes at the panel', () => {
    expect(roomsOf('Double tap at the breaker in the garage.')).toEqual([['panel']]);
  });

  it('falls back to the carried place, the section, then the code default', () => {
    const sentence = 'It is not GFCI protected.';
    expect(roomsOf(sentence, { ...NO_CONTEXT, carried: { room: 'bathroom', location: 'hall bath' } })).toEqual([['bathroom']]);
    expect(roomsOf(sentence, { ...NO_CONTEXT, sectionRoom: 'garage', sectionTitle: 'GARAGE' })).toEqual([['garage']]);
    expect(roomsOf('The drip loop is missing.')).toEqual([['exterior']]);
    expect(roomsOf(sentence)).toEqual([['unknown']]);
  });
});

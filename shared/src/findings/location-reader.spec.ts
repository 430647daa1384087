import { readLocation } from './location-reader';
import { findRooms } from './room-lexicon';

const locationIn = (sentence: string) => readLocation(sentence, findRooms(sentence)[0]);

describe('readLocation', () => {
  it('runs on over the words that narrow the place down', () => {
    expect(locationIn('Reversed polarity at the living room receptacle left of the fireplace.')).toBe(
      'living room receptacle left of the fireplace',
    );
  });

  it('stops at a verb', () => {
    expect(locationIn('Receptacles in the primary bathroom are not GFCI protected.')).toBe('primary bathroom');
  });

  it('keeps the words as written', () => {
    expect(locationIn('OPEN J-BOX IN ATTIC ABOVE GARAGE')).toBe('ATTIC ABOVE GARAGE');
  });
});

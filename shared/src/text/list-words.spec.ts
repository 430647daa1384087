import { eitherWords, listWords } from './list-words';

describe('listWords', () => {
  it.each([
    [[], ''],
    [['the seller'], 'the seller'],
    [['the seller', 'the listing agent'], 'the seller and the listing agent'],
    [['a', 'b', 'c'], 'a, b and c'],
  ])('%p → %p', (words, sentence) => {
    expect(listWords(words)).toBe(sentence);
  });
});

describe('eitherWords', () => {
  it.each([
    [[], ''],
    [['the contractor'], 'the contractor'],
    [['the seller', 'the listing agent'], 'the seller or the listing agent'],
    [['a', 'b', 'c'], 'a, b or c'],
  ])('%p → %p', (words, sentence) => {
    expect(eitherWords(words)).toBe(sentence);
  });
});

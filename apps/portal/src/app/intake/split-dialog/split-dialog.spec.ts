import { readQuantities } from './split-dialog';

describe('readQuantities', () => {
  it('reads whole numbers separated by commas, semicolons or blanks', () => {
    expect(readQuantities('2, 1')).toEqual([2, 1]);
    expect(readQuantities(' 1;1  3 ')).toEqual([1, 1, 3]);
  });

  it('keeps a part that is not a whole number as NaN so the schema refuses it', () => {
    const parts = readQuantities('2, 1.5, two');
    expect(parts[0]).toBe(2);
    expect(Number.isNaN(parts[1]) && Number.isNaN(parts[2])).toBe(true);
  });
});

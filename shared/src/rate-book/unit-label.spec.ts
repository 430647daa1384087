import { pluralUnit, quantityLabel } from './unit-label';

// Plural rules of ordinary English spelling (common practice): -s, -es after s/x/z/ch/sh, -ies after a
// consonant + y, irregular "foot" → "feet"; abbreviations stay as they are.
describe('quantityLabel', () => {
  it.each([
    [1, 'device', '1 device'],
    [3, 'device', '3 devices'],
    [2, 'box', '2 boxes'],
    [2, 'switch', '2 switches'],
    [4, 'circuit', '4 circuits'],
    [0, 'device', '0 devices'],
    [2, 'each', '2 each'],
    [25, 'linear foot', '25 linear feet'],
    [12, 'ft', '12 ft'],
    [2, 'battery', '2 batteries'],
    [2, 'relay', '2 relays'],
    [2, 'GFCI', '2 GFCI'],
  ])('%d %s → %s', (quantity, unit, expected) => {
    expect(quantityLabel(quantity, unit)).toBe(expected);
  });

  it('says the quantity is to be confirmed when it is unknown, and gives a bare number without a unit', () => {
    expect(quantityLabel(null, 'device')).toBe('quantity to confirm (per device)');
    expect(quantityLabel(3, null)).toBe('3');
  });

  it('leaves a word that is already plural-looking to the -es rule', () => {
    expect(pluralUnit('glass')).toBe('glasses');
  });
});

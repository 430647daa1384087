import { visitLabel } from './visit-label';

describe('visitLabel', () => {
  it.each([
    ['visit-1', 'Visit 1'],
    ['visit-12', 'Visit 12'],
    ['afternoon', 'afternoon'],
  ])('reads %s as %s', (key, label) => {
    expect(visitLabel(key)).toBe(label);
  });
});

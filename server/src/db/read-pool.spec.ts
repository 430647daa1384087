import { isoTimestamp } from './read-pool';

// The reference is ECMAScript's own Date#toISOString (ECMA-262, Date Time String Format): the text a
// read connection keeps must come out exactly as a Date read through Knex would.
describe('isoTimestamp', () => {
  const cases: [string, string][] = [
    ['2026-12-04 05:17:37.123456+00', '2026-12-04T05:17:37.123Z'],
    ['2026-12-04 05:17:37.1+00', '2026-12-04T05:17:37.100Z'],
    ['2026-12-04 05:17:37.999999+00', '2026-12-04T05:17:37.999Z'],
    ['2026-02-28 23:59:59+00', '2026-02-28T23:59:59.000Z'],
  ];

  it.each(cases)('writes the UTC text %s as %s, as a Date would', (text, iso) => {
    expect(isoTimestamp(text)).toBe(iso);
    const asDate = new Date(`${text.replace(' ', 'T').replace(/(\.\d{3})\d*/, '$1')}:00`);
    expect(asDate.toISOString()).toBe(iso);
  });

  it('passes a Date through toISOString', () => {
    const date = new Date(Date.UTC(2027, 0, 5, 14, 3, 9, 42));
    expect(isoTimestamp(date)).toBe('2027-01-05T14:03:09.042Z');
  });

  it('reads a time with another offset through Date', () => {
    expect(isoTimestamp('2026-12-04 07:17:37.5+02')).toBe(new Date('2026-12-04T07:17:37.500+02:00').toISOString());
  });
});

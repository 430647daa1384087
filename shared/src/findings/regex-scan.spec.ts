import { scanAll } from './regex-scan';

const summary = (list: RegExpExecArray[]) => list.map((m) => [m.index, m[0], ...m.slice(1)]);

describe('scanAll', () => {
  it.each([
    [/open\s+grounds?/gi, 'Open ground at the den; open grounds at both bedroom receptacles.'],
    [/(?<amps>\d{2})\s?a\b/gi, '20A breaker on 14 AWG, 30 a on #12'],
    [/\s*/g, 'a b'], // empty matches move on by one position
    [/(?:)/gu, 'a\u{1F50C}b'], // by code point with the u flag
    [/x/g, 'no match here'],
  ])('gives the same matches as matchAll for %s', (re, text) => {
    expect(summary(scanAll(re, text))).toEqual(summary([...text.matchAll(re)]));
    expect(scanAll(re, text).map((m) => m.groups)).toEqual([...text.matchAll(re)].map((m) => m.groups));
  });

  it('leaves the expression ready for the next scan', () => {
    const re = /gfci/gi;
    scanAll(re, 'GFCI, GFCI');
    expect(re.lastIndex).toBe(0);
    expect(scanAll(re, 'one GFCI')).toHaveLength(1);
  });

  it('refuses an expression without the g flag, as matchAll does', () => {
    expect(() => scanAll(/gfci/i, 'GFCI')).toThrow(TypeError);
  });
});

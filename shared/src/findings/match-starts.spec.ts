import { CODE_RULES } from './code-patterns';
import { canStartAt, startFilteredScan, startTable } from './match-starts';
import { scanAll } from './regex-scan';

const summary = (list: RegExpExecArray[]) => list.map((m) => [m.index, ...m]);

/** A small deterministic generator, so a failing text can be found again. */
function randomTexts(seed: number, words: readonly string[], count: number): string[] {
  let state = seed;
  const next = () => {
    state = (state * 1103515245 + 12345) & 0x7fffffff;
    return state;
  };
  const glue = [' ', ' ', ' ', ', ', '-', '. ', '; ', '', ': ', '\n', ' (', ') ', "'", '/'];
  const texts: string[] = [];
  for (let k = 0; k < count; k++) {
    let text = '';
    const length = 1 + (next() % 14);
    for (let w = 0; w < length; w++) {
      let word = words[next() % words.length];
      if (next() % 4 === 0) word = word.toUpperCase();
      if (next() % 7 === 0) word = word.slice(0, 1 + (next() % Math.max(1, word.length)));
      text += word + glue[next() % glue.length];
    }
    texts.push(text);
  }
  return texts;
}

describe('startTable', () => {
  it('allows a start only where the first three characters can begin a match', () => {
    const table = startTable(/(?:kitchen|bath)s?/gi)!;
    expect(canStartAt(table, 'the Kitchen', 4)).toBe(true);
    expect(canStartAt(table, 'a bathtub', 2)).toBe(true);
    expect(canStartAt(table, 'the Kitchen', 0)).toBe(false);
    expect(canStartAt(table, 'kind', 0)).toBe(false); // no room word begins "kin"
    expect(canStartAt(table, 'basement', 0)).toBe(false);
  });

  it('reads optional and repeated parts, and a start near the end of the text', () => {
    const table = startTable(/(?:hall\s+)?bath|a{0,2}b/g)!;
    expect(canStartAt(table, 'hall bath', 0)).toBe(true);
    expect(canStartAt(table, 'bath', 0)).toBe(true);
    expect(canStartAt(table, 'aab', 0)).toBe(true);
    expect(canStartAt(table, 'ab', 0)).toBe(true);
    expect(canStartAt(table, 'b', 0)).toBe(true);
    expect(canStartAt(table, 'aac', 0)).toBe(false);
    expect(canStartAt(table, 'a', 0)).toBe(false);
    // Without the i flag case counts.
    expect(canStartAt(table, 'Bath', 0)).toBe(false);
  });

  it('keeps a leading negative lookbehind as a check on the character before', () => {
    const table = startTable(/(?<![\w-])den\b/gi)!;
    expect(canStartAt(table, 'the den', 4)).toBe(true);
    expect(canStartAt(table, 'garden', 3)).toBe(false);
    expect(canStartAt(table, 'sub-den', 4)).toBe(false);
    expect(canStartAt(table, 'den', 0)).toBe(true);
  });

  it('treats what it cannot list as any character, so nothing is ruled out wrongly', () => {
    const spaced = startTable(/\s+kitchen/g)!;
    expect(canStartAt(spaced, '\u00a0kitchen', 0)).toBe(true);
    expect(canStartAt(spaced, 'x', 0)).toBe(false); // too short for any match
    const dotted = startTable(/.x/g)!;
    expect(canStartAt(dotted, 'éx', 0)).toBe(true);
  });

  it('gives no table for an expression that can match the empty string, or with the u flag', () => {
    expect(startTable(/x*/g)).toBeNull();
    expect(startTable(/(?:)|kitchen/g)).toBeNull();
    expect(startTable(/kitchen/gu)).toBeNull();
  });
});

describe('startFilteredScan', () => {
  const words = [
    'kitchen', 'bath', 'bathroom', 'hall', 'hallway', 'the', 'in', 'on', 'throughout', 'house', 'receptacle',
    'gfci', 'not', 'no', 'missing', 'cover', 'plate', 'panel', 'breaker', '20', '12', 'awg', 'a', 'amp',
    'open', 'ground', 'junction', 'box', 'light', 'fixture', 'loose', 'smoke', 'alarm', 'garage', 'exterior',
    'den', 'bedroom', 'br2', 'entry', 'service', 'drop', 'double', 'tap', 'knob', 'tube', 'k&t', '#10', 'café',
  ];
  const texts = [
    'No GFCI protection at the kitchen countertop receptacles; the hall bath receptacle is loose.',
    'Open ground at 2 receptacles in the living room, and a missing cover plate by the front entry.',
    'Double tapped breaker in the panel (slot 14). 30 A breaker on 12 AWG copper.',
    ...randomTexts(7, words, 150),
  ];
  const expressions = [
    /(?<![\w-])(?:((?:hall|guest|master)\s+)?bath(?:room)?s?\b|(kitchens?|kit\b\.?)|(den\b)|(in (?:the )?(?:house|home)\b))/gi,
    /\b(?:no|not|missing)\s+(?:gfci|cover)/gi,
    /(?<![\w.])(\d{2,3})\s?-?(?:a|amps?)\b/gi,
    ...CODE_RULES.flatMap((r) => r.patterns.map((p) => p.re)),
  ];

  it.each(expressions.map((re, i) => [i, re] as const))('gives exactly scanAll for expression %i', (_i, re) => {
    const scan = startFilteredScan(re);
    for (const text of texts) expect(summary(scan(text))).toEqual(summary(scanAll(re, text)));
  });

  it('leaves the expression untouched and refuses one without the g flag', () => {
    const re = /kitchen/gi;
    startFilteredScan(re)('kitchen and kitchen');
    expect(re.lastIndex).toBe(0);
    expect(() => startFilteredScan(/kitchen/i)).toThrow(TypeError);
  });
});

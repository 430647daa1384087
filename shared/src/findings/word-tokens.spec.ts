import { readWords, Vocabulary, WORD_PATTERN } from './word-tokens';

/** The words as the expression reads them: [start, end, lower case] per match. */
function byExpression(text: string): Array<[number, number, string]> {
  return [...text.matchAll(new RegExp(WORD_PATTERN.source, 'g'))].map((m) => [m.index, m.index + m[0].length, m[0].toLowerCase()]);
}

function byReader(text: string): Array<[number, number, string]> {
  const words = readWords(text);
  const found: Array<[number, number, string]> = [];
  for (let k = 0; k < words.count; k++) found.push([words.start[k], words.end[k], words.vocabulary.words[words.id[k]]]);
  return found;
}

/** A small deterministic generator of texts made of the characters the expression treats specially. */
function randomTexts(seed: number, count: number): string[] {
  let state = seed;
  const next = () => {
    state = (state * 1103515245 + 12345) & 0x7fffffff;
    return state;
  };
  const pieces = ['a', 'B', 'k', 'T', 'gfi', 'Rcpt', "'", '&', '/', '-', '.', '#', ' ', '\u00a0', '\t', '1', '2', '12', '3.5', '_', 'é', ',', 'ñ', '\n'];
  const texts: string[] = [];
  for (let k = 0; k < count; k++) {
    let text = '';
    const length = 1 + (next() % 24);
    for (let p = 0; p < length; p++) text += pieces[next() % pieces.length];
    texts.push(text);
  }
  return texts;
}

describe('readWords', () => {
  it('reads shorthand words as the word expression does', () => {
    expect(byReader("K&T w/o J-box, ungr'd inop. #12 Cu 3.5 ft")).toEqual([
      [0, 3, 'k&t'],
      [4, 7, 'w/o'],
      [8, 13, 'j-box'],
      [15, 21, "ungr'd"],
      [22, 27, 'inop.'],
      [28, 31, '#12'],
      [32, 34, 'cu'],
      [35, 38, '3.5'],
      [39, 41, 'ft'],
    ]);
  });

  it('gives the same words as the expression on random text of its special characters', () => {
    for (const text of randomTexts(7, 3000)) expect(byReader(text)).toEqual(byExpression(text));
  });

  it('gives a word the same id whatever its case, and different words different ids', () => {
    const words = readWords('Panel PANEL panel panels');
    expect(words.id[0]).toBe(words.id[1]);
    expect(words.id[1]).toBe(words.id[2]);
    expect(words.id[3]).not.toBe(words.id[0]);
  });
});

describe('Vocabulary', () => {
  it('keeps every word under its own id as the table grows', () => {
    const vocabulary = new Vocabulary();
    const text = Array.from({ length: 5000 }, (_, k) => `w${k}x`).join(' ');
    const ids: number[] = [];
    for (let k = 0, at = 0; k < 5000; k++) {
      const end = text.indexOf(' ', at) < 0 ? text.length : text.indexOf(' ', at);
      ids.push(vocabulary.intern(text, at, end));
      at = end + 1;
    }
    expect(new Set(ids).size).toBe(5000);
    expect(vocabulary.words[ids[4321]]).toBe('w4321x');
    expect(vocabulary.intern('W4321X', 0, 6)).toBe(ids[4321]);
  });

  it('keeps one table of answers per reader', () => {
    const vocabulary = new Vocabulary();
    const a = Symbol('a');
    const b = Symbol('b');
    vocabulary.table<number>(a)[0] = 1;
    expect(vocabulary.table<number>(a)[0]).toBe(1);
    expect(vocabulary.table<number>(b)[0]).toBeUndefined();
  });
});

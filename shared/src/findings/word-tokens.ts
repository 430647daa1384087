/**
 * The words of a sentence, read once into flat arrays: each word's start and end in the text and
 * an id in one interned vocabulary of lower-case words. A word seen before costs no new string and
 * no object: its lower-case copy, and whatever a reader derives from it once (see `wordInfo`), are
 * looked up by id. The normaliser reads its words from here instead of running its own expression
 * and lower-casing every word of every sentence.
 *
 * A word is what the normaliser's word expression matches (`WORD_PATTERN`), with the characters
 * inspectors' shorthand uses ("k&t", "w/o", "j-box", "ungr'd", "inop."); `readWords` reads the
 * same words character by character (its spec compares the two on the corpus and on random text).
 */

/** The word expression `readWords` follows. */
export const WORD_PATTERN = /#\s?\d{1,2}\b|[A-Za-z][A-Za-z'&/-]*[A-Za-z/]\.?|[A-Za-z]\.?|\d+(?:\.\d+)?/g;

/** The interned lower-case words; ids index `words`. A new vocabulary replaces a full one (see VOCABULARY_LIMIT). */
export class Vocabulary {
  readonly words: string[] = [];
  /** Per reader, what it derived from each word once (by id; undefined until asked). */
  private readonly tables = new Map<symbol, unknown[]>();
  /** Open addressing: slot → id + 1 (0: empty). */
  private slots = new Int32Array(1 << 12);

  /** The id of the lower-case form of text[start, end) (ASCII letters lowered), added if new. */
  intern(text: string, start: number, end: number): number {
    const length = end - start;
    let hash = length;
    for (let k = start; k < end; k++) hash = (Math.imul(hash, 31) + lowerCode(text.charCodeAt(k))) | 0;
    const mask = this.slots.length - 1;
    for (let slot = hash & mask; ; slot = (slot + 1) & mask) {
      const entry = this.slots[slot];
      if (entry === 0) return this.add(text.slice(start, end).toLowerCase(), slot);
      const word = this.words[entry - 1];
      if (word.length === length && sameLower(word, text, start)) return entry - 1;
    }
  }

  /** The table a reader keeps its per-word answers in (one per key, by id, for this vocabulary). */
  table<T>(key: symbol): Array<T | undefined> {
    let table = this.tables.get(key);
    if (table === undefined) {
      table = [];
      this.tables.set(key, table);
    }
    return table as Array<T | undefined>;
  }

  get size(): number {
    return this.words.length;
  }

  private add(word: string, slot: number): number {
    const id = this.words.length;
    this.words.push(word);
    this.slots[slot] = id + 1;
    if (2 * this.words.length > this.slots.length) this.grow();
    return id;
  }

  private grow(): void {
    const slots = new Int32Array(this.slots.length * 2);
    const mask = slots.length - 1;
    this.words.forEach((word, id) => {
      let hash = word.length;
      for (let k = 0; k < word.length; k++) hash = (Math.imul(hash, 31) + word.charCodeAt(k)) | 0;
      let slot = hash & mask;
      while (slots[slot] !== 0) slot = (slot + 1) & mask;
      slots[slot] = id + 1;
    });
    this.slots = slots;
  }
}

/** Words kept before a fresh vocabulary is started (a server reads many reports in one process). */
const VOCABULARY_LIMIT = 50_000;
let vocabulary = new Vocabulary();

/** The vocabulary new words go into (a fresh one once the last has grown past VOCABULARY_LIMIT). */
export function currentVocabulary(): Vocabulary {
  if (vocabulary.size > VOCABULARY_LIMIT) vocabulary = new Vocabulary();
  return vocabulary;
}

/**
 * The words of one text: word k (below `count`) is text[start[k], end[k]), its lower-case form
 * `vocabulary.words[id[k]]`. The arrays may be longer than `count`.
 */
export interface WordTokens {
  readonly count: number;
  readonly start: Int32Array;
  readonly end: Int32Array;
  readonly id: Int32Array;
  /** The vocabulary the ids belong to (a later text may start a new one). */
  readonly vocabulary: Vocabulary;
}

/** The arrays of the last text read, grown as needed (see readWords). */
let scratchStart: Int32Array = new Int32Array(256);
let scratchEnd: Int32Array = new Int32Array(256);
let scratchId: Int32Array = new Int32Array(256);

/**
 * Reads the words of `text` (the matches of WORD_PATTERN, in order). The arrays are shared and
 * overwritten by the next call (the parser is synchronous): read them before reading another text.
 */
export function readWords(text: string): WordTokens {
  const vocab = currentVocabulary();
  let count = 0;
  const length = text.length;
  let i = 0;
  while (i < length) {
    const end = wordEndAt(text, i);
    if (end < 0) {
      i++;
      continue;
    }
    if (count === scratchStart.length) {
      scratchStart = grown(scratchStart);
      scratchEnd = grown(scratchEnd);
      scratchId = grown(scratchId);
    }
    scratchStart[count] = i;
    scratchEnd[count] = end;
    scratchId[count] = vocab.intern(text, i, end);
    count++;
    i = end;
  }
  return { count, start: scratchStart, end: scratchEnd, id: scratchId, vocabulary: vocab };
}

function grown(a: Int32Array): Int32Array {
  const b = new Int32Array(a.length * 2);
  b.set(a);
  return b;
}

/**
 * The end of the word WORD_PATTERN matches at position i, or -1 when none begins there (the
 * alternatives tried in order, each with the backtracking the expression would do).
 */
function wordEndAt(text: string, i: number): number {
  const c = text.charCodeAt(i);
  if (c === 35 /* # */) {
    // #\s?\d{1,2}\b
    let k = i + 1;
    if (k < text.length && isSpace(text.charCodeAt(k))) k++;
    if (!isDigit(text.charCodeAt(k))) return -1;
    k++;
    if (isDigit(text.charCodeAt(k))) k++;
    // \b after the digits: a two-digit run followed by a word character backs off to one digit,
    // which is then followed by a digit, so no boundary either way.
    return isWordChar(text.charCodeAt(k)) ? -1 : k;
  }
  if (isLetter(c)) {
    // [A-Za-z][A-Za-z'&/-]*[A-Za-z/]\.? — the longest run that ends on a letter or "/", else [A-Za-z]\.?
    let run = i + 1;
    while (run < text.length && isWordInner(text.charCodeAt(run))) run++;
    let end = run;
    while (end > i + 1 && !isLetterOrSlash(text.charCodeAt(end - 1))) end--;
    return text.charCodeAt(end) === 46 /* . */ ? end + 1 : end;
  }
  if (isDigit(c)) {
    // \d+(?:\.\d+)?
    let k = i + 1;
    while (isDigit(text.charCodeAt(k))) k++;
    if (text.charCodeAt(k) === 46 && isDigit(text.charCodeAt(k + 1))) {
      k += 2;
      while (isDigit(text.charCodeAt(k))) k++;
    }
    return k;
  }
  return -1;
}

export function isDigit(c: number): boolean {
  return c >= 48 && c <= 57;
}
function isLetter(c: number): boolean {
  return (c >= 97 && c <= 122) || (c >= 65 && c <= 90);
}
function isLetterOrSlash(c: number): boolean {
  return isLetter(c) || c === 47;
}
/** [A-Za-z'&/-] */
function isWordInner(c: number): boolean {
  return isLetter(c) || c === 39 || c === 38 || c === 47 || c === 45;
}
/** \w */
function isWordChar(c: number): boolean {
  return isLetter(c) || isDigit(c) || c === 95;
}
/** \s as regular expressions read it. */
export function isSpace(c: number): boolean {
  return (
    (c >= 9 && c <= 13) || c === 32 || c === 0xa0 || c === 0x1680 || (c >= 0x2000 && c <= 0x200a) ||
    c === 0x2028 || c === 0x2029 || c === 0x202f || c === 0x205f || c === 0x3000 || c === 0xfeff
  );
}
function lowerCode(c: number): number {
  return c >= 65 && c <= 90 ? c + 32 : c;
}
/** Whether `word` (lower case) equals text[start, start + word.length) with ASCII letters lowered. */
function sameLower(word: string, text: string, start: number): boolean {
  for (let k = 0; k < word.length; k++) if (word.charCodeAt(k) !== lowerCode(text.charCodeAt(start + k))) return false;
  return true;
}

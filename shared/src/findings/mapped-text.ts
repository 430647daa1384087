import { isSpace } from './word-tokens';

/**
 * Text prepared for matching (line breaks folded, hyphenated wraps joined, whitespace collapsed)
 * that remembers, for every character, where it came from in the joined report text. Matching
 * runs on `text`; evidence and offsets are always taken from the original through `offsets`.
 */
export interface MappedText {
  readonly text: string;
  /** offsets[i] is the index in the joined report text of text[i]. */
  readonly offsets: readonly number[];
}

/** Whether a one-character string (or the first character of one) is whitespace as /\s/ reads it. */
function isWhitespace(ch: string): boolean {
  return isSpace(ch.charCodeAt(0));
}

/**
 * The offsets buffer a finished builder hands to the next one, so that a report's blocks are built
 * one after another in one buffer instead of each in an array grown step by step.
 */
let spareOffsets: Int32Array | null = null;

export class MappedTextBuilder {
  /** The text so far; source characters are appended in runs (slices), not one by one. */
  private text = '';
  /** offsets[0, count) stand for the characters of `text`. */
  private offsets: Int32Array;
  private count = 0;
  /** The last character of `text` ('' while empty). */
  private last = '';

  constructor() {
    this.offsets = spareOffsets ?? new Int32Array(1024);
    spareOffsets = null;
  }

  private pushOffset(sourceIndex: number): void {
    if (this.count === this.offsets.length) {
      const grown = new Int32Array(Math.max(1024, this.offsets.length * 2));
      grown.set(this.offsets);
      this.offsets = grown;
    }
    this.offsets[this.count++] = sourceIndex;
  }

  /** Appends source[from, to) character by character, collapsing runs of spaces and tabs. */
  appendSource(source: string, from: number, to: number): void {
    let run = from; // start of the source run not yet appended to `text`
    for (let i = from; i < to; i++) {
      const ch = source[i];
      if (ch === '|' || ch === '\t') {
        // A column rule of a table row, or a tab between columns: the columns read on as one line
        // ("CO alarm | Hallway | None present"), so an item's condition is read with the item.
        this.text += source.slice(run, i);
        run = i + 1;
        if (this.count === 0 || isWhitespace(this.last)) continue;
        this.text += ' ';
        this.pushOffset(i);
        this.last = ' ';
        continue;
      } else if (ch === ' ' && (this.count === 0 || isWhitespace(this.last))) {
        this.text += source.slice(run, i);
        run = i + 1;
        continue;
      }
      this.pushOffset(i);
      this.last = ch;
    }
    this.text += source.slice(run, to);
  }

  /** Appends a separator standing for a source position (a line break becomes ' ' or '\n'). */
  appendSeparator(ch: ' ' | '\n', sourceIndex: number): void {
    if (this.count === 0) return;
    const last = this.last;
    if (last === '\n' || (ch === ' ' && isWhitespace(last))) return;
    if (ch === '\n' && last === ' ') {
      this.text = this.text.slice(0, -1) + '\n';
      this.last = '\n';
      return;
    }
    this.text += ch;
    this.pushOffset(sourceIndex);
    this.last = ch;
  }

  /** Removes a trailing hyphen (a word wrapped across lines) so the halves join. */
  dropTrailingHyphen(): void {
    if (this.last === '-') {
      this.text = this.text.slice(0, -1);
      this.count--;
      this.last = this.text[this.text.length - 1] ?? '';
    }
  }

  lastChar(): string {
    return this.last;
  }

  /** The text built, without trailing whitespace. The builder is done after this (its buffer goes to the next one). */
  build(): MappedText {
    const { text } = this;
    let end = text.length;
    while (end > 0 && isWhitespace(text[end - 1])) end--;
    // One array of the exact size, filled by index (Array.from would step an iterator per element).
    const offsets = new Array<number>(end);
    for (let k = 0; k < end; k++) offsets[k] = this.offsets[k];
    spareOffsets = this.offsets;
    this.offsets = new Int32Array(0);
    this.count = 0;
    return { text: text.slice(0, end), offsets };
  }
}

/** The part [from, to) of a mapped text, trimmed of surrounding whitespace. */
export function sliceMapped(m: MappedText, from: number, to: number): MappedText {
  let a = from;
  let b = to;
  while (a < b && isWhitespace(m.text[a])) a++;
  while (b > a && isWhitespace(m.text[b - 1])) b--;
  return { text: m.text.slice(a, b), offsets: m.offsets.slice(a, b) };
}

/** The [start, end) range in the joined report text covered by a (non-empty) mapped text. */
export function sourceRange(m: MappedText): { start: number; end: number } {
  return { start: m.offsets[0], end: m.offsets[m.offsets.length - 1] + 1 };
}

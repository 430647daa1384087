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

export class MappedTextBuilder {
  private chars: string[] = [];
  private offsets: number[] = [];

  /** Appends source[from, to) character by character, collapsing runs of spaces and tabs. */
  appendSource(source: string, from: number, to: number): void {
    for (let i = from; i < to; i++) {
      const ch = source[i] === '\t' ? ';' : source[i];
      if (ch === ' ' && (this.chars.length === 0 || /\s$/.test(this.last()))) continue;
      this.push(ch, i);
    }
  }

  /** Appends a separator standing for a source position (a line break becomes ' ' or '\n'). */
  appendSeparator(ch: ' ' | '\n', sourceIndex: number): void {
    if (this.chars.length === 0) return;
    const last = this.last();
    if (last === '\n' || (ch === ' ' && /\s/.test(last))) return;
    if (ch === '\n' && last === ' ') {
      this.chars[this.chars.length - 1] = '\n';
      return;
    }
    this.push(ch, sourceIndex);
  }

  /** Removes a trailing hyphen (a word wrapped across lines) so the halves join. */
  dropTrailingHyphen(): void {
    if (this.last() === '-') {
      this.chars.pop();
      this.offsets.pop();
    }
  }

  lastChar(): string {
    return this.last();
  }

  build(): MappedText {
    let end = this.chars.length;
    while (end > 0 && /\s/.test(this.chars[end - 1])) end--;
    return { text: this.chars.slice(0, end).join(''), offsets: this.offsets.slice(0, end) };
  }

  private last(): string {
    return this.chars[this.chars.length - 1] ?? '';
  }

  private push(ch: string, index: number): void {
    this.chars.push(ch);
    this.offsets.push(index);
  }
}

/** The part [from, to) of a mapped text, trimmed of surrounding whitespace. */
export function sliceMapped(m: MappedText, from: number, to: number): MappedText {
  let a = from;
  let b = to;
  while (a < b && /\s/.test(m.text[a])) a++;
  while (b > a && /\s/.test(m.text[b - 1])) b--;
  return { text: m.text.slice(a, b), offsets: m.offsets.slice(a, b) };
}

/** The [start, end) range in the joined report text covered by a (non-empty) mapped text. */
export function sourceRange(m: MappedText): { start: number; end: number } {
  return { start: m.offsets[0], end: m.offsets[m.offsets.length - 1] + 1 };
}

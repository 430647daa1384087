import { scanAll } from './regex-scan';

/**
 * Where a regular expression can start a match, read off its source when the module loads: the
 * first two characters a match can begin with (a table of pairs), and the characters a leading
 * negative lookbehind (`(?<![\w-])`) forbids before it. `scanner(re)` then finds the same matches
 * as `scanAll(re, text)` but runs the expression (sticky, at one position) only where the three
 * characters there can begin a match: a big alternation such as the room words is otherwise tried
 * at every word start of every sentence.
 *
 * The reading is conservative like phrase-literals.ts: a construct it cannot place (a class it
 * does not expand, `\s`, `.`, a back-reference) stands for "any character", lookarounds and
 * anchors are ignored, so the table only ever allows more starts than the expression has, never
 * fewer. An expression that can match the empty string, or uses the u/v flags, gets no table.
 */

/** Symbols: ASCII codes (letters folded to lower case under the i flag), and ANY for any other character. */
const ANY = 128;
const SYMBOLS = 129;
/** How many leading characters are read. */
const DEPTH = 3;

/** A set of leading symbol sequences: shorter than DEPTH means the part can end there (complete), DEPTH means it goes on. */
type Starts = Map<string, readonly number[]>;

const keyOf = (seq: readonly number[]) => seq.join(',');
function setOf(seqs: ReadonlyArray<readonly number[]>): Starts {
  const out: Starts = new Map();
  for (const s of seqs) out.set(keyOf(s), s);
  return out;
}
const EMPTY = (): Starts => setOf([[]]);
/** A class of more characters than this is read as any character: it rules out little, and keeps the sets small. */
const MAX_CLASS = 16;
/** Past this many sequences the expression gets no table (module load stays quick). */
const MAX_STARTS = 4096;

function checked(starts: Starts): Starts {
  if (starts.size > MAX_STARTS) throw new RangeError('Too many ways to start a match');
  return starts;
}

function union(parts: readonly Starts[]): Starts {
  const out: Starts = new Map();
  for (const p of parts) for (const [k, s] of p) out.set(k, s);
  return out;
}

function concat(a: Starts, b: Starts): Starts {
  const out: Starts = new Map();
  for (const [k, s] of a) {
    if (s.length >= DEPTH) {
      out.set(k, s);
      continue;
    }
    for (const t of b.values()) {
      const joined = [...s, ...t].slice(0, DEPTH);
      out.set(keyOf(joined), joined);
    }
  }
  return checked(out);
}

function repeat(p: Starts, min: number, max: number): Starts {
  let out = EMPTY();
  // Beyond DEPTH copies nothing new can start a match (see the reasoning in the unit test).
  for (let k = 0; k < Math.min(min, DEPTH); k++) out = concat(out, p);
  const optional = union([p, EMPTY()]);
  for (let k = 0; k < Math.min(max - min, DEPTH); k++) out = concat(out, optional);
  return out;
}

class Reader {
  private pos = 0;

  constructor(
    private readonly src: string,
    private readonly fold: boolean,
  ) {}

  atEnd(): boolean {
    return this.pos >= this.src.length;
  }

  /** A leading `(?<![...])` at the very start of the source: the characters it forbids before a match, or null. */
  leadingLookbehindClass(): Uint8Array | null {
    if (!this.src.startsWith('(?<![')) return null;
    const save = this.pos;
    this.pos = 5;
    const chars = this.classMembers(false);
    if (chars === null || this.src[this.pos] !== ')') {
      this.pos = save;
      return null;
    }
    this.pos = save;
    const forbidden = new Uint8Array(SYMBOLS);
    // Only ASCII members are marked: a subset of the class keeps the check conservative.
    for (const c of chars) if (c !== ANY) forbidden[c] = 1;
    return forbidden;
  }

  alternation(): Starts {
    const branches = [this.sequence()];
    while (this.src[this.pos] === '|') {
      this.pos++;
      branches.push(this.sequence());
    }
    return union(branches);
  }

  private sequence(): Starts {
    let out = EMPTY();
    while (!this.atEnd() && this.src[this.pos] !== '|' && this.src[this.pos] !== ')') out = concat(out, this.quantified(this.atom()));
    return out;
  }

  private symbol(ch: string): number {
    const code = ch.charCodeAt(0);
    if (code >= 128) return ANY;
    return this.fold && code >= 65 && code <= 90 ? code + 32 : code;
  }

  private atom(): Starts {
    const ch = this.src[this.pos++];
    if (ch === '(') return this.group();
    if (ch === '[') {
      const members = this.classMembers();
      return setOf([...(members ?? new Set([ANY]))].map((c) => [c]));
    }
    if (ch === '\\') return this.escape();
    if (ch === '.') return setOf([[ANY]]);
    if (ch === '^' || ch === '$') return EMPTY();
    return setOf([[this.symbol(ch)]]);
  }

  private group(): Starts {
    let zeroWidth = false;
    if (this.src.startsWith('?:', this.pos)) this.pos += 2;
    else if (this.src.startsWith('?=', this.pos) || this.src.startsWith('?!', this.pos)) {
      this.pos += 2;
      zeroWidth = true;
    } else if (this.src.startsWith('?<=', this.pos) || this.src.startsWith('?<!', this.pos)) {
      this.pos += 3;
      zeroWidth = true;
    }
    if (zeroWidth) {
      // A lookaround adds no characters: it is only stepped over.
      this.skipGroupBody();
      return EMPTY();
    }
    if (this.src.startsWith('?<', this.pos)) {
      const close = this.src.indexOf('>', this.pos);
      if (close === -1) throw new SyntaxError(`Unclosed group name in ${this.src}`);
      this.pos = close + 1;
    } else if (this.src[this.pos] === '?') {
      throw new SyntaxError(`Unknown group type in ${this.src}`);
    }
    const inner = this.alternation();
    if (this.src[this.pos] !== ')') throw new SyntaxError(`Unclosed group in ${this.src}`);
    this.pos++;
    return inner;
  }

  /** Moves past the rest of a group and its ')', minding escapes, classes and nested groups. */
  private skipGroupBody(): void {
    let depth = 1;
    let inClass = false;
    while (!this.atEnd()) {
      const ch = this.src[this.pos++];
      if (ch === '\\') this.pos++;
      else if (inClass) inClass = ch !== ']';
      else if (ch === '[') inClass = true;
      else if (ch === '(') depth++;
      else if (ch === ')' && --depth === 0) return;
    }
    throw new SyntaxError(`Unclosed group in ${this.src}`);
  }

  /**
   * The symbols of a class after its '[' (the reader moves past its ']'); null when it cannot list
   * them or, `capped`, when they are too many to be worth listing.
   */
  private classMembers(capped = true): Set<number> | null {
    const negated = this.src[this.pos] === '^';
    if (negated) this.pos++;
    const members = new Set<number>();
    let known = !negated;
    // (In JavaScript a ']' right after '[' closes an empty class.)
    while (!this.atEnd() && this.src[this.pos] !== ']') {
      let code = this.src.charCodeAt(this.pos++);
      if (code === 92 /* \ */) {
        const esc = this.src[this.pos++];
        if (esc === 'd') {
          for (let d = 48; d <= 57; d++) members.add(d);
          continue;
        }
        if (esc === 'w') {
          for (let c = 48; c <= 57; c++) members.add(c);
          for (let c = 97; c <= 122; c++) members.add(c);
          if (!this.fold) for (let c = 65; c <= 90; c++) members.add(c);
          members.add(95);
          continue;
        }
        if (/[A-Za-z0-9]/.test(esc)) {
          known = false; // \s, \W, \b (backspace), \xHH, \uHHHH ...: not listed
          continue;
        }
        code = esc.charCodeAt(0);
      }
      if (this.src[this.pos] === '-' && this.src[this.pos + 1] !== ']' && this.pos + 1 < this.src.length) {
        this.pos++;
        let to = this.src.charCodeAt(this.pos++);
        if (to === 92) {
          const esc = this.src[this.pos++];
          if (/[A-Za-z0-9]/.test(esc)) known = false;
          to = esc.charCodeAt(0);
        }
        if (to >= 128 || code >= 128) known = false;
        else for (let c = code; c <= to; c++) members.add(this.symbol(String.fromCharCode(c)));
        continue;
      }
      members.add(this.symbol(String.fromCharCode(code)));
    }
    if (this.src[this.pos] !== ']') throw new SyntaxError(`Unclosed class in ${this.src}`);
    this.pos++;
    if (members.has(ANY) || (capped && members.size > MAX_CLASS)) known = false;
    return known ? members : null;
  }

  private escape(): Starts {
    const ch = this.src[this.pos++];
    if (ch === 'b' || ch === 'B') return EMPTY();
    if (ch === 'd') return setOf(Array.from({ length: 10 }, (_, d) => [48 + d]));
    if (ch === 'n') return setOf([[10]]);
    if (ch === 't') return setOf([[9]]);
    if (ch === 'k' || /[1-9]/.test(ch)) {
      // A back-reference: anything, or nothing.
      if (ch === 'k') this.pos = Math.max(this.pos, this.src.indexOf('>', this.pos) + 1);
      else while (/\d/.test(this.src[this.pos] ?? '')) this.pos++;
      return setOf([[], [ANY], [ANY, ANY]]);
    }
    if (ch === 'x') this.pos += 2;
    else if (ch === 'u') this.pos += 4;
    else if (ch === 'c') this.pos += 1;
    if (/[A-Za-z0-9]/.test(ch)) return setOf([[ANY]]);
    return setOf([[this.symbol(ch)]]);
  }

  private quantified(p: Starts): Starts {
    const ch = this.src[this.pos];
    let min: number;
    let max: number;
    if (ch === '?' || ch === '*' || ch === '+') {
      this.pos++;
      min = ch === '+' ? 1 : 0;
      max = ch === '?' ? 1 : Infinity;
    } else {
      const m = /^\{(\d+)(,(\d*))?\}/.exec(this.src.slice(this.pos));
      if (!m) return p;
      this.pos += m[0].length;
      min = Number(m[1]);
      max = m[2] === undefined ? min : m[3] === '' ? Infinity : Number(m[3]);
    }
    if (this.src[this.pos] === '?') this.pos++; // lazy
    return repeat(p, min, max);
  }
}

/** The start table of an expression: which three characters can begin a match, and what may not stand before it. */
export interface StartTable {
  /** row[a * 129 + b]: -1 when no match begins with symbols a, b; else the row of `third` for them. */
  readonly row: Int32Array;
  /** third[row * 130 + c]: a match can begin with a, b, c; index 129 of a row: with a, b as the text's last two characters. */
  readonly third: Uint8Array;
  /** last[a]: a match can begin with symbol a as the text's last character. */
  readonly last: Uint8Array;
  /** before[c]: a match cannot begin right after symbol c (a leading negative lookbehind), or null. */
  readonly before: Uint8Array | null;
  readonly fold: boolean;
}

/** Index of "the text ends here" in a row of `third`. */
const END = SYMBOLS;
const ROW = SYMBOLS + 1;

/** The start table of `re`, or null when none can be read (the expression must then be tried everywhere). */
export function startTable(re: RegExp): StartTable | null {
  if (re.unicode || re.flags.includes('v')) return null;
  const fold = re.ignoreCase;
  let starts: Starts;
  let before: Uint8Array | null;
  try {
    const reader = new Reader(re.source, fold);
    before = reader.leadingLookbehindClass();
    starts = reader.alternation();
    if (!reader.atEnd()) return null;
  } catch {
    return null;
  }
  const each = (s: number) => (s === ANY ? Array.from({ length: SYMBOLS }, (_, k) => k) : [s]);
  const row = new Int32Array(SYMBOLS * SYMBOLS).fill(-1);
  const rows: Uint8Array[] = [];
  const last = new Uint8Array(SYMBOLS);
  const rowOf = (a: number, b: number) => {
    const at = a * SYMBOLS + b;
    if (row[at] === -1) {
      row[at] = rows.length;
      rows.push(new Uint8Array(ROW));
    }
    return rows[row[at]];
  };
  for (const seq of starts.values()) {
    if (seq.length === 0) return null; // it can match the empty string: anywhere
    for (const a of each(seq[0])) {
      if (seq.length === 1) {
        // A one-character match: whatever follows.
        last[a] = 1;
        for (let b = 0; b < SYMBOLS; b++) rowOf(a, b).fill(1);
        continue;
      }
      for (const b of each(seq[1])) {
        const r = rowOf(a, b);
        if (seq.length === 2) r.fill(1);
        else for (const c of each(seq[2])) r[c] = 1;
      }
    }
  }
  const third = new Uint8Array(rows.length * ROW);
  rows.forEach((r, k) => third.set(r, k * ROW));
  return { row, third, last, before, fold };
}

function symbolAt(text: string, i: number, fold: boolean): number {
  const code = text.charCodeAt(i);
  if (code >= 128) return ANY;
  return fold && code >= 65 && code <= 90 ? code + 32 : code;
}

/** Whether a match of the table's expression can begin at position i of the text. */
export function canStartAt(table: StartTable, text: string, i: number): boolean {
  const { fold } = table;
  if (i > 0 && table.before !== null && table.before[symbolAt(text, i - 1, fold)] === 1) return false;
  const a = symbolAt(text, i, fold);
  if (i + 1 >= text.length) return table.last[a] === 1;
  const r = table.row[a * SYMBOLS + symbolAt(text, i + 1, fold)];
  if (r === -1) return false;
  return table.third[r * ROW + (i + 2 >= text.length ? END : symbolAt(text, i + 2, fold))] === 1;
}

/**
 * A scan that gives exactly `scanAll(re, text)` (same matches, same order), trying the expression
 * only at positions its start table allows; falls back to `scanAll` when no table can be read.
 */
export function startFilteredScan(re: RegExp): (text: string) => RegExpExecArray[] {
  if (!re.global) throw new TypeError(`startFilteredScan needs a global expression: ${re}`);
  const table = startTable(re);
  if (table === null) return (text) => scanAll(re, text);
  const sticky = new RegExp(re.source, `${re.flags.replace('g', '')}y`);
  return (text) => {
    const found: RegExpExecArray[] = [];
    for (let i = 0; i < text.length; ) {
      if (!canStartAt(table, text, i)) {
        i++;
        continue;
      }
      sticky.lastIndex = i;
      const m = sticky.exec(text);
      if (m === null) {
        i++;
        continue;
      }
      found.push(m);
      // The table admits no empty match, so a match always moves on.
      i = m.index + m[0].length;
    }
    sticky.lastIndex = 0;
    return found;
  };
}

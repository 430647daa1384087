/**
 * The words a phrase cannot match without, read off its regular expression: a list of lower-case
 * literals such that every match of the expression contains at least one of them ("gfc", "gfi",
 * "ground fault"...). The matcher uses them as per-phrase trigger words, derived from the phrase
 * table itself, so a phrase is tried only on sentences that contain one of its words.
 *
 * The reading is deliberately conservative: anything it does not fully understand (a class of
 * many characters, `\w`, a back-reference, a non-ASCII letter, an optional part) counts as "could
 * be anything", which only ever makes the list weaker (or empty: then the phrase is always tried),
 * never wrong. It understands the subset the phrase table uses: alternation, (non-)capturing and
 * named groups, lookarounds (zero width), quantifiers, small character classes, escapes.
 */

/** What one part of an expression can match. */
interface Shape {
  /** Every string the part can match (lower case), when that set is small; else null. */
  readonly exact: readonly string[] | null;
  /** Lists of literals: every match contains one literal of each list (empty: nothing known). */
  readonly all: ReadonlyArray<readonly string[]>;
}

const MAX_EXACT = 32;
const MAX_CLASS = 8;
/** Literals shorter than this are too common to be worth checking. */
const MIN_LITERAL = 2;
/**
 * Single signs rare enough in report text to be worth checking on their own, as if they were
 * MIN_LITERAL long ("k & t", "n/g"): without them a phrase with such a branch gets no list at all.
 */
const RARE_SIGNS: ReadonlySet<string> = new Set(['&', '/']);

/** A literal's length for selectivity: a rare sign counts as MIN_LITERAL. */
function weight(literal: string): number {
  return literal.length === 1 && RARE_SIGNS.has(literal) ? MIN_LITERAL : literal.length;
}

const EMPTY: Shape = { exact: [''], all: [] };
const UNKNOWN: Shape = { exact: null, all: [] };

/**
 * The literals every match of `re` contains one of (the most selective such list), or null when
 * none can be derived (the phrase must then always be tried). Only case-insensitive expressions
 * are read, since the sentence is checked in lower case.
 */
export function requiredLiterals(re: RegExp): readonly string[] | null {
  return bestOf(requiredLiteralLists(re));
}

/**
 * Every list of literals that `re` needs one of: a match contains one literal of each list
 * ("no"/"missing"/... and "gfci"/"gfi"/...). Empty when none can be derived.
 */
export function requiredLiteralLists(re: RegExp): ReadonlyArray<readonly string[]> {
  if (!re.flags.includes('i') || re.flags.includes('u') || re.flags.includes('v')) return [];
  let lists: ReadonlyArray<readonly string[]>;
  try {
    const reader = new SourceReader(re.source);
    const shape = reader.alternation();
    lists = reader.atEnd() ? allOf(shape) : [];
  } catch {
    return []; // a construct the reader does not know: always try the phrase
  }
  const seen = new Set<string>();
  return lists.filter((list) => {
    const key = list.join('\n');
    if (seen.has(key) || Math.min(...list.map(weight)) < MIN_LITERAL) return false;
    seen.add(key);
    return true;
  });
}

/**
 * A cheap test that is false only when `re` cannot match the text: the text lacks every literal
 * of one of the lists `requiredLiteralLists` derives (one case-insensitive search per list, much
 * cheaper than the expression on text that has none). With no list derived it is always true.
 */
export function requiredLiteralTest(re: RegExp): (text: string) => boolean {
  const lists = requiredLiteralLists(re);
  if (lists.length === 0) return () => true;
  const searches = lists.map((list) => new RegExp(list.map((l) => l.replace(/[.*+?^${}()|[\]\\/-]/g, '\\$&')).join('|'), 'i'));
  return (text) => searches.every((search) => search.test(text));
}

class SourceReader {
  private pos = 0;

  constructor(private readonly src: string) {}

  atEnd(): boolean {
    return this.pos >= this.src.length;
  }

  alternation(): Shape {
    const branches = [this.sequence()];
    while (this.src[this.pos] === '|') {
      this.pos++;
      branches.push(this.sequence());
    }
    return branches.length === 1 ? branches[0] : either(branches);
  }

  private sequence(): Shape {
    const items: Shape[] = [];
    while (!this.atEnd() && this.src[this.pos] !== '|' && this.src[this.pos] !== ')') {
      items.push(this.quantified(this.atom()));
    }
    return concatenation(items);
  }

  private atom(): Shape {
    const ch = this.src[this.pos++];
    if (ch === '(') return this.group();
    if (ch === '[') return this.characterClass();
    if (ch === '\\') return this.escape();
    if (ch === '.') return UNKNOWN;
    if (ch === '^' || ch === '$') return EMPTY;
    return literal(ch);
  }

  private group(): Shape {
    let zeroWidth = false;
    if (this.src.startsWith('?:', this.pos)) this.pos += 2;
    else if (this.src.startsWith('?=', this.pos) || this.src.startsWith('?!', this.pos)) {
      this.pos += 2;
      zeroWidth = true;
    } else if (this.src.startsWith('?<=', this.pos) || this.src.startsWith('?<!', this.pos)) {
      this.pos += 3;
      zeroWidth = true;
    } else if (this.src.startsWith('?<', this.pos)) {
      const close = this.src.indexOf('>', this.pos);
      if (close === -1) throw new SyntaxError(`Unclosed group name in ${this.src}`);
      this.pos = close + 1;
    } else if (this.src[this.pos] === '?') {
      throw new SyntaxError(`Unknown group type in ${this.src}`);
    }
    const inner = this.alternation();
    if (this.src[this.pos] !== ')') throw new SyntaxError(`Unclosed group in ${this.src}`);
    this.pos++;
    return zeroWidth ? EMPTY : inner;
  }

  private characterClass(): Shape {
    const negated = this.src[this.pos] === '^';
    if (negated) this.pos++;
    const chars = new Set<string>();
    let known = !negated;
    while (!this.atEnd() && this.src[this.pos] !== ']') {
      let ch = this.src[this.pos++];
      if (ch === '\\') {
        const esc = this.src[this.pos++];
        if (/[\w]/.test(esc)) known = false; // \w, \s, \d, \b (backspace), \xHH ...: not read
        ch = esc;
      }
      if (this.src[this.pos] === '-' && this.src[this.pos + 1] !== ']' && this.pos + 1 < this.src.length) {
        known = false; // a range
        this.pos += 2;
        if (this.src[this.pos - 1] === '\\') this.pos++;
        continue;
      }
      if (ch.charCodeAt(0) > 0x7f) known = false;
      chars.add(ch.toLowerCase());
    }
    if (this.src[this.pos] !== ']') throw new SyntaxError(`Unclosed class in ${this.src}`);
    this.pos++;
    return known && chars.size > 0 && chars.size <= MAX_CLASS ? { exact: [...chars], all: [] } : UNKNOWN;
  }

  private escape(): Shape {
    const ch = this.src[this.pos++];
    if (ch === 'b' || ch === 'B') return EMPTY;
    if (ch === 'n') return literal('\n');
    if (ch === 't') return literal('\t');
    if (ch === 'k') {
      const close = this.src.indexOf('>', this.pos);
      this.pos = close === -1 ? this.pos : close + 1;
      return UNKNOWN;
    }
    if (ch === 'x') this.pos += 2;
    else if (ch === 'u') this.pos += 4;
    else if (ch === 'c') this.pos += 1;
    // Letters and digits stand for classes, back-references or code points: not read.
    if (/[\w]/.test(ch)) return UNKNOWN;
    return literal(ch);
  }

  private quantified(shape: Shape): Shape {
    const ch = this.src[this.pos];
    let min: number;
    let max: number;
    if (ch === '?' || ch === '*' || ch === '+') {
      this.pos++;
      min = ch === '+' ? 1 : 0;
      max = ch === '?' ? 1 : Infinity;
    } else {
      const m = /^\{(\d+)(,(\d*))?\}/.exec(this.src.slice(this.pos));
      if (!m) return shape;
      this.pos += m[0].length;
      min = Number(m[1]);
      max = m[2] === undefined ? min : m[3] === '' ? Infinity : Number(m[3]);
    }
    if (this.src[this.pos] === '?') this.pos++; // lazy
    if (min === 1 && max === 1) return shape;
    if (min === 0) return max === 1 && shape.exact ? { exact: unique([...shape.exact, '']), all: [] } : UNKNOWN;
    return { exact: null, all: allOf(shape) };
  }
}

function literal(ch: string): Shape {
  return ch.charCodeAt(0) > 0x7f ? UNKNOWN : { exact: [ch.toLowerCase()], all: [] };
}

function unique(list: readonly string[]): string[] {
  return [...new Set(list)];
}

/** The lists every match contains one literal of: the exact set itself, then the known lists. */
function allOf(shape: Shape): ReadonlyArray<readonly string[]> {
  const fromExact = shape.exact && shape.exact.length > 0 && !shape.exact.includes('') ? [reduce(shape.exact)] : [];
  return [...fromExact, ...shape.all.filter((list) => list.length > 0)];
}

/** The most selective of the lists (see `better`), or null. */
function bestOf(lists: ReadonlyArray<readonly string[]>): readonly string[] | null {
  return lists.reduce<readonly string[] | null>((best, list) => better(best, list), null);
}

/** Drops literals that contain another one of the list (a string containing "gfci" contains "gfc"). */
function reduce(list: readonly string[]): string[] {
  const kept: string[] = [];
  for (const l of unique(list).sort((a, b) => a.length - b.length)) {
    if (!kept.some((shorter) => l.includes(shorter))) kept.push(l);
  }
  return kept;
}

/** The more selective list: longer shortest literal first (by weight), then fewer literals. */
function better(a: readonly string[] | null, b: readonly string[] | null): readonly string[] | null {
  if (!a || a.length === 0) return b && b.length > 0 ? b : null;
  if (!b || b.length === 0) return a;
  const shortest = (l: readonly string[]) => Math.min(...l.map(weight));
  const byLength = shortest(a) - shortest(b);
  if (byLength !== 0) return byLength > 0 ? a : b;
  return a.length <= b.length ? a : b;
}

function either(branches: readonly Shape[]): Shape {
  const exacts = branches.map((b) => b.exact);
  const allExact = exacts.every((e): e is readonly string[] => e !== null);
  const exact = allExact ? unique(exacts.flat()) : null;
  // A match matches one branch: it contains a literal of that branch's best list.
  const parts = branches.map((b) => bestOf(allOf(b)));
  const all = parts.every((p): p is readonly string[] => p !== null) ? [reduce(parts.flat())] : [];
  return { exact: exact && exact.length <= MAX_EXACT ? exact : null, all };
}

function concatenation(items: readonly Shape[]): Shape {
  let run: string[] = [''];
  /** Single strings read since the last product, appended to every string of the run at once. */
  let pending = '';
  let allExact = true;
  const all: Array<readonly string[]> = [];
  const settle = () => {
    if (pending !== '') run = run.map((a) => a + pending);
    pending = '';
  };
  const flush = () => {
    settle();
    if (!run.includes('')) all.push(reduce(run));
    run = [''];
  };
  for (const item of items) {
    if (item.exact && item.exact.length === 1) {
      pending += item.exact[0];
      continue;
    }
    if (item.exact) {
      settle();
      if (run.length * item.exact.length <= MAX_EXACT) {
        run = unique(run.flatMap((a) => item.exact!.map((b) => a + b)));
        continue;
      }
      allExact = false;
      flush();
      run = [...item.exact];
      continue;
    }
    allExact = false;
    flush();
    all.push(...item.all);
  }
  settle();
  const exact = allExact ? run : null;
  flush();
  return { exact, all };
}

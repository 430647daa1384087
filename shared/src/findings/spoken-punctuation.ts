import type { MappedText } from './mapped-text';
import { scanAll } from './regex-scan';

/**
 * Dictated reports: a voice transcript that was never proofread keeps the punctuation the inspector
 * spoke as words ("the cover is cracked period recommend replacing period new paragraph"). In a
 * block that reads so, the spoken marks become the marks themselves before sentences are cut: a
 * spoken full stop ends a sentence (the next word is capitalised so the sentence splitter sees a new
 * sentence), a spoken comma or semicolon splits clauses, "new paragraph" / "new line" ends a
 * sentence like a line break. Every replacing character points at the last letter of its spoken
 * word, so evidence stays an exact substring of the report.
 */
const SPOKEN_MARK =
  /(?<=\S)[ \t]+(period|full stop|comma|semicolon|colon|question mark|new paragraph|next paragraph|new line)\b(?![-'])/gi;
const MARK: Readonly<Record<string, string>> = {
  period: '.',
  'full stop': '.',
  comma: ',',
  semicolon: ';',
  colon: ':',
  'question mark': '?',
  'new paragraph': '\n',
  'next paragraph': '\n',
  'new line': '\n',
};
/** Words before "period" that make it a span of time ("the option period", "this period"), not a mark. */
const TIME_PERIOD_BEFORE = /\b(?:the|a|an|this|that|its|their|your|option|contingency|inspection|warranty|trial|grace|review|objection|response|resp\.?|due[- ]diligence|time|cooling|waiting|same|short|long|rental|escrow|heating|construction)\s*$/i;
/** Words after "period" that make it a noun ("period of construction", "period ends"). */
const TIME_PERIOD_AFTER = /^\s*(?:of|ends?|ended|expires?|expired|lasts?|begins?|starts?|is|was|will|for|when|during|in which)\b/i;
/** A block reads as dictation when it speaks at least this many marks. */
const MIN_MARKS = 2;

interface Mark {
  readonly start: number;
  readonly end: number;
  readonly char: string;
}

function spokenMarks(text: string): Mark[] {
  const marks: Mark[] = [];
  for (const m of scanAll(SPOKEN_MARK, text)) {
    const word = m[1].toLowerCase().replace(/\s+/g, ' ');
    const end = m.index + m[0].length;
    if ((word === 'period' || word === 'full stop') && (TIME_PERIOD_BEFORE.test(text.slice(Math.max(0, m.index - 20), m.index)) || TIME_PERIOD_AFTER.test(text.slice(end, end + 16)))) continue;
    marks.push({ start: m.index, end, char: MARK[word] });
  }
  return marks;
}

/**
 * Trade initialisms spelled out letter by letter, as voice transcripts write them ("G F C I", "A F C
 * I", "C O alarm"); the letters close up into the word the tables know.
 */
const SPELLED = /(?<![\w.])([A-Za-z])(?: ([A-Za-z])){1,3}(?![\w.])/g;
const INITIALISMS: ReadonlySet<string> = new Set(['gfci', 'gfi', 'afci', 'co', 'gec', 'egc', 'nm', 'uf', 'ocpd']);

function closeSpelledLetters(block: MappedText): MappedText {
  const spelled = scanAll(SPELLED, block.text).filter((m) => INITIALISMS.has(m[0].replace(/ /g, '').toLowerCase()));
  if (spelled.length === 0) return block;
  let text = '';
  const offsets: number[] = [];
  for (let i = 0; i < block.text.length; i++) {
    if (block.text[i] === ' ' && spelled.some((m) => m.index < i && i < m.index + m[0].length)) continue;
    text += block.text[i];
    offsets.push(block.offsets[i]);
  }
  return { text, offsets };
}

/**
 * The block with its spoken punctuation written as marks and spelled-out initialisms closed up, or
 * the block itself when it has neither.
 */
export function readSpokenPunctuation(written: MappedText): MappedText {
  const block = closeSpelledLetters(written);
  const marks = spokenMarks(block.text);
  if (marks.length < MIN_MARKS || !marks.some((m) => m.char === '.' || m.char === '\n')) return block;
  let text = '';
  const offsets: number[] = [];
  let at = 0;
  let capitalise = false;
  const copy = (from: number, to: number) => {
    for (let i = from; i < to; i++) {
      let ch = block.text[i];
      if (capitalise && /\S/.test(ch)) {
        ch = ch.toUpperCase();
        capitalise = false;
      }
      text += ch;
      offsets.push(block.offsets[i]);
    }
  };
  for (const mark of marks) {
    copy(at, mark.start);
    text += mark.char;
    offsets.push(block.offsets[mark.end - 1]);
    at = mark.end;
    capitalise = mark.char === '.' || mark.char === '?' || mark.char === '\n';
  }
  copy(at, block.text.length);
  return { text, offsets };
}

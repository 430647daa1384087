import { sliceMapped, type MappedText } from './mapped-text';

/**
 * Splits a block's text into sentences: at line breaks the block splitter kept as boundaries
 * ("\n") and at ".", "!" or "?" followed by a space and a capital, digit or bracket, except after
 * abbreviations inspectors use ("recep.", "approx.", "e.g.", "No.").
 */
const ABBREVIATIONS = new Set([
  'recep', 'rcpt', 'rcpts', 'recept', 'approx', 'e.g', 'i.e', 'eg', 'ie', 'no', 'nos', 'rm', 'bdrm',
  'br', 'ft', 'min', 'max', 'vs', 'mr', 'mrs', 'ms', 'dr', 'st', 'ave', 'elec', 'ext', 'kit', 'bsmt',
  'sq', 'ea', 'qty', 'fig', 'misc', 'mfr', 'temp', 'incl', 'est', 'apt', 'bldg', 'det', 'dets', 'ckt', 'ckts',
  'brkr', 'pnl', 'perm', 'alum', 'cond', 'bkr',
]);

function isAbbreviation(text: string, dot: number): boolean {
  const word = /([\w.']+)$/.exec(text.slice(Math.max(0, dot - 12), dot))?.[1]?.toLowerCase() ?? '';
  return ABBREVIATIONS.has(word) || /^[a-z]$/i.test(word);
}

const DEFECT_ANSWER = /^\s+(?:none|missing|no|not|inop\w*|damaged|loose|broken|open|absent|dead)\b/i;

/** The dot ends a run of three or more dots that starts after a space: a form's leader, not an ellipsis. */
function isLeader(text: string, dot: number): boolean {
  let first = dot;
  while (first > 0 && text[first - 1] === '.') first--;
  return dot - first >= 2 && (first === 0 || /\s/.test(text[first - 1]));
}

export function splitSentences(block: MappedText): MappedText[] {
  const { text } = block;
  const sentences: MappedText[] = [];
  let start = 0;
  const cut = (end: number, next: number) => {
    const s = sliceMapped(block, start, end);
    if (/[\p{L}\p{N}]/u.test(s.text)) sentences.push(s);
    start = next;
  };
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (ch === '\n') {
      cut(i, i + 1);
    } else if ((ch === '.' || ch === '!' || ch === '?') && /^\s+["'(\p{Lu}\p{N}•\-]/u.test(text.slice(i + 1, i + 3))) {
      if (ch === '.' && isAbbreviation(text, i)) continue;
      // A leader of dots after a space leads to an answer that states the defect ("Smoke alarms
      // ......... NONE in BR2"); before a rating ("... OK", "... C") it still ends the row's sentence.
      if (ch === '.' && isLeader(text, i) && DEFECT_ANSWER.test(text.slice(i + 1, i + 24))) continue;
      cut(i + 1, i + 1);
    }
  }
  cut(text.length, text.length);
  return sentences;
}

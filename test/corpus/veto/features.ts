// The learned veto's features (trial only: test/corpus/veto/trial.ts; nothing here ships).
import type { Finding, SectionKind } from '@cc/shared';
import { SUMMARY_HEADING } from '../../../shared/src/findings/section-heading';

/**
 * Generic features of one finding the parser gave, for the learned veto: how it was found, the words
 * of its sentence and of the text just before it, the kind of section it sits in, the shape of its
 * line (table row, check box, leader dots, caption, quote), cue words (denial, condition, history,
 * second-hand, hedge, limitation) and what the report said before it (the same code already found).
 * Nothing here names an excerpt: words are kept by the model only when many excerpts use them.
 */
export interface FindingContext {
  /** The section heading the finding's block sat under, as written, or null. */
  readonly sectionTitle: string | null;
  readonly sectionKind: SectionKind;
}

export type FeatureVector = ReadonlyMap<string, number>;

const WORD = /[a-z]+(?:'[a-z]+)?/g;

const CUES: ReadonlyArray<readonly [string, RegExp]> = [
  ['neg', /\b(?:no|not|none|never|without|nothing|neither|nor)\b|n't\b/i],
  ['cond', /\b(?:if|should|when|where|whether|unless|in the event|in case|future|later)\b/i],
  ['hist', /\b(?:previously|previous|prior|former(?:ly)?|repaired|replaced|corrected|fixed|since|already|was|were|had)\b/i],
  ['second', /\b(?:said|says|per|stated|states|according|report(?:ed|s)?|inspector|seller|buyer|agent|attorney|lender|request(?:ed)?|addendum)\b|["“”]/i],
  ['hedge', /\b(?:appears?|appeared|may|might|possible|possibly|likely|suspect(?:ed)?|seems?|seemed|could|probably|unclear|unknown|undetermined)\b/i],
  ['limit', /\b(?:inaccessible|not accessible|limited|limitation|scope|unable|beyond|not inspected|not tested|not evaluated|blocked|obstructed|disclaim\w*)\b/i],
  ['positive', /\b(?:ok|okay|good|satisfactory|functional|functioning|properly|correctly|as required|present|tested|operational|serviceable|acceptable)\b/i],
  ['advice', /\b(?:recommend\w*|suggest\w*|advise\w*|consider|electrician|evaluat\w*|repair|correct|install|replace|upgrade)\b/i],
  ['info', /\b(?:fyi|note|information(?:al)?|for your information|typical|common|standard|era|age)\b/i],
  ['status', /\b(?:closed|open|done|complete[d]?|resolved|pending|n\/a|yes|no|y|n)\s*[.)]?\s*$/i],
  ['question', /\?/],
];

const LINE_SHAPES: ReadonlyArray<readonly [string, RegExp]> = [
  ['bullet', /^\s*(?:[-•*·▪◦>]|\(?[a-z]\)|[a-z]\.)\s/i],
  ['number', /^\s*(?:#?\d{1,3}(?:\.\d{1,3})*[.):]?|[A-Z]{1,3}[-.]\d{1,3}(?:\.\d+)?)\s/],
  ['pipe', /\|/],
  ['tab', /\t|\S {3,}\S/],
  ['semicolons', /;[^;]*;/],
  ['commas', /,[^\s,][^,]*,[^\s,][^,]*,/],
  ['leader', /\.{4,}|_{4,}|-{4,}/],
  ['box', /\[\s?\]|☐|□/],
  ['checked', /\[\s?[xX✓✔]\s?\]|☒|☑/],
  ['quote-mark', /^\s*>/],
  ['photo', /\b(?:photo|image|pic|picture|fig(?:ure)?)\b\.?\s*#?\d/i],
  ['cross-ref', /\((?:see|ref|refer|item|section|sec)\b[^)]*\)|\(\s*[a-z]{0,3}[-.]?\d{1,2}(?:\.\d{1,2})+\s*\)/i],
  ['label-colon', /^\s*[\w /&'-]{1,30}:\s/],
  ['ends-colon', /:\s*$/],
  ['yn-cell', /(?:\||\t|\s{2,}|;)\s*[YyNn]\s*(?:\||\t|\s{2,}|;|$)/],
];

function lineAround(joined: string, start: number, end: number): string {
  const from = joined.lastIndexOf('\n', start - 1) + 1;
  let to = joined.indexOf('\n', end);
  if (to === -1) to = joined.length;
  return joined.slice(from, Math.min(to, from + 400));
}

function previousLine(joined: string, start: number): string {
  const lineStart = joined.lastIndexOf('\n', start - 1) + 1;
  const before = joined.slice(lineStart, start).trim();
  if (before.length >= 12) return before.slice(-120);
  // The evidence opens its line: the previous non-blank line.
  let end = lineStart - 1;
  while (end > 0) {
    const from = joined.lastIndexOf('\n', end - 1) + 1;
    const line = joined.slice(from, end).trim();
    if (line.length > 0) return `${line} ${before}`.slice(-120);
    end = from - 1;
  }
  return before;
}

function words(text: string): Set<string> {
  return new Set(text.toLowerCase().match(WORD) ?? []);
}

function isUpperCase(text: string): boolean {
  const letters = text.replace(/[^A-Za-z]/g, '');
  return letters.length >= 6 && letters === letters.toUpperCase();
}

/** The features of findings[i] in its report (joined pages); `contexts[i]` is its section. */
export function findingFeatures(findings: readonly Finding[], i: number, joined: string, context: FindingContext): FeatureVector {
  const f = findings[i];
  const out = new Map<string, number>();
  const on = (name: string) => out.set(name, 1);
  on(`code=${f.code}`);
  on(`room=${f.room}`);
  on(`conf=${f.confidence}`);
  if (f.computation !== null) on('computed');
  if (f.recommendation !== null) on('has-recommendation');
  if (f.location === '') on('no-location');
  on(f.quantity === null ? 'qty=none' : f.quantity === 1 ? 'qty=1' : 'qty=many');

  const evidence = f.evidence;
  for (const w of words(evidence)) on(`w=${w}`);
  for (const w of words(previousLine(joined, f.start))) on(`prev=${w}`);
  const nWords = (evidence.match(WORD) ?? []).length;
  on(nWords <= 4 ? 'len<=4' : nWords <= 10 ? 'len<=10' : nWords <= 25 ? 'len<=25' : 'len>25');
  for (const [name, re] of CUES) if (re.test(evidence)) on(`cue=${name}`);

  const line = lineAround(joined, f.start, f.end);
  for (const [name, re] of LINE_SHAPES) if (re.test(line)) on(`line=${name}`);
  if (isUpperCase(line)) on('line=upper-case');
  if (line.trim().length <= 60) on('line=short');

  on(`section=${context.sectionKind}`);
  if (context.sectionTitle !== null) {
    if (SUMMARY_HEADING.test(context.sectionTitle)) on('section=summary');
    for (const w of words(context.sectionTitle)) on(`head=${w}`);
  }

  let sameCode = 0;
  let sameCodeRoom = 0;
  for (let j = 0; j < findings.length; j++) {
    if (j === i) continue;
    const g = findings[j];
    if (g.start === f.start && g.end === f.end) on('shares-sentence');
    if (g.code !== f.code) continue;
    if (j < i) {
      sameCode++;
      if (g.room === f.room) sameCodeRoom++;
    } else {
      on('same-code-later');
      if (g.room === f.room) on('same-code-room-later');
    }
  }
  if (sameCode > 0) on('same-code-before');
  if (sameCodeRoom > 0) on('same-code-room-before');
  on(findings.length <= 2 ? 'findings<=2' : findings.length <= 6 ? 'findings<=6' : 'findings>6');
  const position = joined.length === 0 ? 0 : f.start / joined.length;
  out.set('position', position);
  if (position < 0.15) on('position<0.15');
  return out;
}

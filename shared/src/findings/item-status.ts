import type { MappedText } from './mapped-text';

/**
 * Re-inspection and punch-list notes give each item of an earlier report with its status after a
 * leader ("Double tap, 20A brkr ...... corrected", "#4 attic J-box -- cover installed. CLOSED"). An
 * item whose status says it was put right reports no defect any more; one that is "still open",
 * "partial" or "not corrected" is reported as before (common practice in re-inspection reports).
 */
const LEADER = /\.{3,}|\s[-–—]{1,2}\s|\s[-–—]{2}/g;
/** A status that closes the item, at the end of the part after the leader. */
const CLOSED_END =
  /(?:\bclosed|\b(?:was\s+|been\s+|now\s+)?(?:corrected|repaired|resolved|completed?|done|fixed|addressed|cleared)|(?<!\b(?:not|none|never|no)\s+)\b(?:installed|replaced|added)|\b(?:tests?|tested|checks?|checked|verified|operates|operating)\s+(?:ok(?:ay)?|good|fine|properly|correctly))[\s.;!)]*$/i;
const CLOSED_WORD = /\bCLOSED\b|\bclosed\s*$/;
/** A status that keeps the item open. */
const STILL_OPEN = /\b(?:still\s+(?:open|present|there|not|no|loose|missing|reversed|inop\w*|dead|exposed|chirp\w*)|remains?\s+(?:open|unresolved|as\s+(?:was|before|reported))|not\s+(?:yet\s+)?(?:corrected|repaired|resolved|completed|done|fixed|addressed|replaced|installed)|partial(?:ly)?|incomplete|recommend\w*|should|needs?\b|must\b|suggest\w*|advise\w*|to be\b|have (?:it|them|this)\b|unchanged|no change|open\s*[.;]?\s*$)/i;

const MAX_DASH_STATUS = 60;

/** Whether an item (one block) is an earlier finding whose status says it has been put right. */
export function isClosedItem(item: string): boolean {
  if (item.length > 240 || STILL_OPEN.test(item)) return false;
  LEADER.lastIndex = 0;
  const leader = LEADER.exec(item);
  if (leader === null) return false;
  const status = item.slice(leader.index + leader[0].length);
  // After a dash the status is short ("#2 hall GFCI -- replaced, tests ok"); a longer text after a
  // dash is the item's description ("Kitchen - the receptacle ... is cracked. Counter GFCIs tested ok.").
  if (!leader[0].includes('.') && status.length > MAX_DASH_STATUS) return CLOSED_WORD.test(status);
  return CLOSED_WORD.test(status) || CLOSED_END.test(status);
}

/**
 * The block without its lines that are items put right (a re-inspection list read as one block of
 * short lines: "E2  Missing GFCI, hall bath ...... installed, tests OK. CLOSED"), or null when
 * nothing is left to read.
 */
export function withoutClosedItems(block: MappedText): MappedText | null {
  if (isClosedItem(block.text)) return null;
  const cuts = itemStarts(block.text);
  if (cuts.length === 0) return block;
  let text = '';
  // The result is never longer than the block: one array of that size, cut to length at the end.
  const offsets = new Array<number>(block.text.length);
  let length = 0;
  [0, ...cuts].forEach((from, k) => {
    const to = k < cuts.length ? cuts[k] - 1 : block.text.length;
    if (isClosedItem(block.text.slice(from, to))) return;
    if (text.length > 0) {
      text += '\n';
      offsets[length++] = block.offsets[from - 1];
    }
    text += block.text.slice(from, to);
    for (let k = from; k < to; k++) offsets[length++] = block.offsets[k];
  });
  offsets.length = length;
  return text.trim().length > 0 ? { text, offsets } : null;
}

/** An item label that starts a status line ("P4  Attic J-box ...... STILL OPEN") inside a block of joined short lines. */
const ITEM_START = /\s(?=(?:[A-Z]{1,3}-?\d{1,3}|#\d{1,3}|[Ii]tem\s+\d{1,3})\s+[^\n]*?(?:\.{3,}|\s[-–—]{2}\s))/g;

/** Where the lines or items of a block start (after the first): line breaks, and item labels when the block has two leaders or more. */
function itemStarts(text: string): number[] {
  const starts: number[] = [];
  for (let i = text.indexOf('\n'); i >= 0; i = text.indexOf('\n', i + 1)) starts.push(i + 1);
  LEADER.lastIndex = 0;
  if ((text.match(LEADER) ?? []).length >= 2) {
    ITEM_START.lastIndex = 0;
    for (let m = ITEM_START.exec(text); m !== null; m = ITEM_START.exec(text)) if (text[m.index] !== '\n') starts.push(m.index + 1);
  }
  return [...new Set(starts)].sort((a, b) => a - b);
}

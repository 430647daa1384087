/**
 * Every match of a global regular expression in a text, in order: the same list as
 * `[...text.matchAll(re)]`, found with a plain `exec` loop. `matchAll` first copies the
 * expression (a new RegExp per call), and on the short sentences the parser reads that copy
 * costs several times more than the matching itself.
 *
 * The expression's `lastIndex` is used during the scan and left at 0, so a shared module-level
 * expression can be scanned from anywhere (the parser is synchronous, scans never interleave).
 */
export function scanAll(re: RegExp, text: string): RegExpExecArray[] {
  if (!re.global) throw new TypeError(`scanAll needs a global expression: ${re}`);
  const found: RegExpExecArray[] = [];
  re.lastIndex = 0;
  for (let m = re.exec(text); m !== null; m = re.exec(text)) {
    found.push(m);
    // An empty match moves on by one position (one code point for unicode expressions), as matchAll does.
    if (m[0].length === 0) re.lastIndex = nextIndex(text, re.lastIndex, re.unicode || re.flags.includes('v'));
  }
  re.lastIndex = 0;
  return found;
}

function nextIndex(text: string, index: number, byCodePoint: boolean): number {
  if (!byCodePoint || index + 1 >= text.length) return index + 1;
  const unit = text.charCodeAt(index);
  const next = text.charCodeAt(index + 1);
  return unit >= 0xd800 && unit <= 0xdbff && next >= 0xdc00 && next <= 0xdfff ? index + 2 : index + 1;
}

/** A stretch of the joined report text a person selected. */
export interface TextSelection {
  readonly start: number;
  readonly end: number;
  readonly text: string;
}

/**
 * The offset in the joined text of a DOM position inside `root`, where every element carrying
 * `data-offset` holds exactly the joined text from that offset on (page labels are CSS, not text).
 */
function offsetOf(root: HTMLElement, node: Node, offset: number): number | null {
  if (!root.contains(node)) return null;
  if (node === root) {
    const child = root.childNodes[offset];
    if (child instanceof HTMLElement && child.dataset['offset'] !== undefined) return Number(child.dataset['offset']);
    const last = root.lastElementChild;
    return last instanceof HTMLElement ? Number(last.dataset['offset']) + (last.textContent?.length ?? 0) : null;
  }
  const element = node instanceof HTMLElement ? node : node.parentElement;
  const anchor = element?.closest<HTMLElement>('[data-offset]');
  if (!anchor || !root.contains(anchor)) return null;
  const before = document.createRange();
  before.setStart(anchor, 0);
  before.setEnd(node, offset);
  return Number(anchor.dataset['offset']) + before.toString().length;
}

/** The selected report text as offsets into the joined text, or null when nothing in `root` is selected. */
export function selectionOffsets(root: HTMLElement, selection: Selection | null, joined: string): TextSelection | null {
  if (!selection || selection.rangeCount === 0 || selection.isCollapsed) return null;
  const range = selection.getRangeAt(0);
  let start = offsetOf(root, range.startContainer, range.startOffset);
  let end = offsetOf(root, range.endContainer, range.endOffset);
  if (start === null || end === null) return null;
  // Leave out the blanks (and page breaks) at either end of the selection.
  while (start < end && /\s/.test(joined[start])) start++;
  while (end > start && /\s/.test(joined[end - 1])) end--;
  return end > start ? { start, end, text: joined.slice(start, end) } : null;
}

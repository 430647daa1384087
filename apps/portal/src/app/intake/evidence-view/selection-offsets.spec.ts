import { selectionOffsets } from './selection-offsets';

describe('selectionOffsets', () => {
  // Two pages as the evidence view draws them: each page and each stretch carries its offset.
  const pages = ['Kitchen: no GFCI at sink.', 'Bath: loose outlet.'];
  const joined = pages.join('\f');
  let root: HTMLElement;

  beforeEach(() => {
    root = document.createElement('div');
    root.innerHTML =
      `<div data-offset="0"><span data-offset="0">Kitchen: </span><mark data-offset="9">no GFCI</mark><span data-offset="16"> at sink.</span></div>` +
      `<div data-offset="${pages[0].length + 1}"><span data-offset="${pages[0].length + 1}">Bath: loose outlet.</span></div>`;
    document.body.appendChild(root);
  });
  afterEach(() => root.remove());

  function select(startNode: Node, startOffset: number, endNode: Node, endOffset: number): Selection {
    const selection = window.getSelection()!;
    const range = document.createRange();
    range.setStart(startNode, startOffset);
    range.setEnd(endNode, endOffset);
    selection.removeAllRanges();
    selection.addRange(range);
    return selection;
  }

  it('maps a selection inside one stretch to offsets of the joined text', () => {
    const text = root.querySelector('mark')!.firstChild!;
    const result = selectionOffsets(root, select(text, 3, text, 7), joined);
    expect(result).toEqual({ start: 12, end: 16, text: 'GFCI' });
  });

  it('maps a selection across a page break and drops the blanks at its ends', () => {
    const first = root.querySelectorAll('span')[1].firstChild!;
    const second = root.querySelectorAll('span')[2].firstChild!;
    const result = selectionOffsets(root, select(first, 0, second, 5), joined)!;
    expect(result.text).toBe('at sink.\fBath:');
    expect(joined.slice(result.start, result.end)).toBe(result.text);
  });

  it('ignores an empty selection and one outside the report', () => {
    const outside = document.createElement('p');
    outside.textContent = 'elsewhere';
    document.body.appendChild(outside);
    expect(selectionOffsets(root, select(outside.firstChild!, 0, outside.firstChild!, 4), joined)).toBeNull();
    const text = root.querySelector('mark')!.firstChild!;
    expect(selectionOffsets(root, select(text, 2, text, 2), joined)).toBeNull();
    outside.remove();
  });
});

import { reportSegments } from './report-segments';

describe('reportSegments', () => {
  const pages = ['Kitchen: no GFCI. Roof fine.', 'Bath outlet loose.'];
  const joined = pages.join('\f');

  it('highlights an item’s evidence so that its text is exactly the joined text at its offsets', () => {
    const start = joined.indexOf('no GFCI.');
    const [first] = reportSegments(pages, [{ id: 7, start, end: start + 'no GFCI.'.length }]);
    expect(first.segments.map((s) => [s.text, s.itemIds])).toEqual([
      ['Kitchen: ', []],
      ['no GFCI.', [7]],
      [' Roof fine.', []],
    ]);
    for (const s of first.segments) expect(joined.slice(s.start, s.start + s.text.length)).toBe(s.text);
  });

  it('numbers pages and starts each one after the form feed that separates them', () => {
    const result = reportSegments(pages, []);
    expect(result.map((p) => [p.number, p.start])).toEqual([
      [1, 0],
      [2, pages[0].length + 1],
    ]);
    expect(result[1].segments[0].text).toBe('Bath outlet loose.');
  });

  it('splits evidence that runs over a page break into a highlight on each page', () => {
    const start = joined.indexOf('Roof');
    const end = joined.indexOf(' outlet');
    const result = reportSegments(pages, [{ id: 3, start, end }]);
    expect(result[0].segments.at(-1)).toEqual({ start, text: 'Roof fine.', itemIds: [3] });
    expect(result[1].segments[0]).toEqual({ start: pages[0].length + 1, text: 'Bath', itemIds: [3] });
  });

  it('marks overlapping evidence with both items', () => {
    const result = reportSegments(['abcdef'], [
      { id: 1, start: 0, end: 4 },
      { id: 2, start: 2, end: 6 },
    ]);
    expect(result[0].segments.map((s) => [s.text, s.itemIds])).toEqual([
      ['ab', [1]],
      ['cd', [1, 2]],
      ['ef', [2]],
    ]);
  });
});

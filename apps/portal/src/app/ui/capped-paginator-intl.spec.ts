import { CappedPaginatorIntl, paginatorLength, type ListCount } from './capped-paginator-intl';

const counted = (c: Partial<ListCount>): ListCount => ({ total: 45, isTotalCapped: false, hasMore: false, page: 0, pageSize: 20, rowCount: 20, ...c });

describe('CappedPaginatorIntl', () => {
  it('says the exact total of an uncapped list', () => {
    const intl = new CappedPaginatorIntl();
    intl.setCount(counted({ hasMore: true }));
    expect(intl.getRangeLabel(1, 20, 45)).toBe('21 – 40 of 45');
    expect(intl.getRangeLabel(0, 20, 0)).toBe('0 of 0');
  });

  it('adds a plus to a capped total and tells the paginator to redraw', () => {
    const intl = new CappedPaginatorIntl();
    const redraws: number[] = [];
    intl.changes.subscribe(() => redraws.push(1));
    intl.setCount(counted({ total: 1000, isTotalCapped: true, hasMore: true, page: 49 }));
    intl.setCount(counted({ total: 1000, isTotalCapped: true, hasMore: true, page: 48 }));
    expect(redraws).toHaveLength(1);
    expect(intl.getRangeLabel(49, 20, 1000)).toBe('981 – 1,000 of 1,000+');
  });

  it('past the cap, says no more than it knows: more rows than the page shown, then the exact total on the last page', () => {
    const intl = new CappedPaginatorIntl();
    const sixth = counted({ total: 100, isTotalCapped: true, hasMore: true, page: 5 });
    intl.setCount(sixth);
    expect(intl.getRangeLabel(5, 20, paginatorLength(sixth))).toBe('101 – 120 of 120+');
    const last = counted({ total: 100, isTotalCapped: true, hasMore: false, page: 6, rowCount: 7 });
    intl.setCount(last);
    expect(intl.getRangeLabel(6, 20, paginatorLength(last))).toBe('121 – 127 of 127');
  });
});

describe('paginatorLength', () => {
  it('is the total when it is exact, whatever the cursor says', () => {
    expect(paginatorLength(counted({ hasMore: true }))).toBe(45);
    expect(paginatorLength(counted({ page: 2, rowCount: 5 }))).toBe(45);
  });

  it('keeps one page more past a capped total while pages follow, and ends at the last page’s rows', () => {
    // Within the cap the capped total already leaves pages to go.
    expect(paginatorLength(counted({ total: 100, isTotalCapped: true, hasMore: true }))).toBe(100);
    expect(paginatorLength(counted({ total: 100, isTotalCapped: true, hasMore: true, page: 4 }))).toBe(120);
    expect(paginatorLength(counted({ total: 100, isTotalCapped: true, hasMore: true, page: 9 }))).toBe(220);
    expect(paginatorLength(counted({ total: 100, isTotalCapped: true, hasMore: false, page: 9, rowCount: 20 }))).toBe(200);
  });
});

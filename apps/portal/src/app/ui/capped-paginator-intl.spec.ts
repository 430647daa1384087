import { CappedPaginatorIntl } from './capped-paginator-intl';

describe('CappedPaginatorIntl', () => {
  it('says the exact total of an uncapped list', () => {
    const intl = new CappedPaginatorIntl();
    expect(intl.getRangeLabel(1, 20, 45)).toBe('21 – 40 of 45');
    expect(intl.getRangeLabel(0, 20, 0)).toBe('0 of 0');
  });

  it('adds a plus to a capped total and tells the paginator to redraw', () => {
    const intl = new CappedPaginatorIntl();
    const redraws: number[] = [];
    intl.changes.subscribe(() => redraws.push(1));
    intl.setCapped(true);
    intl.setCapped(true);
    expect(redraws).toHaveLength(1);
    expect(intl.getRangeLabel(49, 20, 1000)).toBe('981 – 1,000 of 1,000+');
  });
});

import type { LineItem } from '@cc/shared';
import { orderByConfidence } from './item-review';
import { isLowConfidence } from '../item-table/item-table';

/** Only the fields the order reads; the rest of a line item does not matter here. */
const item = (id: number, confidence: LineItem['confidence']) => ({ id, confidence }) as LineItem;

describe('orderByConfidence', () => {
  it('lists inferred items first, then items read from a device and its condition, then from shorthand, then exact phrases, each in report order', () => {
    const items = [item(1, 'exact'), item(2, 'composed'), item(3, 'normalised'), item(4, 'inferred'), item(5, 'composed'), item(6, null)];
    expect(orderByConfidence(items).map((i) => i.id)).toEqual([4, 2, 5, 3, 1, 6]);
  });
});

describe('isLowConfidence', () => {
  it('marks items inferred from context or composed from a device and its condition, not shorthand or exact phrases', () => {
    expect((['inferred', 'composed', 'normalised', 'exact', null] as const).map((c) => isLowConfidence(c))).toEqual([true, true, false, false, false]);
  });
});

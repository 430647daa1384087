import * as z from 'zod';
import { GfciReadingSchema } from '../readings/readings.schema';
import { SpareAllowanceSchema } from '../economics/economics.schema';
import { CreateLineItemSchema, SplitLineItemSchema, UpdateLineItemSchema } from '../items/line-item.schema';
import { ChangeOrderLineInputSchema } from '../payments/payment.schema';
import { BulkPriceItemsSchema } from '../quotes/bulk-pricing.schema';
import { plainText, QuantitySchema, wholeNumber } from './bounds';

const firstMessage = (schema: z.ZodType, value: unknown) => schema.safeParse(value).error?.issues[0]?.message;

describe('wholeNumber', () => {
  const minutes = wholeNumber(1, 60, 'the minutes');

  it.each([
    [undefined, 'Enter the minutes'],
    ['12', 'Enter the minutes'],
    [Number.NaN, 'Enter the minutes'],
    [1.5, 'Use a whole number, without decimals'],
    [0, 'Use a whole number of 1 or more'],
    [-3, 'Use a whole number of 1 or more'],
    [61, 'Use at most 60'],
    [999_999_999, 'Use at most 60'],
  ])('says %p back in plain words: %s', (value, message) => {
    expect(firstMessage(minutes, value)).toBe(message);
  });

  it('takes every whole number in its range', () => {
    for (const value of [1, 30, 60]) expect(minutes.parse(value)).toBe(value);
  });
});

// The review found "Too big: expected number to be <=999" and "Invalid input: expected int, received
// number" under the bulk toolbar's quantity: zod's own messages must not reach a form.
describe('whole-number fields of the forms', () => {
  const zodDefault = /^(Invalid input|Too (big|small)|Expected)/;
  const fields: [string, z.ZodType][] = [
    ['a quantity', QuantitySchema],
    ['the bulk quantity', BulkPriceItemsSchema.shape.set.shape.quantity],
    ['an item quantity', UpdateLineItemSchema.shape.quantity],
    ['a new item quantity', CreateLineItemSchema.shape.quantity],
    ['a split part', SplitLineItemSchema.shape.quantities.element],
    ['a change-order quantity', ChangeOrderLineInputSchema.options[1].shape.quantity],
    ['the downstream receptacles proven', GfciReadingSchema.shape.downstreamProven],
    ['the spare units', SpareAllowanceSchema.shape.spareUnits],
  ];

  it.each(fields)('%s is refused in plain words', (_name, schema) => {
    for (const value of [1.5, 999_999_999, -3, 'x']) {
      const message = firstMessage(schema, value);
      expect(message).toBeDefined();
      expect(message).not.toMatch(zodDefault);
    }
  });

  it('says the bulk quantity limits as the review typed them', () => {
    const quantity = BulkPriceItemsSchema.shape.set.shape.quantity;
    expect(firstMessage(quantity, 999_999_999)).toBe('Use at most 999');
    expect(firstMessage(quantity, 1.5)).toBe('Use a whole number, without decimals');
    expect(firstMessage(quantity, 0)).toBe('Use a whole number of 1 or more');
  });
});

describe('plainText', () => {
  it('says its limit in plain words', () => {
    expect(firstMessage(plainText(10), 'x'.repeat(11))).toBe('Use at most 10 characters');
    expect(firstMessage(plainText(10, 'Keep the street short'), 'x'.repeat(11))).toBe('Keep the street short');
  });
});

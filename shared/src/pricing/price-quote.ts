import { MONEY_TOTAL_FIELDS, type MoneyTotals, type QuoteBreakdown, type VisitBreakdown } from './pricing-breakdown.schema';
import { PricingError } from './pricing-error';
import type { Quote } from './pricing-input.schema';
import { priceVisit, type LineToPrice } from './price-visit';
import type { RateBook } from './rate-book.schema';
import { applyBasisPoints } from './rounding';

/** A quote to price. Defaults of the schema may be left out. */
export interface QuoteToPrice {
  visits: readonly (Pick<Quote['visits'][number], 'key'> & Partial<Pick<Quote['visits'][number], 'adderIds' | 'hasPermit'>>)[];
  lines: readonly (LineToPrice & { visitKey: string })[];
}

/**
 * Prices a quote: each visit on its own (priceVisit), then the quote's money is the sum of its
 * visits' money, except the deposit, which is taken from the quote total (R1), not summed.
 */
export function priceQuote(book: RateBook, quote: QuoteToPrice): QuoteBreakdown {
  const linesByVisit = new Map<string, LineToPrice[]>();
  for (let i = 0; i < quote.visits.length; i++) {
    const key = quote.visits[i].key;
    if (linesByVisit.has(key)) throw new PricingError('duplicate-visit', ['visits', i, 'key'], `Visit "${key}" is listed twice`);
    linesByVisit.set(key, []);
  }
  for (let i = 0; i < quote.lines.length; i++) {
    const line = quote.lines[i];
    const bucket = linesByVisit.get(line.visitKey);
    if (!bucket) throw new PricingError('unknown-visit', ['lines', i, 'visitKey'], `No visit "${line.visitKey}" in this quote`);
    bucket.push(line);
  }

  const visits: VisitBreakdown[] = new Array(quote.visits.length);
  for (let i = 0; i < quote.visits.length; i++) {
    const { key, adderIds, hasPermit } = quote.visits[i];
    visits[i] = priceVisit(book, { key, adderIds, hasPermit, lines: linesByVisit.get(key) ?? [] }, ['visits', i]);
  }

  const totals = {} as MoneyTotals;
  for (const field of MONEY_TOTAL_FIELDS) {
    let sum = 0;
    for (const visit of visits) sum += visit[field];
    totals[field] = sum;
  }
  totals.depositCents = applyBasisPoints(totals.totalCents, book.terms.cardDepositBp);

  return {
    ...totals,
    visits,
    quoteValidityDays: book.terms.quoteValidityDays,
    warrantyText: book.terms.warrantyText,
  };
}

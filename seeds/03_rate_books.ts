import type { Knex } from 'knex';
import { DEMO_RATE_BOOK, RateBookSchema, type RateBook, type RateBookInput } from '@cc/shared';
import { RateBookRepository } from '../server/src/rate-book/rate-book.repository';
import { ORGANISATIONS } from './data/demo-scenario';

/**
 * Copperleaf's own rate book: the demo book's entries and conditions with its own terms (common
 * practice, inside the trade reference's ranges: trip $75–200, first hour $150–300, $90–175/h,
 * markup 20–50 %, permit $50–250 + $25–75). It shows no sales tax (it pays tax on its purchases),
 * bills in 30-minute steps and keeps no flat-rate entries except its own GFCI price.
 */
function copperleafBook(name: string): RateBookInput {
  const timedOnly = DEMO_RATE_BOOK.entries.filter((e) => e.pricing.mode === 'time-and-materials');
  return {
    contractorName: name,
    terms: {
      serviceCallCents: 8_500,
      firstHourMinimumCents: 16_500,
      firstHourCoversMinutes: 60,
      hourlyRateCents: 12_000,
      billingIncrementMinutes: 30,
      materialsMarkupBp: 3_000,
      materialsTaxBp: 0,
      permit: { feeCents: 7_500, handlingCents: 3_500 },
      cardDepositBp: 3_000,
      quoteValidityDays: 21,
      warrantyText: 'Our workmanship is guaranteed for two years from the completion letter; parts per their manufacturer.',
      visitCapacityMinutes: 420,
    },
    entries: [
      ...timedOnly,
      // first GFCI $125–275, each additional in the same visit $60–150
      { id: 'gfci-swap-flat', code: 'gfci-inoperative', name: 'Swap GFCI receptacle, flat rate', unit: 'device', pricing: { mode: 'flat', firstUnitCents: 15_500, additionalUnitCents: 7_500, hardSiteMultiplierBp: 13_000 } },
    ],
    adders: DEMO_RATE_BOOK.adders.map((a) => (a.id === 'plaster-walls' ? { ...a, effect: { kind: 'labour-multiplier' as const, multiplierBp: 12_500 } } : a)),
  };
}

async function store(knex: Knex, organisationId: number, book: RateBook): Promise<void> {
  const repo = new RateBookRepository(knex);
  await knex.transaction(async (trx) => {
    await repo.insertTerms(organisationId, book.terms, trx);
    for (const { id, ...content } of book.entries) await repo.createEntry(organisationId, id, content, null, trx);
    for (const { id, ...adder } of book.adders) await repo.createAdder(organisationId, id, adder, trx);
  });
}

// Resets every rate book (and so the quotes and item prices made with them) and gives the two demo
// contractors theirs: Brightline the demo rate book, Copperleaf its own variant.
export async function seed(knex: Knex): Promise<void> {
  await knex('quotes').delete();
  await knex('line_items').update({ entry_id: null, adder_ids: '{}', pricing_quantity: null, is_quantity_assumed: false, visit_key: 'visit-1', out_of_scope_reason: null });
  await knex('request_pricing_visits').delete();
  await knex('repair_requests').update({ site_adder_ids: '{}' });
  for (const table of ['rate_book_changes', 'rate_book_adders', 'rate_book_entries', 'rate_books']) await knex(table).delete();

  const nameOf = (key: string) => ORGANISATIONS.find((o) => o.key === key)!.name;
  const idOf = async (key: string) => (await knex('organisations').where({ name: nameOf(key) }).first('id')).id as number;
  await store(knex, await idOf('brightline'), RateBookSchema.parse({ ...DEMO_RATE_BOOK, contractorName: nameOf('brightline') }));
  await store(knex, await idOf('copperleaf'), RateBookSchema.parse(copperleafBook(nameOf('copperleaf'))));
}

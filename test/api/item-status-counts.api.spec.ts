// A request's items counted by status (repair_requests.item_status_counts) are kept by statement
// triggers on line_items, whatever writes the items: these tests write them with plain SQL and
// compare the kept counts with a fresh count (PostgreSQL documentation, CREATE TRIGGER,
// "REFERENCING ... TRANSITION TABLE").
import type { Db } from '../../server/src/db/knex';
import { createOrganisation, createUser, resetDatabase } from '../helpers/fixtures';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let agentId: number;

beforeAll(async () => {
  t = createTestApp();
  await resetDatabase(t.db);
  const brokerage = await createOrganisation(t.db, 'brokerage');
  agentId = (await createUser(t.db, 'agent', brokerage)).id;
});
afterAll(() => t.close());

async function newRequest(street: string): Promise<number> {
  const [row] = await t.db('repair_requests')
    .insert({ street, city: 'Marlow Springs', state: 'CO', zip: '81290', year_built: 1962, closing_date: '2027-03-01', nec_edition: 2023, status: 'intake', created_by: agentId })
    .returning('id');
  return row.id;
}

const addItems = (db: Db, requestId: number, statuses: string[]) =>
  db('line_items').insert(statuses.map((status) => ({ request_id: requestId, code: 'gfci-missing', room: 'kitchen', severity: 'safety', status }))).returning('id');

async function kept(requestId: number): Promise<Record<string, number>> {
  return (await t.db('repair_requests').where({ id: requestId }).first('item_status_counts')).item_status_counts;
}

async function counted(requestId: number): Promise<Record<string, number>> {
  const rows: { status: string; n: number }[] = await t.db('line_items').where({ request_id: requestId }).groupBy('status').select('status', t.db.raw('count(*)::int AS n'));
  return Object.fromEntries(rows.map((r) => [r.status, r.n]));
}

describe('items counted by status on the request', () => {
  it('follows inserts, status changes, moves between requests and deletes', async () => {
    const a = await newRequest('1 Tally Row');
    const b = await newRequest('2 Tally Row');
    expect(await kept(a)).toEqual({});

    const ids = (await addItems(t.db, a, ['proposed', 'proposed', 'open', 'open', 'open'])).map((r: { id: number }) => r.id);
    expect(await kept(a)).toEqual({ proposed: 2, open: 3 });

    await t.db('line_items').whereIn('id', ids.slice(0, 2)).update({ status: 'open' });
    expect(await kept(a)).toEqual({ open: 5 });

    // A change that is not a status leaves the counts alone.
    await t.db('line_items').whereIn('id', ids).update({ room: 'laundry' });
    expect(await kept(a)).toEqual({ open: 5 });

    await t.db('line_items').where({ id: ids[4] }).update({ request_id: b, status: 'removed' });
    expect(await kept(a)).toEqual({ open: 4 });
    expect(await kept(b)).toEqual({ removed: 1 });

    await t.db('line_items').whereIn('id', ids.slice(0, 4)).delete();
    expect(await kept(a)).toEqual({});
    expect(await kept(a)).toEqual(await counted(a));
    expect(await kept(b)).toEqual(await counted(b));
  });

  it('leaves the counts as they were when the transaction that changed items rolls back', async () => {
    const a = await newRequest('3 Tally Row');
    await addItems(t.db, a, ['open', 'open']);
    await expect(
      t.db.transaction(async (trx) => {
        await addItems(trx, a, ['approved']);
        await trx('line_items').where({ request_id: a, status: 'open' }).update({ status: 'priced' });
        throw new Error('rolled back');
      }),
    ).rejects.toThrow('rolled back');
    expect(await kept(a)).toEqual({ open: 2 });
  });

  it('adds up changes that concurrent transactions make to the same request', async () => {
    const a = await newRequest('4 Tally Row');
    const ids = (await addItems(t.db, a, Array(12).fill('open'))).map((r: { id: number }) => r.id);
    // Twelve transactions at once, each moving one item; they wait on the request row in turn.
    await Promise.all(ids.map((id, i) => t.db.transaction((trx) => trx('line_items').where({ id }).update({ status: i % 2 ? 'approved' : 'priced' }))));
    expect(await kept(a)).toEqual({ approved: 6, priced: 6 });
    expect(await kept(a)).toEqual(await counted(a));
  });
});

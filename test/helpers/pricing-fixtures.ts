// Test data for rate books, pricing and quotes, written through the repositories the app uses.
import type { Express } from 'express';
import type { CurrentUser, RateBookInput, RequestStatus } from '@cc/shared';
import { RateBookSchema } from '@cc/shared';
import type { Db } from '../../server/src/db/knex';
import { RateBookRepository } from '../../server/src/rate-book/rate-book.repository';
import { createOrganisation, createUser, signIn, validRequestBody, type SignedIn } from './fixtures';

/** Ids of a stored rate book's entries and adders by their keys. */
export interface StoredBook {
  entry: Record<string, number>;
  adder: Record<string, number>;
}

/** Stores `input` as the rate book of `organisationId` (terms, entries, adders in book order). */
export async function storeRateBook(db: Db, organisationId: number, input: RateBookInput): Promise<StoredBook> {
  const book = RateBookSchema.parse(input);
  const repo = new RateBookRepository(db);
  const stored: StoredBook = { entry: {}, adder: {} };
  await db.transaction(async (trx) => {
    await repo.insertTerms(organisationId, book.terms, trx);
    for (const { id, ...content } of book.entries) stored.entry[id] = await repo.createEntry(organisationId, id, content, null, trx);
    for (const { id, ...adder } of book.adders) stored.adder[id] = await repo.createAdder(organisationId, id, adder, trx);
  });
  return stored;
}

export interface DemoItem {
  code: string;
  quantity: number | null;
  location?: string;
  status?: string;
}

/** Adds line items to a request as confirmed items would be. Returns their ids in order. */
export async function addItems(db: Db, requestId: number, items: DemoItem[]): Promise<number[]> {
  const rows = await db('line_items')
    .insert(
      items.map((i) => ({
        request_id: requestId,
        code: i.code,
        room: 'kitchen',
        location: i.location ?? `${i.code} location`,
        quantity: i.quantity,
        severity: 'safety',
        status: i.status ?? 'open',
      })),
    )
    .returning('id');
  return rows.map((r: { id: number }) => r.id);
}

export async function setStatus(db: Db, requestId: number, status: RequestStatus): Promise<void> {
  await db('repair_requests').where({ id: requestId }).update({ status });
}

export const CAST = ['buyerAgent', 'listingAgent', 'seller', 'inspector', 'contractor', 'colleague', 'otherContractor', 'outsiderAgent', 'admin'] as const;
export type CastKey = (typeof CAST)[number];

/** Everyone around one request assigned to `contractorOrg`, signed in. */
export interface PricingCast {
  contractorOrg: number;
  otherContractorOrg: number;
  users: Record<CastKey, CurrentUser>;
  s: Record<CastKey, SignedIn>;
}

export async function createPricingCast(app: Express, db: Db): Promise<PricingCast> {
  const brokerage = await createOrganisation(db, 'brokerage');
  const contractorOrg = await createOrganisation(db, 'contractor', 'Assigned Electric');
  const otherContractorOrg = await createOrganisation(db, 'contractor', 'Other Electric');
  const users: Record<CastKey, CurrentUser> = {
    buyerAgent: await createUser(db, 'agent', brokerage),
    listingAgent: await createUser(db, 'agent', brokerage),
    seller: await createUser(db, 'seller'),
    inspector: await createUser(db, 'inspector'),
    contractor: await createUser(db, 'contractor', contractorOrg),
    colleague: await createUser(db, 'contractor', contractorOrg),
    otherContractor: await createUser(db, 'contractor', otherContractorOrg),
    outsiderAgent: await createUser(db, 'agent', brokerage),
    admin: await createUser(db, 'admin'),
  };
  const s = Object.fromEntries(await Promise.all(CAST.map(async (k) => [k, await signIn(app, users[k])]))) as Record<CastKey, SignedIn>;
  return { contractorOrg, otherContractorOrg, users, s };
}

/** A request of the cast's buyer's agent with every party named, in `status`, with `items`. */
export async function createPricedRequest(
  cast: PricingCast,
  db: Db,
  options: { status?: RequestStatus; items?: DemoItem[]; yearBuilt?: number; contractorOrg?: number | null } = {},
): Promise<{ requestId: number; itemIds: number[] }> {
  const { s, users } = cast;
  const res = await s.buyerAgent.agent
    .post('/api/requests')
    .set('x-csrf-token', s.buyerAgent.csrfToken)
    .send(
      validRequestBody({
        listingAgentEmail: users.listingAgent.email,
        sellerEmail: users.seller.email,
        inspectorEmail: users.inspector.email,
        contractorOrganisationId: options.contractorOrg === undefined ? cast.contractorOrg : options.contractorOrg,
        yearBuilt: options.yearBuilt ?? 1978,
      }),
    );
  if (res.status !== 201) throw new Error(`request not created: ${res.status} ${JSON.stringify(res.body)}`);
  const requestId: number = res.body.id;
  await setStatus(db, requestId, options.status ?? 'pricing');
  const itemIds = await addItems(db, requestId, options.items ?? []);
  return { requestId, itemIds };
}

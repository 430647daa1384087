// Outcomes a contractor records within a few minutes of each other reach each person as one e-mail
// (ITEM_MESSAGES_GATHER_MINUTES, 10 here as in production): the message waits in the outbox, each new
// outcome of the same request is added to it, and it goes out once its wait is over.
import { DEMO_RATE_BOOK, requestReference } from '@cc/shared';
import type { NotifyInput } from '../../server/src/notifications/notify-input';
import type { OutboxWorker } from '../../server/src/notifications/outbox-worker';
import { proofMessagesByMail } from '../../server/src/notifications/proof-message-mail';
import { resetDatabase } from '../helpers/fixtures';
import { startMailCapture, testWorker, type MailCapture } from '../helpers/mail-capture';
import { createPricedRequest, createPricingCast, storeRateBook, type CastKey, type PricingCast } from '../helpers/pricing-fixtures';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let cast: PricingCast;
let mail: MailCapture;
let worker: OutboxWorker;
const TOLD: CastKey[] = ['buyerAgent', 'listingAgent', 'seller'];

const outcome = (requestId: number, itemId: number, itemLabel: string, result: 'corrected' | 'not-corrected' = 'corrected'): NotifyInput => ({
  kind: 'item-corrected',
  requestId,
  actorUserId: cast.users.contractor.id,
  itemId,
  correctionId: itemId,
  outcome: result,
  itemLabel,
});
const notify = (input: NotifyInput) => t.db.transaction((trx) => t.services.notifications.notify(trx, input));
const waiting = (requestId: number) => t.db('outbox_messages').where({ request_id: requestId, kind: 'item-corrected', status: 'pending' }).orderBy('recipient_email');
/** Ends the wait of the request's gathered messages, as ten minutes passing would. */
const endWait = (requestId: number) => t.db('outbox_messages').where({ request_id: requestId, kind: 'item-corrected' }).update({ next_attempt_at: t.db.fn.now() });

beforeAll(async () => {
  t = createTestApp({ ITEM_MESSAGES_GATHER_MINUTES: '10' });
  await resetDatabase(t.db);
  cast = await createPricingCast(t.app, t.db);
  await storeRateBook(t.db, cast.contractorOrg, DEMO_RATE_BOOK);
  mail = await startMailCapture();
  worker = testWorker(t, mail.transport);
});
afterAll(async () => {
  await mail.close();
  await t.close();
});

describe('outcomes recorded close together', () => {
  it('are told in one e-mail per person, listing each item with its outcome, once the wait is over', async () => {
    const { requestId, itemIds } = await createPricedRequest(cast, t.db, { items: [{ code: 'gfci-inoperative', quantity: 1 }, { code: 'double-tap', quantity: 1 }] });
    await worker.drain();
    mail.clear();

    expect(await notify(outcome(requestId, itemIds[0], 'Hall bath GFCI'))).toBe(3);
    expect(await notify(outcome(requestId, itemIds[1], 'Double tap, breaker 14', 'not-corrected'))).toBe(3);
    const rows = await waiting(requestId);
    expect(rows).toHaveLength(3);
    expect(rows.map((r) => r.gathered.map((g: { itemId: number }) => g.itemId))).toEqual([itemIds, itemIds, itemIds]);
    expect(rows[0].subject).toBe(`${requestReference(requestId)}: 2 items recorded — 1 corrected, 1 could not be corrected`);

    // Not yet: the message waits for more outcomes.
    await worker.drain();
    expect(mail.messages).toHaveLength(0);

    await endWait(requestId);
    await worker.drain();
    for (const who of TOLD) {
      const messages = mail.to(cast.users[who].email);
      expect(messages).toHaveLength(1);
      expect(messages[0].text).toContain('• Hall bath GFCI: corrected');
      expect(messages[0].text).toContain('• Double tap, breaker 14: could not be corrected');
      expect(messages[0].text).toContain(`/requests/${requestId}/work`);
    }
    // The timeline keeps one entry per outcome.
    expect(await t.db('activity_events').where({ request_id: requestId, action: 'item-corrected' }).count()).toEqual([{ count: '2' }]);
  });

  it('adds an outcome told twice (two call points of one change) only once', async () => {
    const { requestId, itemIds } = await createPricedRequest(cast, t.db, { items: [{ code: 'gfci-inoperative', quantity: 1 }] });
    expect(await notify(outcome(requestId, itemIds[0], 'Kitchen GFCI'))).toBe(3);
    expect(await notify(outcome(requestId, itemIds[0], 'Kitchen GFCI'))).toBe(0);
    const rows = await waiting(requestId);
    expect(rows.map((r) => r.gathered.length)).toEqual([1, 1, 1]);
    expect(rows[0].subject).toBe(`${requestReference(requestId)}: Kitchen GFCI — corrected`);
    expect(await t.db('activity_events').where({ request_id: requestId, action: 'item-corrected' }).count()).toEqual([{ count: '1' }]);
  });

  it('starts a new message for an outcome recorded after the last one went out', async () => {
    const { requestId, itemIds } = await createPricedRequest(cast, t.db, { items: [{ code: 'gfci-inoperative', quantity: 1 }, { code: 'gfci-missing', quantity: 1 }] });
    await notify(outcome(requestId, itemIds[0], 'Garage GFCI'));
    await endWait(requestId);
    await worker.drain();
    mail.clear();

    await notify(outcome(requestId, itemIds[1], 'Porch receptacle'));
    const rows = await waiting(requestId);
    expect(rows.map((r) => r.gathered.map((g: { itemLabel: string }) => g.itemLabel))).toEqual([['Porch receptacle'], ['Porch receptacle'], ['Porch receptacle']]);
    await endWait(requestId);
    await worker.drain();
    expect(mail.to(cast.users.seller.email).map((m) => m.subject)).toEqual([`${requestReference(requestId)}: Porch receptacle — corrected`]);
  });

  it('keeps each request’s outcomes apart', async () => {
    const a = await createPricedRequest(cast, t.db, { items: [{ code: 'gfci-inoperative', quantity: 1 }] });
    const b = await createPricedRequest(cast, t.db, { items: [{ code: 'gfci-inoperative', quantity: 1 }] });
    await notify(outcome(a.requestId, a.itemIds[0], 'Bath GFCI'));
    await notify(outcome(b.requestId, b.itemIds[0], 'Bath GFCI'));
    expect((await waiting(a.requestId)).map((r) => r.gathered.length)).toEqual([1, 1, 1]);
    expect((await waiting(b.requestId)).map((r) => r.gathered.length)).toEqual([1, 1, 1]);
  });

  it('go out at once when the completion letter is issued meanwhile, before the letter, saying it is issued', async () => {
    const { requestId, itemIds } = await createPricedRequest(cast, t.db, { items: [{ code: 'gfci-inoperative', quantity: 1 }] });
    await worker.drain();
    mail.clear();
    await notify(outcome(requestId, itemIds[0], 'Kitchen GFCI'));
    await t.db.transaction((trx) => proofMessagesByMail(t.services.notifications).letterIssued(trx, { requestId, by: cast.users.contractor.id, letterNumber: 'CL-00077', revision: 1 }));
    // No ten-minute wait: both go now, the outcome first.
    await worker.drain();
    const seller = mail.to(cast.users.seller.email);
    expect(seller.map((m) => m.subject)).toEqual([`${requestReference(requestId)}: Kitchen GFCI — corrected`, expect.stringContaining('completion letter CL-00077 issued')]);
    expect(seller[0].text).toContain('Completion letter CL-00077 is issued with these outcomes');
    expect(seller[0].text).not.toContain('The completion letter follows');
    expect(await waiting(requestId)).toEqual([]);
  });
});

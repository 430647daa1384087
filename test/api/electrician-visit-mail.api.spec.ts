// The electrician hears of their own visits: booked for them, moved, or handed to a colleague; the person
// who made the change is not told of it, and the seller's side keeps its own message. Read from the mail
// the worker delivered.
import { resetDatabase, type SignedIn } from '../helpers/fixtures';
import { startMailCapture, testWorker, type MailCapture } from '../helpers/mail-capture';
import { createPricedRequest, createPricingCast, type PricingCast } from '../helpers/pricing-fixtures';
import { createTestApp, type TestApp } from '../helpers/test-app';
import type { OutboxWorker } from '../../server/src/notifications/outbox-worker';

let t: TestApp;
let cast: PricingCast;
let mail: MailCapture;
let worker: OutboxWorker;
const PORTAL = 'http://portal.test';

const write = (who: SignedIn, method: 'post' | 'put', path: string) => who.agent[method](path).set('x-csrf-token', who.csrfToken);
const inDays = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
const longDay = (date: string) => new Date(`${date}T12:00:00Z`).toLocaleDateString('en-US', { weekday: 'long', month: 'long', day: 'numeric', year: 'numeric', timeZone: 'UTC' });
/** The electricians' own messages that went out, as [who, subject]. */
const electricianMail = () =>
  mail.messages
    .filter((m) => /your visit|taken off your day/.test(m.subject))
    .map((m) => [m.to.join(','), m.subject] as const);

async function approvedJob(): Promise<number> {
  const job = await createPricedRequest(cast, t.db, { status: 'approved', items: [{ code: 'gfci-missing', quantity: 1, status: 'approved' }] });
  return job.requestId;
}

async function book(who: SignedIn, requestId: number, electricianId: number, date: string): Promise<number> {
  const res = await write(who, 'post', `/api/requests/${requestId}/visits`).send({ date, arrivalFrom: '08:00', arrivalTo: '10:00', electricianId, accessNotes: 'Lockbox 2211' });
  expect(res.status).toBe(201);
  return res.body.id;
}

const move = (who: SignedIn, visitId: number, body: object) => write(who, 'post', `/api/day-plan/visits/${visitId}/move`).send(body);

beforeAll(async () => {
  t = createTestApp();
  await resetDatabase(t.db);
  cast = await createPricingCast(t.app, t.db);
  mail = await startMailCapture();
  worker = testWorker(t, mail.transport);
});
afterAll(async () => {
  await mail.close();
  await t.close();
});
beforeEach(async () => {
  await worker.drain();
  mail.clear();
});

describe('the electrician is e-mailed about their own visits', () => {
  it('a visit booked for a colleague: the colleague gets the day, window and a link to their day plan; the booker does not', async () => {
    const requestId = await approvedJob();
    const date = inDays(15);
    await book(cast.s.contractor, requestId, cast.users.colleague.id, date);
    await worker.drain();
    const [message, ...more] = mail.to(cast.users.colleague.email);
    expect(more).toEqual([]);
    expect(message.subject).toBe(`CC-${String(requestId).padStart(5, '0')}: your visit 1 on ${longDay(date)}`);
    expect(message.text).toContain(`Hello ${cast.users.colleague.name},`);
    expect(message.text).toContain(`Visit 1 to 14 Test Hollow Road, Marlow Springs, CO 81290 is booked for you on ${longDay(date)}, arriving between 8:00 AM and 10:00 AM.`);
    const link = `${PORTAL}/day-plan?date=${date}&electricianId=${cast.users.colleague.id}`;
    expect(message.text).toContain(`Open your day plan: ${link}`);
    expect(message.html).toContain(`href="${link.replace('&', '&amp;')}"`);
    // Access notes stay in the portal, as in the calendar feed.
    expect(message.text).not.toContain('Lockbox');
    expect(message.text).toContain('the visit is (or was) booked for you');
    expect(mail.to(cast.users.contractor.email)).toEqual([]);
    // The seller's side still hears of the visit in its own words.
    expect(mail.to(cast.users.seller.email).map((m) => m.subject)).toEqual([expect.stringContaining("electrician's visit on")]);
    const outbox = await t.db('outbox_messages').where({ request_id: requestId, kind: 'electrician-visit' }).select('recipient_user_id', 'status');
    expect(outbox).toEqual([{ recipient_user_id: cast.users.colleague.id, status: 'sent' }]);
  });

  it('an electrician who books a visit for themself is not e-mailed about it', async () => {
    const requestId = await approvedJob();
    await book(cast.s.colleague, requestId, cast.users.colleague.id, inDays(16));
    await worker.drain();
    expect(electricianMail()).toEqual([]);
    expect(await t.db('outbox_messages').where({ request_id: requestId, kind: 'electrician-visit' })).toEqual([]);
  });

  it('moved on the day plan: the electrician reads the new and the old window; handed over: the one who takes it hears it is theirs', async () => {
    const requestId = await approvedJob();
    const date = inDays(17);
    const later = inDays(18);
    const visitId = await book(cast.s.contractor, requestId, cast.users.colleague.id, date);
    await worker.drain();
    mail.clear();

    expect((await move(cast.s.contractor, visitId, { date: later, electricianId: cast.users.colleague.id, arrivalFrom: '13:00', arrivalTo: '15:00' })).status).toBe(200);
    await worker.drain();
    const [moved] = mail.to(cast.users.colleague.email).filter((m) => m.subject.includes('your visit'));
    expect(moved.subject).toContain(`your visit 1 moved to ${longDay(later)}`);
    expect(moved.text).toContain(`is now on ${longDay(later)}, arriving between 1:00 PM and 3:00 PM. It was on ${longDay(date)}, arriving between 8:00 AM and 10:00 AM.`);
    expect(mail.to(cast.users.contractor.email)).toEqual([]);
    mail.clear();

    // The colleague hands it to the contractor on the same day and window: only the contractor is told.
    expect((await move(cast.s.colleague, visitId, { date: later, electricianId: cast.users.contractor.id })).status).toBe(200);
    await worker.drain();
    expect(electricianMail()).toEqual([[cast.users.contractor.email, `CC-${String(requestId).padStart(5, '0')}: your visit 1 on ${longDay(later)}`]]);
    mail.clear();

    // Given back, it is the colleague's again: a new message, though the colleague held this visit, day
    // and window before (the contractor, who made the change, hears nothing).
    expect((await move(cast.s.contractor, visitId, { date: later, electricianId: cast.users.colleague.id })).status).toBe(200);
    await worker.drain();
    expect(electricianMail()).toEqual([[cast.users.colleague.email, `CC-${String(requestId).padStart(5, '0')}: your visit 1 on ${longDay(later)}`]]);
  });

  it('handed to a colleague: the electrician it was booked for hears it is taken off their day, and by whom it is done', async () => {
    const date = inDays(17);
    const again = await approvedJob();
    const second = await book(cast.s.colleague, again, cast.users.contractor.id, date);
    await worker.drain();
    mail.clear();
    expect((await move(cast.s.colleague, second, { date, electricianId: cast.users.colleague.id })).status).toBe(200);
    await worker.drain();
    const [gone, ...others] = mail.to(cast.users.contractor.email);
    expect(others).toEqual([]);
    expect(gone.subject).toBe(`CC-${String(again).padStart(5, '0')}: visit 1 on ${longDay(date)} taken off your day`);
    expect(gone.text).toContain(`is no longer booked for you: it went to ${cast.users.colleague.name}.`);
  });

  it('honours the electrician’s choice to turn the message off', async () => {
    await write(cast.s.colleague, 'put', '/api/notifications/preferences').send({ preferences: [{ kind: 'electrician-visit', delivery: 'off' }] }).expect(200);
    try {
      const requestId = await approvedJob();
      await book(cast.s.contractor, requestId, cast.users.colleague.id, inDays(19));
      await worker.drain();
      expect(electricianMail()).toEqual([]);
    } finally {
      await write(cast.s.colleague, 'put', '/api/notifications/preferences').send({ preferences: [{ kind: 'electrician-visit', delivery: 'immediate' }] }).expect(200);
    }
  });
});

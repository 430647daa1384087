import type { Browser, Page } from 'playwright-core';
import { expectAccessible, launchBrowser, openPage, portalUrl, screenshot, signInAs, tablesWiderThanViewport, watchConsole } from '../helpers/browser';

jest.setTimeout(180_000);

// Calling off a booked visit. The demo scenario (seeds/data/demo-scenario.ts) has approved Brightline
// jobs waiting for a visit near the shop (58 Weaver Lane, 7 Tannery Close, 311 Spindle Way, 140 Cooper
// Hill; the day-plan test books some of them). Sam Okafor, working the office, books one of those
// still approved for Lee Park a month ahead (through the API: booking has its own tests), then cancels
// it with a reason: on the request's visits page at desktop width, and from the day plan on a phone.
// Each cancellation puts the request back where it was (approved, its items free), so the other tests
// find the demo as they expect it.
const OFFICE = 'sam.okafor@brightline.test';
const ELECTRICIAN = 'Lee Park';
const WAITING = ['140 Cooper Hill', '311 Spindle Way', '7 Tannery Close', '58 Weaver Lane'];

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser?.close());

const inDays = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);

interface Booked {
  requestId: number;
  street: string;
  visitNumber: number;
  electricianId: number;
}

/** Books a visit on one of the waiting approved jobs for Lee Park on `date`, through the API with the page's session. */
async function bookWaitingJob(page: Page, date: string): Promise<Booked> {
  const { csrfToken } = (await (await page.request.get(portalUrl('/api/auth/csrf'))).json()) as { csrfToken: string };
  const list = (await (await page.request.get(portalUrl('/api/requests?status=approved&pageSize=100'))).json()) as { items: { id: number; street: string }[] };
  const job = WAITING.map((street) => list.items.find((r) => r.street === street)).find((r) => r !== undefined);
  expect(job).toBeDefined();
  const electricians = (await (await page.request.get(portalUrl('/api/day-plan/electricians'))).json()) as { id: number; name: string }[];
  const electricianId = electricians.find((e) => e.name === ELECTRICIAN)!.id;
  const res = await page.request.post(portalUrl(`/api/requests/${job!.id}/visits`), {
    headers: { 'x-csrf-token': csrfToken },
    data: { date, arrivalFrom: '13:00', arrivalTo: '15:00', electricianId },
  });
  expect(res.status()).toBe(201);
  return { requestId: job!.id, street: job!.street, visitNumber: ((await res.json()) as { number: number }).number, electricianId };
}

async function openDay(page: Page, date: string, electricianId: number): Promise<void> {
  await page.goto(portalUrl(`/day-plan?date=${date}&electricianId=${electricianId}`));
  await page.getByTestId('day-plan-heading').waitFor();
  await page.getByTestId('day-plan-summary').waitFor();
}

/** The index of the day plan's stop at `street`, or -1. */
async function stopIndex(page: Page, street: string): Promise<number> {
  const titles = await page.locator('[data-testid^="day-plan-stop-"] mat-card-title').allTextContents();
  return titles.findIndex((t) => t.includes(street));
}

/** Fills the cancel dialog: first without a reason (the field says what is missing), then with one. */
async function cancelInDialog(page: Page, reason: string, shot: string): Promise<void> {
  await page.getByTestId('cancel-visit-reason').waitFor();
  await page.getByTestId('cancel-visit-go').click();
  const fieldError = page.getByTestId('cancel-visit-reason-error');
  await fieldError.waitFor();
  expect((await fieldError.textContent())?.trim()).toBe('Say why the visit is cancelled');
  await screenshot(page, shot);
  await page.getByTestId('cancel-visit-reason').fill(reason);
  await page.getByTestId('cancel-visit-go').click();
  await page.getByTestId('cancel-visit-reason').waitFor({ state: 'detached' });
}

describe('cancelling a booked visit', () => {
  it('on the request’s visits page: the contractor gives a reason, sees the visit cancelled, and the day plan no longer lists it', async () => {
    const page = await openPage(browser);
    const problems = watchConsole(page);
    await signInAs(page, OFFICE);
    const date = inDays(33);
    const booked = await bookWaitingJob(page, date);

    await openDay(page, date, booked.electricianId);
    expect(await stopIndex(page, booked.street)).toBeGreaterThanOrEqual(0);
    await expectAccessible(page);

    await page.goto(portalUrl(`/requests/${booked.requestId}/work`));
    const card = page.getByTestId(`visit-${booked.visitNumber}`);
    await card.waitFor();
    expect(await page.getByTestId('work-next').textContent()).toContain('Start the visit: the contractor');
    await expectAccessible(page);
    await card.getByTestId('visit-cancel').click();
    const reason = 'The seller cancelled the showing day; booking again next week';
    await cancelInDialog(page, reason, 'cancel-visit-dialog-desktop');

    await card.getByTestId('visit-cancellation').waitFor();
    expect(await card.getByTestId('visit-status').textContent()).toBe('Cancelled');
    expect(await card.getByTestId('visit-cancellation').textContent()).toContain(reason);
    expect(await card.getByTestId('visit-cancellation').textContent()).toContain('Sam Okafor');
    expect(await card.getByTestId('visit-cancel').count()).toBe(0);
    // The last visit booked: the request is approved again and waits for the contractor to book.
    await page.getByTestId('work-status').filter({ hasText: 'Approved' }).waitFor();
    expect(await page.getByTestId('work-next').textContent()).toContain('Book a visit: the contractor');
    await screenshot(page, 'visit-cancelled-desktop');
    await expectAccessible(page);

    await openDay(page, date, booked.electricianId);
    expect(await stopIndex(page, booked.street)).toBe(-1);
    await expectAccessible(page);
    expect(problems).toEqual([]);
    await page.close();
  });

  it('from the day plan on a phone (390 px): the stop goes, the visits page shows it cancelled, nothing wider than the screen', async () => {
    const page = await openPage(browser, { viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
    const problems = watchConsole(page);
    await signInAs(page, OFFICE);
    const date = inDays(34);
    const booked = await bookWaitingJob(page, date);

    await openDay(page, date, booked.electricianId);
    const index = await stopIndex(page, booked.street);
    expect(index).toBeGreaterThanOrEqual(0);
    await page.getByTestId(`day-plan-cancel-${index}`).click();
    await cancelInDialog(page, 'Occupant ill', 'cancel-visit-dialog-phone');
    await screenshot(page, 'visit-cancelled-day-plan-phone');
    await page.waitForFunction((street) => !Array.from(document.querySelectorAll('[data-testid^="day-plan-stop-"] mat-card-title')).some((t) => t.textContent?.includes(street)), booked.street);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    expect(await tablesWiderThanViewport(page)).toEqual([]);
    await expectAccessible(page);

    await page.goto(portalUrl(`/requests/${booked.requestId}/work`));
    const card = page.getByTestId(`visit-${booked.visitNumber}`);
    await card.getByTestId('visit-cancellation').waitFor();
    expect(await card.getByTestId('visit-cancellation').textContent()).toContain('Occupant ill');
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    expect(await tablesWiderThanViewport(page)).toEqual([]);
    await screenshot(page, 'visit-cancelled-phone');
    await expectAccessible(page);
    expect(problems).toEqual([]);
    await page.close();
  });
});

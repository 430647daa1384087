// An e-mail of the proof side, end to end in the portal: the contractor records an item's outcome, the
// administrator reads the message to the seller in the development mailbox (text and HTML, with the
// link to the visits and proof page), and the seller follows that link.
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, openPage, portalUrl, screenshot, signInAs } from '../helpers/browser';

// Generous: a loaded 2-core CI machine takes minutes for three sign-ins, a form and axe on each page.
jest.setTimeout(300_000);

// The demo scenario (seeds/data/demo-scenario.ts): Brightline's work at 87 Tinsmith Way is under way;
// Ellen Brooks is the seller. Only this file records outcomes there.
const STREET = '87 Tinsmith Way';
const CONTRACTOR = 'sam.okafor@brightline.test';
const SELLER = 'ellen.brooks@mail.test';
const ITEM = 'Junction box without a cover, or splices outside a box';
const DESKTOP = { width: 1366, height: 900 };
const PHONE = { width: 390, height: 844 };

let browser: Browser;
let page: Page;

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser?.close());
afterEach(() => page?.close());

describe('an item’s outcome is e-mailed to the seller with the link to the proof page', () => {
  it('the contractor records that the attic junction boxes could not be corrected; the administrator reads the seller’s message in the development mailbox, text and HTML; the seller follows its link', async () => {
    page = await openPage(browser, { viewport: DESKTOP });
    await signInAs(page, CONTRACTOR);
    await page.getByTestId('request-row').filter({ hasText: STREET }).click();
    await page.getByTestId('request-work-link').click();
    await page.getByTestId('work-heading').waitFor();
    const workPath = new URL(page.url()).pathname;
    expect(workPath).toMatch(/^\/requests\/\d+\/work$/);

    await page.locator('mat-card').filter({ hasText: ITEM }).getByTestId('record-outcome').click();
    await page.getByTestId('correction-heading').waitFor();
    await page.getByRole('radio', { name: 'Could not correct' }).check();
    await page.getByTestId('correction-reason').fill('The attic is closed off by the seller’s stored furniture; the boxes are reachable once it is moved.');
    await page.getByTestId('correction-save').click();
    await page.waitForURL((url) => url.pathname === workPath);
    await page.getByTestId('work-heading').waitFor();
    await screenshot(page, 'proof-message-outcome-saved-desktop');
    await page.close();

    page = await openPage(browser, { viewport: DESKTOP });
    await signInAs(page, 'admin@closingcircuit.test');
    // The outbox worker sends a moment after the commit: look again until it is there.
    const item = page.getByTestId('mailbox-item').filter({ hasText: SELLER }).filter({ hasText: 'could not correct' });
    for (let tries = 0; tries < 30 && !(await item.count()); tries++) {
      await page.goto(portalUrl('/mailbox'));
      await page.getByTestId('mailbox-heading').waitFor();
      await page.waitForLoadState('networkidle');
    }
    await item.first().click();
    const text = await page.getByTestId('mailbox-text').textContent();
    expect(text).toContain('Hello Ellen Brooks,');
    expect(text).toContain(`The contractor could not correct “${ITEM} (Attic above garage)” at ${STREET}`);
    expect(text).toContain(`See the item: ${portalUrl(workPath)}`);
    await page.getByRole('tab', { name: 'HTML' }).click();
    expect(await page.getByTestId('mailbox-html').getByRole('link', { name: 'See the item' }).getAttribute('href')).toBe(portalUrl(workPath));
    await screenshot(page, 'proof-message-mailbox-desktop');
    await page.setViewportSize(PHONE);
    await screenshot(page, 'proof-message-mailbox-phone');
    await page.close();

    page = await openPage(browser, { viewport: PHONE });
    await signInAs(page, SELLER);
    await page.goto(portalUrl(workPath));
    await page.getByTestId('work-heading').waitFor();
    await page.getByText('The attic is closed off by the seller’s stored furniture').first().waitFor();
    await screenshot(page, 'proof-message-link-phone');
  });
});

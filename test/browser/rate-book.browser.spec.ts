import type { Browser } from 'playwright-core';
import { launchBrowser, openPage, portalUrl, screenshot, signInAs } from '../helpers/browser';

jest.setTimeout(180_000);

// The demo scenario seeds Brightline Electric's rate book from the demo entries (shared/src/pricing/
// demo-rate-book.ts); Sam Okafor works for Brightline. This file only reads the rate book.
const CONTRACTOR = 'sam.okafor@brightline.test';

/** Words of other pricing schemes that this product does not use (its terms: rate book, entry, flat rate, time and materials). */
const FOREIGN_WORDS = /price[- ]?book|\btasks?\b/i;

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser?.close());

describe('the rate book in the product’s own words', () => {
  it('shows flat-rate entries by their names, modes and finding labels, and exports a CSV in the same words', async () => {
    const page = await openPage(browser, { viewport: { width: 1366, height: 900 } });
    await signInAs(page, CONTRACTOR);
    await page.goto(portalUrl('/rate-book'));
    await page.getByTestId('rate-book-heading').waitFor();
    await page.getByRole('tab', { name: /^Entries/ }).click();

    const gfci = page.getByTestId('entry-row').filter({ hasText: 'Replace GFCI receptacle, flat rate' });
    await gfci.waitFor();
    expect(await gfci.textContent()).toContain('Flat rate');
    // The finding is named in plain words, not by its code.
    expect(await gfci.textContent()).toContain('GFCI');
    expect(await gfci.textContent()).not.toContain('gfci-inoperative');
    await page.getByTestId('entry-row').filter({ hasText: 'AFCI breaker upgrade, flat rate' }).waitFor();

    const text = (await page.locator('main').textContent()) ?? '';
    expect(text).not.toMatch(FOREIGN_WORDS);
    await screenshot(page, 'rate-book-entries');

    const csv = await page.request.get(portalUrl('/api/rate-book/entries.csv'));
    expect(csv.ok()).toBe(true);
    const body = await csv.text();
    expect(body).toContain('Replace GFCI receptacle, flat rate');
    expect(body).not.toMatch(FOREIGN_WORDS);
    await page.close();
  });
});

// E-mail, the activity timeline and the dashboards, as people use them in the portal.
import type { Browser, Page } from 'playwright-core';
import { seriousViolations } from '../helpers/axe';
import { openPage, launchBrowser, portalUrl, screenshot, signInAs } from '../helpers/browser';

// Generous: a loaded 2-core CI machine takes minutes for a sign-in, a form and axe on each page.
jest.setTimeout(300_000);

let browser: Browser;
let page: Page;
const DESKTOP = { width: 1366, height: 900 };
const PHONE = { width: 390, height: 844 };
const SELLER = `new.seller.${Date.now().toString(36)}@mail.test`;

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser?.close());
afterEach(() => page?.close());

async function open(viewport = DESKTOP): Promise<Page> {
  page = await openPage(browser, { viewport });
  return page;
}

describe('an invitation goes out by e-mail and is in the timeline', () => {
  it('the agent invites a seller without an account; the page says it was e-mailed; the timeline lists it; the administrator reads it in the development mailbox, text and HTML', async () => {
    await open();
    await signInAs(page, 'maya.chen@juniperkey.test');
    await page.goto(portalUrl('/requests/new'));
    await page.getByTestId('request-form-street').fill('12 Quarry Bend Court');
    await page.getByTestId('request-form-city').fill('Marlow Springs');
    await page.getByTestId('request-form-state').click();
    await page.getByRole('option', { name: 'Colorado (CO)', exact: true }).click();
    await page.getByTestId('request-form-zip').fill('81290');
    await page.getByTestId('request-form-year-built').fill('1971');
    await page.getByTestId('request-form-closing-date').fill('2/12/2027');
    await page.getByTestId('request-form-seller-email').fill(SELLER);
    await page.getByTestId('request-form-submit').click();
    await page.getByTestId('request-detail-heading').waitFor();
    const requestPath = new URL(page.url()).pathname;

    expect(await page.getByTestId('invite-pending').first().textContent()).toContain(`e-mailed to ${SELLER}`);
    const entries = page.getByTestId('activity-entry');
    await entries.first().waitFor();
    await page.getByTestId('activity-filter-parties').click();
    await page.getByTestId('activity-entry').filter({ hasText: 'You are invited' }).waitFor();
    const kinds = await page.getByTestId('activity-entry').evaluateAll((els) => els.map((e) => e.getAttribute('data-kind')));
    expect(new Set(kinds)).toEqual(new Set(['parties']));
    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, 'request-activity-desktop');
    await page.setViewportSize(PHONE);
    await screenshot(page, 'request-activity-phone');
    await page.close();

    await open();
    await signInAs(page, 'admin@closingcircuit.test');
    const item = page.getByTestId('mailbox-item').filter({ hasText: SELLER });
    for (let tries = 0; tries < 30 && !(await item.count()); tries++) {
      await page.goto(portalUrl('/mailbox'));
      await page.getByTestId('mailbox-heading').waitFor();
      await page.waitForLoadState('networkidle');
    }
    await item.first().click();
    const text = await page.getByTestId('mailbox-text').textContent();
    expect(text).toContain('You have been named seller on repair request');
    expect(text).toMatch(new RegExp(`Open the invitation: ${portalUrl('/invite/')}\\S+`));
    expect(requestPath).toMatch(/^\/requests\/\d+$/);
    await page.getByRole('tab', { name: 'HTML' }).click();
    expect(await page.getByTestId('mailbox-html').getByRole('link', { name: 'Open the invitation' }).getAttribute('href')).toContain('/invite/');
    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, 'mailbox-desktop');

    // Phone (review 7, P5-5): a tapped message takes the list's place at once, with a way back, and the
    // list is filtered by request and recipient on the server.
    await page.setViewportSize(PHONE);
    await page.goto(portalUrl('/mailbox'));
    await page.getByTestId('mailbox-item').first().waitFor();
    await screenshot(page, 'mailbox-phone');
    const items = page.getByTestId('mailbox-item');
    const tapped = items.nth(Math.min((await items.count()) - 1, 9));
    const tappedSubject = (await tapped.locator('.subject').textContent())!.trim();
    await tapped.click();
    const reader = page.getByTestId('mailbox-message');
    await page.getByTestId('mailbox-back').waitFor();
    const box = (await reader.boundingBox())!;
    expect(box.y).toBeGreaterThanOrEqual(0);
    expect(box.y).toBeLessThan(PHONE.height / 3);
    expect(await reader.getByRole('heading').or(reader.locator('mat-card-title')).first().textContent()).toContain(tappedSubject);
    expect(await items.first().isVisible()).toBe(false);
    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, 'mailbox-phone-reading');
    await page.getByTestId('mailbox-back').click();
    await items.first().waitFor();
    expect(await reader.isVisible()).toBe(false);

    const reference = `CC-${requestPath.split('/').pop()!.padStart(5, '0')}`;
    await page.getByTestId('mailbox-filter-request').fill('house 12');
    await page.getByTestId('mailbox-filter-apply').click();
    await page.getByText('Type a request reference, such as CC-00008').waitFor();
    await page.getByTestId('mailbox-filter-request').fill(reference);
    await page.getByTestId('mailbox-filter-to').fill(SELLER.toUpperCase());
    await page.getByTestId('mailbox-filter-apply').click();
    // The filtered page replaces the whole list: only the invitation's messages to the new seller.
    await page.waitForFunction((seller) => {
      const shown = [...document.querySelectorAll('[data-testid="mailbox-item"]')];
      return shown.length > 0 && shown.every((e) => e.textContent?.includes(seller));
    }, SELLER);
    const found = await items.allTextContents();
    expect(found.length).toBeGreaterThan(0);
    for (const text of found) expect(text).toContain(SELLER);
    expect(await seriousViolations(page)).toEqual([]);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
    await screenshot(page, 'mailbox-phone-filtered');
  });
});

describe('dashboards', () => {
  it('the agent sees the open requests by closing date with risk, the finished ones, and the items by status', async () => {
    await open();
    await signInAs(page, 'maya.chen@juniperkey.test');
    await page.getByTestId('nav-dashboard').click();
    await page.getByTestId('dashboard-heading').waitFor();
    await page.getByTestId('dashboard-request').first().waitFor();
    expect(await page.getByTestId('dashboard-request').count()).toBeGreaterThan(0);
    expect(await page.getByTestId('dashboard-request').first().textContent()).toMatch(/Closing .* (left|ago)/);
    // Finished requests stay on the dashboard in their own section (review 7, P4-2): the demo's
    // accepted 640 Bellweather Road (closing today) and withdrawn 301 Kestrel Point are Maya's.
    await page.getByTestId('finished-request').first().waitFor();
    const finished = await page.getByTestId('finished-request').allTextContents();
    expect(finished.some((text) => text.includes('640 Bellweather Road') && text.includes('closing today'))).toBe(true);
    expect(finished.some((text) => text.includes('301 Kestrel Point') && text.includes('Withdrawn'))).toBe(true);
    expect((await page.getByTestId('dashboard-request').allTextContents()).some((text) => text.includes('640 Bellweather Road'))).toBe(false);
    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, 'agent-dashboard-desktop');
    await page.setViewportSize(PHONE);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
    await screenshot(page, 'agent-dashboard-phone');
  });

  it('the contractor sees the pipeline, revenue by month with its chart, and the agents who send work', async () => {
    await open();
    await signInAs(page, 'sam.okafor@brightline.test');
    await page.goto(portalUrl('/dashboard'));
    await page.getByTestId('pipeline-to-price').waitFor();
    expect(await page.getByTestId('pipeline-to-price').textContent()).toContain('To price');
    await page.locator('canvas[aria-label^="Revenue"]').waitFor();
    expect(await page.getByTestId('revenue-table').locator('tbody tr').count()).toBe(6);
    await page.getByRole('radio', { name: '12 months' }).click();
    await page.getByTestId('revenue-table').locator('tbody tr').nth(11).waitFor();
    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, 'contractor-dashboard-desktop');
    await page.setViewportSize(PHONE);
    const width = await page.evaluate(() => document.documentElement.scrollWidth);
    expect(width).toBeLessThanOrEqual(PHONE.width);
    await screenshot(page, 'contractor-dashboard-phone');
  });
});

describe('message preferences', () => {
  it('a seller turns “Quote sent” into the daily digest and saves', async () => {
    await open(PHONE);
    await signInAs(page, 'ellen.brooks@mail.test');
    await page.goto(portalUrl('/account'));
    const row = page.getByTestId('pref-quote-sent');
    await row.waitFor();
    await row.getByRole('radio', { name: 'Daily digest' }).click();
    await page.getByTestId('save-preferences').click();
    await page.getByText('Your e-mail choices are saved.').waitFor();
    await page.reload();
    await page.getByTestId('pref-quote-sent').waitFor();
    expect(await page.getByTestId('pref-quote-sent').getByRole('radio', { name: 'Daily digest' }).getAttribute('aria-checked')).toBe('true');
    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, 'preferences-phone');
  });
});

import { existsSync } from 'node:fs';
import type { Browser, Page } from 'playwright-core';
import { expectAccessible, launchBrowser, openPage, portalUrl, screenshot, signInAs } from '../helpers/browser';

jest.setTimeout(180_000);

let browser: Browser;
let page: Page;

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser?.close());
beforeEach(async () => {
  page = await openPage(browser, { viewport: { width: 1280, height: 900 } });
});
afterEach(() => page?.close());

describe('a buyer’s agent opens a repair request', () => {
  it('signs in, fills the form, and finds the new request in the list', async () => {
    await signInAs(page, 'maya.chen@juniperkey.test');
    await page.getByTestId('request-list-heading').waitFor();
    await page.getByTestId('request-list-new').click();
    await page.getByTestId('request-form-heading').waitFor();
    await expectAccessible(page);

    // Submitting an empty form shows field messages and stays on the form.
    await page.getByTestId('request-form-submit').click();
    await page.getByText('Enter the street address').waitFor();

    await page.getByTestId('request-form-street').fill('77 Juniper Switchback');
    await page.getByTestId('request-form-city').fill('Marlow Springs');
    await page.getByTestId('request-form-state').click();
    await page.getByRole('option', { name: 'Colorado (CO)', exact: true }).click();
    await page.getByTestId('request-form-zip').fill('81290');
    await page.getByTestId('request-form-year-built').fill('1964');
    await page.getByTestId('request-form-closing-date').fill('1/20/2027');
    await page.getByTestId('request-form-seller-email').fill('walt.simms@mail.test');
    await page.getByTestId('request-form-submit').click();

    await page.getByTestId('request-detail-heading').waitFor();
    expect(await page.getByTestId('request-detail-heading').textContent()).toContain('77 Juniper Switchback');
    await page.getByTestId('invite-url').first().waitFor();
    await expectAccessible(page);

    await page.goto(portalUrl('/requests'));
    const row = page.getByTestId('request-row').filter({ hasText: '77 Juniper Switchback' });
    await row.waitFor();
    expect(await row.textContent()).toContain('Draft');
    expect(existsSync(await screenshot(page, 'agent-request-list'))).toBe(true);
  });
});

describe('the portal shell', () => {
  it('loads its own fonts and icons from the app, within the content security policy', async () => {
    const violations: string[] = [];
    const outside: string[] = [];
    page.on('console', (m) => {
      if (/Content Security Policy/i.test(m.text())) violations.push(m.text());
    });
    page.on('request', (r) => {
      if (!r.url().startsWith(portalUrl(''))) outside.push(r.url());
    });
    await signInAs(page, 'maya.chen@juniperkey.test');
    await page.getByTestId('request-row').first().waitFor();
    const fonts = await page.evaluate(async () => {
      await document.fonts.ready;
      return {
        icons: document.fonts.check('24px "Material Symbols Outlined"', 'home'),
        text: document.fonts.check('16px "Source Sans 3"'),
        loaded: [...document.fonts].filter((f) => f.status === 'loaded').map((f) => f.family),
      };
    });
    expect(fonts.loaded).toEqual(expect.arrayContaining(['Material Symbols Outlined', 'Source Sans 3']));
    expect(fonts.icons && fonts.text).toBe(true);
    expect(violations).toEqual([]);
    expect(outside).toEqual([]);
  });
});

describe('what each role sees', () => {
  it('shows the contractor only requests assigned to its firm', async () => {
    await signInAs(page, 'jo.fenn@copperleaf.test');
    await page.getByTestId('request-row').first().waitFor();
    const rows = await page.getByTestId('request-row').allTextContents();
    // Copperleaf is assigned to two requests in the demo scenario, both in Quarry Bend.
    expect(rows.length).toBe(2);
    expect(rows.every((r) => r.includes('Quarry Bend'))).toBe(true);
  });

  it('answers a request of someone else with the not-found page', async () => {
    await signInAs(page, 'jo.fenn@copperleaf.test');
    await page.goto(portalUrl('/requests/1'));
    await page.getByTestId('not-found-heading').or(page.getByText(/no such|not found/i)).first().waitFor();
    await expectAccessible(page);
  });
});

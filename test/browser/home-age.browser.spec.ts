// Home age: a buyer's agent reads, per item, whether the code in force when the house was built
// asked for the protection, and filters the request list by build year. The test opens its own
// 1978 request (through the API, with the signed-in page's cookies) so it owns its data.
import { existsSync } from 'node:fs';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launchBrowser, portalUrl, screenshot, signInAs } from '../helpers/browser';
import { axeOf } from '../helpers/axe';

jest.setTimeout(180_000);

const AGENT = 'maya.chen@juniperkey.test';

const REPORT = [
  'Section 7 - Electrical',
  '7.1 Two receptacles in the primary bathroom are not GFCI protected.',
  '7.2 The receptacles at the kitchen countertop are not GFCI protected (2 locations).',
].join('\n');

let browser: Browser;
let context: BrowserContext;
let page: Page;

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser?.close());
beforeEach(async () => {
  // A context of its own: axe needs the page's context to run in its frames.
  context = await browser.newContext({ viewport: { width: 1366, height: 900 } });
  page = await context.newPage();
});
afterEach(() => context?.close());

/** Serious and critical accessibility problems axe finds on the page as it is now. */
async function seriousViolations(): Promise<string[]> {
  const { violations } = await axeOf(page).analyze();
  return violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`);
}

async function newRequest(street: string, yearBuilt: number): Promise<number> {
  const { csrfToken } = (await (await page.request.get(portalUrl('/api/auth/csrf'))).json()) as { csrfToken: string };
  const res = await page.request.post(portalUrl('/api/requests'), {
    headers: { 'x-csrf-token': csrfToken },
    data: { street, city: 'Marlow Springs', state: 'CO', zip: '81290', yearBuilt, closingDate: '2027-03-05' },
  });
  expect(res.status()).toBe(201);
  return ((await res.json()) as { id: number }).id;
}

describe('the code in force when the house was built', () => {
  it('tells the agent, per item of a 1978 house, what its code asked for and what is a recommended upgrade', async () => {
    await signInAs(page, AGENT);
    const street = `${Date.now() % 100000} Switchback Lane`;
    const id = await newRequest(street, 1978);
    await page.goto(portalUrl(`/requests/${id}`));
    await page.getByTestId('paste-toggle').click();
    await page.getByTestId('paste-text').fill(REPORT);
    await page.getByTestId('paste-submit').click();
    await page.getByTestId('parse-result-proposed').waitFor();
    const rows = page.getByTestId('review-item-row');
    await rows.nth(1).waitFor();

    // From memory (commonly quoted dates): bathroom receptacles 1975, the kitchen counter near the
    // sink 1987. The adopted edition for Colorado here is 2023; replacements: NEC 406.4(D)(3).
    const bathroom = rows.filter({ hasText: 'bathroom' }).getByTestId('edition-note');
    expect(await bathroom.getByTestId('edition-note-summary').innerText()).toBe('GFCI: required when this 1978 house was built; required for any replacement today');
    await bathroom.getByTestId('edition-note-summary').click();
    await bathroom.getByTestId('edition-note-text').waitFor({ state: 'visible' });
    const bathroomText = await bathroom.getByTestId('edition-note-text').innerText();
    expect(bathroomText).toContain(
      'GFCI protection for bathroom receptacles was first required in 1975 (the year as commonly cited; check it in that edition), so this house was built under a code that asked for it.',
    );
    expect(bathroomText).toContain('the authority having jurisdiction decides');

    const kitchen = rows.filter({ hasText: 'kitchen' }).getByTestId('edition-note');
    await kitchen.getByTestId('edition-note-summary').click();
    await kitchen.getByTestId('edition-note-text').waitFor({ state: 'visible' });
    const kitchenText = await kitchen.getByTestId('edition-note-text').innerText();
    expect(kitchenText).toContain('GFCI protection for kitchen counter-top receptacles within 6 ft of the sink was first required in 1987 (the year as commonly cited; check it in that edition), after this house was built.');
    expect(kitchenText).toContain('adding it is recommended for safety, not a code violation of the original work');
    expect(kitchenText).toContain('GFCI protection is required here for new work and for any replacement today (NEC 406.4(D)(3))');

    expect(await seriousViolations()).toEqual([]);
    expect(existsSync(await screenshot(page, 'home-age-review-desktop'))).toBe(true);
    await page.setViewportSize({ width: 390, height: 844 });
    await kitchen.getByTestId('edition-note-text').waitFor({ state: 'visible' });
    expect(existsSync(await screenshot(page, 'home-age-review-phone'))).toBe(true);
  });

  it('lists only the houses built before the chosen year', async () => {
    await signInAs(page, AGENT);
    const street = `${Date.now() % 100000} Gable End Road`;
    await newRequest(street, 1978);
    await page.goto(portalUrl('/requests'));
    // The agent has more requests than one page holds: find the new one by its street.
    await page.getByTestId('request-list-search').fill(street);
    await page.getByTestId('request-row').filter({ hasText: street }).waitFor();

    await page.getByTestId('request-list-built').click();
    await page.getByRole('option', { name: 'Built before 1975' }).click();
    await page.getByTestId('request-row').filter({ hasText: street }).waitFor({ state: 'detached' });
    await page.getByTestId('request-list-empty').waitFor();
    await page.getByTestId('request-list-search').fill('');
    await page.getByTestId('request-row').first().waitFor();
    const places = await page.locator('[data-testid="request-row"] .place').allInnerTexts();
    expect(places.length).toBeGreaterThan(0);
    for (const place of places) expect(Number(/built (\d{4})/.exec(place)?.[1])).toBeLessThan(1975);

    expect(await seriousViolations()).toEqual([]);
    expect(existsSync(await screenshot(page, 'home-age-list-desktop'))).toBe(true);
    await page.setViewportSize({ width: 390, height: 844 });
    expect(existsSync(await screenshot(page, 'home-age-list-phone'))).toBe(true);
  });
});

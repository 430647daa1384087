// Upload → parse → review → confirm in the portal, for a PDF, a text file and pasted text. Each test
// opens its own repair request (through the API, with the signed-in page's cookies) so it owns its data.
import { existsSync } from 'node:fs';
import type { Browser, Page } from 'playwright-core';
import { REQUEST_STATUS_LABELS } from '@cc/shared';
import { expectAccessible, launchBrowser, openPage, portalUrl, screenshot, signInAs, watchConsole } from '../helpers/browser';
import { textPdf } from '../helpers/pdf-fixtures';
import { axeOf } from '../helpers/axe';

jest.setTimeout(180_000);

const AGENT = 'maya.chen@juniperkey.test';

// An invented two-page report excerpt: three electrical findings and a roofing passage.
const PDF_PAGES = [
  'ELECTRICAL\n1. The receptacles at the kitchen countertop are not GFCI protected (3 locations).\n2. Reversed polarity at the primary bedroom receptacle near the window.',
  'ROOFING\nThe shingles on the north slope are curling.\n\nELECTRICAL (continued)\n3. Double tap observed at the 20 amp breaker in the main panel.',
];

const TEXT_REPORT = [
  'Section 7 - Electrical',
  '7.1 Two receptacles in the primary bathroom are not GFCI protected.',
  '7.2 The exterior receptacle at the rear patio has no weatherproof cover.',
  '',
  'Section 8 - Roofing',
  'Shingles are lifting at the ridge. The heat cable along the gutter hangs loose from its clips.',
].join('\n');

// A report with one passage the reader names electrical things in but makes no item of.
const UNITEMISED_REPORT = [
  'Section 7 - Electrical',
  '7.1 Two receptacles in the primary bathroom are not GFCI protected.',
  '7.2 The receptacle behind the washer in the laundry room makes a popping sound when a plug is inserted.',
].join('\n');

let browser: Browser;
let page: Page;

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser?.close());
beforeEach(async () => {
  page = await openPage(browser, { viewport: { width: 1440, height: 1000 } });
});
afterEach(() => page?.close());

/** A new draft request of the signed-in agent, made with the page's own session and CSRF token. */
async function newRequest(street: string): Promise<number> {
  const { csrfToken } = (await (await page.request.get(portalUrl('/api/auth/csrf'))).json()) as { csrfToken: string };
  const res = await page.request.post(portalUrl('/api/requests'), {
    headers: { 'x-csrf-token': csrfToken },
    data: { street, city: 'Marlow Springs', state: 'CO', zip: '81290', yearBuilt: 1968, closingDate: '2027-02-12' },
  });
  expect(res.status()).toBe(201);
  return ((await res.json()) as { id: number }).id;
}

async function openNewRequest(street: string): Promise<void> {
  await signInAs(page, AGENT);
  const id = await newRequest(`${street} ${Date.now() % 100000}`);
  await page.goto(portalUrl(`/requests/${id}`));
  await page.getByTestId('request-detail-heading').waitFor();
  await page.getByTestId('report-drop-zone').waitFor();
  await expectAccessible(page);
}

async function confirmAndExpectPricing(count: number): Promise<void> {
  await page.getByTestId('review-confirm').click();
  // Confirming cannot be taken back, so the portal asks first.
  expect(await page.getByTestId('confirm-message').textContent()).toContain('can no longer be changed');
  await page.getByTestId('confirm-go').click();
  await page.getByTestId('request-detail-status').filter({ hasText: REQUEST_STATUS_LABELS.pricing }).waitFor();
  await page.getByTestId('line-item-status').filter({ hasText: 'Confirmed' }).nth(count - 1).waitFor();
  expect(await page.getByTestId('line-item-row').count()).toBe(count);
  expect(await page.getByTestId('line-item-status').allTextContents()).toEqual(Array(count).fill('Confirmed'));
  // The review is over: nothing can be uploaded or edited any more.
  expect(await page.getByTestId('report-drop-zone').count()).toBe(0);
  expect(await page.getByTestId('review-item-edit').count()).toBe(0);
}

/** Selects `needle` in the report text the way a mouse would, and lets the view read the selection. */
async function selectReportText(needle: string): Promise<void> {
  // The report text is drawn after the items; wait until it holds the passage before selecting.
  await page.getByTestId('report-text').filter({ hasText: needle }).waitFor();
  await page.evaluate((text) => {
    const root = document.querySelector('[data-testid="report-text"]')!;
    const walker = document.createTreeWalker(root, NodeFilter.SHOW_TEXT);
    while (walker.nextNode()) {
      const node = walker.currentNode;
      const at = node.textContent!.indexOf(text);
      if (at < 0) continue;
      const range = document.createRange();
      range.setStart(node, at);
      range.setEnd(node, at + text.length);
      const selection = window.getSelection()!;
      selection.removeAllRanges();
      selection.addRange(range);
      root.dispatchEvent(new MouseEvent('mouseup', { bubbles: true }));
      return;
    }
    throw new Error(`"${text}" is not in the report text`);
  }, needle);
}

describe('a buyer’s agent takes in an inspection report', () => {
  it('uploads a PDF, reviews the proposed items beside the highlighted text, edits one and confirms', async () => {
    await openNewRequest('Breaker Hollow');
    const problems = watchConsole(page);
    await page.getByTestId('report-file-input').setInputFiles({ name: 'inspection-excerpt.pdf', mimeType: 'application/pdf', buffer: await textPdf(PDF_PAGES) });

    await page.getByTestId('parse-result-proposed').waitFor();
    await page.getByTestId('review-item-row').nth(2).waitFor();
    // The upload loads the lists once: no request started and then cancelled, nothing in the console.
    expect(problems).toEqual([]);
    expect(await page.getByTestId('parse-result-proposed').textContent()).toBe('3 items proposed');
    // The first report moves the request from draft into review.
    await page.getByTestId('request-detail-status').filter({ hasText: REQUEST_STATUS_LABELS.intake }).waitFor();

    const rows = page.getByTestId('review-item-row');
    await rows.nth(2).waitFor();
    expect(await rows.count()).toBe(3);
    expect(await page.getByTestId('review-item-label').allTextContents()).toEqual([
      'No ground-fault (GFCI) protection where it is expected',
      'Hot and neutral reversed at a receptacle',
      'Two conductors under one breaker terminal not listed for it',
    ]);
    // Each item's evidence is highlighted in the extracted text; the third is on page 2.
    const marks = page.getByTestId('evidence-mark');
    expect(await marks.count()).toBe(3);
    expect(await marks.nth(0).textContent()).toContain('not GFCI protected');
    expect(await page.locator('[data-page="2"] [data-testid="evidence-mark"]').textContent()).toContain('Double tap');
    // The GFCI item carries its code-edition note, worded as information.
    expect(await rows.nth(0).getByTestId('edition-note').textContent()).toContain('information');

    // Clicking an item marks its evidence in the text.
    await rows.nth(1).click();
    await page.locator('mark.is-active').waitFor();
    expect(await page.locator('mark.is-active').textContent()).toContain('Reversed polarity');

    // The skipped roofing passage is listed for a second look.
    await page.getByTestId('skipped-text').click();
    await page.getByTestId('skipped-passage').filter({ hasText: 'shingles' }).waitFor();
    expect(existsSync(await screenshot(page, 'intake-pdf-review'))).toBe(true);

    // Correct the reader: the double tap is in the garage subpanel, and there are two.
    await rows.nth(2).getByTestId('review-item-edit').click();
    await page.getByTestId('item-edit-location').fill('garage subpanel, 20 A breaker');
    await page.getByTestId('item-edit-quantity').fill('2');
    await page.getByTestId('item-edit-save').click();
    await page.getByTestId('item-edit-save').waitFor({ state: 'detached' });
    await rows.nth(2).getByTestId('review-item-location').filter({ hasText: 'garage subpanel, 20 A breaker' }).waitFor();
    expect(await rows.nth(2).getByTestId('review-item-quantity').textContent()).toBe('2');
    expect(await rows.nth(2).textContent()).toContain('edited');

    // Reading the report again keeps the correction: only untouched proposals are replaced.
    await page.getByTestId('report-read-again').click();
    // Two untouched proposals read anew; the edited one is kept, not proposed again.
    await page.getByTestId('parse-result-proposed').filter({ hasText: '2 items proposed' }).waitFor();
    // The banner agrees with the list: the edited item kept from before is counted too.
    await page.getByTestId('parse-result-kept').filter({ hasText: '1 item kept from before' }).waitFor();
    expect(await page.getByTestId('parse-result-kept').textContent()).toContain('holds 3 to confirm');
    await rows.nth(2).getByTestId('review-item-location').filter({ hasText: 'garage subpanel, 20 A breaker' }).waitFor();
    expect(await rows.count()).toBe(3);

    await confirmAndExpectPricing(3);
    expect(await page.getByTestId('line-item-row').nth(2).textContent()).toContain('garage subpanel, 20 A breaker');
    expect(existsSync(await screenshot(page, 'intake-pdf-confirmed'))).toBe(true);
  });

  it('uploads a plain-text report and confirms what the reader proposed', async () => {
    await openNewRequest('Conduit Row');
    await page.getByTestId('report-file-input').setInputFiles({ name: 'report-notes.txt', mimeType: 'text/plain', buffer: Buffer.from(TEXT_REPORT, 'utf8') });
    await page.getByTestId('parse-result-proposed').waitFor();
    expect(await page.getByTestId('parse-result-proposed').textContent()).toBe('2 items proposed');
    await page.getByTestId('review-item-row').nth(1).waitFor();
    expect(await page.getByTestId('review-item-room').allTextContents()).toEqual(['Bathroom', 'Exterior']);

    await confirmAndExpectPricing(2);
    expect(existsSync(await screenshot(page, 'intake-text-confirmed'))).toBe(true);
  });

  it('pastes the report text, adds a missed finding from selected text, and confirms', async () => {
    await openNewRequest('Grounding Court');
    await page.getByTestId('paste-toggle').click();
    await page.getByTestId('paste-text').fill(TEXT_REPORT);
    await page.getByTestId('paste-submit').click();
    await page.getByTestId('parse-result-proposed').waitFor();
    expect(await page.getByTestId('parse-result-proposed').textContent()).toBe('2 items proposed');
    await page.getByTestId('review-item-row').nth(1).waitFor();

    // The reader skipped the gutter's heat cable (it sits under "Roofing", a section of another
    // trade); the agent adds it by hand.
    const missed = 'heat cable along the gutter hangs loose from its clips';
    await selectReportText(missed);
    expect(await page.getByTestId('review-selection-text').textContent()).toBe(missed);
    await page.getByTestId('review-add-from-selection').click();
    await page.getByTestId('item-edit-code').click();
    await page.getByRole('option', { name: /^Unprotected or unsecured wiring/ }).click();
    await page.getByTestId('item-edit-room').click();
    await page.getByRole('option', { name: 'Exterior', exact: true }).click();
    await page.getByTestId('item-edit-save').click();

    await page.getByTestId('review-item-row').nth(2).waitFor();
    expect(await page.getByTestId('review-confirm').textContent()).toContain('Confirm 3 items');
    const added = page.getByTestId('evidence-mark').filter({ hasText: missed });
    expect(await added.textContent()).toBe(missed);
    expect(existsSync(await screenshot(page, 'intake-paste-review'))).toBe(true);

    await confirmAndExpectPricing(3);
  });

  it('lists a passage read but not itemised and adds it as an item with one click', async () => {
    await openNewRequest('Arc Spark Lane');
    await page.getByTestId('paste-toggle').click();
    await page.getByTestId('paste-text').fill(UNITEMISED_REPORT);
    await page.getByTestId('paste-submit').click();
    await page.getByTestId('parse-result-proposed').waitFor();
    expect(await page.getByTestId('parse-result-proposed').textContent()).toBe('1 item proposed');
    await page.getByTestId('review-item-row').first().waitFor();

    // The washer receptacle passage is listed with the reader's guess, one click from an item.
    const passage = page.getByTestId('unitemised-passage').filter({ hasText: 'makes a popping sound when a plug is inserted' });
    await passage.waitFor();
    const add = passage.getByTestId('unitemised-add');
    expect(await add.textContent()).toContain('Laundry');
    expect(existsSync(await screenshot(page, 'intake-unitemised-before'))).toBe(true);
    const serious = (await axeOf(page).analyze()).violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
    expect(serious.map((v) => v.id)).toEqual([]);

    await add.click();
    await page.getByTestId('review-item-row').nth(1).waitFor();
    expect(await page.getByTestId('review-confirm').textContent()).toContain('Confirm 2 items');
    expect(await page.getByTestId('review-item-room').allTextContents()).toContain('Laundry');
    // The new item is anchored to the passage: its text is highlighted in the report.
    expect(await page.getByTestId('evidence-mark').filter({ hasText: 'makes a popping sound when a plug is inserted' }).count()).toBe(1);
    // …and no longer listed as not itemised.
    await passage.waitFor({ state: 'detached' });
    expect(existsSync(await screenshot(page, 'intake-unitemised-added'))).toBe(true);
  });
});

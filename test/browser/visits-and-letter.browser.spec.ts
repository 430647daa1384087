import { readFileSync } from 'node:fs';
import sharp from 'sharp';
import type { Browser, Page } from 'playwright-core';
import { seriousViolations } from '../helpers/axe';
import { launchBrowser, portalUrl, screenshot, signInAs } from '../helpers/browser';

jest.setTimeout(180_000);

// The demo scenario (seeds/data/demo-scenario.ts): the seller approved Brightline's work at
// 33 Mill Street (an open ground in the living room, a double tap in the panel); Sam Okafor and Lee
// Park work for Brightline, Nora Vance is the inspector. This file takes that request from approved
// to an issued letter, so no other browser test relies on it staying approved.
const STREET = '33 Mill Street';
const CONTRACTOR = 'sam.okafor@brightline.test';
const INSPECTOR = 'nora.vance@keystonelens.test';

let browser: Browser;
let requestId = '';
let verifyPath = '';
let pdfPath = '';

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser?.close());

const tomorrow = () => new Date(Date.now() + 86_400_000).toISOString().slice(0, 10);

/** A page in a context of its own (axe needs pages made through a context). */
async function openPage(options: Parameters<Browser['newContext']>[0]): Promise<Page> {
  const context = await browser.newContext(options);
  return context.newPage();
}

async function expectAccessible(page: Page): Promise<void> {
  expect(await seriousViolations(page)).toEqual([]);
}

describe('visits, corrections and the completion letter', () => {
  it('lets the contractor book a visit for the approved items', async () => {
    const page = await openPage({ viewport: { width: 1366, height: 900 } });
    await signInAs(page, CONTRACTOR);
    await page.getByTestId('request-list-heading').waitFor();
    await page.getByTestId('request-row').filter({ hasText: STREET }).click();
    await page.getByTestId('request-work-link').click();
    await page.getByTestId('work-heading').waitFor();
    requestId = /\/requests\/(\d+)\/work/.exec(page.url())?.[1] ?? '';
    expect(requestId).not.toBe('');
    expect(await page.getByTestId('work-caution').count()).toBe(1);
    expect(await page.getByRole('heading', { name: 'Before the truck rolls' }).count()).toBe(1);

    await page.getByTestId('visit-date').fill(tomorrow());
    await page.getByTestId('visit-electrician').click();
    await page.locator('mat-option').filter({ hasText: 'Lee Park' }).click();
    await page.getByTestId('visit-access').fill('Lockbox on the back door, code 2291');
    await page.getByTestId('visit-book').click();
    await page.getByTestId('visit-1').waitFor();
    expect(await page.getByTestId('visit-access-notes').textContent()).toContain('code 2291');
    expect((await page.getByTestId('work-status').textContent())?.trim()).toContain('Visit booked');
    await screenshot(page, 'work-visit-booked-desktop');
    await expectAccessible(page);
    await page.context().close();
  });

  it('lets the electrician record corrections with a photo and GFCI readings on a phone', async () => {
    const page = await openPage({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
    await signInAs(page, CONTRACTOR);
    await page.goto(portalUrl(`/requests/${requestId}/work`));
    await page.getByTestId('work-heading').waitFor();
    // The visit was booked for tomorrow: starting it today moves it to today (review 7, P3-2).
    expect(await page.getByTestId('visit-early').textContent()).toContain('Starting it now moves the visit to today');
    const bookedTitle = (await page.getByTestId('visit-1').locator('mat-card-title').textContent())?.trim();
    expect((await page.getByTestId('visit-start').textContent())?.trim()).toBe('Start it today anyway');
    await expectAccessible(page);
    await page.getByTestId('visit-start').click();
    await page.getByTestId('visit-finish').waitFor();
    expect(await page.getByTestId('visit-early').count()).toBe(0);
    await page.getByTestId('visit-1').locator('mat-card-title').filter({ hasNotText: bookedTitle ?? '' }).waitFor();

    const openGround = page.locator('mat-card').filter({ hasText: 'Three-slot receptacle with no equipment ground' });
    await openGround.getByTestId('record-outcome').click();
    await page.getByTestId('correction-heading').waitFor();
    expect(await page.getByTestId('work-caution').count()).toBe(1);
    await page.getByTestId('correction-work').fill('GFCI receptacle installed at the first outlet; downstream receptacles protected and labelled');
    await page.getByTestId('correction-make').fill('Acme Devices');
    await page.getByTestId('correction-model').fill('GF15-TR');
    await page.getByRole('checkbox', { name: 'No Equipment Ground' }).check();
    await page.getByRole('checkbox', { name: 'GFCI Protected' }).check();
    // Nothing is taken until ticked: no reading is judged before it is entered.
    expect(await page.getByTestId('correction-evaluations').count()).toBe(0);
    await page.getByTestId('gfci-taken').locator('input').check();
    await page.getByTestId('gfci-trips').locator('input').check();
    await page.getByTestId('gfci-resets').locator('input').check();
    // A count out of range says its bound, and the other readings are judged meanwhile.
    await page.getByTestId('gfci-downstream').fill('99999');
    await page.getByTestId('gfci-trip-ms').fill('25');
    await page.getByTestId('gfci-test-ma').fill('7.4');
    await page.locator('mat-error').filter({ hasText: 'Use at most 40' }).waitFor();
    // UL 943: at 7.4 mA a Class A GFCI trips within (20/7.4)^1.43 ≈ 4.14 s; 25 ms is within.
    const tripTime = page.getByTestId('reading-gfci.tripTimeMs');
    await tripTime.filter({ hasText: 'Within range' }).waitFor();
    await page.getByTestId('gfci-downstream').fill('3');
    await page.getByTestId('receptacle-taken').locator('input').check();
    await page.getByTestId('polarity-correct').locator('input').check();
    expect(await tripTime.textContent()).toContain('UL 943');
    // No ground, but labelled "No Equipment Ground" under GFCI protection (NFPA 70 (NEC) 406.4(D)(2)).
    await page.getByTestId('reading-receptacle.groundPresent').filter({ hasText: 'Within range' }).waitFor();

    const photo = await sharp({ create: { width: 800, height: 600, channels: 3, background: '#d35400' } }).jpeg().toBuffer();
    await page.getByTestId('photo-after').setInputFiles({ name: 'after-living-room.jpg', mimeType: 'image/jpeg', buffer: photo });
    await page.getByText('after-living-room.jpg').waitFor();
    await screenshot(page, 'correction-form-phone');
    await expectAccessible(page);
    const width = await page.evaluate(() => document.documentElement.scrollWidth);
    expect(width).toBeLessThanOrEqual(390);
    await page.getByTestId('correction-save').click();
    await page.getByTestId('work-heading').waitFor();
    await openGround.getByTestId('work-item-status').filter({ hasText: 'Corrected' }).waitFor();
    expect(await openGround.locator('img').count()).toBe(1);

    const panel = page.locator('mat-card').filter({ hasText: 'double-tapped' }).or(page.locator('mat-card').filter({ hasText: 'main panel, breaker 14' }));
    await panel.getByTestId('record-outcome').click();
    await page.getByTestId('correction-heading').waitFor();
    await page.getByTestId('outcome-not-corrected').locator('input').check();
    await page.getByTestId('correction-reason').fill('The panel has no listed tandem breaker; the seller will decide on a panel replacement separately');
    await page.getByTestId('correction-save').click();
    await page.getByTestId('work-heading').waitFor();
    await page.getByTestId('work-status').filter({ hasText: 'Work finished' }).waitFor();
    // The visit is still marked on site: the next steps say so before the letter.
    expect(await page.getByTestId('work-next').textContent()).toContain('Finish visit 1 (on site): the contractor');
    await screenshot(page, 'work-page-phone');
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await page.context().close();
  });

  it('lets the contractor issue the completion letter', async () => {
    const page = await openPage({ viewport: { width: 1366, height: 900 } });
    await signInAs(page, CONTRACTOR);
    await page.goto(portalUrl(`/requests/${requestId}/work`));
    await page.getByTestId('letter-signature').fill('Sam Okafor');
    await page.getByTestId('letter-no-permit').locator('input').check();
    await page.getByTestId('letter-issue').click();
    await page.getByTestId('letter-1').waitFor();
    await page.getByTestId('work-status').filter({ hasText: 'Letter issued' }).waitFor();
    // The letter ended the visit left on site: nobody is shown on site after it.
    expect(await page.getByTestId('visit-1').locator('mat-card-subtitle').textContent()).not.toContain('On site');
    expect(await page.getByTestId('visit-finish').count()).toBe(0);
    verifyPath = (await page.getByTestId('letter-verify-link').getAttribute('href')) ?? '';
    pdfPath = (await page.getByTestId('letter-download').getAttribute('href')) ?? '';
    expect(verifyPath).toMatch(/^\/verify\/[A-Z2-9]{10}$/);
    await screenshot(page, 'work-letter-issued-desktop');
    await page.context().close();
  });

  it('lets the inspector download the letter and verify it on the public page', async () => {
    const page = await openPage({ viewport: { width: 1366, height: 900 }, acceptDownloads: true });
    await signInAs(page, INSPECTOR);
    await page.goto(portalUrl(`/requests/${requestId}/work`));
    await page.getByTestId('letter-1').waitFor();
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('letter-download').click()]);
    expect(download.suggestedFilename()).toMatch(/^CL-\d{5}-rev1\.pdf$/);
    // Read the bytes now: the download's file goes with its browser context.
    const pdf = readFileSync(await download.path());
    await page.getByTestId('review-accept').waitFor();
    // The electrician's preparation is not shown to the inspector, who does no work here.
    expect(await page.getByRole('heading', { name: 'Before the truck rolls' }).count()).toBe(0);
    await expectAccessible(page);
    await page.context().close();

    // The public page: a fresh browser context that never signed in.
    const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
    const visitor = await context.newPage();
    await visitor.goto(portalUrl(verifyPath));
    await visitor.getByTestId('verify-result').waitFor();
    expect(await visitor.getByTestId('verify-current').textContent()).toContain('current revision');
    expect(await visitor.locator('body').textContent()).not.toContain(STREET);
    await visitor.getByTestId('verify-file').setInputFiles({ name: 'letter.pdf', mimeType: 'application/pdf', buffer: pdf });
    await visitor.getByTestId('verify-check').filter({ hasText: 'Genuine' }).waitFor();
    await screenshot(visitor, 'verify-letter-phone');
    await expectAccessible(visitor);
    expect(pdfPath).toBe(`/api/requests/${requestId}/letters/1.pdf`);
    await context.close();
  });
});

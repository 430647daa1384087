// playwright-core driving Debian's chromium (never a downloaded browser), for the browser tests.
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { chromium, type Browser, type BrowserContextOptions, type Page } from 'playwright-core';
import { axeOf, settled } from './axe';

export const SCREENSHOTS = join(__dirname, '..', '..', 'test-results', 'screenshots');

/** Arguments that keep chromium quiet on a machine without outside network. */
const ARGS = ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--disable-dev-shm-usage'];

export function launchBrowser(): Promise<Browser> {
  return chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium', headless: true, args: ARGS });
}

export function portalUrl(path = '/'): string {
  const base = process.env.PORTAL_URL;
  if (!base) throw new Error('PORTAL_URL is not set: run the browser tests through npm test');
  return `${base}${path}`;
}

export const DEMO_PASSWORD = 'marlow-springs-demo';

/**
 * A page in a context of its own (axe needs one, and nothing leaks between tests); closing the page
 * closes its context.
 */
export async function openPage(browser: Browser, options: BrowserContextOptions = {}): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 1366, height: 900 }, ...options });
  const page = await context.newPage();
  // A context may be closing already (the browser at the end of a file): that is no failure of the test.
  page.once('close', () => {
    context.close().catch(() => undefined);
  });
  return page;
}

/**
 * Runs axe-core (@axe-core/playwright) on the page as it stands and fails on any serious or critical
 * violation. Every browser test calls it on every page it visits.
 */
export async function expectAccessible(page: Page): Promise<void> {
  await settled(page);
  const results = await axeOf(page).analyze();
  const blocking = results.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.id} (${v.impact}) on ${page.url()}: ${v.help}: ${v.nodes.slice(0, 3).map((n) => n.target.join(' ')).join('; ')}`);
  expect(blocking).toEqual([]);
}

export async function signInAs(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto(portalUrl('/sign-in'));
  await page.getByTestId('sign-in-email').waitFor();
  await expectAccessible(page);
  await page.getByTestId('sign-in-email').fill(email);
  await page.getByTestId('sign-in-password').fill(password);
  await page.getByTestId('sign-in-submit').click();
  await page.getByTestId('signed-in-user').waitFor();
  await expectAccessible(page);
}

/**
 * The visible Material icons narrower or lower than their glyph: mat-icon hides what overflows its box,
 * so such an icon shows as a sliver (a caution icon squeezed by the long line of text beside it).
 */
export function clippedIcons(page: Page): Promise<string[]> {
  return page.evaluate(() =>
    Array.from(document.querySelectorAll<HTMLElement>('mat-icon'))
      .filter((icon) => icon.offsetParent !== null)
      .filter((icon) => {
        const box = icon.getBoundingClientRect();
        const size = parseFloat(getComputedStyle(icon).fontSize);
        return box.width + 0.5 < size || box.height + 0.5 < size;
      })
      .map((icon) => `${icon.textContent?.trim()} (${Math.round(icon.getBoundingClientRect().width)} px)`),
  );
}

/** Whether `testId`'s element shows all of its content without scrolling sideways. */
export function fitsSideways(page: Page, testId: string): Promise<boolean> {
  return page.getByTestId(testId).first().evaluate((el) => el.scrollWidth <= el.clientWidth + 1);
}

/** Saves a full-page screenshot after checking the page with axe (a screenshot marks a page the test visits). */
export async function screenshot(page: Page, name: string): Promise<string> {
  await expectAccessible(page);
  mkdirSync(SCREENSHOTS, { recursive: true });
  const path = join(SCREENSHOTS, `${name}.png`);
  await page.screenshot({ path, fullPage: true });
  return path;
}

/** Errors the page writes to its console and requests that fail (or writes that are cancelled), to assert none. */
export function watchConsole(page: Page): string[] {
  const problems: string[] = [];
  page.on('console', (m) => {
    if (m.type() === 'error') problems.push(`console: ${m.text()}`);
  });
  // A read the page cancels itself (a newer choice replaced it, e.g. the day plan's date) ends as
  // net::ERR_ABORTED: that is the page working, not a failure. Writes must never be cancelled.
  page.on('requestfailed', (r) => {
    const reason = r.failure()?.errorText ?? '';
    if (r.method() === 'GET' && reason === 'net::ERR_ABORTED') return;
    problems.push(`request failed: ${r.method()} ${r.url()} ${reason}`);
  });
  return problems;
}

/** Tables wider than the viewport (scrollWidth against the window's inner width). */
export function tablesWiderThanViewport(page: Page): Promise<string[]> {
  return page.evaluate(() =>
    [...document.querySelectorAll('table')]
      .filter((t) => t.scrollWidth > window.innerWidth || t.getBoundingClientRect().right > window.innerWidth + 1)
      .map((t) => `${t.getAttribute('aria-label') ?? 'table'}: ${t.scrollWidth}px in ${window.innerWidth}px`),
  );
}

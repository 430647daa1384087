// playwright-core driving Debian's chromium (never a downloaded browser), for the browser tests.
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';

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

export async function signInAs(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto(portalUrl('/sign-in'));
  await page.getByTestId('sign-in-email').fill(email);
  await page.getByTestId('sign-in-password').fill(password);
  await page.getByTestId('sign-in-submit').click();
  await page.getByTestId('signed-in-user').waitFor();
}

export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(SCREENSHOTS, { recursive: true });
  const path = join(SCREENSHOTS, `${name}.png`);
  await page.screenshot({ path, fullPage: true });
  return path;
}

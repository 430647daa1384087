// Debian's chromium for the browser tests (never a browser download).
import { existsSync } from 'node:fs';
import { aptInstall } from './run.mjs';

export const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

export function ensureChromium() {
  if (!existsSync(CHROMIUM)) aptInstall(['chromium'], 'Chromium for the browser tests (Debian package chromium)');
  return CHROMIUM;
}

// Accessibility check of the page in view with axe-core: serious and critical violations only.
import AxeBuilder from '@axe-core/playwright';
import type { Page } from 'playwright-core';

export async function seriousViolations(page: Page): Promise<string[]> {
  const result = await new AxeBuilder({ page }).analyze();
  return result.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(' ')).join('; ')})`);
}

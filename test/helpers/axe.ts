// Accessibility check of the page in view with axe-core: serious and critical violations only.
import AxeBuilder from '@axe-core/playwright';
import type { Page } from 'playwright-core';

/**
 * Waits for the page to settle: a hint or error fading in is measured at its final colour, not mid-way
 * (finite animations only, at most 2 s; a spinner's endless one is left running), and a snack bar
 * coming or going is waited for too (its classes mark the animation before it runs).
 */
export async function settled(page: Page): Promise<void> {
  await page.evaluate(async () => {
    const until = Date.now() + 2000;
    // A snack bar is measured fully shown (or once gone): not while it fades in or out, which a busy
    // machine can stretch past the animation classes.
    const fading = () =>
      !!document.querySelector('.mat-snack-bar-container-enter, .mat-snack-bar-container-exit') ||
      Array.from(document.querySelectorAll<HTMLElement>('.mat-mdc-snack-bar-container, .mat-mdc-snack-bar-container *')).some((el) => getComputedStyle(el).opacity !== '1');
    while (fading() && Date.now() < until + 1000) {
      await new Promise((resolve) => setTimeout(resolve, 50));
    }
    await Promise.race([
      Promise.all(document.getAnimations().filter((a) => a.effect?.getComputedTiming().endTime !== Infinity).map((a) => a.finished.catch(() => undefined))),
      new Promise((resolve) => setTimeout(resolve, Math.max(0, until - Date.now()))),
    ]);
  });
}

/**
 * axe over the page, leaving out the snack bar: a notice shown for 4 s starts fading out while a slow
 * machine is still analysing, and a half-faded label is measured as low contrast. Its colours are
 * Material's inverse-surface pair, which meet the contrast rule when shown.
 */
export function axeOf(page: Page): AxeBuilder {
  return new AxeBuilder({ page }).exclude('.mat-mdc-snack-bar-container');
}

/** The serious and critical axe violations of the page once it has settled. */
export async function seriousViolations(page: Page): Promise<string[]> {
  await settled(page);
  const result = await axeOf(page).analyze();
  return result.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(' ')).join('; ')})`);
}

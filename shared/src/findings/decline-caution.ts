import { FINDING_CODE_TABLE, type FindingCode } from './finding-code';

/**
 * The one line shown beside "Decline" on an item whose finding is a hazard to life or safety: the
 * seller may still decline (the product never blocks it), and the local rules decide what a sale needs.
 * Smoke and CO alarms get their own words: many states and towns require working alarms when a house
 * is sold or changes hands (common practice; e.g. California Health and Safety Code 13113.8 and
 * 17926.1, from memory; docs/trade-facts.md). Other codes whose default severity in the finding-code
 * table is `safety` get the general line; the rest none.
 */
export function declineCaution(code: string): string | null {
  if (code === 'smoke-co-alarm') {
    return 'Working smoke and CO alarms protect lives, and many places require them when a house is sold: check the local rules before declining.';
  }
  const info = FINDING_CODE_TABLE[code as FindingCode] as { severity: string } | undefined;
  if (info?.severity === 'safety') {
    return 'The report lists this as a safety hazard, and declined it stays as found: check the local rules before declining.';
  }
  return null;
}

/** "in 12 days", "tomorrow", "today", "passed yesterday", "passed 3 days ago". */
export function closingCountdown(days: number): string {
  if (days === 0) return 'closing today';
  if (days === 1) return 'tomorrow';
  if (days > 1) return `in ${days} days`;
  if (days === -1) return 'passed yesterday';
  return `passed ${-days} days ago`;
}

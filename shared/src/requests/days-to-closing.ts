/**
 * Whole calendar days from `today` to `closingDate` (both ISO dates, `YYYY-MM-DD`).
 * Negative once the closing date has passed. Pure: the caller supplies today.
 */
export function daysToClosing(closingDate: string, today: string): number {
  const msPerDay = 86_400_000;
  return Math.round((Date.parse(`${closingDate}T00:00:00Z`) - Date.parse(`${today}T00:00:00Z`)) / msPerDay);
}

/** How pressing a closing date is, for colouring and sorting. */
export type ClosingUrgency = 'passed' | 'this-week' | 'soon' | 'later';

export function closingUrgency(days: number): ClosingUrgency {
  if (days < 0) return 'passed';
  if (days <= 7) return 'this-week';
  if (days <= 21) return 'soon';
  return 'later';
}

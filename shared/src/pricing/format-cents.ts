const DOLLARS = new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' });

/** Whole cents as US dollars for reading (`12345` → `$123.45`); computation stays in cents. */
export function formatCents(cents: number): string {
  return DOLLARS.format(cents / 100);
}

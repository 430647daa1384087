/** Whole cents as US dollars for reading (`31434` → `$314.34`, `-350` → `−$3.50`); computation stays in cents. */
export function formatCents(cents: number): string {
  const sign = cents < 0 ? '−' : '';
  const abs = Math.abs(cents);
  const dollars = Math.floor(abs / 100).toLocaleString('en-US');
  return `${sign}$${dollars}.${String(abs % 100).padStart(2, '0')}`;
}

/** A signed difference in cents (`+$12.00`, `−$3.50`, `$0.00`). */
export function formatCentsDelta(cents: number): string {
  return cents > 0 ? `+${formatCents(cents)}` : formatCents(cents);
}

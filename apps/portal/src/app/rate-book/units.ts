/*
 * The rate book stores whole cents, minutes and basis points; people type dollars, percentages and
 * factors. These read what was typed exactly (digit by digit, no floating point) and write it back.
 * A value that does not read returns null.
 */

const DOLLARS = /^\$?\s*(\d{1,9})(?:\.(\d{1,2}))?$/;
const PERCENT = /^(\d{1,3})(?:\.(\d{1,2}))?\s*%?$/;
const FACTOR = /^×?\s*(\d)(?:\.(\d{1,4}))?$/;
const WHOLE = /^\d{1,6}$/;

function digits(match: RegExpExecArray, fractionDigits: number): number {
  const whole = Number(match[1]);
  const fraction = Number((match[2] ?? '').padEnd(fractionDigits, '0'));
  return whole * 10 ** fractionDigits + fraction;
}

const text = (value: unknown) => (typeof value === 'number' ? String(value) : typeof value === 'string' ? value.trim().replace(/,/g, '') : '');

/** `"95"`, `"95.5"`, `"$1,095.00"` → cents. */
export function dollarsToCents(value: unknown): number | null {
  const match = DOLLARS.exec(text(value));
  return match ? digits(match, 2) : null;
}

export function centsToDollars(cents: number): string {
  return `${Math.trunc(cents / 100)}.${String(cents % 100).padStart(2, '0')}`;
}

/** `"35"`, `"6.25"`, `"35 %"` → basis points. */
export function percentToBp(value: unknown): number | null {
  const match = PERCENT.exec(text(value));
  return match ? digits(match, 2) : null;
}

export function bpToPercent(bp: number): string {
  const fraction = bp % 100;
  return fraction === 0 ? String(bp / 100) : `${Math.trunc(bp / 100)}.${String(fraction).padStart(2, '0').replace(/0$/, '')}`;
}

/** `"1.3"`, `"×1.25"` → basis points of a multiplier (×1.3 = 13,000). */
export function factorToBp(value: unknown): number | null {
  const match = FACTOR.exec(text(value));
  return match ? digits(match, 4) : null;
}

export function bpToFactor(bp: number): string {
  const fraction = String(bp % 10_000).padStart(4, '0').replace(/0+$/, '');
  return fraction ? `${Math.trunc(bp / 10_000)}.${fraction}` : String(bp / 10_000);
}

/** Whole minutes, days or years as typed. */
export function toWholeNumber(value: unknown): number | null {
  const typed = text(value);
  return WHOLE.test(typed) ? Number(typed) : null;
}

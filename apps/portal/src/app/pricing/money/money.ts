import { Pipe, PipeTransform } from '@angular/core';
import { formatCents } from '@cc/shared';

export { formatCents };

/** A signed difference in cents (`+$12.00`, `−$3.50`, `$0.00`). */
export function formatCentsDelta(cents: number): string {
  if (cents === 0) return formatCents(0);
  return `${cents > 0 ? '+' : '−'}${formatCents(Math.abs(cents))}`;
}

/** `{{ line.lineCents | money }}`; an empty value shows as a dash. */
@Pipe({ name: 'money' })
export class MoneyPipe implements PipeTransform {
  transform(cents: number | null | undefined): string {
    return cents === null || cents === undefined ? '—' : formatCents(cents);
  }
}

import { Pipe, PipeTransform } from '@angular/core';
import { formatCents } from '@cc/shared';

// The one money formatter lives in shared (the quote PDF uses it too); the portal reads it from here.
export { formatCents, formatCentsDelta } from '@cc/shared';

/** `{{ line.lineCents | money }}`; an empty value shows as a dash. */
@Pipe({ name: 'money' })
export class MoneyPipe implements PipeTransform {
  transform(cents: number | null | undefined): string {
    return cents === null || cents === undefined ? '—' : formatCents(cents);
  }
}

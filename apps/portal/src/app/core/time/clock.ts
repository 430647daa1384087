import { Injectable } from '@angular/core';
import { toIsoDate } from './iso-date';

/** The one place the portal reads the current date, so pages and tests agree on "today". */
@Injectable({ providedIn: 'root' })
export class Clock {
  /** Today's local date as `YYYY-MM-DD`. */
  today(): string {
    return toIsoDate(new Date());
  }
}

import { HttpErrorResponse } from '@angular/common/http';
import { describeFailure } from '../core/http/api-error-of';

/** How a review dialog ended: the change was kept, or refused because the item changed meanwhile. */
export type ReviewOutcome = { kind: 'saved' } | { kind: 'conflict'; message: string };

/** The sentence for a change the server refused as stale (409), or null for any other failure. */
export function conflictMessage(err: unknown): string | null {
  return err instanceof HttpErrorResponse && err.status === 409 ? describeFailure(err) : null;
}

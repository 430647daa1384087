import { HttpErrorResponse } from '@angular/common/http';
import type { ApiError } from '@cc/shared';

/**
 * Whether a response body has the API's error shape. A structural check rather than
 * `ApiErrorSchema.safeParse`, because this runs in the start-up bundle and the schema would bring the
 * whole validation library into the first download; the pages that use schemas load it lazily.
 */
function isApiError(body: unknown): body is ApiError {
  if (typeof body !== 'object' || body === null) return false;
  const { error, details } = body as Record<string, unknown>;
  return (
    typeof error === 'string' &&
    Array.isArray(details) &&
    details.every(
      (d: unknown) =>
        typeof d === 'object' &&
        d !== null &&
        typeof (d as Record<string, unknown>)['path'] === 'string' &&
        typeof (d as Record<string, unknown>)['message'] === 'string',
    )
  );
}

/** The API's error body carried by a failed request, or null when there is none (network, proxy page). */
export function apiErrorOf(err: unknown): ApiError | null {
  if (!(err instanceof HttpErrorResponse)) return null;
  return isApiError(err.error) ? err.error : null;
}

/** A sentence for a person, whatever went wrong. */
export function describeFailure(err: unknown): string {
  const body = apiErrorOf(err);
  if (err instanceof HttpErrorResponse) {
    if (err.status === 0) return 'The server could not be reached. Check the connection and try again.';
    if (err.status === 403) return body?.error ?? 'Your account may not do this.';
    if (err.status === 404) return 'Not found, or not shared with you.';
    if (err.status >= 500) return 'Something went wrong on the server. Please try again.';
  }
  return body?.error ?? 'Something went wrong. Please try again.';
}

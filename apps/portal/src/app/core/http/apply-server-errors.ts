import { AbstractControl } from '@angular/forms';
import { applyIssues } from '../forms/apply-issues';
import { apiErrorOf, describeFailure } from './api-error-of';

/**
 * Puts the field messages of a failed request on the matching controls of `form` (by dotted path) and
 * returns one sentence for everything that did not match a control, or null when every problem found
 * its field.
 */
export function applyServerErrors(form: AbstractControl, err: unknown): string | null {
  const body = apiErrorOf(err);
  if (!body || body.details.length === 0) return describeFailure(err);

  const unmatched = applyIssues(form, body.details);
  if (unmatched.length === 0) return null;
  const rest = unmatched.map((detail) => (detail.path ? `${detail.path}: ${detail.message}` : detail.message));
  return `${body.error}. ${rest.join(' ')}`;
}

import { AbstractControl } from '@angular/forms';
import { ApiErrorDetail } from '@cc/shared';

/** The key under which a message from a whole-form check or from the server is stored on a control. */
export const ISSUE_ERROR = 'issue';

/**
 * Puts each `{path, message}` on the control at that dotted path of `form` and returns the ones that
 * match no control (they belong in a message for the whole form).
 */
export function applyIssues(form: AbstractControl, issues: readonly ApiErrorDetail[]): ApiErrorDetail[] {
  const unmatched: ApiErrorDetail[] = [];
  for (const issue of issues) {
    const control = issue.path ? form.get(issue.path) : null;
    if (control && control !== form) {
      control.setErrors({ ...control.errors, [ISSUE_ERROR]: issue.message });
      control.markAsTouched();
    } else {
      unmatched.push(issue);
    }
  }
  return unmatched;
}

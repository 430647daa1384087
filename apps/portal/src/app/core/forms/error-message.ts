import { Pipe, PipeTransform } from '@angular/core';
import { AbstractControl, ValidationErrors } from '@angular/forms';
import { ISSUE_ERROR } from './apply-issues';
import { ZOD_ERROR } from './zod-validator';

/** The sentence to show for a control's first error (server and whole-form messages win over field ones). */
export function errorMessage(errors: ValidationErrors | null): string {
  if (!errors) return '';
  if (typeof errors[ISSUE_ERROR] === 'string') return errors[ISSUE_ERROR];
  if (typeof errors[ZOD_ERROR] === 'string') return errors[ZOD_ERROR];
  if (errors['matDatepickerParse']) return 'Enter a date such as 6/30/2026';
  if (errors['required']) return 'This field is needed';
  // The min and max attributes of a number field (e.g. 0 to 40 receptacles).
  if (errors['max']) return `Use at most ${(errors['max'] as { max: number }).max}`;
  if (errors['min']) return `Use at least ${(errors['min'] as { min: number }).min}`;
  return 'Check this field';
}

/**
 * `{{ form.controls.email | errorMessage }}` inside `<mat-error>`. Impure, because a control's errors
 * change without the control object changing.
 */
@Pipe({ name: 'errorMessage', pure: false })
export class ErrorMessagePipe implements PipeTransform {
  transform(control: AbstractControl): string {
    return errorMessage(control.errors);
  }
}

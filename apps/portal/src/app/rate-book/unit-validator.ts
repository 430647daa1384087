import { AbstractControl, ValidationErrors, ValidatorFn } from '@angular/forms';
import type { z } from 'zod';
import { ZOD_ERROR } from '../core/forms/zod-validator';

/**
 * A validator for a field typed in people's units (dollars, percent, ×factor, minutes): `read` turns
 * the text into the rate book's integer, `unreadable` says what to type when it cannot, and the
 * shared schema of the field checks the integer with the server's own messages. An empty optional
 * field is valid.
 */
export function unitValidator(read: (value: unknown) => number | null, schema: z.ZodType, unreadable: string, isOptional = false): ValidatorFn {
  return (control: AbstractControl): ValidationErrors | null => {
    const typed = control.value === null || control.value === undefined ? '' : String(control.value).trim();
    if (typed === '') return isOptional ? null : { [ZOD_ERROR]: unreadable };
    const value = read(typed);
    if (value === null) return { [ZOD_ERROR]: unreadable };
    const result = schema.safeParse(value);
    return result.success ? null : { [ZOD_ERROR]: result.error.issues[0]?.message ?? 'Check this field' };
  };
}

export const TYPE_DOLLARS = 'Enter dollars and cents, such as 95.00';
export const TYPE_PERCENT = 'Enter a percentage, such as 35 or 6.25';
export const TYPE_FACTOR = 'Enter a factor from 1 to 4, such as 1.3';
export const TYPE_WHOLE = 'Enter a whole number';

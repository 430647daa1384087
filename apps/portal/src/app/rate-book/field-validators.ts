import { AbstractControl, ValidationErrors, ValidatorFn } from '@angular/forms';
import type { z } from 'zod';
import { ZOD_ERROR } from '../core/forms/zod-validator';
import { bpToFactor, bpToPercent, centsToDollars, dollarsToCents, factorToBp, percentToBp, toWholeNumber } from './units';

/** How a rate-book field is typed: read into the stored integer, and an integer shown back in the same units. */
export interface FieldUnit {
  read: (value: unknown) => number | null;
  show: (value: number) => string;
  /** What to type when the text does not read. */
  unreadable: string;
}

export const DOLLARS: FieldUnit = { read: dollarsToCents, show: (c) => `$${centsToDollars(c)}`, unreadable: 'Enter dollars and cents, such as 95.00' };
export const PERCENT: FieldUnit = { read: percentToBp, show: (bp) => `${bpToPercent(bp)} %`, unreadable: 'Enter a percentage, such as 35 or 6.25' };
export const FACTOR: FieldUnit = { read: factorToBp, show: (bp) => `×${bpToFactor(bp)}`, unreadable: 'Enter a factor from 1 to 4, such as 1.3' };
export const WHOLE: FieldUnit = { read: toWholeNumber, show: String, unreadable: 'Enter a whole number' };

/**
 * A validator for a field typed in people's units (dollars, percent, ×factor, minutes): the text is
 * read into the rate book's integer and checked with the field's shared schema; a limit of the
 * schema is said back in the field's units. An empty optional field is valid.
 */
export function unitValidator(unit: FieldUnit, schema: z.ZodType, isOptional = false): ValidatorFn {
  return (control: AbstractControl): ValidationErrors | null => {
    const typed = control.value === null || control.value === undefined ? '' : String(control.value).trim();
    if (typed === '') return isOptional ? null : { [ZOD_ERROR]: unit.unreadable };
    const value = unit.read(typed);
    if (value === null) return { [ZOD_ERROR]: unit.unreadable };
    const issue = schema.safeParse(value).error?.issues[0];
    if (!issue) return null;
    if (issue.code === 'too_big') return { [ZOD_ERROR]: `At most ${unit.show(Number(issue.maximum))}` };
    if (issue.code === 'too_small') return { [ZOD_ERROR]: `At least ${unit.show(Number(issue.minimum))}` };
    return { [ZOD_ERROR]: issue.message };
  };
}

/** A text field checked by its shared schema, with a plain request when it is left empty. */
export function textValidator(schema: z.ZodType, whenEmpty: string): ValidatorFn {
  return (control: AbstractControl): ValidationErrors | null => {
    const typed = typeof control.value === 'string' ? control.value.trim() : '';
    if (typed === '') return { [ZOD_ERROR]: whenEmpty };
    const result = schema.safeParse(control.value);
    return result.success ? null : { [ZOD_ERROR]: result.error.issues[0]?.message ?? 'Check this field' };
  };
}

import { ValidatorFn } from '@angular/forms';
import type { z } from 'zod';
import { toIsoDateOrEmpty } from '../time/iso-date';
import { ZOD_ERROR, zodValidator } from './zod-validator';

/** What a date field asks for: the way people type it in the field (its hint says the same). */
export const DATE_FIELD_MESSAGE = 'Enter the date as MM/DD/YYYY, or pick it from the calendar';

/**
 * A datepicker field checked against a shared date schema. A missing or unreadable date gets the
 * message in the form the field is typed in (MM/DD/YYYY), not the API's YYYY-MM-DD; the schema's
 * other rules (e.g. after today) keep their own messages.
 */
export function dateFieldValidator(schema: z.ZodType): ValidatorFn {
  const bySchema = zodValidator(schema, toIsoDateOrEmpty);
  return (control) => (toIsoDateOrEmpty(control.value) === '' ? { [ZOD_ERROR]: DATE_FIELD_MESSAGE } : bySchema(control));
}

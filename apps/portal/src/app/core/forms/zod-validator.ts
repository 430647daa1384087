import { AbstractControl, ValidationErrors, ValidatorFn } from '@angular/forms';
import type { z } from 'zod';

/** The key under which a schema message is stored on a form control. */
export const ZOD_ERROR = 'zod';

/**
 * A form validator from one field schema of a shared DTO, so the portal shows the same messages the
 * server would answer with. `toInput` turns the control's value into what the DTO carries (e.g. a
 * Date into `YYYY-MM-DD`). A null value is checked as "missing" (undefined).
 */
export function zodValidator(schema: z.ZodType, toInput: (value: unknown) => unknown = (v) => v): ValidatorFn {
  return (control: AbstractControl): ValidationErrors | null => {
    const value = control.value === null ? undefined : control.value;
    const result = schema.safeParse(toInput(value));
    if (result.success) return null;
    return { [ZOD_ERROR]: result.error.issues[0]?.message ?? 'Check this field' };
  };
}

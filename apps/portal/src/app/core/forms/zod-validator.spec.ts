import { FormControl } from '@angular/forms';
import { CreateRepairRequestSchema, SignInSchema } from '@cc/shared';
import { toIsoDateOrEmpty } from '../time/iso-date';
import { errorMessage } from './error-message';
import { zodValidator, ZOD_ERROR } from './zod-validator';

describe('zodValidator', () => {
  it('accepts a value the field schema accepts', () => {
    const control = new FormControl('agent@example.test', zodValidator(SignInSchema.shape.email));
    expect(control.errors).toBeNull();
  });

  it("reports the shared schema's own message for a bad value", () => {
    const control = new FormControl('not-an-address', zodValidator(SignInSchema.shape.email));
    expect(control.errors).toEqual({ [ZOD_ERROR]: 'Enter a valid e-mail address' });
  });

  it('treats an empty number input (null) as missing', () => {
    const control = new FormControl<number | null>(null, zodValidator(CreateRepairRequestSchema.shape.yearBuilt));
    expect(errorMessage(control.errors)).toBe('Enter the year the house was built');
  });

  it('checks the value as the DTO carries it when given a conversion', () => {
    const validator = zodValidator(CreateRepairRequestSchema.shape.closingDate, toIsoDateOrEmpty);
    expect(new FormControl<Date | null>(new Date(2026, 5, 30), validator).errors).toBeNull();
    expect(errorMessage(new FormControl<Date | null>(null, validator).errors)).toBe('Enter a date as YYYY-MM-DD');
  });

  it('accepts an empty optional e-mail and rejects a malformed one', () => {
    const validator = zodValidator(CreateRepairRequestSchema.shape.sellerEmail);
    expect(new FormControl('', validator).errors).toBeNull();
    expect(errorMessage(new FormControl('seller@', validator).errors)).toBe('Enter a valid e-mail address');
  });

  it('re-validates when the value changes', () => {
    const control = new FormControl('12', zodValidator(CreateRepairRequestSchema.shape.zip));
    expect(control.invalid).toBe(true);
    control.setValue('80302');
    expect(control.valid).toBe(true);
  });
});

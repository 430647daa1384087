import { FormControl, Validators } from '@angular/forms';
import { errorMessage } from './error-message';

describe('errorMessage', () => {
  it('names the bound a number field broke (its min and max attributes), never a vague "Check this field"', () => {
    const control = new FormControl(99_999, { validators: [Validators.min(0), Validators.max(40)] });
    expect(errorMessage(control.errors)).toBe('Use at most 40');
    control.setValue(-1);
    expect(errorMessage(control.errors)).toBe('Use at least 0');
  });

  it('says a needed field is needed, and nothing when there is no error', () => {
    expect(errorMessage(new FormControl('', { validators: Validators.required }).errors)).toBe('This field is needed');
    expect(errorMessage(null)).toBe('');
  });
});

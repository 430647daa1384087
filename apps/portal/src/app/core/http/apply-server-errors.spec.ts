import { HttpErrorResponse } from '@angular/common/http';
import { FormControl, FormGroup } from '@angular/forms';
import { errorMessage } from '../forms/error-message';
import { applyServerErrors } from './apply-server-errors';

function badRequest(details: { path: string; message: string }[]): HttpErrorResponse {
  return new HttpErrorResponse({ status: 400, error: { error: 'Invalid input', details } });
}

describe('applyServerErrors', () => {
  const form = () => new FormGroup({ street: new FormControl('1 Elm'), zip: new FormControl('00000') });

  it('puts each detail on the control named by its path and leaves no general message', () => {
    const group = form();
    const general = applyServerErrors(group, badRequest([{ path: 'zip', message: 'Unknown ZIP code' }]));
    expect(general).toBeNull();
    expect(errorMessage(group.controls.zip.errors)).toBe('Unknown ZIP code');
    expect(group.controls.zip.touched).toBe(true);
    expect(group.controls.street.errors).toBeNull();
  });

  it('collects details without a matching control into the general message', () => {
    const group = form();
    const general = applyServerErrors(
      group,
      badRequest([
        { path: 'street', message: 'Too short' },
        { path: 'parcel', message: 'Unknown parcel' },
      ]),
    );
    expect(general).toBe('Invalid input. parcel: Unknown parcel');
    expect(errorMessage(group.controls.street.errors)).toBe('Too short');
  });

  it('words a failure without details, such as a conflict or an unreachable server', () => {
    expect(applyServerErrors(form(), new HttpErrorResponse({ status: 409, error: { error: 'Already invited', details: [] } }))).toBe(
      'Already invited',
    );
    expect(applyServerErrors(form(), new HttpErrorResponse({ status: 0 }))).toContain('could not be reached');
  });
});

import { HttpErrorResponse } from '@angular/common/http';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { throwError } from 'rxjs';
import { WorkApi } from '../work-api';
import { VerifyLetter } from './verify-letter';

describe('VerifyLetter', () => {
  it('says that no letter has an unknown code, and what to do, without an uncaught error', async () => {
    const notFound = new HttpErrorResponse({ status: 404, error: { error: 'No letter has this verification code', details: [] }, url: '/api/verify/XXXXXXXXXX' });
    TestBed.configureTestingModule({ providers: [provideRouter([]), { provide: WorkApi, useValue: { verify: () => throwError(() => notFound) } }] });
    const fixture = TestBed.createComponent(VerifyLetter);
    fixture.componentRef.setInput('code', 'XXXXXXXXXX');
    await fixture.whenStable();
    fixture.detectChanges();
    const host: HTMLElement = fixture.nativeElement;
    const message = host.querySelector('[data-testid="verify-not-found"]');
    expect(message?.textContent).toContain('No letter has this code');
    expect(message?.textContent).toContain('Check the code printed beside the QR code');
    expect(host.querySelector('[data-testid="verify-code"]')).not.toBeNull();
  });
});

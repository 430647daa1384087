import { HttpErrorResponse } from '@angular/common/http';
import { TestBed } from '@angular/core/testing';
import { provideRouter, Router } from '@angular/router';
import { of, throwError } from 'rxjs';
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

  it('asks for the code when "Look up" is pressed with none typed, and goes nowhere', async () => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), { provide: WorkApi, useValue: { verify: jest.fn() } }] });
    const fixture = TestBed.createComponent(VerifyLetter);
    fixture.detectChanges();
    const host: HTMLElement = fixture.nativeElement;
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate');
    host.querySelector<HTMLButtonElement>('form.lookup button[type="submit"]')!.click();
    fixture.detectChanges();
    expect(host.querySelector('[data-testid="verify-code-error"]')?.textContent).toContain('Enter the verification code printed on the letter');
    expect(navigate).not.toHaveBeenCalled();
  });
});

describe('VerifyLetter file check', () => {
  function render(checkPdf: jest.Mock) {
    TestBed.configureTestingModule({ providers: [provideRouter([]), { provide: WorkApi, useValue: { verify: jest.fn(), checkPdf } }] });
    const fixture = TestBed.createComponent(VerifyLetter);
    fixture.detectChanges();
    return fixture;
  }
  function choose(fixture: ReturnType<typeof render>, file: File): HTMLElement {
    const picker: HTMLInputElement = fixture.nativeElement.querySelector('[data-testid="verify-file"]');
    Object.defineProperty(picker, 'files', { value: [file], configurable: true });
    picker.dispatchEvent(new Event('change'));
    fixture.detectChanges();
    return fixture.nativeElement;
  }

  it('refuses a non-PDF under the file picker without sending it', () => {
    const checkPdf = jest.fn();
    const host = choose(render(checkPdf), new File(['hello'], 'letter.txt', { type: 'text/plain' }));
    expect(checkPdf).not.toHaveBeenCalled();
    expect(host.querySelector('[data-testid="verify-file-error"]')?.textContent).toContain('This file is not a PDF');
    expect(host.querySelector('[data-testid="verify-file"]')?.getAttribute('aria-invalid')).toBe('true');
  });

  it('says an unknown PDF is not a letter issued through Closing Circuit, not "not found"', () => {
    const message = 'This PDF is not a completion letter issued through Closing Circuit (or it was changed after issue).';
    const checkPdf = jest.fn(() => of({ isGenuine: false, isCurrent: false, matchesCode: null, letter: null, message }));
    const host = choose(render(checkPdf), new File(['%PDF-1.7'], 'letter.pdf', { type: 'application/pdf' }));
    expect(checkPdf).toHaveBeenCalled();
    expect(host.querySelector('[data-testid="verify-check"]')?.textContent).toContain(message);
    expect(host.textContent).not.toContain('Not found');
  });

  it('puts the server’s refusal of the file under the picker', () => {
    const refused = new HttpErrorResponse({ status: 400, error: { error: 'This file is not a PDF', details: [{ path: 'file', message: 'This file is not a PDF. Choose the completion letter’s PDF file (it ends in .pdf).' }] } });
    const host = choose(render(jest.fn(() => throwError(() => refused))), new File(['nope'], 'renamed.pdf', { type: 'application/pdf' }));
    expect(host.querySelector('[data-testid="verify-file-error"]')?.textContent).toContain('This file is not a PDF');
  });
});

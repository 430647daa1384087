import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { Auth } from '../../core/auth/auth';
import { NextStepPanel } from './next-step';

function render(status: string, role: string, myParts: string[]): HTMLElement {
  TestBed.configureTestingModule({
    imports: [NextStepPanel],
    providers: [provideRouter([]), { provide: Auth, useValue: { role: signal(role) } }],
  });
  const fixture = TestBed.createComponent(NextStepPanel);
  fixture.componentRef.setInput('requestId', 42);
  fixture.componentRef.setInput('status', status);
  fixture.componentRef.setInput('myParts', myParts);
  fixture.detectChanges();
  return fixture.nativeElement as HTMLElement;
}

describe('NextStepPanel', () => {
  it('gives two steps made on the same page one button, and says so beside the second', () => {
    // A letter issued: the inspector accepts the corrections or lists items not accepted, both on the proof page.
    const el = render('letter-issued', 'inspector', ['inspector']);
    const moves = el.querySelectorAll('[data-testid="next-step-move"]');
    expect(moves.length).toBe(2);
    const links = el.querySelectorAll('a[data-testid="next-step-link"]');
    expect(links.length).toBe(1);
    expect(links[0].getAttribute('href')).toBe('/requests/42/work');
    expect(moves[1].textContent).toContain('On the same page as the step above.');
  });
});

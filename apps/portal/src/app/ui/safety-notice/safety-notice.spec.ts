import { TestBed } from '@angular/core/testing';
import { SafetyNotice } from './safety-notice';

describe('SafetyNotice', () => {
  it('is announced as a note that names licensed electricians and permits', async () => {
    const fixture = TestBed.createComponent(SafetyNotice);
    await fixture.whenStable();
    const host: HTMLElement = fixture.nativeElement;
    expect(host.getAttribute('role')).toBe('note');
    expect(host.textContent).toContain('licensed electricians');
    expect(host.textContent).toContain('permits');
  });

  it('stands out as a box when asked', async () => {
    const fixture = TestBed.createComponent(SafetyNotice);
    fixture.componentRef.setInput('isBoxed', true);
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).classList).toContain('is-boxed');
  });
});

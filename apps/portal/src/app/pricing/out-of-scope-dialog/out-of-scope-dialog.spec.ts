import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { MatInputHarness } from '@angular/material/input/testing';
import { OutOfScopeDialog } from './out-of-scope-dialog';

describe('OutOfScopeDialog', () => {
  let fixture: ComponentFixture<OutOfScopeDialog>;
  let loader: HarnessLoader;
  const close = jest.fn();

  beforeEach(async () => {
    close.mockReset();
    TestBed.configureTestingModule({ providers: [{ provide: MAT_DIALOG_DATA, useValue: { count: 2 } }, { provide: MatDialogRef, useValue: { close } }] });
    fixture = TestBed.createComponent(OutOfScopeDialog);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
  });

  const leaveOut = async () => (await loader.getHarness(MatButtonHarness.with({ text: 'Leave out' }))).click();

  it('is handled by the form directive, so the browser never submits the page itself', () => {
    const form = (fixture.nativeElement as HTMLElement).querySelector('form')!;
    const submit = new Event('submit', { cancelable: true });
    form.dispatchEvent(submit);
    // FormGroupDirective cancels the native submit; a bare <form> would reload the page.
    expect(submit.defaultPrevented).toBe(true);
  });

  it('closes with the trimmed reason when "Leave out" is pressed', async () => {
    await (await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="out-of-scope-reason"]' }))).setValue('  Gas line work, not electrical  ');
    await leaveOut();
    expect(close).toHaveBeenCalledWith('Gas line work, not electrical');
  });

  it('asks for a reason and stays open without one', async () => {
    await leaveOut();
    expect(close).not.toHaveBeenCalled();
    expect((fixture.nativeElement as HTMLElement).textContent).toMatch(/reason/i);
  });
});

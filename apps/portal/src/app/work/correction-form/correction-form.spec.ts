import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { WorkOverview } from '@cc/shared';
import { NEVER, of } from 'rxjs';
import { WorkApi } from '../work-api';
import { CorrectionForm } from './correction-form';

const overview = {
  requestId: 5,
  reference: 'CC-00005',
  street: '87 Tinsmith Way',
  status: 'in-progress',
  closingDate: '2026-12-10',
  closing: { businessDaysLeft: 5, approvedCount: 1, resolvedCount: 0, isAtRisk: false, atRiskBusinessDays: 3 },
  can: { bookVisit: true, recordCorrections: true, finishVisit: true, cancelVisit: true, issueLetter: false, review: false, resume: false, seeAccessNotes: true },
  quotedVisitKeys: ['v1'],
  electricians: [],
  visits: [],
  items: [
    { id: 11, code: 'gfci-inoperative', room: 'bathroom', location: 'hall bath vanity', quantity: 1, necRefs: [], status: 'approved', quotedVisitKey: 'v1', siteVisitId: null, readingKinds: ['gfci', 'receptacle', 'groundPath', 'voltageDrop'], correction: null, notAcceptedReason: null },
  ],
  letters: [],
  reviews: [],
} as unknown as WorkOverview;

describe('CorrectionForm', () => {
  let recordCorrection: jest.Mock;

  async function render() {
    // The save stays pending: the test looks at what was sent, not at the page that follows.
    recordCorrection = jest.fn(() => NEVER);
    TestBed.configureTestingModule({ providers: [provideRouter([]), { provide: WorkApi, useValue: { overview: () => of(overview), recordCorrection } }] });
    const fixture = TestBed.createComponent(CorrectionForm);
    fixture.componentRef.setInput('id', '5');
    fixture.componentRef.setInput('itemId', '11');
    await fixture.whenStable();
    fixture.detectChanges();
    return fixture;
  }

  const type = (host: HTMLElement, testId: string, value: string) => {
    const input = host.querySelector<HTMLInputElement | HTMLTextAreaElement>(`[data-testid="${testId}"]`)!;
    input.value = value;
    input.dispatchEvent(new Event('input'));
  };

  it('starts with no reading taken, so nothing is judged before anything is typed', async () => {
    const host: HTMLElement = (await render()).nativeElement;
    expect(host.querySelector('[data-testid="polarity-correct"]')).toBeNull();
    expect(host.querySelector('[data-testid="correction-evaluations"]')).toBeNull();
    expect(host.querySelector('[data-testid="correction-outside"]')).toBeNull();
  });

  it('warns before saving that a trip time is outside its range (UL 943: at most 100 ms at 100 mA) and saves "corrected" only with a note', async () => {
    const fixture = await render();
    const host: HTMLElement = fixture.nativeElement;
    type(host, 'correction-work', 'Replaced the GFCI receptacle');
    (host.querySelector('[data-testid="readings-gfci"] mat-checkbox input') as HTMLInputElement).click();
    fixture.detectChanges();
    await fixture.whenStable();
    type(host, 'gfci-trip-ms', '300');
    type(host, 'gfci-test-ma', '100');
    fixture.detectChanges();
    await fixture.whenStable();

    const warning = host.querySelector('[data-testid="correction-outside"]');
    expect(warning?.textContent).toContain('A reading is outside its expected range');
    expect(warning?.textContent).toContain('Trip time at 100 mA: 300 ms');
    expect(warning?.textContent).toContain('Could not correct');

    (host.querySelector('[data-testid="correction-save"]') as HTMLButtonElement).click();
    fixture.detectChanges();
    expect(recordCorrection).not.toHaveBeenCalled();

    type(host, 'correction-outside-note', 'Re-tested after tightening the terminals: 22 ms');
    (host.querySelector('[data-testid="correction-save"]') as HTMLButtonElement).click();
    expect(recordCorrection).toHaveBeenCalledTimes(1);
    const record = recordCorrection.mock.calls[0][2];
    expect(record).toMatchObject({ outcome: 'corrected', reason: 'Re-tested after tightening the terminals: 22 ms' });
    expect(record.readings.receptacle).toBeNull();
  });

  it('records "corrected" on a GFCI item only with its GFCI test (its listing instructions: UL 943 devices; NFPA 70 (NEC) 2023, 110.3(B))', async () => {
    const fixture = await render();
    const host: HTMLElement = fixture.nativeElement;
    expect(host.querySelector('[data-testid="proof-needed"]')?.textContent).toContain('GFCI test');
    type(host, 'correction-work', 'Replaced the GFCI receptacle');
    (host.querySelector('[data-testid="correction-save"]') as HTMLButtonElement).click();
    fixture.detectChanges();
    expect(recordCorrection).not.toHaveBeenCalled();
    expect(host.querySelector('[data-testid="proof-error"]')?.textContent).toContain('Take the “GFCI test” reading');

    (host.querySelector('[data-testid="readings-gfci"] mat-checkbox input') as HTMLInputElement).click();
    fixture.detectChanges();
    await fixture.whenStable();
    expect(host.querySelector('[data-testid="proof-error"]')).toBeNull();
    (host.querySelector('[data-testid="gfci-trips"] input') as HTMLInputElement).click();
    (host.querySelector('[data-testid="gfci-resets"] input') as HTMLInputElement).click();
    (host.querySelector('[data-testid="correction-save"]') as HTMLButtonElement).click();
    expect(recordCorrection).toHaveBeenCalledTimes(1);
    expect(recordCorrection.mock.calls[0][2].readings.gfci).toMatchObject({ tripsOnTest: true, resets: true });
  });
});

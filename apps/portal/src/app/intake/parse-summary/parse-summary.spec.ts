import { TestBed } from '@angular/core/testing';
import { UploadResult } from '@cc/shared';
import { report } from '../testing/intake-fixtures';
import { ParseSummary } from './parse-summary';

describe('ParseSummary', () => {
  async function render(proposedCount: number, toConfirm: number | null): Promise<HTMLElement> {
    const fixture = TestBed.createComponent(ParseSummary);
    const result: UploadResult = { report: report(), isDuplicate: false, proposedCount, skippedCount: 2 };
    fixture.componentRef.setInput('result', result);
    fixture.componentRef.setInput('toConfirm', toConfirm);
    await fixture.whenStable();
    return fixture.nativeElement;
  }

  it('after reading again, accounts for the items kept from before so the banner agrees with the list', async () => {
    const host = await render(9, 10);
    expect(host.querySelector('[data-testid="parse-result-proposed"]')?.textContent).toBe('9 items proposed');
    expect(host.querySelector('[data-testid="parse-result-kept"]')?.textContent).toMatch(/With 1 item kept from before .* the list holds 10 to confirm/s);
  });

  it('says nothing more when the list holds just what was proposed', async () => {
    const host = await render(3, 3);
    expect(host.querySelector('[data-testid="parse-result-kept"]')).toBeNull();
    expect(host.querySelector('[data-testid="parse-result-proposed"]')?.textContent).toBe('3 items proposed');
  });
});

import { TestBed } from '@angular/core/testing';
import { FINAL_STATUSES, REQUEST_STATUSES } from '@cc/shared';
import { StatusChip } from './status-chip';
import { statusTone } from './status-tone';

describe('StatusChip', () => {
  it('shows the plain-words label of the state and its tone', async () => {
    const fixture = TestBed.createComponent(StatusChip);
    fixture.componentRef.setInput('status', 'pricing');
    await fixture.whenStable();
    const host = fixture.nativeElement as HTMLElement;
    // The product's wording for a request waiting on the contractor's prices.
    expect(host.textContent?.trim()).toBe('Awaiting prices');
    expect(host.getAttribute('data-tone')).toBe('waiting');
    expect(host.getAttribute('data-status')).toBe('pricing');
  });
});

describe('statusTone', () => {
  it('ends only withdrawn and declined requests as stopped', () => {
    const stopped = REQUEST_STATUSES.filter((status) => statusTone(status) === 'stopped');
    expect(stopped.sort()).toEqual(['declined', 'withdrawn']);
  });

  it('uses each of the five tones, and tones every final state as finished or stopped', () => {
    expect(new Set(REQUEST_STATUSES.map(statusTone))).toEqual(new Set(['setup', 'waiting', 'work', 'finished', 'stopped']));
    for (const status of FINAL_STATUSES) expect(['finished', 'stopped']).toContain(statusTone(status));
  });
});

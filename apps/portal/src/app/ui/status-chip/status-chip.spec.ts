import { TestBed } from '@angular/core/testing';
import { REQUEST_STATUS_LABELS, REQUEST_STATUSES } from '@cc/shared';
import { StatusChip } from './status-chip';
import { statusTone } from './status-tone';

describe('StatusChip', () => {
  it('shows the plain-words label of the state from shared', async () => {
    const fixture = TestBed.createComponent(StatusChip);
    fixture.componentRef.setInput('status', 'pricing');
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).textContent?.trim()).toBe(REQUEST_STATUS_LABELS.pricing);
  });
});

describe('statusTone', () => {
  it('gives every state a tone, and ends only withdrawn and declined requests as stopped', () => {
    const stopped = REQUEST_STATUSES.filter((status) => statusTone(status) === 'stopped');
    expect(stopped.sort()).toEqual(['declined', 'withdrawn']);
    expect(REQUEST_STATUSES.every((status) => statusTone(status) !== undefined)).toBe(true);
  });
});

import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatChipListboxHarness } from '@angular/material/chips/testing';
import { ActivityEntry } from '@cc/shared';
import { ActivityTimeline, changesOf } from './activity-timeline';

const edit: ActivityEntry = {
  id: 2,
  kind: 'items',
  action: 'item-edited',
  summary: 'Item edited: GFCI does not trip',
  actorName: 'Maya Chen',
  itemId: 9,
  before: { quantity: 1, location: 'hall bath' },
  after: { quantity: 3, location: 'hall bath, both sinks' },
  at: '2026-11-30T15:00:00Z',
};
const opened: ActivityEntry = { id: 1, kind: 'status', action: 'open', summary: 'Open the request: Draft', actorName: null, itemId: null, before: null, after: { status: 'draft' }, at: '2026-11-30T14:00:00Z' };

describe('ActivityTimeline', () => {
  it('puts an edit in words, field by field, before and after', () => {
    expect(changesOf(edit)).toEqual([
      { field: 'Quantity', before: '1', after: '3' },
      { field: 'Where', before: 'hall bath', after: 'hall bath, both sinks' },
    ]);
  });

  it('lists the entries with who and what changed, and reads them again for the kinds chosen', async () => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    const http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(ActivityTimeline);
    fixture.componentRef.setInput('requestId', 12);
    await fixture.whenStable();
    http.expectOne('/api/requests/12/activity?page=0&pageSize=20').flush({ items: [edit, opened], total: 2, page: 0, pageSize: 20 });
    await fixture.whenStable();
    const host: HTMLElement = fixture.nativeElement;
    const entries = host.querySelectorAll('[data-testid="activity-entry"]');
    expect(entries).toHaveLength(2);
    expect(entries[0].textContent).toContain('Item edited: GFCI does not trip');
    expect(entries[0].textContent).toContain('Maya Chen');
    expect(entries[0].querySelector('del')?.textContent).toBe('1');
    expect(entries[0].querySelector('ins')?.textContent).toBe('3');
    expect(entries[1].textContent).toContain('Closing Circuit');

    const chips = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatChipListboxHarness);
    await chips.selectChips({ text: 'Items' });
    http.expectOne('/api/requests/12/activity?page=0&pageSize=20&kind=items').flush({ items: [edit], total: 1, page: 0, pageSize: 20 });
    await fixture.whenStable();
    expect(host.querySelectorAll('[data-testid="activity-entry"]')).toHaveLength(1);
    http.verify();
  });
});

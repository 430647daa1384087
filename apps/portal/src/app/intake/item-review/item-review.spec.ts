import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { LineItem } from '@cc/shared';
import { proposedItems, report, REPORT_PAGES, reportText } from '../testing/intake-fixtures';
import { ItemReview } from './item-review';

describe('ItemReview', () => {
  let fixture: ComponentFixture<ItemReview>;
  let loader: HarnessLoader;
  let documentLoader: HarnessLoader;
  let httpTesting: HttpTestingController;
  let changes: number;
  let confirmed: LineItem[][];

  beforeEach(async () => {
    TestBed.configureTestingModule({
      // Without animations a dialog closes at once, so its outcome is handled before the assertions.
      providers: [provideHttpClient(), provideHttpClientTesting(), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }],
    });
    httpTesting = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(ItemReview);
    fixture.componentRef.setInput('requestId', 12);
    fixture.componentRef.setInput('items', proposedItems());
    fixture.componentRef.setInput('reports', [report()]);
    changes = 0;
    confirmed = [];
    fixture.componentInstance.changed.subscribe(() => changes++);
    fixture.componentInstance.confirmed.subscribe((items) => confirmed.push(items));
    loader = TestbedHarnessEnvironment.loader(fixture);
    documentLoader = TestbedHarnessEnvironment.documentRootLoader(fixture);
    // The report's text is loaded when it is shown (the page is stable once it has come).
    fixture.detectChanges();
    httpTesting.expectOne('/api/requests/12/reports/5/text').flush(reportText());
    await fixture.whenStable();
  });

  afterEach(() => httpTesting.verify());

  const host = (): HTMLElement => fixture.nativeElement;
  const marks = () => Array.from(host().querySelectorAll<HTMLElement>('[data-testid="evidence-mark"]'));

  /** Answers the confirmation that guards an action that cannot be taken back. */
  async function answerConfirmation(goAhead: boolean): Promise<string> {
    const dialog = await documentLoader.getHarness(MatDialogHarness);
    const text = await dialog.getText();
    await (await dialog.getHarness(MatButtonHarness.with({ selector: goAhead ? '[data-testid="confirm-go"]' : '[data-testid="confirm-cancel"]' }))).click();
    await fixture.whenStable();
    return text;
  }

  async function openEditorOf(row: number): Promise<MatDialogHarness> {
    const buttons = await loader.getAllHarnesses(MatButtonHarness.with({ selector: '[data-testid="review-item-edit"]' }));
    await buttons[row].click();
    return documentLoader.getHarness(MatDialogHarness);
  }

  it('lists each item with its plain-language label, room, quantity and NEC references', async () => {
    const table = await loader.getHarness(MatTableHarness);
    const rows = await table.getCellTextByColumnName();
    expect(rows['code'].text[0]).toContain('No ground-fault (GFCI) protection where it is expected');
    expect(rows['room'].text).toEqual(['Kitchen', 'Bedroom', 'Garage']);
    expect(rows['quantity'].text).toEqual(['2', '—', '—']);
    expect(rows['severity'].text[0]).toBe('Safety NEC 210.8(A), 406.4(D)(3)');
    // The GFCI item carries its note on the code in force when the house was built, worded as information.
    expect(host().querySelector('[data-testid="edition-note"]')?.textContent).toContain('information');
    expect(host().querySelector('[data-testid="edition-note-summary"]')?.textContent).toContain('GFCI: came in 1987 (after this 1978 house was built)');
  });

  it('highlights each item’s evidence in the report text, page by page, and marks the clicked item’s', async () => {
    expect(marks().map((m) => m.textContent)).toEqual(proposedItems().map((i) => i.evidence));
    expect(host().querySelectorAll('[data-page]')).toHaveLength(REPORT_PAGES.length);
    expect(marks()[2].closest('[data-page]')?.getAttribute('data-page')).toBe('2');

    const rows = host().querySelectorAll<HTMLElement>('[data-testid="review-item-row"]');
    rows[1].click();
    await fixture.whenStable();
    expect(marks().map((m) => m.classList.contains('is-active'))).toEqual([false, true, false]);
    expect(rows[1].getAttribute('aria-current')).toBe('true');
  });

  it('sends a change with the item’s version and, when the version is stale (409), says so and reloads', async () => {
    const dialog = await openEditorOf(0);
    const location = await dialog.getHarness(MatInputHarness.with({ selector: '[data-testid="item-edit-location"]' }));
    await location.setValue('kitchen island and left of the range');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Save changes' }))).click();

    const req = httpTesting.expectOne({ method: 'PATCH', url: '/api/requests/12/items/31' });
    expect(req.request.body).toEqual(
      expect.objectContaining({ version: 3, code: 'gfci-missing', room: 'kitchen', location: 'kitchen island and left of the range', quantity: 2 }),
    );
    req.flush(
      { error: 'This item was changed by someone else meanwhile. Reload to see the current version.', details: [] },
      { status: 409, statusText: 'Conflict' },
    );
    await fixture.whenStable();

    expect(await documentLoader.getAllHarnesses(MatDialogHarness)).toHaveLength(0);
    expect(host().querySelector('[data-testid="review-conflict"]')?.textContent).toContain('changed by someone else meanwhile');
    expect(changes).toBe(1);
  });

  it('keeps a valid change and asks for the list again', async () => {
    const dialog = await openEditorOf(1);
    await (await dialog.getHarness(MatInputHarness.with({ selector: '[data-testid="item-edit-quantity"]' }))).setValue('2');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Save changes' }))).click();
    const req = httpTesting.expectOne({ method: 'PATCH', url: '/api/requests/12/items/32' });
    expect(req.request.body).toEqual(expect.objectContaining({ version: 1, quantity: 2 }));
    req.flush({ ...proposedItems()[1], quantity: 2, version: 2, isEdited: true });
    await fixture.whenStable();
    expect(changes).toBe(1);
    expect(host().querySelector('[data-testid="review-conflict"]')).toBeNull();
  });

  it('splits an item into parts that must add up to its quantity, sent with its version', async () => {
    const buttons = await loader.getAllHarnesses(MatButtonHarness.with({ selector: '[data-testid="review-item-split"]' }));
    await buttons[0].click();
    const dialog = await documentLoader.getHarness(MatDialogHarness);
    const parts = await dialog.getHarness(MatInputHarness.with({ selector: '[data-testid="split-quantities"]' }));
    expect(await parts.getValue()).toBe('1, 1');
    await parts.setValue('2, 1');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Split' }))).click();
    expect(await dialog.getText()).toContain('The parts add up to 3, but the item has 2');
    httpTesting.expectNone('/api/requests/12/items/31/split');

    await parts.setValue('1, 1');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Split' }))).click();
    const req = httpTesting.expectOne('/api/requests/12/items/31/split');
    expect(req.request.body).toEqual({ version: 3, quantities: [1, 1] });
    req.flush([proposedItems()[0]]);
    await fixture.whenStable();
    expect(changes).toBe(1);
  });

  it('asks before removing an item and sends nothing when the agent cancels', async () => {
    const buttons = await loader.getAllHarnesses(MatButtonHarness.with({ selector: '[data-testid="review-item-remove"]' }));
    await buttons[2].click();
    expect(await answerConfirmation(false)).toContain('Remove this item?');
    httpTesting.expectNone((r) => r.url === '/api/requests/12/items/33');
    expect(changes).toBe(0);
  });

  it('removes an item with its version once the agent confirms', async () => {
    const buttons = await loader.getAllHarnesses(MatButtonHarness.with({ selector: '[data-testid="review-item-remove"]' }));
    await buttons[2].click();
    await answerConfirmation(true);
    const req = httpTesting.expectOne((r) => r.url === '/api/requests/12/items/33');
    expect(req.request.method).toBe('DELETE');
    expect(req.request.params.get('version')).toBe('2');
    req.flush(null, { status: 204, statusText: 'No Content' });
    await fixture.whenStable();
    expect(changes).toBe(1);
  });

  it('merges the two ticked items, the first keeping its id', async () => {
    const boxes = await loader.getAllHarnesses(MatCheckboxHarness);
    await boxes[2].check();
    await boxes[0].check();
    await (await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="review-merge"]' }))).click();
    const req = httpTesting.expectOne('/api/requests/12/items/merge');
    expect(req.request.body).toEqual({ items: [{ id: 31, version: 3 }, { id: 33, version: 2 }] });
    req.flush(proposedItems()[0]);
    await fixture.whenStable();
    expect(changes).toBe(1);
  });

  it('adds an item from text selected in the report, with the selection’s offsets in the joined text', async () => {
    const skippedStart = REPORT_PAGES[0].length + 1 + REPORT_PAGES[1].indexOf('Shingles');
    const span = Array.from(host().querySelectorAll<HTMLElement>('[data-testid="report-text"] span')).find((s) => s.textContent?.includes('Shingles'))!;
    const textNode = span.firstChild!;
    const offsetInSpan = textNode.textContent!.indexOf('Shingles');
    const range = document.createRange();
    range.setStart(textNode, offsetInSpan);
    range.setEnd(textNode, offsetInSpan + 'Shingles are worn'.length);
    window.getSelection()!.removeAllRanges();
    window.getSelection()!.addRange(range);
    host().querySelector('[data-testid="report-text"]')!.dispatchEvent(new MouseEvent('mouseup', { bubbles: true }));
    await fixture.whenStable();
    expect(host().querySelector('[data-testid="review-selection-text"]')?.textContent).toBe('Shingles are worn');

    await (await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="review-add-from-selection"]' }))).click();
    const dialog = await documentLoader.getHarness(MatDialogHarness);
    await (await dialog.getHarness(MatSelectHarness.with({ selector: '[data-testid="item-edit-code"]' }))).clickOptions({ text: /^Service mast/ });
    await (await dialog.getHarness(MatSelectHarness.with({ selector: '[data-testid="item-edit-room"]' }))).clickOptions({ text: 'Exterior' });
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Add item' }))).click();

    const req = httpTesting.expectOne({ method: 'POST', url: '/api/requests/12/items' });
    expect(req.request.body).toEqual(
      expect.objectContaining({ code: 'service-equipment', room: 'exterior', reportFileId: 5, evidenceStart: skippedStart, evidenceEnd: skippedStart + 17 }),
    );
    req.flush({}, { status: 201, statusText: 'Created' });
    await fixture.whenStable();
    expect(changes).toBe(1);
  });

  it('asks before confirming, saying it cannot be changed afterwards, and sends nothing on cancel', async () => {
    await (await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="review-confirm"]' }))).click();
    const text = await answerConfirmation(false);
    expect(text).toContain('Confirm 3 items?');
    expect(text).toContain('can no longer be changed');
    httpTesting.expectNone('/api/requests/12/items/confirm');
    expect(confirmed).toEqual([]);
  });

  it('confirms by sending every proposed item with the version it was shown at', async () => {
    await (await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="review-confirm"]' }))).click();
    await answerConfirmation(true);
    const req = httpTesting.expectOne('/api/requests/12/items/confirm');
    expect(req.request.body).toEqual({
      items: [
        { id: 31, version: 3 },
        { id: 32, version: 1 },
        { id: 33, version: 2 },
      ],
    });
    const open = proposedItems().map((i) => ({ ...i, status: 'open' as const }));
    req.flush(open);
    await fixture.whenStable();
    expect(confirmed).toEqual([open]);
  });

  it('reloads and explains when the list changed before the confirmation (409)', async () => {
    await (await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="review-confirm"]' }))).click();
    await answerConfirmation(true);
    httpTesting
      .expectOne('/api/requests/12/items/confirm')
      .flush({ error: 'The list of items changed since you loaded it. Reload and review again.', details: [] }, { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    expect(host().querySelector('[data-testid="review-conflict"]')?.textContent).toContain('The list of items changed');
    expect(confirmed).toEqual([]);
    expect(changes).toBe(1);
  });
  it('lists the items resting on context or on a device and its condition first, marks them "Check" and counts them', async () => {
    const [gfci, polarity, box] = proposedItems();
    fixture.componentRef.setInput('items', [
      { ...gfci, confidence: 'exact' },
      { ...polarity, confidence: 'composed' },
      { ...box, confidence: 'inferred' },
    ]);
    await fixture.whenStable();
    const table = await loader.getHarness(MatTableHarness);
    expect((await table.getCellTextByColumnName())['room'].text).toEqual(['Garage', 'Bedroom', 'Kitchen']);
    const labels = Array.from(host().querySelectorAll('[data-testid="review-item-confidence"]')).map((m) => m.textContent?.trim());
    expect(labels).toEqual([expect.stringMatching(/Check: inferred$/), expect.stringMatching(/Check: device and condition$/)]);
    expect(host().querySelector('[data-testid="review-low-confidence"]')?.textContent).toContain('2 items rest on context or on a device and its condition');

    fixture.componentRef.setInput('items', [{ ...gfci, confidence: 'exact' }, { ...polarity, confidence: 'normalised' }]);
    await fixture.whenStable();
    expect(host().querySelector('[data-testid="review-low-confidence"]')).toBeNull();
    expect(Array.from(host().querySelectorAll('[data-testid="review-item-confidence"]')).map((m) => m.textContent)).toEqual([expect.stringContaining('Read from shorthand')]);
  });
});

// The sum under a quote's lines (docs/pricing.md, "The model": the service call once per visit, labour
// of a site condition of the whole visit shared out once per visit), priced by the engine from the demo
// rate book: what the reader adds up is what the subtotal says.
import { TestBed } from '@angular/core/testing';
import { DEMO_RATE_BOOK, formatCents, priceQuote } from '@cc/shared';
import { BillSum } from './bill-sum';

const cents = (text: string | null | undefined) => Math.round(Number((text ?? '').replace(/[$,]/g, '')) * 100);

describe('BillSum', () => {
  it('shows the items, the service calls, the site conditions of a visit and the permit, adding up to the subtotal', () => {
    const breakdown = priceQuote(DEMO_RATE_BOOK, {
      visits: [{ key: 'v1', adderIds: ['panel-shutoff'], hasPermit: true }, { key: 'v2' }],
      lines: [
        { key: 'a', visitKey: 'v1', entryId: 'double-tap-pigtail', quantity: 1 },
        { key: 'b', visitKey: 'v1', entryId: 'gfci-replace-flat', quantity: 2 },
        { key: 'c', visitKey: 'v2', entryId: 'smoke-alarm-sealed', quantity: 1 },
      ],
    });
    const fixture = TestBed.createComponent(BillSum);
    fixture.componentRef.setInput('breakdown', breakdown);
    fixture.detectChanges();
    const host: HTMLElement = fixture.nativeElement;
    const amounts = Array.from(host.querySelectorAll('dd')).map((dd) => cents(dd.textContent));
    const subtotal = amounts.pop()!;
    expect(subtotal).toBe(breakdown.subtotalCents);
    expect(amounts.reduce((s, a) => s + a, 0)).toBe(subtotal);
    expect(host.textContent).toContain('Service calls (2 visits)');
    expect(host.querySelector('[data-testid="bill-sum-conditions"]')?.textContent?.trim()).not.toBe(formatCents(0));
  });

  it('shows nothing before anything is priced', () => {
    const fixture = TestBed.createComponent(BillSum);
    fixture.componentRef.setInput('breakdown', null);
    fixture.detectChanges();
    expect(fixture.nativeElement.querySelector('[data-testid="bill-sum"]')).toBeNull();
  });
});

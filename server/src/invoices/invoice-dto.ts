import type { InvoiceSummary } from '@cc/shared';
import type { InvoiceSeries, StoredInvoice } from './invoice.repository';

const PREFIX: Record<InvoiceSeries, string> = { invoice: 'INV', receipt: 'RCT' };

/** The number as printed: INV-000012, RCT-000007 (per contractor organisation and series). */
export function invoiceNumber(series: InvoiceSeries, number: number): string {
  return `${PREFIX[series]}-${String(number).padStart(6, '0')}`;
}

export function toInvoiceSummary(i: StoredInvoice): InvoiceSummary {
  return {
    id: i.id,
    number: invoiceNumber(i.series, i.number),
    kind: i.kind,
    issuedAt: i.issuedAt.toISOString(),
    totalCents: i.totalCents,
    balanceCents: i.balanceCents,
    pdfPath: `/api/requests/${i.requestId}/invoices/${i.id}.pdf`,
    sentTo: i.sentTo,
  };
}

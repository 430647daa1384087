import type { InvoiceContent } from '../../invoices/invoices.service';
import { createPdfLayout, MARGIN, MUTED } from './pdf-layout';
import { formatCents } from '@cc/shared';
import { formatDay } from './quote-pdf';

/** An invoice, an invoice payable at closing, or a receipt, as a PDF to download. */
export function renderInvoicePdf(c: InvoiceContent): Promise<Buffer> {
  const { doc, heading, paragraph, row, finish } = createPdfLayout({ info: { Title: `${c.title} ${c.number}`, Author: c.contractor.name, Subject: `${c.title} for ${c.requestReference}` } });
  doc.font('strong').fontSize(18).text(c.contractor.name, MARGIN, MARGIN);
  const licence = c.contractor.licenceNumber ? `Licence ${c.contractor.licenceNumber}${c.contractor.licenceState ? ` (${c.contractor.licenceState})` : ''}` : 'Licence number not on file';
  paragraph([licence, c.contractor.address, c.contractor.phone].filter(Boolean).join(' · '), 10, MUTED);
  doc.moveDown(1);
  doc.font('strong').fontSize(14).fillColor('black').text(`${c.title} ${c.number}`);
  paragraph(`Request ${c.requestReference} · ${c.property}`);
  const facts = [c.issuedOn && `Issued ${formatDay(c.issuedOn)}`, c.sellerName && `Seller: ${c.sellerName}`, c.closingDate && `Closing ${formatDay(c.closingDate)}`].filter(Boolean);
  if (facts.length) paragraph(facts.join(' · '), 10, MUTED);
  heading('To');
  paragraph(c.addressedTo.name);
  for (const line of c.addressedTo.lines) paragraph(line, 10, MUTED);

  if (c.receiptFor) {
    heading('Payment received');
    row(`${c.receiptFor.description}, ${c.receiptFor.date}`, '', formatCents(c.receiptFor.amountCents), 'strong');
  }

  heading('Work');
  row('Item', 'Qty', 'Amount', 'strong');
  for (const line of c.lines) row(`${line.description}${line.state ? ` (${line.state})` : ''}`, line.quantity === null ? '' : String(line.quantity), formatCents(line.amountCents));
  if (c.serviceCallsCents) row('Service calls', '', formatCents(c.serviceCallsCents));
  if (c.visitConditionsCents) row('Site conditions per visit', '', formatCents(c.visitConditionsCents));
  if (c.permitCents) row('Permit fee and handling', '', formatCents(c.permitCents));
  row('Subtotal', '', formatCents(c.subtotalCents), 'strong');
  row('Sales tax on materials', '', formatCents(c.taxCents));
  row('Total', '', formatCents(c.totalCents), 'strong');

  heading('Payments');
  if (!c.payments.length) paragraph('No payment received yet.', 10, MUTED);
  for (const p of c.payments) row(`${p.description}, ${p.date}`, '', formatCents(p.amountCents));
  row('Paid', '', formatCents(c.paidCents));
  row('Balance due', '', formatCents(c.balanceCents), 'strong');

  if (c.instructions) {
    heading('Payment instructions');
    paragraph(c.instructions);
  }
  doc.moveDown(1);
  paragraph(`Amounts in US dollars. ${c.number} · ${c.requestReference}.`, 9, MUTED);
  return finish();
}

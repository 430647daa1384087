import PDFDocument from 'pdfkit';
import { formatCents, formatCentsDelta, type QuoteVersion } from '@cc/shared';
import { PDF_FONT_REGULAR as REGULAR, PDF_FONT_SEMIBOLD as SEMIBOLD } from './pdf-fonts';

// The quote as a PDF to download: Letter pages, Source Sans 3 embedded as a subset.

const MARGIN = 54;
const PAGE_WIDTH = 612;
const CONTENT_WIDTH = PAGE_WIDTH - 2 * MARGIN;
const AMOUNT_WIDTH = 90;
const QTY_WIDTH = 50;
const MUTED = '#555555';

const basisPointsAsPercent = (bp: number) => `${(bp / 100).toLocaleString('en-US', { maximumFractionDigits: 2 })} %`;

function licenceLine(c: QuoteVersion['contractor']): string {
  if (!c.licenceNumber) return 'Licence number not on file';
  return [`Licence ${c.licenceNumber}`, c.licenceState && `(${c.licenceState})`, c.licenceClass && `· ${c.licenceClass}`].filter(Boolean).join(' ');
}

/** Each distinct edition note of the priced lines once, with the items it is about. */
export function houseAndCodeNotes(lines: readonly QuoteVersion['lines'][number][]): { items: string; text: string }[] {
  const byText = new Map<string, string[]>();
  for (const line of lines) {
    if (!line.editionNote) continue;
    const name = `${line.entry?.name ?? line.code}${line.location ? ` (${line.location})` : ''}`;
    byText.set(line.editionNote.text, [...(byText.get(line.editionNote.text) ?? []), name]);
  }
  return [...byText].map(([text, names]) => ({ items: names.join('; '), text }));
}

export function renderQuotePdf(quote: QuoteVersion): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const doc = new PDFDocument({
      size: 'LETTER',
      margin: MARGIN,
      info: { Title: `Quote ${quote.requestReference} version ${quote.version}`, Author: quote.contractor.name, Subject: 'Electrical repair quote' },
    });
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    doc.registerFont('body', REGULAR);
    doc.registerFont('strong', SEMIBOLD);

    const bottom = () => doc.page.height - MARGIN;
    const ensureSpace = (height: number) => {
      if (doc.y + height > bottom()) doc.addPage();
    };
    const heading = (text: string) => {
      ensureSpace(40);
      doc.moveDown(0.8).font('strong').fontSize(13).fillColor('black').text(text, MARGIN, doc.y, { width: CONTENT_WIDTH });
      doc.moveDown(0.3);
    };
    const paragraph = (text: string, size = 10, color = 'black') => {
      doc.font('body').fontSize(size).fillColor(color).text(text, MARGIN, doc.y, { width: CONTENT_WIDTH });
    };
    /** A row of description, quantity and amount, kept together on one page. */
    const row = (description: string, qty: string, amount: string, font: 'body' | 'strong' = 'body') => {
      const descWidth = CONTENT_WIDTH - QTY_WIDTH - AMOUNT_WIDTH - 12;
      doc.font(font).fontSize(10).fillColor('black');
      const height = Math.max(doc.heightOfString(description, { width: descWidth }), doc.heightOfString(amount, { width: AMOUNT_WIDTH }));
      ensureSpace(height + 4);
      const y = doc.y;
      doc.text(description, MARGIN, y, { width: descWidth });
      doc.text(qty, MARGIN + descWidth + 6, y, { width: QTY_WIDTH, align: 'right' });
      doc.text(amount, PAGE_WIDTH - MARGIN - AMOUNT_WIDTH, y, { width: AMOUNT_WIDTH, align: 'right' });
      doc.x = MARGIN;
      doc.y = y + height + 4;
    };

    const c = quote.contractor;
    doc.font('strong').fontSize(18).text(c.name, MARGIN, MARGIN, { width: CONTENT_WIDTH });
    paragraph(licenceLine(c), 10, MUTED);
    const contact = [c.address, c.phone].filter(Boolean).join(' · ');
    if (contact) paragraph(contact, 10, MUTED);

    doc.moveDown(1);
    doc.font('strong').fontSize(14).fillColor('black').text(`Quote ${quote.requestReference}, version ${quote.version}`, { width: CONTENT_WIDTH });
    paragraph(`${quote.property.street}, ${quote.property.city}, ${quote.property.state} ${quote.property.zip}`);
    paragraph(`Sent ${quote.sentAt.slice(0, 10)}${quote.sentByName ? ` by ${quote.sentByName}` : ''} · Prices valid until ${quote.validUntil}`, 10, MUTED);
    paragraph(quote.isCurrent ? 'This is the current version of the quote.' : 'A later version of this quote has been sent; this version is superseded.', 10, MUTED);
    if (quote.note) {
      doc.moveDown(0.5);
      paragraph(quote.note);
    }

    heading('Work quoted');
    row('Item', 'Qty', 'Amount', 'strong');
    const priced = quote.lines.filter((l) => l.kind === 'priced');
    for (const line of priced) {
      const where = [line.location, line.room !== 'unknown' ? line.room : null].filter(Boolean).join(', ');
      const extras = [line.adders.length ? `site: ${line.adders.map((a) => a.name).join(', ')}` : null, line.isQuantityAssumed ? 'quantity assumed, to be confirmed on site' : null].filter(Boolean).join('; ');
      const description = `${line.entry?.name ?? line.code}${where ? ` — ${where}` : ''}${extras ? ` (${extras})` : ''}`;
      row(description, String(line.quantity ?? ''), formatCents(line.lineCents));
      if (line.editionNote) paragraph(`Code when built: ${line.editionNote.summary}`, 8.5, MUTED);
    }
    doc.font('body').fontSize(9).fillColor(MUTED).text('Line amounts hold the labour share, materials with markup and flat-rate prices; the charges of each visit follow.', MARGIN, doc.y, { width: CONTENT_WIDTH });

    const b = quote.breakdown;
    heading('Totals');
    const visitAdderLabour = b.visits.reduce((sum, v) => sum + v.visitAdderLabourCents, 0);
    const totals: [string, number][] = [
      [`Service call${b.visits.length > 1 ? `s (${b.visits.length} visits)` : ''}`, b.serviceCallCents],
      ['First-hour minimum (travel and first hour of labour)', b.firstHourMinimumCents],
      ['Labour after the first hour', b.extraLabourCents],
      ['Flat-rate work', b.flatCents],
      ['Materials', b.materialsCostCents],
      ['Markup on materials', b.materialsMarkupCents],
      ['Permit fee and handling', b.permitCents],
    ];
    for (const [label, cents] of totals) if (cents > 0) row(label, '', formatCents(cents));
    if (visitAdderLabour > 0) paragraph(`Labour includes ${formatCents(visitAdderLabour)} for site conditions of the visit as a whole.`, 9, MUTED);
    row('Subtotal', '', formatCents(b.subtotalCents), 'strong');
    row('Sales tax on materials', '', formatCents(b.materialsTaxCents));
    row('Total', '', formatCents(b.totalCents), 'strong');
    row(`Deposit when paying by card (${basisPointsAsPercent(quote.cardDepositBp)})`, '', formatCents(b.depositCents));

    const declined = quote.lines.filter((l) => l.kind === 'out-of-scope');
    if (declined.length) {
      heading('Not in our scope');
      for (const line of declined) paragraph(`${line.code}${line.location ? ` — ${line.location}` : ''}: ${line.outOfScopeReason ?? ''}`);
    }

    if (quote.changes) {
      const ch = quote.changes;
      heading(`Changes since version ${ch.previousVersion}`);
      for (const l of ch.added) paragraph(`Added: ${l.code}${l.location ? ` — ${l.location}` : ''}, ${formatCents(l.lineCents)}`);
      for (const l of ch.removed) paragraph(`Removed: ${l.code}${l.location ? ` — ${l.location}` : ''}, was ${formatCents(l.lineCents)}`);
      for (const l of ch.changed) paragraph(`Changed: ${l.code}${l.location ? ` — ${l.location}` : ''}, ${formatCents(l.previousLineCents)} → ${formatCents(l.lineCents)}`);
      paragraph(`Total ${formatCents(ch.previousTotalCents)} → ${formatCents(b.totalCents)} (${formatCentsDelta(ch.totalDeltaCents)})`);
    }

    const notes = houseAndCodeNotes(priced);
    if (notes.length) {
      heading('The house and the code in force when it was built');
      for (const n of notes) {
        ensureSpace(30);
        doc.font('strong').fontSize(10).fillColor('black').text(n.items, MARGIN, doc.y, { width: CONTENT_WIDTH });
        paragraph(n.text, 9.5);
        doc.moveDown(0.3);
      }
    }

    heading('Warranty');
    paragraph(quote.warrantyText);
    heading('Safety and permits');
    paragraph(quote.safetyNotice);
    doc.moveDown(1);
    paragraph(`Prices in US dollars. ${quote.requestReference} · quote version ${quote.version}.`, 9, MUTED);
    doc.end();
  });
}

import { FINDING_CODE_TABLE, formatCents, formatCentsDelta, placeLabel, quantityLabel, type QuoteVersion } from '@cc/shared';
import { CONTENT_WIDTH, createPdfLayout, MARGIN, MUTED } from './pdf-layout';

// The quote as a PDF to download: Letter pages in Source Sans 3 (pdf-layout.ts), page numbers at the foot.

/** Room kept free at the foot of each page for the page number. */
const FOOTER_HEIGHT = 24;

/** "Dec 2, 2026", as the portal writes a date (Angular's mediumDate), from `YYYY-MM-DD` or a timestamp. */
export function formatDay(iso: string): string {
  const day = new Date(`${iso.slice(0, 10)}T12:00:00Z`);
  return new Intl.DateTimeFormat('en-US', { month: 'short', day: 'numeric', year: 'numeric', timeZone: 'UTC' }).format(day);
}

/** The plain-words label of a finding code (the code itself only for one the table does not know). */
const findingLabel = (code: string) => (code in FINDING_CODE_TABLE ? FINDING_CODE_TABLE[code as keyof typeof FINDING_CODE_TABLE].label : code);

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
    const name = `${line.entry?.name ?? line.code} (${placeLabel(line.room, line.location)})`;
    byText.set(line.editionNote.text, [...(byText.get(line.editionNote.text) ?? []), name]);
  }
  return [...byText].map(([text, names]) => ({ items: names.join('; '), text }));
}

export function renderQuotePdf(quote: QuoteVersion): Promise<Buffer> {
  const layout = createPdfLayout({
    info: { Title: `Quote ${quote.requestReference} version ${quote.version}`, Author: quote.contractor.name, Subject: 'Electrical repair quote' },
    footerHeight: FOOTER_HEIGHT,
  });
  const { doc, ensureSpace, heading, paragraph, section, row } = layout;

  const c = quote.contractor;
  doc.font('strong').fontSize(18).text(c.name, MARGIN, MARGIN, { width: CONTENT_WIDTH });
  paragraph(licenceLine(c), 10, MUTED);
  const contact = [c.address, c.phone].filter(Boolean).join(' · ');
  if (contact) paragraph(contact, 10, MUTED);

  doc.moveDown(1);
  doc.font('strong').fontSize(14).fillColor('black').text(`Quote ${quote.requestReference}, version ${quote.version}`, { width: CONTENT_WIDTH });
  paragraph(`${quote.property.street}, ${quote.property.city}, ${quote.property.state} ${quote.property.zip}`);
  paragraph(`Sent ${formatDay(quote.sentAt)}${quote.sentByName ? ` by ${quote.sentByName}` : ''} · Prices valid until ${formatDay(quote.validUntil)}`, 10, MUTED);
  paragraph(quote.isCurrent ? 'This is the current version of the quote.' : 'A later version of this quote has been sent; this version is superseded.', 10, MUTED);
  if (quote.note) {
    doc.moveDown(0.5);
    paragraph(quote.note);
  }

  heading('Work quoted');
  row('Item', 'Qty', 'Amount', 'strong');
  const priced = quote.lines.filter((l) => l.kind === 'priced');
  for (const line of priced) {
    const where = placeLabel(line.room, line.location);
    const extras = [line.adders.length ? `site: ${line.adders.map((a) => a.name).join(', ')}` : null, line.isQuantityAssumed ? 'quantity assumed, to be confirmed on site' : null].filter(Boolean).join('; ');
    const description = `${line.entry?.name ?? findingLabel(line.code)} — ${where}${extras ? ` (${extras})` : ''}`;
    row(description, quantityLabel(line.quantity, line.entry?.unit), formatCents(line.lineCents));
    if (line.editionNote) {
      // The note belongs to the row above it: a gap before the next row keeps it from reading as that row's.
      paragraph(`Code when built: ${line.editionNote.summary}`, 8.5, MUTED);
      doc.moveDown(0.4);
    }
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
    for (const line of declined) paragraph(`${findingLabel(line.code)} — ${placeLabel(line.room, line.location)}: ${line.outOfScopeReason ?? ''}`);
  }

  if (quote.changes) {
    const ch = quote.changes;
    heading(`Changes since version ${ch.previousVersion}`);
    const what = (l: { code: string; location: string }) => `${findingLabel(l.code)}${l.location ? ` — ${l.location}` : ''}`;
    for (const l of ch.added) paragraph(`Added: ${what(l)}, ${formatCents(l.lineCents)}`);
    for (const l of ch.removed) paragraph(`Removed: ${what(l)}, was ${formatCents(l.lineCents)}`);
    for (const l of ch.changed) paragraph(`Changed: ${what(l)}, ${formatCents(l.previousLineCents)} → ${formatCents(l.lineCents)}`);
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

  section('Warranty', quote.warrantyText);
  section('Safety and permits', quote.safetyNotice);
  acceptance(doc, quote, ensureSpace, heading);
  layout.pageNumbers(`${quote.requestReference} · quote version ${quote.version} · prices in US dollars`);
  return layout.finish();
}

/** Where the seller accepts the quote in writing, kept whole on one page. */
function acceptance(doc: PDFKit.PDFDocument, quote: QuoteVersion, ensureSpace: (height: number) => void, heading: (text: string) => void): void {
  const text =
    `The seller accepts the work quoted above, version ${quote.version} of quote ${quote.requestReference}, for ${formatCents(quote.breakdown.totalCents)}, ` +
    `at the prices valid until ${formatDay(quote.validUntil)}, and authorises ${quote.contractor.name} to carry it out under the terms above.`;
  doc.font('body').fontSize(10);
  ensureSpace(40 + doc.heightOfString(text, { width: CONTENT_WIDTH }) + 110);
  heading('Acceptance');
  doc.font('body').fontSize(10).fillColor('black').text(text, MARGIN, doc.y, { width: CONTENT_WIDTH });
  const fields: [string, string][] = [
    ['Seller’s name', 'Date'],
    ['Seller’s signature', ''],
  ];
  const half = (CONTENT_WIDTH - 24) / 2;
  for (const [left, right] of fields) {
    doc.moveDown(2.2);
    const y = doc.y;
    doc.moveTo(MARGIN, y).lineTo(MARGIN + (right ? half : CONTENT_WIDTH), y).strokeColor('#888888').lineWidth(0.7).stroke();
    if (right) doc.moveTo(MARGIN + half + 24, y).lineTo(MARGIN + CONTENT_WIDTH, y).stroke();
    doc.font('body').fontSize(8).fillColor(MUTED).text(left, MARGIN, y + 3, { width: half });
    if (right) doc.text(right, MARGIN + half + 24, y + 3, { width: half });
    doc.x = MARGIN;
  }
}

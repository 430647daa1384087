import PDFDocument from 'pdfkit';
import QRCode from 'qrcode';
import { CORRECTION_OUTCOME_LABELS, findingCodeInfo, placeLabel, WORK_SAFETY_CAUTION, type Correction, type FindingCode } from '@cc/shared';
import { PDF_FONT_REGULAR, PDF_FONT_SEMIBOLD } from '../integrations/pdf/pdf-fonts';

/** Everything a completion letter says, gathered by the letters service. */
export interface LetterContent {
  number: string;
  revision: number;
  issuedOn: string;
  requestReference: string;
  contractor: { name: string; licence: string; contact: string };
  property: string;
  parties: { role: string; name: string }[];
  reportReference: string;
  items: { code: FindingCode; room: string; location: string; quantity: number | null; correction: Correction | null }[];
  /** Items the seller declined: not done, for that reason. */
  declinedItems: { code: FindingCode; room: string; location: string; quantity: number | null }[];
  permit: string;
  warranty: string;
  paymentStatus: string;
  signatureName: string;
  verificationUrl: string;
  verificationCode: string;
  photos: Map<number, Buffer>;
}

const MARGIN = 54;
const PAGE_WIDTH = 612;
const CONTENT_WIDTH = PAGE_WIDTH - 2 * MARGIN;
const MUTED = '#555555';
const THUMB = 96;

/** What the letter says of items the seller declined (in "Items not done"). */
export const DECLINED_BY_SELLER = 'Not done: declined by the seller';

export const SCOPE_STATEMENT =
  'Only the items listed in this letter were addressed. No other part of the electrical system was evaluated, ' +
  'repaired or warranted, and this letter is not a full inspection of the property.';

/** The completion letter as a PDF (Letter pages, Source Sans 3 embedded, QR code to the verification page). */
export async function renderLetterPdf(letter: LetterContent): Promise<Buffer> {
  const qr = await QRCode.toBuffer(letter.verificationUrl, { type: 'png', margin: 1, width: 180 });
  return new Promise((resolve, reject) => {
    const doc = new PDFDocument({
      size: 'LETTER',
      margin: MARGIN,
      info: { Title: `Completion letter ${letter.number} revision ${letter.revision}`, Author: letter.contractor.name, Subject: 'Electrical completion letter' },
    });
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    doc.registerFont('body', PDF_FONT_REGULAR);
    doc.registerFont('strong', PDF_FONT_SEMIBOLD);

    const ensureSpace = (height: number) => {
      if (doc.y + height > doc.page.height - MARGIN) doc.addPage();
    };
    const heading = (text: string, size = 13) => {
      ensureSpace(48);
      doc.moveDown(0.8).font('strong').fontSize(size).fillColor('black').text(text, MARGIN, doc.y, { width: CONTENT_WIDTH });
      doc.moveDown(0.3);
    };
    const paragraph = (text: string, size = 10, color = 'black', indent = 0) => {
      doc.font('body').fontSize(size).fillColor(color).text(text, MARGIN + indent, doc.y, { width: CONTENT_WIDTH - indent });
    };

    doc.font('strong').fontSize(18).text(letter.contractor.name, MARGIN, MARGIN, { width: CONTENT_WIDTH - 110 });
    paragraph(letter.contractor.licence, 10, MUTED);
    if (letter.contractor.contact) paragraph(letter.contractor.contact, 10, MUTED);
    doc.image(qr, PAGE_WIDTH - MARGIN - 90, MARGIN, { fit: [90, 90] });
    doc.font('body').fontSize(7).fillColor(MUTED).text(`Verify: ${letter.verificationCode}`, PAGE_WIDTH - MARGIN - 100, MARGIN + 92, { width: 110, align: 'center' });

    doc.y = Math.max(doc.y, MARGIN + 110);
    doc.font('strong').fontSize(15).fillColor('black').text(`Completion letter ${letter.number}, revision ${letter.revision}`, MARGIN, doc.y, { width: CONTENT_WIDTH });
    paragraph(`Issued ${letter.issuedOn} · request ${letter.requestReference}`, 10, MUTED);
    paragraph(`Property: ${letter.property}`);
    for (const p of letter.parties) paragraph(`${p.role}: ${p.name}`);
    paragraph(`Inspection report: ${letter.reportReference}`);
    paragraph(`Verify this letter at ${letter.verificationUrl} (code ${letter.verificationCode}).`, 9, MUTED);

    const corrected = letter.items.filter((i) => i.correction?.outcome === 'corrected');
    const notDone = letter.items.filter((i) => i.correction && i.correction.outcome !== 'corrected');

    heading('Items corrected');
    if (!corrected.length) paragraph('None.');
    for (const [index, item] of corrected.entries()) writeItem(index + 1, item);

    heading('Items not done');
    if (!notDone.length && !letter.declinedItems.length) paragraph('None: every listed item was corrected.');
    const notDoneLines = [
      ...notDone.map((item) => ({ item, why: `${CORRECTION_OUTCOME_LABELS[item.correction!.outcome]}: ${item.correction!.reason}` })),
      ...letter.declinedItems.map((item) => ({ item, why: DECLINED_BY_SELLER })),
    ];
    for (const { item, why } of notDoneLines) {
      ensureSpace(40);
      doc.font('strong').fontSize(10.5).fillColor('black').text(`${findingCodeInfo(item.code).label} — ${where(item)}`, MARGIN, doc.y, { width: CONTENT_WIDTH });
      paragraph(why, 10, 'black', 12);
      doc.moveDown(0.4);
    }

    heading('Permit');
    paragraph(letter.permit);
    heading('Scope');
    paragraph(SCOPE_STATEMENT);
    heading('Warranty');
    paragraph(letter.warranty);
    heading('Payment');
    paragraph(letter.paymentStatus);
    heading('Safety and code notice');
    paragraph(WORK_SAFETY_CAUTION);
    paragraph('Code references are for information; the edition adopted locally and the authority having jurisdiction decide.', 10);

    ensureSpace(80);
    doc.moveDown(1.2);
    paragraph(`Signed for ${letter.contractor.name}`, 10, MUTED);
    doc.font('strong').fontSize(13).fillColor('black').text(`/s/ ${letter.signatureName}`, MARGIN, doc.y, { width: CONTENT_WIDTH });
    paragraph(`Date: ${letter.issuedOn}`);
    doc.end();

    function where(item: LetterContent['declinedItems'][number]): string {
      return [placeLabel(item.room, item.location), item.quantity ? `quantity ${item.quantity}` : null].filter(Boolean).join(', ');
    }

    function writeItem(position: number, item: LetterContent['items'][number]): void {
      const c = item.correction!;
      const outside = c.evaluations.filter((e) => e.status === 'outside');
      ensureSpace(60);
      doc.font('strong').fontSize(10.5).fillColor('black').text(`${position}. ${findingCodeInfo(item.code).label} — ${where(item)}`, MARGIN, doc.y, { width: CONTENT_WIDTH });
      if (outside.length) {
        // Never listed as corrected without saying so: the failing checks and the contractor's note come first.
        paragraph(`${outsideReadingNotice(outside.map((e) => e.label))} ${c.reason ? `Contractor's note: ${c.reason}` : 'No note was given.'}`, 10, 'black', 12);
      }
      paragraph(`Work performed: ${c.workPerformed}`, 10, 'black', 12);
      if (c.materials) paragraph(`Materials: ${c.materials}`, 10, 'black', 12);
      const device = [c.deviceMake, c.deviceModel, c.deviceLot && `lot/date code ${c.deviceLot}`].filter(Boolean).join(' ');
      if (device) paragraph(`Device installed: ${device}`, 10, 'black', 12);
      if (c.labels.length) paragraph(`Labels applied: ${c.labels.map((l) => `"${l}"`).join(', ')}`, 10, 'black', 12);
      if (c.siteVisitNumber) paragraph(`Done on site visit ${c.siteVisitNumber}`, 9, MUTED, 12);
      if (c.evaluations.length) {
        paragraph('Test results:', 10, 'black', 12);
        for (const e of c.evaluations) {
          const verdict = { within: 'within the expected range', outside: 'OUTSIDE the expected range', flag: 'within the limit, worth a look', recorded: 'recorded' }[e.status];
          paragraph(`• ${e.label}: ${e.value} — ${verdict}. Expected: ${e.expected}.${e.source ? ` Source: ${e.source}.` : ''}`, 9.5, 'black', 20);
        }
      }
      const thumbs = c.photos.filter((p) => letter.photos.has(p.id));
      if (thumbs.length) {
        ensureSpace(THUMB + 20);
        const top = doc.y + 4;
        thumbs.slice(0, 5).forEach((p, i) => {
          const x = MARGIN + 12 + i * (THUMB + 8);
          doc.image(letter.photos.get(p.id)!, x, top, { fit: [THUMB, THUMB] });
          doc.font('body').fontSize(7.5).fillColor(MUTED).text(p.kind === 'before' ? 'Before' : 'After', x, top + THUMB + 2, { width: THUMB });
        });
        doc.x = MARGIN;
        doc.y = top + THUMB + 14;
      }
      doc.moveDown(0.5);
    }
  });
}

/** The line a corrected item with a reading outside its range carries on the letter. */
export function outsideReadingNotice(labels: readonly string[]): string {
  return `Recorded as corrected with ${labels.length === 1 ? 'a reading' : 'readings'} OUTSIDE the expected range (${labels.join('; ')}).`;
}

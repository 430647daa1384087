import PDFDocument from 'pdfkit';
import QRCode from 'qrcode';
import { codeReferenceText, CORRECTION_OUTCOME_LABELS, findingCodeInfo, placeLabel, WORK_SAFETY_CAUTION, type Correction, type FindingCode } from '@cc/shared';
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
  items: { code: FindingCode; room: string; location: string; quantity: number | null; necRefs: readonly string[]; correction: Correction | null }[];
  /** Items the seller declined: not done, for that reason. */
  declinedItems: { code: FindingCode; room: string; location: string; quantity: number | null }[];
  permit: string;
  warranty: string;
  /** Paid in full or to be paid at closing, in neutral words; null leaves the section out (no amounts: `letterPaymentText`). */
  paymentStatus: string | null;
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
/** Room kept at the foot of every page for the letter's number, the page and the verification code. */
const FOOTER = 22;

/** What the letter says of items the seller declined (in "Items not done"). */
export const DECLINED_BY_SELLER = 'Not done: declined by the seller';

export const SCOPE_STATEMENT =
  'Only the items listed in this letter were addressed. No other part of the electrical system was evaluated, ' +
  'repaired or warranted, and this letter is not a full inspection of the property.';

/** The completion letter as a PDF (Letter pages, Source Sans 3 embedded, QR code to the verification page). */
export async function renderLetterPdf(letter: LetterContent): Promise<Buffer> {
  const qr = await QRCode.toBuffer(letter.verificationUrl, { type: 'png', margin: 1, width: 180 });
  return new Promise((resolve, reject) => {
    // Pages are kept until the end so that each gets its footer ("page 2 of 3") once the count is known.
    const doc = new PDFDocument({
      size: 'LETTER',
      margins: { top: MARGIN, left: MARGIN, right: MARGIN, bottom: MARGIN + FOOTER },
      bufferPages: true,
      info: { Title: `Completion letter ${letter.number} revision ${letter.revision}`, Author: letter.contractor.name, Subject: 'Electrical completion letter' },
    });
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    doc.registerFont('body', PDF_FONT_REGULAR);
    doc.registerFont('strong', PDF_FONT_SEMIBOLD);

    const bottom = () => doc.page.height - MARGIN - FOOTER;
    const usable = () => doc.page.height - 2 * MARGIN - FOOTER;
    const ensureSpace = (height: number) => {
      if (doc.y + height > bottom()) doc.addPage();
    };
    /** Starts a block on a new page when it does not fit the rest of this one but fits a page of its own. */
    const keepTogether = (height: number) => ensureSpace(Math.min(height, usable()));
    const heightOf = (text: string, size: number, indent = 0, font = 'body') => doc.font(font).fontSize(size).heightOfString(text, { width: CONTENT_WIDTH - indent });
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
    if (letter.paymentStatus) {
      heading('Payment');
      paragraph(letter.paymentStatus);
    }
    // The last notice and the signature stay together: a signature is never alone on a page.
    const codeNote = 'Code references are for information; the edition adopted locally and the authority having jurisdiction decide.';
    keepTogether(48 + heightOf(WORK_SAFETY_CAUTION, 10) + heightOf(codeNote, 10) + 80);
    heading('Safety and code notice');
    paragraph(WORK_SAFETY_CAUTION);
    paragraph(codeNote, 10);

    ensureSpace(80);
    doc.moveDown(1.2);
    paragraph(`Signed for ${letter.contractor.name}`, 10, MUTED);
    doc.font('strong').fontSize(13).fillColor('black').text(`/s/ ${letter.signatureName}`, MARGIN, doc.y, { width: CONTENT_WIDTH });
    paragraph(`Date: ${letter.issuedOn}`);

    // Every page names the letter, its page and how to verify it, so no page can pass for another letter's.
    const pages = doc.bufferedPageRange();
    for (let i = 0; i < pages.count; i++) {
      doc.switchToPage(pages.start + i);
      doc.page.margins.bottom = 0;
      doc
        .font('body')
        .fontSize(8)
        .fillColor(MUTED)
        .text(letterFooter(letter, i + 1, pages.count), MARGIN, doc.page.height - MARGIN - 8, { width: CONTENT_WIDTH, align: 'center', lineBreak: false });
    }
    doc.end();

    function where(item: LetterContent['declinedItems'][number]): string {
      return [placeLabel(item.room, item.location), item.quantity ? `quantity ${item.quantity}` : null].filter(Boolean).join(', ');
    }

    function writeItem(position: number, item: LetterContent['items'][number]): void {
      const c = item.correction!;
      const outside = c.evaluations.filter((e) => e.status === 'outside');
      const title = `${position}. ${findingCodeInfo(item.code).label} — ${where(item)}`;
      // The item's lines: [text, size, colour, indent].
      const lines: Array<[string, number, string, number]> = [];
      if (outside.length) {
        // Never listed as corrected without saying so: the failing checks and the contractor's note come first.
        lines.push([`${outsideReadingNotice(outside.map((e) => e.label))} ${c.reason ? `Contractor's note: ${c.reason}` : 'No note was given.'}`, 10, 'black', 12]);
      }
      lines.push([`Work performed: ${c.workPerformed}`, 10, 'black', 12]);
      if (c.materials) lines.push([`Materials: ${c.materials}`, 10, 'black', 12]);
      const device = [c.deviceMake, c.deviceModel, c.deviceLot && `lot/date code ${c.deviceLot}`].filter(Boolean).join(' ');
      if (device) lines.push([`Device installed: ${device}`, 10, 'black', 12]);
      if (c.labels.length) lines.push([`Labels applied: ${c.labels.map((l) => `"${l}"`).join(', ')}`, 10, 'black', 12]);
      if (item.necRefs.length) lines.push([`Code reference: ${codeReferenceText(item.necRefs)}`, 9, MUTED, 12]);
      if (c.siteVisitNumber) lines.push([`Done on site visit ${c.siteVisitNumber}`, 9, MUTED, 12]);
      if (c.evaluations.length) {
        lines.push(['Test results:', 10, 'black', 12]);
        for (const e of c.evaluations) {
          const verdict = { within: 'within the expected range', outside: 'OUTSIDE the expected range', flag: 'within the limit, worth a look', recorded: 'recorded' }[e.status];
          lines.push([`• ${e.label}: ${e.value} — ${verdict}. Expected: ${e.expected}.${e.source ? ` Source: ${e.source}.` : ''}`, 9.5, 'black', 20]);
        }
      }
      // Each photo's drawn height (fitted in a THUMB square), so its caption sits right under it.
      const thumbs = c.photos
        .filter((p) => letter.photos.has(p.id))
        .slice(0, 5)
        .map((p) => {
          // pdfkit's openImage (not in its type declarations) reads the image's size without drawing it.
          const image = (doc as unknown as { openImage(src: Buffer): { width: number; height: number } }).openImage(letter.photos.get(p.id)!);
          return { photo: p, height: image.height * Math.min(THUMB / image.width, THUMB / image.height) };
        });
      const photoRow = thumbs.length ? 4 + Math.max(...thumbs.map((t) => t.height)) + 14 : 0;
      // The item, its test results and its photos stay on one page (unless longer than a page).
      keepTogether(heightOf(title, 10.5, 0, 'strong') + lines.reduce((sum, [text, size, , indent]) => sum + heightOf(text, size, indent), 0) + photoRow + 8);
      doc.font('strong').fontSize(10.5).fillColor('black').text(title, MARGIN, doc.y, { width: CONTENT_WIDTH });
      for (const [text, size, color, indent] of lines) paragraph(text, size, color, indent);
      if (thumbs.length) {
        ensureSpace(photoRow);
        const top = doc.y + 4;
        thumbs.forEach(({ photo, height }, i) => {
          const x = MARGIN + 12 + i * (THUMB + 8);
          doc.image(letter.photos.get(photo.id)!, x, top, { fit: [THUMB, THUMB] });
          doc.font('body').fontSize(7.5).fillColor(MUTED).text(photo.kind === 'before' ? 'Before' : 'After', x, top + height + 2, { width: THUMB });
        });
        doc.x = MARGIN;
        doc.y = top + photoRow - 4;
      }
      doc.moveDown(0.5);
    }
  });
}

/** The footer of page `page` of `pages`: "CL-00008, revision 1 · page 2 of 3 · verify with code ABCDEFGHJK at …". */
export function letterFooter(letter: Pick<LetterContent, 'number' | 'revision' | 'verificationCode' | 'verificationUrl'>, page: number, pages: number): string {
  return `${letter.number}, revision ${letter.revision} · page ${page} of ${pages} · verify with code ${letter.verificationCode} at ${new URL(letter.verificationUrl).origin}/verify`;
}

/** The line a corrected item with a reading outside its range carries on the letter. */
export function outsideReadingNotice(labels: readonly string[]): string {
  return `Recorded as corrected with ${labels.length === 1 ? 'a reading' : 'readings'} OUTSIDE the expected range (${labels.join('; ')}).`;
}

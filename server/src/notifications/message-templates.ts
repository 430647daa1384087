// The words of every e-mail, in one place: a subject, a few paragraphs and one link to the page in
// the portal where the person acts. `renderMessage` lays them out as HTML and as plain text.
import { CORRECTION_OUTCOME_LABELS, CORRECTION_OUTCOMES, formatCents, formatCentsDelta, PARTY_ROLE_LABELS, type NotificationKind } from '@cc/shared';
import type { EscrowRecipient, NotifyInput, VisitWindow } from './notify-input';

export interface RequestFacts {
  id: number;
  reference: string;
  address: string;
  closingDate: string;
}

export interface MessageWords {
  subject: string;
  paragraphs: string[];
  /** The button's words and the portal path it opens; null for someone with no account (the escrow officer). */
  action: { label: string; path: string } | null;
}

/** `2027-02-10` → `Wednesday, February 10, 2027` (the day as written, whatever the server's zone). */
const dayOf = (date: string) => new Date(`${date}T12:00:00Z`).toLocaleDateString('en-US', { weekday: 'long', month: 'long', day: 'numeric', year: 'numeric', timeZone: 'UTC' });
/** `13:30` → `1:30 PM`. */
const clockOf = (time: string) => {
  const [h, m] = time.split(':').map(Number);
  return `${((h + 11) % 12) + 1}:${String(m).padStart(2, '0')} ${h < 12 ? 'AM' : 'PM'}`;
};
/** `Wednesday, February 10, 2027, arriving between 8:00 AM and 10:00 AM`. */
export const visitWindowText = (w: VisitWindow) => `${dayOf(w.date)}, arriving between ${clockOf(w.arrivalFrom)} and ${clockOf(w.arrivalTo)}`;

/** `Carla Ruiz at Pine Point Title (carla.ruiz@example.com)`. */
const escrowContact = (e: EscrowRecipient) => `${e.officer ? `${e.officer} at ` : ''}${e.company} (${e.email})`;

/** An outcome as a sentence about an item or a count of items says it. */
const OUTCOME_WORDS: Record<ItemOutcome['outcome'], string> = { corrected: 'corrected', 'not-corrected': 'could not be corrected', 'declined-on-site': 'declined on site' };

/** One item's recorded outcome, as an `item-corrected` message tells it. */
export type ItemOutcome = Pick<Extract<NotifyInput, { kind: 'item-corrected' }>, 'itemId' | 'itemLabel' | 'outcome'>;

/**
 * The words of an `item-corrected` message: one outcome, or the outcomes the contractor recorded
 * within a few minutes of each other, gathered into one message (NotificationsService). `letter`: the
 * completion letter issued while the message was still gathering.
 */
export function outcomesWords(r: RequestFacts, outcomes: readonly ItemOutcome[], letter: string | null = null): MessageWords {
  const action = { label: outcomes.length > 1 ? 'See the items' : 'See the item', path: `/requests/${r.id}/work` };
  const next = letter ? `Completion letter ${letter} is issued with these outcomes; it comes in its own message.` : 'The completion letter follows once every approved item has an outcome.';
  if (outcomes.length === 1) {
    const [one] = outcomes;
    return {
      subject: `${r.reference}: ${one.itemLabel} — ${CORRECTION_OUTCOME_LABELS[one.outcome].toLowerCase()}`,
      paragraphs: [
        {
          corrected: `The contractor recorded “${one.itemLabel}” at ${r.address} as corrected, with photos and test readings.`,
          'not-corrected': `The contractor could not correct “${one.itemLabel}” at ${r.address}; the reason is on the visits and proof page.`,
          'declined-on-site': `“${one.itemLabel}” at ${r.address} was declined on site; the reason is on the visits and proof page.`,
        }[one.outcome],
        next,
      ],
      action,
    };
  }
  const counts = CORRECTION_OUTCOMES.flatMap((o) => {
    const n = outcomes.filter((i) => i.outcome === o).length;
    return n ? [`${n} ${OUTCOME_WORDS[o]}`] : [];
  });
  return {
    subject: `${r.reference}: ${outcomes.length} items recorded — ${counts.join(', ')}`,
    paragraphs: [
      `The contractor recorded the outcome of ${outcomes.length} items at ${r.address}; photos, test readings and any reasons are on the visits and proof page:`,
      ...outcomes.map((i) => `• ${i.itemLabel}: ${OUTCOME_WORDS[i.outcome]}`),
      next,
    ],
    action,
  };
}

/** The words of one message about request `r`. */
export function wordsFor(input: NotifyInput, r: RequestFacts): MessageWords {
  const page = `/requests/${r.id}`;
  // The seller's side (decision, change orders, payments, receipts) and the proof side (visits, outcomes, letters).
  const approvalPage = `${page}/approval`;
  const workPage = `${page}/work`;
  switch (input.kind) {
    case 'invitation':
      return {
        subject: `You are invited to the electrical repairs for ${r.address}`,
        paragraphs: [
          `You have been named ${PARTY_ROLE_LABELS[input.role].toLowerCase()} on repair request ${r.reference} for ${r.address}, closing on ${dayOf(r.closingDate)}.`,
          'Open the link to make your account (or sign in) and follow the repairs. The link works for 14 days.',
        ],
        action: { label: 'Open the invitation', path: `/invite/${input.inviteToken}` },
      };
    case 'report-parsed':
      return {
        subject: `${r.reference}: the inspection report was read — ${input.itemCount} items to review`,
        paragraphs: [
          `The inspection report for ${r.address} was read and ${input.itemCount} electrical ${input.itemCount === 1 ? 'item was' : 'items were'} proposed.`,
          'Check each item against the report, then confirm the list so the contractor can price it.',
        ],
        action: { label: 'Review the items', path: page },
      };
    case 'ready-to-price':
      return {
        subject: `${r.reference}: ready to price — ${input.itemCount} items at ${r.address}`,
        paragraphs: [
          `The agent confirmed ${input.itemCount} electrical ${input.itemCount === 1 ? 'item' : 'items'} for ${r.address}. Closing is on ${dayOf(r.closingDate)}.`,
          'Price them against your rate book and send the quote to the seller.',
        ],
        action: { label: 'Price the request', path: `${page}/pricing` },
      };
    case 'quote-sent':
      return {
        subject: `${r.reference}: quote${input.version > 1 ? ` version ${input.version}` : ''} for ${r.address} — ${formatCents(input.totalCents)}`,
        paragraphs: [
          `The contractor sent ${input.version > 1 ? `version ${input.version} of ` : ''}the quote for the electrical repairs at ${r.address}: ${formatCents(input.totalCents)} in total.`,
          'The seller reads it, approves the items to be done and signs. Closing is on ' + `${dayOf(r.closingDate)}.`,
        ],
        action: { label: 'Read the quote', path: `${page}/quotes/${input.version}` },
      };
    case 'items-decided': {
      const declinedAll = input.approvedCount === 0;
      // Who decided: the seller, or whoever signed for them, named with their capacity.
      const who = input.signedBy ? `${input.signedBy},` : 'The seller';
      return {
        subject: declinedAll
          ? `${r.reference}: the quote was declined — ${input.declinedCount} ${input.declinedCount === 1 ? 'item' : 'items'} declined`
          : `${r.reference}: the quote was approved — ${input.approvedCount} approved, ${input.declinedCount} declined`,
        paragraphs: declinedAll
          ? [`${who} declined every item of the quote for ${r.address}. No work is booked on this request.`]
          : [
              `${who} approved and signed ${input.approvedCount} ${input.approvedCount === 1 ? 'item' : 'items'} for ${r.address}, ${formatCents(input.approvedCents)} in total${input.declinedCount ? `, and declined ${input.declinedCount}` : ''}.`,
              `Next the seller's side chooses how to pay, and the contractor books the visit. Closing is on ${dayOf(r.closingDate)}.`,
            ],
        action: { label: 'See the decision', path: approvalPage },
      };
    }
    case 'payment-received':
      return {
        subject: `${r.reference}: payment of ${formatCents(input.amountCents)} received`,
        paragraphs: [
          `A payment of ${formatCents(input.amountCents)} for the electrical repairs at ${r.address} was received.`,
          input.receiptNumber ? `Receipt ${input.receiptNumber} is on the approval and payment page, beside what is left to pay, if anything.` : 'It is recorded on the approval and payment page, beside what is left to pay, if anything.',
        ],
        action: { label: input.receiptNumber ? 'See the receipt' : 'See the payment', path: approvalPage },
      };
    case 'closing-payment-chosen':
      return {
        subject: `${r.reference}: ${formatCents(input.amountCents)} to be paid at closing`,
        paragraphs: [
          `The seller's side chose to pay ${formatCents(input.amountCents)} for the electrical repairs at ${r.address} from the proceeds at closing (closing date ${dayOf(r.closingDate)}).`,
          `Invoice ${input.invoiceNumber} was e-mailed with its PDF to ${escrowContact(input.escrow)}; the contractor records the funds when they arrive. The work goes ahead as approved.`,
        ],
        action: { label: 'See the invoice', path: approvalPage },
      };
    case 'closing-invoice': {
      const file = input.escrow.fileNumber ? ` and your file number ${input.escrow.fileNumber}` : '';
      return {
        subject: `Invoice ${input.invoiceNumber} payable at closing — ${r.address}${input.escrow.fileNumber ? ` (file ${input.escrow.fileNumber})` : ''}`,
        paragraphs: [
          `The seller's side of the sale of ${r.address}, closing on ${dayOf(r.closingDate)}, chose to pay for the electrical repairs from the proceeds at closing.`,
          `Please pay ${formatCents(input.amountCents)} to ${input.payee} at closing. Invoice ${input.invoiceNumber} is attached as a PDF with the payment instructions; please quote it${file} with the payment.`,
          `Questions about the work or the invoice go to ${input.payee}, who records the funds when they arrive.`,
        ],
        action: null,
      };
    }
    case 'change-order-sent':
      return {
        subject: `${r.reference}: change order ${input.number} to decide — ${formatCentsDelta(input.priceCents)}`,
        paragraphs: [
          `The contractor sent change order ${input.number} for ${r.address}, with this reason: “${input.reason}”`,
          `It changes the approved work by ${formatCentsDelta(input.priceCents)}. The seller or the listing agent approves or declines it; nothing in it is done until then.`,
        ],
        action: { label: 'Decide on the change order', path: approvalPage },
      };
    case 'change-order-decided':
      return {
        // Who decided, in what capacity: the history (the message's timeline entry) says it too.
        subject: `${r.reference}: change order ${input.number} ${input.isApproved ? 'approved' : 'declined'} by ${input.signedBy}`,
        paragraphs: [
          input.isApproved
            ? `${input.signedBy}, approved and signed change order ${input.number} for ${r.address} (${formatCentsDelta(input.priceCents)}). It is part of the approved work now.`
            : `${input.signedBy}, declined change order ${input.number} for ${r.address}. The approved work stays as it was.`,
        ],
        action: { label: 'See the change order', path: approvalPage },
      };
    case 'refund-settled':
      return {
        subject: `${r.reference}: refund of ${formatCents(input.amountCents)} paid back`,
        paragraphs: [
          `The payment service paid ${formatCents(input.amountCents)} back to the card it came from, for the repairs at ${r.address}.`,
          'The payments and what is left to pay are on the approval and payment page.',
        ],
        action: { label: 'See the payments', path: approvalPage },
      };
    case 'visit-scheduled':
      return {
        subject: `${r.reference}: electrician's visit ${input.previous ? 'moved to' : 'on'} ${dayOf(input.date)}`,
        paragraphs: [
          input.previous
            ? `Visit ${input.visitNumber} to ${r.address} is now on ${visitWindowText(input)}. It was on ${visitWindowText(input.previous)}.`
            : `The contractor booked visit ${input.visitNumber} to ${r.address} on ${visitWindowText(input)}.`,
          'Please make sure the electrician can get in and reach the panel and the rooms on the list. Power may be off for part of the visit.',
        ],
        action: { label: 'See the visit', path: workPage },
      };
    case 'visit-cancelled':
      return {
        subject: `${r.reference}: electrician's visit on ${dayOf(input.date)} cancelled`,
        paragraphs: [
          `The contractor cancelled visit ${input.visitNumber} to ${r.address}, which was booked for ${visitWindowText(input)}, with this reason: “${input.reason}”`,
          'Nobody will come on that day. The contractor books another visit for the items that are still to be done, and you are told its day.',
        ],
        action: { label: 'See the visits', path: workPage },
      };
    case 'electrician-visit': {
      // The electrician's own day: the day plan opens on the visit's day with their stops and route.
      const action = { label: 'Open your day plan', path: `/day-plan?date=${input.date}&electricianId=${input.electricianUserId}` };
      const details = 'The items, the access notes and the route of the day are on your day plan; your calendar feed shows the change too.';
      if (input.change === 'cancelled') {
        return {
          subject: `${r.reference}: visit ${input.visitNumber} on ${dayOf(input.date)} cancelled`,
          paragraphs: [
            `Visit ${input.visitNumber} to ${r.address} on ${visitWindowText(input)}, is cancelled${input.reason ? `: “${input.reason}”` : ''}.`,
            'It is off your day plan, and your calendar feed marks it cancelled. Nothing more is needed from you for this visit.',
          ],
          action,
        };
      }
      if (input.change === 'removed') {
        return {
          subject: `${r.reference}: visit ${input.visitNumber} on ${dayOf(input.date)} taken off your day`,
          paragraphs: [
            `Visit ${input.visitNumber} to ${r.address} on ${visitWindowText(input)}, is no longer booked for you${input.handedTo ? `: it went to ${input.handedTo}` : ''}.`,
            'Nothing more is needed from you for this visit.',
          ],
          action,
        };
      }
      return {
        subject: `${r.reference}: your visit ${input.visitNumber} ${input.change === 'moved' ? 'moved to' : 'on'} ${dayOf(input.date)}`,
        paragraphs: [
          input.change === 'moved' && input.previous
            ? `Your visit ${input.visitNumber} to ${r.address} is now on ${visitWindowText(input)}. It was on ${visitWindowText(input.previous)}.`
            : `Visit ${input.visitNumber} to ${r.address} is booked for you on ${visitWindowText(input)}.`,
          details,
        ],
        action,
      };
    }
    case 'item-corrected':
      return outcomesWords(r, [input]);
    case 'letter-issued':
      return {
        subject: `${r.reference}: completion letter ${input.letterNumber}${input.revision > 1 ? ` revision ${input.revision}` : ''} issued for ${r.address}`,
        paragraphs: [
          `The contractor issued completion letter ${input.letterNumber}${input.revision > 1 ? `, revision ${input.revision},` : ''} for the electrical repairs at ${r.address}.`,
          'The inspector (or the buyer’s agent) checks the corrections and accepts them or lists the items not accepted.',
        ],
        action: { label: 'Read the letter', path: workPage },
      };
    case 'proof-reviewed':
      return input.isAccepted
        ? {
            subject: `${r.reference}: electrical corrections accepted at ${r.address}`,
            paragraphs: [
              `The re-inspection accepted the corrections recorded in the completion letter for ${r.address}. The repairs on this request are done.`,
              'Any payment still open (for example an invoice to be paid from the proceeds at closing) is settled as agreed; the contractor records it when the funds arrive.',
            ],
            action: { label: 'Open the visits and proof', path: workPage },
          }
        : {
            subject: `${r.reference}: ${input.notAcceptedCount} ${input.notAcceptedCount === 1 ? 'item' : 'items'} not accepted at ${r.address}`,
            paragraphs: [
              `The re-inspection did not accept ${input.notAcceptedCount} of the corrected ${input.notAcceptedCount === 1 ? 'item' : 'items'} at ${r.address}; the reasons are on the visits and proof page.`,
              'The contractor takes them back in hand, books a visit and issues a revised completion letter.',
            ],
            action: { label: 'See what was not accepted', path: workPage },
          };
    case 'closing-at-risk':
      return {
        subject: `${r.reference}: closing at risk`,
        paragraphs: [
          input.daysLeft < 0
            ? `The closing date of ${r.address} (${dayOf(r.closingDate)}) has passed and the repairs are not finished.`
            : `${r.address} closes in ${input.daysLeft} ${input.daysLeft === 1 ? 'day' : 'days'} (${dayOf(r.closingDate)}) and the repairs are not finished.`,
        ],
        action: { label: 'Open the request', path: page },
      };
  }
}

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

export interface RenderedMessage {
  subject: string;
  text: string;
  html: string;
  link: string;
}

export interface Layout {
  publicUrl: string;
  recipientName: string | null;
  /** Why the person gets it and where to change it (absent for invitations). */
  footer: string | null;
  footerLink: { label: string; url: string } | null;
}

/** One message as plain text and HTML, with the same words and link in both. */
export function layOut(words: Pick<MessageWords, 'subject' | 'paragraphs'> & { action: { label: string; url: string } | null }, layout: Layout, extraHtml = '', extraText = ''): RenderedMessage {
  const greeting = layout.recipientName ? `Hello ${layout.recipientName},` : 'Hello,';
  const text = [
    greeting,
    '',
    ...words.paragraphs.flatMap((p) => [p, '']),
    ...(extraText ? [extraText, ''] : []),
    ...(words.action ? [`${words.action.label}: ${words.action.url}`, ''] : []),
    '— Closing Circuit',
    ...(layout.footer ? ['', layout.footer] : []),
    ...(layout.footerLink ? [`${layout.footerLink.label}: ${layout.footerLink.url}`] : []),
  ].join('\n');
  const html = `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(words.subject)}</title></head>
<body style="font-family: 'Source Sans 3', Arial, sans-serif; color: #1c1b1f; line-height: 1.5; max-width: 36rem; margin: 0 auto; padding: 1rem;">
<p>${escapeHtml(greeting)}</p>
${words.paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`).join('\n')}
${extraHtml}
${words.action ? `<p><a href="${escapeHtml(words.action.url)}" style="display: inline-block; background: #1d4f91; color: #ffffff; padding: 0.6rem 1rem; border-radius: 4px; text-decoration: none;">${escapeHtml(words.action.label)}</a></p>` : ''}
<p style="color: #49454f;">— Closing Circuit</p>
${layout.footer ? `<p style="color: #49454f; font-size: 0.875rem;">${escapeHtml(layout.footer)}${layout.footerLink ? ` <a href="${escapeHtml(layout.footerLink.url)}">${escapeHtml(layout.footerLink.label)}</a>` : ''}</p>` : ''}
</body></html>`;
  return { subject: subjectLine(words.subject), text, html, link: words.action?.url ?? '' };
}

export { escapeHtml };

/** The outbox keeps subjects of at most 300 characters (a long street and city with a file number can pass it). */
export const MAX_SUBJECT = 300;

/** A subject as sent: cut to MAX_SUBJECT with an ellipsis, never refused by the outbox. */
export function subjectLine(subject: string): string {
  return subject.length <= MAX_SUBJECT ? subject : `${subject.slice(0, MAX_SUBJECT - 1)}…`;
}

/** Footer words: why the person gets a message of this kind. */
export function footerFor(kind: NotificationKind): string | null {
  if (kind === 'invitation') return null;
  if (kind === 'closing-invoice') return 'You get this message because the seller’s side named you as the escrow or title contact for this sale. No account is needed.';
  if (kind === 'electrician-visit') return 'You get this message because the visit is (or was) booked for you.';
  return 'You get this message because you take part in this repair request.';
}

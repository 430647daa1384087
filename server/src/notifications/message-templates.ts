// The words of every e-mail, in one place: a subject, a few paragraphs and one link to the page in
// the portal where the person acts. `renderMessage` lays them out as HTML and as plain text.
import { formatCents, PARTY_ROLE_LABELS, type NotificationKind } from '@cc/shared';
import type { NotifyInput } from './notify-input';

export interface RequestFacts {
  id: number;
  reference: string;
  address: string;
  closingDate: string;
}

export interface MessageWords {
  subject: string;
  paragraphs: string[];
  /** The button's words and the portal path it opens. */
  action: { label: string; path: string };
}

const visitTime = (iso: string) =>
  new Date(iso).toLocaleString('en-US', { weekday: 'long', month: 'long', day: 'numeric', hour: 'numeric', minute: '2-digit', timeZone: 'America/Denver' });

/** The words of one message about request `r`. */
export function wordsFor(input: NotifyInput, r: RequestFacts): MessageWords {
  const page = `/requests/${r.id}`;
  switch (input.kind) {
    case 'invitation':
      return {
        subject: `You are invited to the electrical repairs for ${r.address}`,
        paragraphs: [
          `You have been named ${PARTY_ROLE_LABELS[input.role].toLowerCase()} on repair request ${r.reference} for ${r.address}, closing on ${r.closingDate}.`,
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
          `The agent confirmed ${input.itemCount} electrical ${input.itemCount === 1 ? 'item' : 'items'} for ${r.address}. Closing is on ${r.closingDate}.`,
          'Price them against your rate book and send the quote to the seller.',
        ],
        action: { label: 'Price the request', path: `${page}/pricing` },
      };
    case 'quote-sent':
      return {
        subject: `${r.reference}: quote${input.version > 1 ? ` version ${input.version}` : ''} for ${r.address} — ${formatCents(input.totalCents)}`,
        paragraphs: [
          `The contractor sent ${input.version > 1 ? `version ${input.version} of ` : ''}the quote for the electrical repairs at ${r.address}: ${formatCents(input.totalCents)} in total.`,
          'The seller reads it, approves the items to be done and signs. Closing is on ' + `${r.closingDate}.`,
        ],
        action: { label: 'Read the quote', path: `${page}/quotes/${input.version}` },
      };
    case 'items-decided':
      return {
        subject: `${r.reference}: the seller decided — ${input.approvedCount} approved, ${input.declinedCount} declined`,
        paragraphs: [
          `The seller approved ${input.approvedCount} ${input.approvedCount === 1 ? 'item' : 'items'} (${formatCents(input.approvedCents)}) and declined ${input.declinedCount} for ${r.address}.`,
          'The contractor books the visit next.',
        ],
        action: { label: 'See the decision', path: page },
      };
    case 'payment-received':
      return {
        subject: `${r.reference}: payment of ${formatCents(input.amountCents)} received`,
        paragraphs: [`A payment of ${formatCents(input.amountCents)} for the repairs at ${r.address} was received.`, 'The receipt is on the request page.'],
        action: { label: 'See the payment', path: page },
      };
    case 'visit-scheduled':
      return {
        subject: `${r.reference}: electrician's visit on ${visitTime(input.startsAt)}`,
        paragraphs: [
          `The contractor booked a visit to ${r.address} on ${visitTime(input.startsAt)}${input.endsAt ? ` until ${visitTime(input.endsAt)}` : ''} (Mountain time).`,
          'Please make sure the electrician can reach the panel and the rooms listed. Power may be off for part of the visit.',
        ],
        action: { label: 'See the visit', path: page },
      };
    case 'item-corrected':
      return {
        subject: `${r.reference}: ${input.itemLabel} — ${input.outcome === 'done' ? 'corrected' : 'not corrected'}`,
        paragraphs: [
          input.outcome === 'done'
            ? `The contractor recorded “${input.itemLabel}” at ${r.address} as corrected, with photos and test readings.`
            : `The contractor recorded “${input.itemLabel}” at ${r.address} as not corrected; the reason is on the request page.`,
        ],
        action: { label: 'See the item', path: page },
      };
    case 'letter-issued':
      return {
        subject: `${r.reference}: completion letter issued for ${r.address}`,
        paragraphs: [
          `The contractor issued the completion letter for the electrical repairs at ${r.address}.`,
          'The inspector (or the buyer’s agent) checks the corrections and accepts them or lists the items not accepted.',
        ],
        action: { label: 'Read the letter', path: page },
      };
    case 'closing-at-risk':
      return {
        subject: `${r.reference}: closing at risk`,
        paragraphs: [
          input.daysLeft < 0
            ? `The closing date of ${r.address} (${r.closingDate}) has passed and the repairs are not finished.`
            : `${r.address} closes in ${input.daysLeft} ${input.daysLeft === 1 ? 'day' : 'days'} (${r.closingDate}) and the repairs are not finished.`,
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
export function layOut(words: Pick<MessageWords, 'subject' | 'paragraphs'> & { action: { label: string; url: string } }, layout: Layout, extraHtml = '', extraText = ''): RenderedMessage {
  const greeting = layout.recipientName ? `Hello ${layout.recipientName},` : 'Hello,';
  const text = [
    greeting,
    '',
    ...words.paragraphs.flatMap((p) => [p, '']),
    ...(extraText ? [extraText, ''] : []),
    `${words.action.label}: ${words.action.url}`,
    '',
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
<p><a href="${escapeHtml(words.action.url)}" style="display: inline-block; background: #1d4f91; color: #ffffff; padding: 0.6rem 1rem; border-radius: 4px; text-decoration: none;">${escapeHtml(words.action.label)}</a></p>
<p style="color: #49454f;">— Closing Circuit</p>
${layout.footer ? `<p style="color: #49454f; font-size: 0.875rem;">${escapeHtml(layout.footer)}${layout.footerLink ? ` <a href="${escapeHtml(layout.footerLink.url)}">${escapeHtml(layout.footerLink.label)}</a>` : ''}</p>` : ''}
</body></html>`;
  return { subject: words.subject, text, html, link: words.action.url };
}

export { escapeHtml };

/** Footer words: why the person gets a message of this kind. */
export function footerFor(kind: NotificationKind): string | null {
  return kind === 'invitation' ? null : 'You get this message because you take part in this repair request.';
}

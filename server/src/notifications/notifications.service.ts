// notify(): the one call that turns something that happened on a request into e-mails. It runs inside
// the caller's transaction: it finds the people the message is for, honours each one's preferences,
// writes the outbox rows (sent later by the worker) and the timeline entry, and commits or rolls back
// with the change itself.
import { createHash } from 'node:crypto';
import {
  ADJUSTABLE_KINDS,
  kindsForRole,
  NOTIFICATION_RULES,
  requestReference,
  type ActivityKind,
  type CurrentUser,
  type FlowActor,
  type NotificationKind,
  type NotificationPreference,
  type PartyRole,
  type UpdatePreferences,
} from '@cc/shared';
import type { NewActivity, ActivityRepository } from '../activity/activity.repository';
import type { Db, Trx } from '../db/knex';
import { NotFoundError, ValidationError } from '../errors';
import { footerFor, layOut, outcomesWords, wordsFor, type MessageWords, type RequestFacts } from './message-templates';
import { occurrenceOf, type NotifyInput } from './notify-input';
import type { NewOutboxMessage, OutboxRepository } from './outbox.repository';
import type { PreferencesRepository } from './preferences.repository';
import { readUnsubscribeToken } from './unsubscribe-token';

export interface MailSettings {
  publicUrl: string;
  /** The From address of every message. */
  from: string;
  /** Signs unsubscribe links. */
  secret: string;
  /** How long an item's outcome waits for more outcomes of the same request to share its e-mail (0: not at all). */
  gatherItemMessagesMs: number;
}

interface Recipient {
  userId: number | null;
  email: string;
  name: string | null;
}

/** The timeline group of each kind's entry (none for the daily risk notice, which changes nothing). */
const ACTIVITY_OF: Record<NotificationKind, ActivityKind | null> = {
  invitation: 'parties',
  'report-parsed': 'reports',
  'ready-to-price': 'items',
  'quote-sent': 'quotes',
  'items-decided': 'approvals',
  'payment-received': 'payments',
  'closing-payment-chosen': 'payments',
  'closing-invoice': 'payments',
  'change-order-sent': 'approvals',
  'change-order-decided': 'approvals',
  'refund-settled': 'payments',
  'visit-scheduled': 'visits',
  'visit-cancelled': 'visits',
  // The seller side's visit entry already tells the booking or the move; the electrician's own message adds none.
  'electrician-visit': null,
  'item-corrected': 'items',
  'letter-issued': 'letters',
  'proof-reviewed': 'letters',
  'closing-at-risk': null,
};

/** Money an entry carries, for the dashboards. */
function amountOf(input: NotifyInput): number | null {
  if (input.kind === 'quote-sent') return input.totalCents;
  if (input.kind === 'items-decided') return input.approvedCents;
  if (input.kind === 'payment-received' || input.kind === 'refund-settled' || input.kind === 'closing-payment-chosen') return input.amountCents;
  // The invoice's money is already on the entry of the choice; a send of it moves none.
  if (input.kind === 'change-order-sent' || input.kind === 'change-order-decided') return input.priceCents;
  return null;
}

/** The one person outside the request's accounts a message is for (an invitee, the escrow officer), if any. */
function outsider(input: NotifyInput): Recipient[] | null {
  if (input.kind === 'invitation') return [{ userId: null, email: input.email, name: null }];
  if (input.kind === 'closing-invoice') return [{ userId: null, email: input.escrow.email, name: input.escrow.officer || null }];
  return null;
}

/** The one person of the request's people a message is for (the electrician of a visit), if it names one. */
function onlyFor(input: NotifyInput): number | null {
  return input.kind === 'electrician-visit' ? input.electricianUserId : null;
}

export class NotificationsService {
  constructor(
    private readonly db: Db,
    private readonly outbox: OutboxRepository,
    private readonly preferences: PreferencesRepository,
    private readonly activity: ActivityRepository,
    readonly settings: MailSettings,
  ) {}

  /**
   * Writes the messages `input` calls for, in `trx`. Returns how many messages were written (0 when
   * nobody is to be told, everyone turned it off, or the same occurrence was written before).
   */
  async notify(trx: Trx, input: NotifyInput): Promise<number> {
    const facts = await this.requestFacts(input.requestId, trx);
    const rule = NOTIFICATION_RULES[input.kind];
    const people = outsider(input) ?? (await this.recipients(input.requestId, rule.to, input.actorUserId, trx)).filter((p) => onlyFor(input) === null || p.userId === onlyFor(input));
    const deliveries = await this.preferences.deliveries(
      people.flatMap((p) => (p.userId === null ? [] : [p.userId])),
      input.kind,
      trx,
    );
    const words = wordsFor(input, facts);
    const messages: NewOutboxMessage[] = [];
    const told: string[] = [];
    let regathered = 0;
    let repeated = 0;
    for (const person of people) {
      const delivery = person.userId === null ? 'immediate' : deliveries.get(person.userId)!;
      if (delivery === 'off') continue;
      const key = hash(`${input.kind}|${input.requestId}|${occurrenceOf(input)}|${person.userId ?? person.email}`);
      if (input.kind === 'item-corrected' && delivery === 'immediate' && person.userId !== null && this.settings.gatherItemMessagesMs > 0) {
        // An outcome joins the message still waiting for this person's outcomes of the request, if any.
        const waiting = await this.outbox.gathering(input.requestId, person.userId, trx);
        if (waiting) {
          const outcomes = waiting.gathered ?? [];
          if (outcomes.some((o) => o.itemId === input.itemId)) {
            repeated++;
            continue;
          }
          const all = [...outcomes, { itemId: input.itemId, itemLabel: input.itemLabel, outcome: input.outcome }];
          const message = this.render(outcomesWords(facts, all), input.kind, person);
          await this.outbox.regather(waiting.id, { subject: message.subject, text_body: message.text, html_body: message.html, link: message.link }, all, trx);
          regathered++;
          told.push(person.name ?? person.email);
          continue;
        }
      }
      const message = this.render(words, input.kind, person);
      messages.push({
        dedupe_key: key,
        kind: input.kind,
        request_id: input.requestId,
        recipient_user_id: person.userId,
        recipient_email: person.email,
        subject: message.subject,
        text_body: message.text,
        html_body: message.html,
        link: message.link,
        message_id: this.messageId(key),
        attachment_invoice_id: input.kind === 'closing-invoice' ? input.invoiceId : null,
        status: delivery === 'digest' ? 'held' : 'pending',
        ...(input.kind === 'item-corrected'
          ? {
              gathered: JSON.stringify([{ itemId: input.itemId, itemLabel: input.itemLabel, outcome: input.outcome }]),
              next_attempt_at: trx.raw('now() + make_interval(secs => ?::double precision / 1000)', [this.settings.gatherItemMessagesMs]),
            }
          : {}),
      });
      told.push(person.name ?? person.email);
    }
    const written = (await this.outbox.enqueue(messages, trx)) + regathered;
    const group = ACTIVITY_OF[input.kind];
    if (group && (written > 0 || (messages.length === 0 && repeated === 0))) {
      const entry: NewActivity = {
        requestId: input.requestId,
        itemId: input.kind === 'item-corrected' ? input.itemId : null,
        actorUserId: input.actorUserId,
        kind: group,
        action: input.kind,
        summary: `${words.subject.replace(`${facts.reference}: `, '')}${told.length ? ` — e-mailed to ${told.join(', ')}` : ''}`,
        after: { emailedTo: told },
        amountCents: amountOf(input),
        at: input.at,
      };
      await this.activity.record(trx, entry);
    }
    return written;
  }

  /**
   * The outcome messages of `requestId` still gathering go out now, saying that completion letter
   * `letter` is issued, so that nobody reads "the letter follows" after the letter (in the caller's transaction).
   */
  async releaseGathered(requestId: number, letter: string, trx: Trx): Promise<void> {
    const waiting = await this.outbox.allGathering(requestId, trx);
    if (!waiting.length) return;
    const facts = await this.requestFacts(requestId, trx);
    for (const row of waiting) {
      const message = this.render(outcomesWords(facts, row.gathered ?? [], letter), 'item-corrected', { userId: row.recipient_user_id, email: row.recipient_email, name: row.name });
      await this.outbox.release(row.id, { subject: message.subject, text_body: message.text, html_body: message.html, link: message.link }, trx);
    }
  }

  /** One person's message: the words laid out as HTML and text with the greeting, footer and link. */
  private render(words: MessageWords, kind: NotifyInput['kind'], person: Recipient) {
    return layOut(
      { ...words, action: words.action && { label: words.action.label, url: `${this.settings.publicUrl}${words.action.path}` } },
      {
        publicUrl: this.settings.publicUrl,
        recipientName: person.name,
        footer: footerFor(kind),
        footerLink: NOTIFICATION_RULES[kind].isAdjustable ? { label: 'Choose which messages you get', url: `${this.settings.publicUrl}/account` } : null,
      },
    );
  }

  messageId(key: string): string {
    return `<cc-${key.slice(0, 40)}@${new URL(this.settings.publicUrl).hostname || 'closing-circuit.local'}>`;
  }

  async requestFacts(requestId: number, trx?: Trx): Promise<RequestFacts> {
    const row = await (trx ?? this.db)('repair_requests').where({ id: requestId }).first('id', 'street', 'city', 'state', 'zip', 'closing_date');
    if (!row) throw new NotFoundError('No such repair request');
    return { id: row.id, reference: requestReference(row.id), address: `${row.street}, ${row.city}, ${row.state} ${row.zip}`, closingDate: row.closing_date };
  }

  /** The people playing `parts` on the request (and the assigned contractor's people), but not `actor`. */
  private async recipients(requestId: number, parts: readonly FlowActor[], actorUserId: number | null, trx: Trx): Promise<Recipient[]> {
    const roles = parts.filter((p): p is PartyRole => p !== 'contractor' && p !== 'admin');
    const rows: { id: number; email: string; name: string }[] = await trx('users as u')
      .select('u.id', 'u.email', 'u.name')
      .where('u.is_active', true)
      .where((w) => {
        if (roles.length) {
          w.whereIn('u.id', trx('request_parties').select('user_id').where({ request_id: requestId }).whereIn('role', roles).whereNotNull('user_id'));
        }
        if (parts.includes('contractor')) {
          w.orWhere((c) =>
            c.where('u.role', 'contractor').whereIn('u.organisation_id', trx('repair_requests').select('contractor_organisation_id').where({ id: requestId }).whereNotNull('contractor_organisation_id')),
          );
        }
        if (!roles.length && !parts.includes('contractor')) w.whereRaw('false');
      })
      .orderBy('u.id');
    return rows.filter((r) => r.id !== actorUserId).map((r) => ({ userId: r.id, email: r.email, name: r.name }));
  }

  // ---- preferences ---------------------------------------------------------------------------

  async preferencesOf(user: CurrentUser): Promise<NotificationPreference[]> {
    const chosen = await this.preferences.forUser(user.id);
    return kindsForRole(user.role).map((kind) => ({
      kind,
      label: NOTIFICATION_RULES[kind].label,
      delivery: chosen.get(kind) ?? NOTIFICATION_RULES[kind].defaultDelivery,
      isDigestOnly: NOTIFICATION_RULES[kind].isDigestOnly ?? false,
    }));
  }

  async updatePreferences(user: CurrentUser, input: UpdatePreferences): Promise<NotificationPreference[]> {
    const mine = kindsForRole(user.role);
    const foreign = input.preferences.flatMap((p, i) => (mine.includes(p.kind) ? [] : [{ path: `preferences.${i}.kind`, message: 'Your account never receives this message' }]));
    if (foreign.length) throw new ValidationError('Some messages never reach your account', foreign);
    await this.db.transaction(async (trx) => {
      await this.preferences.set(user.id, input.preferences, trx);
      // Messages already waiting for the digest of a kind now turned off are not sent.
      const off = input.preferences.filter((p) => p.delivery === 'off').map((p) => p.kind);
      if (off.length) await trx('outbox_messages').where({ recipient_user_id: user.id, status: 'held' }).whereIn('kind', off).update({ status: 'skipped' });
    });
    return this.preferencesOf(user);
  }

  // ---- unsubscribe from digests ----------------------------------------------------------------

  private async userOfToken(token: string): Promise<{ id: number; email: string }> {
    const userId = readUnsubscribeToken(this.settings.secret, token);
    const user = userId === null ? null : await this.db('users').where({ id: userId }).first('id', 'email');
    if (!user) throw new NotFoundError('This unsubscribe link is not valid.');
    return user;
  }

  /** Who the link is for (the address only, half hidden). */
  async unsubscribeLookup(token: string): Promise<{ email: string }> {
    const user = await this.userOfToken(token);
    return { email: maskEmail(user.email) };
  }

  /** Turns every message that came in the digest off, and drops what was waiting for it. */
  async unsubscribe(token: string): Promise<{ email: string; turnedOff: NotificationKind[] }> {
    const user = await this.userOfToken(token);
    const turnedOff = await this.db.transaction(async (trx) => {
      const chosen = await this.preferences.forUser(user.id, trx);
      const kinds = ADJUSTABLE_KINDS.filter((k) => (chosen.get(k) ?? NOTIFICATION_RULES[k].defaultDelivery) === 'digest');
      await this.preferences.set(user.id, kinds.map((kind) => ({ kind, delivery: 'off' as const })), trx);
      await this.outbox.skipHeldFor(user.id, trx);
      return kinds;
    });
    return { email: maskEmail(user.email), turnedOff };
  }
}

export function hash(value: string): string {
  return createHash('sha256').update(value).digest('hex');
}

function maskEmail(email: string): string {
  const [name, domain] = email.split('@');
  return `${name.slice(0, 2)}${'•'.repeat(Math.max(1, name.length - 2))}@${domain}`;
}

// The daily digest: once a day (one server process runs it: the day's row in digest_runs decides),
// requests whose closing is at risk are noted for their agents and contractor, and everything that
// waited for the digest is folded into one e-mail per person, with a link that turns digests off.
import { closingProgress, daysToClosing, isEnded, REQUEST_STATUSES, type RequestStatus } from '@cc/shared';
import { joinItemCounts } from '../requests/request.repository';
import type { Db, Trx } from '../db/knex';
import { escapeHtml, layOut } from './message-templates';
import { hash, type NotificationsService } from './notifications.service';
import type { OutboxRepository, OutboxRow } from './outbox.repository';
import { unsubscribeToken } from './unsubscribe-token';

export interface DigestOutcome {
  /** False when the day's digest had run already. */
  ran: boolean;
  atRisk: number;
  digests: number;
}

const OPEN_STATUSES = REQUEST_STATUSES.filter((s) => !isEnded(s));

export class DailyDigest {
  constructor(
    private readonly db: Db,
    private readonly notifications: NotificationsService,
    private readonly outbox: OutboxRepository,
    /** Open approved work this many business days before closing notes a request as at risk (as the request list flags it). */
    private readonly atRiskBusinessDays = 3,
  ) {}

  /** Runs the digest of `day` (YYYY-MM-DD) unless it ran already. */
  async run(day: string): Promise<DigestOutcome> {
    return this.db.transaction(async (trx) => {
      const claimed = await trx('digest_runs').insert({ day }).onConflict('day').ignore().returning('day');
      if (!claimed.length) return { ran: false, atRisk: 0, digests: 0 };
      const atRisk = await this.noteRisks(day, trx);
      const digests = await this.foldHeld(day, trx);
      return { ran: true, atRisk, digests };
    });
  }

  private async noteRisks(day: string, trx: Trx): Promise<number> {
    const rows: { id: number; status: RequestStatus; closing_date: string; open_work_count: number }[] = await joinItemCounts(
      trx,
      trx('repair_requests as r').whereIn('r.status', OPEN_STATUSES).select('r.id', 'r.status', 'r.closing_date', 'ic.open_work_count'),
    );
    let count = 0;
    for (const r of rows) {
      const daysLeft = daysToClosing(r.closing_date, day);
      // The request list's rule (shared closing-progress): open approved work this close to closing.
      const { isAtRisk } = closingProgress({ closingDate: r.closing_date, today: day, approvedCount: Number(r.open_work_count), resolvedCount: 0, atRiskBusinessDays: this.atRiskBusinessDays });
      if (!isAtRisk) continue;
      await this.notifications.notify(trx, { kind: 'closing-at-risk', requestId: r.id, actorUserId: null, day, daysLeft });
      count++;
    }
    return count;
  }

  private async foldHeld(day: string, trx: Trx): Promise<number> {
    const held = await this.outbox.held(trx);
    const byUser = new Map<number, OutboxRow[]>();
    for (const row of held) byUser.set(row.recipient_user_id!, [...(byUser.get(row.recipient_user_id!) ?? []), row]);
    const { publicUrl, secret } = this.notifications.settings;
    for (const [userId, rows] of byUser) {
      const user = await trx('users').where({ id: userId }).first('name', 'email');
      const subject = `Closing Circuit: your daily summary for ${day} (${rows.length} ${rows.length === 1 ? 'update' : 'updates'})`;
      const listText = rows.map((r) => `• ${r.subject}\n  ${r.link}`).join('\n');
      const listHtml = `<ul>${rows.map((r) => `<li><a href="${escapeHtml(r.link)}">${escapeHtml(r.subject)}</a></li>`).join('')}</ul>`;
      const message = layOut(
        { subject, paragraphs: ['Here is what happened on your repair requests since the last summary.'], action: { label: 'Open your requests', url: `${publicUrl}/requests` } },
        {
          publicUrl,
          recipientName: user.name,
          footer: 'You get this summary because you chose the daily digest for some messages.',
          footerLink: { label: 'Stop the daily digest', url: `${publicUrl}/unsubscribe/${unsubscribeToken(secret, userId)}` },
        },
        listHtml,
        listText,
      );
      const key = hash(`digest|${day}|${userId}`);
      const [inserted] = await trx('outbox_messages')
        .insert({
          dedupe_key: key,
          kind: 'digest',
          request_id: null,
          recipient_user_id: userId,
          recipient_email: user.email,
          subject: message.subject,
          text_body: message.text,
          html_body: message.html,
          link: message.link,
          message_id: this.notifications.messageId(key),
          status: 'pending',
        })
        .returning('id');
      await this.outbox.markDigested(
        rows.map((r) => r.id),
        inserted.id,
        trx,
      );
    }
    return byUser.size;
  }
}

/** The day (UTC) whose digest is due at `now`, or null before the hour digests go out. */
export function digestDayDue(now: Date, hourUtc: number): string | null {
  return now.getUTCHours() >= hourUtc ? now.toISOString().slice(0, 10) : null;
}

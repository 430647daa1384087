// The development mailbox: messages the local SMTP sink received, kept in the database so every
// server process (and the admin page) sees the same list.
import type { CapturedMail, Page } from '@cc/shared';
import type { Db } from '../../db/knex';
import type { CapturedMessage } from './smtp-sink';

interface CapturedRow {
  id: string;
  message_id: string | null;
  from_address: string;
  to_addresses: string[];
  subject: string;
  text_body: string;
  html_body: string;
  attachments: CapturedMail['attachments'];
  received_at: Date;
}

const toMail = (r: CapturedRow): CapturedMail => ({
  id: Number(r.id),
  messageId: r.message_id,
  from: r.from_address,
  to: r.to_addresses,
  subject: r.subject,
  text: r.text_body,
  html: r.html_body,
  attachments: r.attachments,
  receivedAt: r.received_at.toISOString(),
});

export interface MailboxFilters {
  to: string | null;
  requestId: number | null;
}
const NO_FILTERS: MailboxFilters = { to: null, requestId: null };

export class CapturedMailRepository {
  constructor(private readonly db: Db) {}

  async keep(message: CapturedMessage): Promise<void> {
    const messageId = message.messageId?.slice(0, 300) ?? null;
    await this.db('captured_mail').insert({
      message_id: messageId,
      // The request of the outbox row it was sent from (index on outbox_messages.message_id); null for a digest.
      request_id: messageId === null ? null : this.db('outbox_messages').where({ message_id: messageId }).whereNotNull('request_id').first('request_id'),
      from_address: message.from.slice(0, 300),
      to_addresses: message.to.map((a) => a.toLowerCase()),
      subject: message.subject.slice(0, 500),
      text_body: message.text,
      html_body: message.html,
      attachments: JSON.stringify(message.attachments.map((a) => ({ fileName: a.fileName.slice(0, 200), contentType: a.contentType.slice(0, 100), bytes: a.content.length }))),
    });
  }

  /** Newest first; `to` narrows to messages sent to that address (any case), `requestId` to one request's. */
  async list(page: number, pageSize: number, filters: MailboxFilters = NO_FILTERS): Promise<Page<CapturedMail>> {
    const rows = (await this.listQuery(page, pageSize, filters)) as (CapturedRow & { total_count: string })[];
    return { items: rows.map(toMail), total: rows.length ? Number(rows[0].total_count) : 0, page, pageSize };
  }

  /** The page's statement: each filter is answered by an index (`(request_id, id)`, the GIN index of `to_addresses`). */
  listQuery(page: number, pageSize: number, { to, requestId }: MailboxFilters) {
    const query = this.db<CapturedRow>('captured_mail').select('*', this.db.raw('count(*) over() AS total_count'));
    if (to) query.whereRaw('to_addresses @> ARRAY[?]::text[]', [to.toLowerCase()]);
    if (requestId !== null) query.where('request_id', requestId);
    return query.orderBy('id', 'desc').limit(pageSize).offset(page * pageSize);
  }

  async find(id: number): Promise<CapturedMail | null> {
    const row: CapturedRow | undefined = await this.db('captured_mail').where('id', id).first();
    return row ? toMail(row) : null;
  }
}

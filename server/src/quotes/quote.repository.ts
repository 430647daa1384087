import type { Quote, QuoteBreakdown, QuoteContractor, QuoteVersion, QuoteVersionLine, QuoteVersionSummary, RateBook } from '@cc/shared';
import type { Db, Trx } from '../db/knex';
import type { QuoteLineRow, QuoteRow } from '../db/pricing-tables';

/** The entry of a quote line as priced, kept whole so the line can be recomputed and shown later. */
export interface QuoteLineEntrySnapshot extends NonNullable<QuoteVersionLine['entry']> {
  code: string | null;
  pricing: unknown;
}

export interface NewQuoteLine extends Omit<QuoteVersionLine, 'entry'> {
  entry: QuoteLineEntrySnapshot | null;
  entryVersionId: number | null;
}

export interface NewQuote {
  requestId: number;
  version: number;
  organisationId: number;
  sentBy: number | null;
  sentAt: Date;
  validUntil: string;
  breakdown: QuoteBreakdown;
  warrantyText: string;
  safetyNotice: string;
  note: string | null;
  contractor: QuoteContractor;
  property: QuoteVersion['property'];
  rateBook: RateBook;
  pricingInput: Quote;
  lines: NewQuoteLine[];
}

/** A sent quote version as stored (what the API shows, less what is computed on reading). */
export type StoredQuote = Omit<QuoteVersion, 'requestReference' | 'isCurrent' | 'changes' | 'pdfPath'>;

function toLine(row: QuoteLineRow): QuoteVersionLine {
  const entry = row.entry as QuoteLineEntrySnapshot | null;
  return {
    lineItemId: row.line_item_id,
    kind: row.kind,
    code: row.code,
    room: row.room,
    location: row.location,
    entry: entry && { id: entry.id, key: entry.key, version: entry.version, name: entry.name, unit: entry.unit, mode: entry.mode },
    quantity: row.quantity,
    isQuantityAssumed: row.is_quantity_assumed,
    adders: (row.adders as QuoteVersionLine['adders']).map((a) => ({ id: a.id, key: a.key, name: a.name })),
    visitKey: row.visit_key,
    labourMinutes: row.labour_minutes,
    labourCents: row.labour_cents,
    materialsCents: row.materials_cents,
    flatCents: row.flat_cents,
    lineCents: row.line_cents,
    outOfScopeReason: row.out_of_scope_reason,
    editionNote: (row.edition_note as QuoteVersionLine['editionNote']) ?? null,
  };
}

const json = (value: unknown) => JSON.stringify(value);

/** Sent quote versions and their lines; rows are written once and never changed. */
export class QuoteRepository {
  constructor(private readonly db: Db) {}

  async insert(quote: NewQuote, trx: Trx): Promise<number> {
    const t = quote.breakdown;
    const [row] = await trx<QuoteRow>('quotes')
      .insert({
        request_id: quote.requestId,
        version: quote.version,
        organisation_id: quote.organisationId,
        sent_by: quote.sentBy,
        sent_at: quote.sentAt,
        valid_until: quote.validUntil,
        subtotal_cents: t.subtotalCents,
        tax_cents: t.materialsTaxCents,
        total_cents: t.totalCents,
        deposit_cents: t.depositCents,
        warranty_text: quote.warrantyText,
        safety_notice: quote.safetyNotice,
        note: quote.note,
        contractor: json(quote.contractor),
        property: json(quote.property),
        rate_book: json(quote.rateBook),
        pricing_input: json(quote.pricingInput),
        breakdown: json(quote.breakdown),
      } as Partial<QuoteRow>)
      .returning('id');
    await trx('quote_lines').insert(
      quote.lines.map((line, position) => ({
        quote_id: row.id,
        position,
        line_item_id: line.lineItemId,
        kind: line.kind,
        code: line.code,
        room: line.room,
        location: line.location,
        entry_version_id: line.entryVersionId,
        entry: line.entry === null ? null : json(line.entry),
        quantity: line.quantity,
        is_quantity_assumed: line.isQuantityAssumed,
        adders: json(line.adders),
        visit_key: line.visitKey,
        labour_minutes: line.labourMinutes,
        labour_cents: line.labourCents,
        materials_cents: line.materialsCents,
        flat_cents: line.flatCents,
        line_cents: line.lineCents,
        out_of_scope_reason: line.outOfScopeReason,
        edition_note: line.editionNote === null ? null : json(line.editionNote),
      })),
    );
    return row.id;
  }

  /** The number of the latest version sent for the request, or null before the first. */
  async latestVersion(requestId: number, trx?: Trx): Promise<number | null> {
    const row = await (trx ?? this.db)('quotes').where({ request_id: requestId }).max<{ max: number | null }>('version as max').first();
    return row?.max ?? null;
  }

  async summaries(requestId: number): Promise<QuoteVersionSummary[]> {
    const rows: (QuoteRow & { by_name: string | null; line_count: number })[] = await this.db('quotes as q')
      .leftJoin('users as u', 'u.id', 'q.sent_by')
      .where('q.request_id', requestId)
      .select('q.id', 'q.version', 'q.sent_at', 'q.valid_until', 'q.total_cents', 'q.deposit_cents', 'u.name as by_name')
      .select(this.db.raw("(SELECT count(*) FROM quote_lines l WHERE l.quote_id = q.id AND l.kind = 'priced')::int AS line_count"))
      .orderBy('q.version');
    const latest = rows.length ? rows[rows.length - 1].version : null;
    return rows.map((r, i) => ({
      version: r.version,
      isCurrent: r.version === latest,
      sentAt: r.sent_at.toISOString(),
      sentByName: r.by_name,
      validUntil: r.valid_until,
      totalCents: r.total_cents,
      depositCents: r.deposit_cents,
      lineCount: r.line_count,
      totalDeltaCents: i === 0 ? null : r.total_cents - rows[i - 1].total_cents,
    }));
  }

  async find(requestId: number, version: number): Promise<StoredQuote | null> {
    const row: (QuoteRow & { by_name: string | null }) | undefined = await this.db('quotes as q')
      .leftJoin('users as u', 'u.id', 'q.sent_by')
      .where({ 'q.request_id': requestId, 'q.version': version })
      .select('q.*', 'u.name as by_name')
      .first();
    if (!row) return null;
    const lines: QuoteLineRow[] = await this.db('quote_lines').where({ quote_id: row.id }).orderBy('position');
    const breakdown = row.breakdown as QuoteBreakdown;
    return {
      id: row.id,
      requestId: row.request_id,
      version: row.version,
      sentAt: row.sent_at.toISOString(),
      sentByName: row.by_name,
      validUntil: row.valid_until,
      contractor: row.contractor as QuoteContractor,
      property: row.property as QuoteVersion['property'],
      lines: lines.map(toLine),
      breakdown,
      cardDepositBp: (row.rate_book as RateBook).terms.cardDepositBp,
      warrantyText: row.warranty_text,
      safetyNotice: row.safety_notice,
      note: row.note,
    };
  }
}

import type { Db, Trx } from '../db/knex';

export interface LetterRecord {
  id: number;
  requestId: number;
  number: string;
  revision: number;
  verificationCode: string;
  sha256: string;
  storageKey: string;
  itemCount: number;
  permitNumber: string | null;
  issuedByName: string | null;
  issuedAt: Date;
}

export interface ReviewRecord {
  letterId: number;
  decision: 'accept' | 'not-accept';
  note: string;
  items: { itemId: number; reason: string }[];
  decidedByName: string | null;
  decidedAt: Date;
}

interface LetterRow {
  id: number;
  request_id: number;
  number: string;
  revision: number;
  verification_code: string;
  sha256: string;
  storage_key: string;
  item_count: number;
  permit_number: string | null;
  issued_by_name: string | null;
  issued_at: Date;
}

function toLetter(row: LetterRow): LetterRecord {
  return {
    id: row.id,
    requestId: row.request_id,
    number: row.number,
    revision: row.revision,
    verificationCode: row.verification_code,
    sha256: row.sha256,
    storageKey: row.storage_key,
    itemCount: row.item_count,
    permitNumber: row.permit_number,
    issuedByName: row.issued_by_name,
    issuedAt: row.issued_at,
  };
}

export type NewLetter = Omit<LetterRecord, 'id' | 'issuedByName' | 'issuedAt'> & { issuedBy: number; issuedAt: Date };

export class LetterRepository {
  constructor(private readonly db: Db) {}

  private select(trx?: Trx) {
    return (trx ?? this.db)('completion_letters as l').leftJoin('users as u', 'u.id', 'l.issued_by').select('l.*', 'u.name as issued_by_name');
  }

  async listForRequest(requestId: number, trx?: Trx): Promise<LetterRecord[]> {
    const rows: LetterRow[] = await this.select(trx).where('l.request_id', requestId).orderBy('l.revision');
    return rows.map(toLetter);
  }

  async findByRevision(requestId: number, revision: number): Promise<LetterRecord | null> {
    const row: LetterRow | undefined = await this.select().where({ 'l.request_id': requestId, 'l.revision': revision }).first();
    return row ? toLetter(row) : null;
  }

  async findByCode(code: string): Promise<LetterRecord | null> {
    const row: LetterRow | undefined = await this.select().where('l.verification_code', code).first();
    return row ? toLetter(row) : null;
  }

  async findBySha256(sha256: string): Promise<LetterRecord | null> {
    const row: LetterRow | undefined = await this.select().where('l.sha256', sha256).first();
    return row ? toLetter(row) : null;
  }

  async insert(letter: NewLetter, trx: Trx): Promise<number> {
    const [row] = await trx('completion_letters')
      .insert({
        request_id: letter.requestId,
        number: letter.number,
        revision: letter.revision,
        verification_code: letter.verificationCode,
        sha256: letter.sha256,
        storage_key: letter.storageKey,
        item_count: letter.itemCount,
        permit_number: letter.permitNumber,
        issued_by: letter.issuedBy,
        issued_at: letter.issuedAt,
      })
      .returning('id');
    return row.id;
  }

  async addReview(review: Omit<ReviewRecord, 'decidedByName' | 'decidedAt'> & { requestId: number; decidedBy: number }, trx: Trx): Promise<void> {
    await trx('proof_reviews').insert({
      request_id: review.requestId,
      letter_id: review.letterId,
      decision: review.decision,
      note: review.note,
      items: JSON.stringify(review.items),
      decided_by: review.decidedBy,
    });
  }

  async reviews(requestId: number): Promise<ReviewRecord[]> {
    const rows: { letter_id: number; decision: 'accept' | 'not-accept'; note: string; items: ReviewRecord['items']; name: string | null; decided_at: Date }[] = await this.db('proof_reviews as r')
      .leftJoin('users as u', 'u.id', 'r.decided_by')
      .where('r.request_id', requestId)
      .orderBy('r.id')
      .select('r.letter_id', 'r.decision', 'r.note', 'r.items', 'u.name', 'r.decided_at');
    return rows.map((r) => ({ letterId: r.letter_id, decision: r.decision, note: r.note, items: r.items, decidedByName: r.name, decidedAt: r.decided_at }));
  }

  async isAccepted(letterId: number): Promise<boolean> {
    return !!(await this.db('proof_reviews').where({ letter_id: letterId, decision: 'accept' }).first('id'));
  }

  /** The text the letter quotes for its warranty when none is typed: the latest quote's. */
  async quoteWarranty(requestId: number, trx?: Trx): Promise<string | null> {
    const row = await (trx ?? this.db)('quotes').where({ request_id: requestId }).orderBy('version', 'desc').first('warranty_text');
    return row?.warranty_text ?? null;
  }

  /** The report files the items were read from (the letter's report reference). */
  /** The inspection-report files of the request: their names, kinds and upload dates. */
  async reportFiles(requestId: number, trx?: Trx): Promise<{ name: string; kind: string; uploadedOn: string }[]> {
    const rows: { original_name: string; kind: string; created_at: Date }[] = await (trx ?? this.db)('report_files')
      .where({ request_id: requestId })
      .orderBy('id')
      .select('original_name', 'kind', 'created_at');
    return rows.map((r) => ({ name: r.original_name, kind: r.kind, uploadedOn: r.created_at.toISOString().slice(0, 10) }));
  }
}

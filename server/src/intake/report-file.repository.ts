import type { ReportFile, SkippedText } from '@cc/shared';
import type { Db, Trx } from '../db/knex';
import type { ReportFileRow } from '../db/tables';

const TABLE = 'report_files';

type RowWithUploader = ReportFileRow & { uploader_name: string | null };

function toReportFile(row: RowWithUploader): ReportFile {
  return {
    id: row.id,
    kind: row.kind,
    originalName: row.original_name,
    sizeBytes: row.size_bytes,
    pageCount: row.page_count,
    sha256: row.sha256,
    pages: row.pages,
    skipped: row.skipped as SkippedText[],
    uploadedByName: row.uploader_name,
    createdAt: row.created_at.toISOString(),
  };
}

export interface NewReportFile {
  requestId: number;
  sha256: string;
  kind: ReportFile['kind'];
  originalName: string;
  sizeBytes: number;
  pages: string[];
  skipped: SkippedText[];
  storageKey: string;
  uploadedBy: number;
}

export class ReportFileRepository {
  constructor(private readonly db: Db) {}

  private query(trx?: Trx) {
    return (trx ?? this.db)<RowWithUploader>(`${TABLE} as f`).leftJoin('users as u', 'u.id', 'f.uploaded_by').select('f.*', 'u.name as uploader_name');
  }

  async listForRequest(requestId: number): Promise<ReportFile[]> {
    return (await this.query().where('f.request_id', requestId).orderBy('f.id')).map(toReportFile);
  }

  async findInRequest(requestId: number, id: number, trx?: Trx): Promise<ReportFile | null> {
    const row = await this.query(trx).where({ 'f.request_id': requestId, 'f.id': id }).first();
    return row ? toReportFile(row) : null;
  }

  async findBySha(requestId: number, sha256: string, trx?: Trx): Promise<ReportFile | null> {
    const row = await this.query(trx).where({ 'f.request_id': requestId, 'f.sha256': sha256 }).first();
    return row ? toReportFile(row) : null;
  }

  async insert(file: NewReportFile, trx: Trx): Promise<number> {
    const [row] = await trx<ReportFileRow>(TABLE)
      .insert({
        request_id: file.requestId,
        sha256: file.sha256,
        kind: file.kind,
        original_name: file.originalName,
        size_bytes: file.sizeBytes,
        page_count: file.pages.length,
        storage_key: file.storageKey,
        pages: JSON.stringify(file.pages) as unknown as string[],
        skipped: JSON.stringify(file.skipped) as unknown as unknown[],
        skipped_count: file.skipped.length,
        uploaded_by: file.uploadedBy,
      })
      .returning('id');
    return row.id;
  }

  async setSkipped(id: number, skipped: SkippedText[], trx: Trx): Promise<void> {
    await trx<ReportFileRow>(TABLE)
      .where({ id })
      .update({ skipped: JSON.stringify(skipped) as unknown as unknown[], skipped_count: skipped.length });
  }
}

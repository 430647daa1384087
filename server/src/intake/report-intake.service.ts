import { createHash } from 'node:crypto';
import {
  findingCodeInfo,
  parseReport,
  type CurrentUser,
  type Finding,
  type ReportFile,
  type UploadResult,
} from '@cc/shared';
import type { Db, Trx } from '../db/knex';
import type { LineItemRepository, NewLineItem } from './line-item.repository';
import type { ReportFileRepository } from './report-file.repository';
import type { RequestRepository } from '../requests/request.repository';
import type { FileStorage } from '../integrations/storage/file-storage';
import { ConflictError, ForbiddenError, NotFoundError } from '../errors';
import { checkReport, type PdfPageReader, type UploadedFile } from './report-intake';
import type { RequestsService } from '../requests/requests.service';

/** Request states in which a report can be added and its items reviewed. */
export const INTAKE_STATES = ['draft', 'intake'] as const;

function proposalsFrom(findings: Finding[], requestId: number, reportFileId: number): NewLineItem[] {
  return findings.map((f) => ({
    requestId,
    code: f.code,
    room: f.room,
    location: f.location,
    quantity: f.quantity,
    evidence: f.evidence,
    page: f.page,
    severity: f.severity ?? findingCodeInfo(f.code).severity,
    necRefs: f.necRefs,
    status: 'proposed',
    isEdited: false,
    reportFileId,
    evidenceStart: f.start,
    evidenceEnd: f.end,
  }));
}

/** Upload, text extraction and parsing of report excerpts into proposed line items. */
export class ReportIntakeService {
  constructor(
    private readonly db: Db,
    private readonly access: RequestsService,
    private readonly requests: RequestRepository,
    private readonly reports: ReportFileRepository,
    private readonly items: LineItemRepository,
    private readonly storage: FileStorage,
    private readonly readPdfPages: PdfPageReader,
  ) {}

  /** 404 unless visible; 403 unless an agent or inspector of the request (or admin); 409 after intake. */
  private async assertCanUpload(user: CurrentUser, requestId: number) {
    const request = await this.access.get(user, requestId);
    const canUpload = user.role === 'admin' || request.myParts.some((p) => p !== 'seller');
    if (!canUpload) throw new ForbiddenError("Only the request's agents and inspector add the report");
    if (!(INTAKE_STATES as readonly string[]).includes(request.status)) {
      throw new ConflictError('The items of this request are confirmed already; the report cannot be changed now');
    }
    return request;
  }

  async list(user: CurrentUser, requestId: number): Promise<ReportFile[]> {
    await this.access.get(user, requestId);
    return this.reports.listForRequest(requestId);
  }

  async uploadFile(user: CurrentUser, requestId: number, file: UploadedFile): Promise<UploadResult> {
    await this.assertCanUpload(user, requestId);
    const checked = await checkReport(file, this.readPdfPages);
    return this.keep(user, requestId, file.buffer, checked.kind, file.originalName, checked.pages);
  }

  async paste(user: CurrentUser, requestId: number, text: string, name?: string): Promise<UploadResult> {
    await this.assertCanUpload(user, requestId);
    const pages = text.replace(/\r\n?/g, '\n').split('\f');
    return this.keep(user, requestId, Buffer.from(text, 'utf8'), 'pasted', name || 'Pasted text', pages);
  }

  /** Parses, then stores the file row, its proposals, the state change and the bytes in one transaction. */
  private async keep(user: CurrentUser, requestId: number, bytes: Buffer, kind: ReportFile['kind'], originalName: string, pages: string[]): Promise<UploadResult> {
    const sha256 = createHash('sha256').update(bytes).digest('hex');
    const existing = await this.reports.findBySha(requestId, sha256);
    if (existing) return { report: existing, isDuplicate: true, proposedCount: 0, skippedCount: existing.skipped.length };

    const parsed = parseReport(pages);
    let storedNew = false;
    try {
      const reportId = await this.db.transaction(async (trx) => {
        const id = await this.reports.insert(
          { requestId, sha256, kind, originalName: originalName.slice(0, 255), sizeBytes: bytes.length, pages, skipped: parsed.skipped, storageKey: sha256, uploadedBy: user.id },
          trx,
        );
        await this.items.insert(proposalsFrom(parsed.findings, requestId, id), trx);
        await this.moveToIntake(requestId, user, trx);
        storedNew = await this.storage.put(sha256, bytes);
        return id;
      });
      const report = await this.reports.findInRequest(requestId, reportId);
      if (!report) throw new Error('report vanished after insert');
      return { report, isDuplicate: false, proposedCount: parsed.findings.length, skippedCount: parsed.skipped.length };
    } catch (err) {
      // The transaction rolled back: drop bytes this attempt stored so nothing is left behind.
      if (storedNew) await this.storage.delete(sha256);
      if ((err as { code?: string }).code === '23505') return this.keep(user, requestId, bytes, kind, originalName, pages);
      throw err;
    }
  }

  /**
   * Reads a stored report again (e.g. after the parser learned new phrasings). Proposals nobody
   * touched are replaced; edited, confirmed or removed items stay as they are, and a finding at the
   * same place as one of them is not proposed again.
   */
  async reparse(user: CurrentUser, requestId: number, reportId: number): Promise<UploadResult> {
    await this.assertCanUpload(user, requestId);
    const report = await this.reports.findInRequest(requestId, reportId);
    if (!report) throw new NotFoundError('No such report');
    const parsed = parseReport(report.pages);
    const proposedCount = await this.db.transaction(async (trx) => {
      const replaceable = await this.items.uneditedProposals(reportId, trx);
      await this.items.deleteByIds(replaceable.map((i) => i.id), trx);
      const kept = await this.keptPlaces(reportId, trx);
      const fresh = parsed.findings.filter((f) => !kept.has(`${f.code}@${f.start}`) && !kept.has(`*@${f.start}`));
      await this.items.insert(proposalsFrom(fresh, requestId, reportId), trx);
      await this.reports.setSkipped(reportId, parsed.skipped, trx);
      return fresh.length;
    });
    const updated = await this.reports.findInRequest(requestId, reportId);
    return { report: updated!, isDuplicate: false, proposedCount, skippedCount: parsed.skipped.length };
  }

  /** Places in the report already spoken for: `code@start`, and `*@start` for items a person edited. */
  private async keptPlaces(reportId: number, trx: Trx): Promise<Set<string>> {
    const rows: { code: string; evidence_start: number | null; is_edited: boolean }[] = await trx('line_items')
      .where({ report_file_id: reportId })
      .select('code', 'evidence_start', 'is_edited');
    const places = new Set<string>();
    for (const r of rows) {
      if (r.evidence_start === null) continue;
      places.add(`${r.code}@${r.evidence_start}`);
      if (r.is_edited) places.add(`*@${r.evidence_start}`);
    }
    return places;
  }

  private async moveToIntake(requestId: number, user: CurrentUser, trx: Trx): Promise<void> {
    const { status } = await trx('repair_requests').where({ id: requestId }).forUpdate().first('status');
    if (status === 'draft') {
      await this.requests.changeStatus(requestId, { from: 'draft', to: 'intake', by: user.id, note: 'Inspection report added' }, trx);
    } else if (status !== 'intake') {
      throw new ConflictError('The items of this request are confirmed already; the report cannot be changed now');
    }
  }
}

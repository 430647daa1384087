import { createHash } from 'node:crypto';
import {
  findingCodeInfo,
  type CurrentUser,
  type Finding,
  type ParseResult,
  type ReportFile,
  type ReportText,
  type UploadResult,
} from '@cc/shared';
import type { Db, Trx } from '../db/knex';
import type { LineItemRepository, NewLineItem } from './line-item.repository';
import type { ReportFileRepository } from './report-file.repository';
import type { RequestRepository } from '../requests/request.repository';
import { inTransaction } from '../db/transaction';
import type { ReadJob } from '../integrations/report-reader/read-report';
import type { ReportReader } from '../integrations/report-reader/report-reader';
import type { FileStorage, StagedFile } from '../integrations/storage/file-storage';
import { ConflictError, ForbiddenError, NotFoundError } from '../errors';
import { checkUpload, refusalError, type UploadedFile } from './report-intake';
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

const sha256Of = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex');

const duplicate = (existing: ReportFile): UploadResult => ({ report: existing, isDuplicate: true, proposedCount: 0, skippedCount: existing.skipped.length });

/** Upload, text extraction and parsing of report excerpts into proposed line items. */
export class ReportIntakeService {
  constructor(
    private readonly db: Db,
    private readonly access: RequestsService,
    private readonly requests: RequestRepository,
    private readonly reports: ReportFileRepository,
    private readonly items: LineItemRepository,
    private readonly storage: FileStorage,
    private readonly reader: Pick<ReportReader, 'read'>,
  ) {}

  /** Pages and findings of a report, read in the worker pool; a refusal becomes its domain error. */
  private async read(job: ReadJob, field: string): Promise<{ pages: string[]; parsed: ParseResult }> {
    const outcome = await this.reader.read(job);
    if (!outcome.ok) throw refusalError(outcome.refusal, field);
    return outcome;
  }

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

  /** The pages of one report (lists and upload answers carry summaries only). */
  async text(user: CurrentUser, requestId: number, reportId: number): Promise<ReportText> {
    await this.access.get(user, requestId);
    const text = await this.reports.text(requestId, reportId);
    if (!text) throw new NotFoundError('No such report');
    return text;
  }

  async uploadFile(user: CurrentUser, requestId: number, file: UploadedFile): Promise<UploadResult> {
    await this.assertCanUpload(user, requestId);
    const kind = checkUpload(file);
    const sha256 = sha256Of(file.buffer);
    const existing = await this.reports.findBySha(requestId, sha256);
    if (existing) return duplicate(existing);
    const { pages, parsed } = await this.read({ kind, bytes: file.buffer }, 'file');
    return this.keep(user, requestId, file.buffer, sha256, kind, file.originalName, pages, parsed);
  }

  async paste(user: CurrentUser, requestId: number, text: string, name?: string): Promise<UploadResult> {
    await this.assertCanUpload(user, requestId);
    const bytes = Buffer.from(text, 'utf8');
    const sha256 = sha256Of(bytes);
    const existing = await this.reports.findBySha(requestId, sha256);
    if (existing) return duplicate(existing);
    const { pages, parsed } = await this.read({ kind: 'pasted', text }, 'text');
    return this.keep(user, requestId, bytes, sha256, 'pasted', name || 'Pasted text', pages, parsed);
  }

  /**
   * Stores the file row, its proposals and the state change in one transaction that locks the
   * request first (so uploads to one request queue instead of deadlocking); the bytes are written
   * under a temporary name and moved under their key only once the transaction committed.
   */
  private async keep(
    user: CurrentUser,
    requestId: number,
    bytes: Buffer,
    sha256: string,
    kind: ReportFile['kind'],
    originalName: string,
    pages: string[],
    parsed: ParseResult,
  ): Promise<UploadResult> {
    const staged: StagedFile = await this.storage.stage(sha256, bytes);
    let reportId: number | null;
    try {
      reportId = await inTransaction(this.db, async (trx) => {
        await this.moveToIntake(requestId, user, trx);
        // Another upload of the same bytes may have committed while this one waited for the lock.
        if (await this.reports.findBySha(requestId, sha256, trx)) return null;
        const id = await this.reports.insert(
          { requestId, sha256, kind, originalName: originalName.slice(0, 255), sizeBytes: bytes.length, pages, skipped: parsed.skipped, storageKey: sha256, uploadedBy: user.id },
          trx,
        );
        await this.items.insert(proposalsFrom(parsed.findings, requestId, id), trx);
        return id;
      });
    } catch (err) {
      await staged.discard();
      throw err;
    }
    if (reportId === null) {
      await staged.discard();
      const existing = await this.reports.findBySha(requestId, sha256);
      if (!existing) throw new Error('report vanished after a concurrent insert');
      return duplicate(existing);
    }
    await staged.commit();
    const report = await this.reports.findInRequest(requestId, reportId);
    if (!report) throw new Error('report vanished after insert');
    return { report, isDuplicate: false, proposedCount: parsed.findings.length, skippedCount: parsed.skipped.length };
  }

  /**
   * Reads a stored report again (e.g. after the parser learned new phrasings). Proposals nobody
   * touched are replaced; edited, confirmed or removed items stay as they are, and a finding at the
   * same place as one of them is not proposed again.
   */
  async reparse(user: CurrentUser, requestId: number, reportId: number): Promise<UploadResult> {
    await this.assertCanUpload(user, requestId);
    const report = await this.reports.text(requestId, reportId);
    if (!report) throw new NotFoundError('No such report');
    const { parsed } = await this.read({ kind: 'pages', pages: report.pages }, 'reportId');
    const proposedCount = await inTransaction(this.db, async (trx) => {
      await this.lockRequest(requestId, trx);
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

  /** Locks the request's row: every write to its reports and items takes this lock first. */
  private async lockRequest(requestId: number, trx: Trx): Promise<string> {
    const { status } = await trx('repair_requests').where({ id: requestId }).forUpdate().first('status');
    return status;
  }

  private async moveToIntake(requestId: number, user: CurrentUser, trx: Trx): Promise<void> {
    const status = await this.lockRequest(requestId, trx);
    if (status === 'draft') {
      await this.requests.changeStatus(requestId, { from: 'draft', to: 'intake', by: user.id, note: 'Inspection report added' }, trx);
    } else if (status !== 'intake') {
      throw new ConflictError('The items of this request are confirmed already; the report cannot be changed now');
    }
  }
}

import { createHash } from 'node:crypto';
import {
  findingCodeInfo,
  requestMove,
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
import { NotFoundError } from '../errors';
import { assertMayAct, moverOn, type FlowService, type Mover } from '../flow/flow.service';
import type { NotificationsService } from '../notifications/notifications.service';
import { checkUpload, refusalError, type UploadedFile } from './report-intake';
import type { RequestsService } from '../requests/requests.service';

const UPLOAD_REFUSED = {
  notYours: "Only the request's agents and inspector add the report",
  notNow: 'The items of this request are confirmed already; the report cannot be changed now',
};

function proposalsFrom(findings: Finding[], requestId: number, reportFileId: number): Omit<NewLineItem, 'status'>[] {
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
    isEdited: false,
    reportFileId,
    evidenceStart: f.start,
    evidenceEnd: f.end,
    confidence: f.confidence,
    recommendation: f.recommendation,
    computation: f.computation,
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
    private readonly flow: FlowService,
    private readonly notifications: NotificationsService,
  ) {}

  /** Pages and findings of a report, read in the worker pool; a refusal becomes its domain error. */
  private async read(job: ReadJob, field: string): Promise<{ pages: string[]; parsed: ParseResult }> {
    const outcome = await this.reader.read(job);
    if (!outcome.ok) throw refusalError(outcome.refusal, field);
    return outcome;
  }

  /** 404 unless visible; 403 unless an agent or inspector of the request (or admin); 409 after intake. */
  private async assertCanUpload(user: CurrentUser, requestId: number): Promise<Mover> {
    const request = await this.access.get(user, requestId);
    const mover = moverOn(user, request);
    assertMayAct(mover.actors, 'upload-report', request.status, UPLOAD_REFUSED);
    return mover;
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
    const mover = await this.assertCanUpload(user, requestId);
    const kind = checkUpload(file);
    const sha256 = sha256Of(file.buffer);
    const existing = await this.reports.findBySha(requestId, sha256);
    if (existing) return duplicate(existing);
    const { pages, parsed } = await this.read({ kind, bytes: file.buffer }, 'file');
    return this.keep(mover, requestId, file.buffer, sha256, kind, file.originalName, pages, parsed);
  }

  async paste(user: CurrentUser, requestId: number, text: string, name?: string): Promise<UploadResult> {
    const mover = await this.assertCanUpload(user, requestId);
    const bytes = Buffer.from(text, 'utf8');
    const sha256 = sha256Of(bytes);
    const existing = await this.reports.findBySha(requestId, sha256);
    if (existing) return duplicate(existing);
    const { pages, parsed } = await this.read({ kind: 'pasted', text }, 'text');
    return this.keep(mover, requestId, bytes, sha256, 'pasted', name || 'Pasted text', pages, parsed);
  }

  /**
   * Stores the file row, its proposals and the state change in one transaction that locks the
   * request first (so uploads to one request queue instead of deadlocking); the bytes are written
   * under a temporary name and moved under their key only once the transaction committed.
   */
  private async keep(
    mover: Mover,
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
        await this.moveToIntake(requestId, mover, trx);
        // Another upload of the same bytes may have committed while this one waited for the lock.
        if (await this.reports.findBySha(requestId, sha256, trx)) return null;
        const id = await this.reports.insert(
          { requestId, sha256, kind, originalName: originalName.slice(0, 255), sizeBytes: bytes.length, pages, skipped: parsed.skipped, storageKey: sha256, uploadedBy: mover.userId },
          trx,
        );
        await this.flow.createItems(trx, 'propose', mover, proposalsFrom(parsed.findings, requestId, id), UPLOAD_REFUSED);
        await this.notifications.notify(trx, { kind: 'report-parsed', requestId, actorUserId: mover.userId, reportFileId: id, itemCount: parsed.findings.length });
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
    const mover = await this.assertCanUpload(user, requestId);
    const report = await this.reports.text(requestId, reportId);
    if (!report) throw new NotFoundError('No such report');
    const { parsed } = await this.read({ kind: 'pages', pages: report.pages }, 'reportId');
    const proposedCount = await inTransaction(this.db, async (trx) => {
      // The request's row first, as every write to its reports and items takes it.
      await this.requests.lockStatus(requestId, trx);
      const replaceable = await this.items.uneditedProposals(reportId, trx);
      await this.items.deleteByIds(replaceable.map((i) => i.id), trx);
      const kept = await this.keptPlaces(reportId, trx);
      const fresh = parsed.findings.filter((f) => !kept.has(`${f.code}@${f.start}`) && !kept.has(`*@${f.start}`));
      await this.flow.createItems(trx, 'propose', mover, proposalsFrom(fresh, requestId, reportId), UPLOAD_REFUSED);
      await this.reports.setSkipped(reportId, parsed.skipped, trx);
      return fresh.length;
    });
    const updated = await this.reports.findInRequest(requestId, reportId);
    return { report: updated!, isDuplicate: false, proposedCount, skippedCount: parsed.skipped.length };
  }

  /** Places in the report already spoken for: `code@start`, and `*@start` for items a person edited. */
  private async keptPlaces(reportId: number, trx: Trx): Promise<Set<string>> {
    const places = new Set<string>();
    for (const r of await this.items.placesInReport(reportId, trx)) {
      if (r.evidenceStart === null) continue;
      places.add(`${r.code}@${r.evidenceStart}`);
      if (r.isEdited) places.add(`*@${r.evidenceStart}`);
    }
    return places;
  }

  /** The first report moves the request into intake; later ones find it there (409 once intake is over). */
  private async moveToIntake(requestId: number, mover: Mover, trx: Trx): Promise<void> {
    const status = await this.requests.lockStatus(requestId, trx);
    if (status === null) throw new NotFoundError('No such repair request');
    assertMayAct(mover.actors, 'upload-report', status, UPLOAD_REFUSED);
    if (requestMove('add-report', status)) await this.flow.moveRequest(trx, requestId, 'add-report', mover, 'Inspection report added', UPLOAD_REFUSED);
  }
}

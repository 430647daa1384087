import { createHash } from 'node:crypto';
import {
  findingCodeInfo,
  parseReport,
  requestMove,
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
import { NotFoundError } from '../errors';
import { assertMayAct, moverOn, type FlowService, type Mover } from '../flow/flow.service';
import type { NotificationsService } from '../notifications/notifications.service';
import { checkReport, type PdfPageReader, type UploadedFile } from './report-intake';
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
    private readonly flow: FlowService,
    private readonly notifications: NotificationsService,
  ) {}

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

  async uploadFile(user: CurrentUser, requestId: number, file: UploadedFile): Promise<UploadResult> {
    const mover = await this.assertCanUpload(user, requestId);
    const checked = await checkReport(file, this.readPdfPages);
    return this.keep(mover, requestId, file.buffer, checked.kind, file.originalName, checked.pages);
  }

  async paste(user: CurrentUser, requestId: number, text: string, name?: string): Promise<UploadResult> {
    const mover = await this.assertCanUpload(user, requestId);
    const pages = text.replace(/\r\n?/g, '\n').split('\f');
    return this.keep(mover, requestId, Buffer.from(text, 'utf8'), 'pasted', name || 'Pasted text', pages);
  }

  /** Parses, then stores the file row, its proposals, the state change and the bytes in one transaction. */
  private async keep(mover: Mover, requestId: number, bytes: Buffer, kind: ReportFile['kind'], originalName: string, pages: string[]): Promise<UploadResult> {
    const sha256 = createHash('sha256').update(bytes).digest('hex');
    const existing = await this.reports.findBySha(requestId, sha256);
    if (existing) return { report: existing, isDuplicate: true, proposedCount: 0, skippedCount: existing.skipped.length };

    const parsed = parseReport(pages);
    let storedNew = false;
    try {
      const reportId = await this.db.transaction(async (trx) => {
        const id = await this.reports.insert(
          { requestId, sha256, kind, originalName: originalName.slice(0, 255), sizeBytes: bytes.length, pages, skipped: parsed.skipped, storageKey: sha256, uploadedBy: mover.userId },
          trx,
        );
        await this.moveToIntake(requestId, mover, trx);
        await this.flow.createItems(trx, 'propose', mover, proposalsFrom(parsed.findings, requestId, id), UPLOAD_REFUSED);
        await this.notifications.notify(trx, { kind: 'report-parsed', requestId, actorUserId: mover.userId, reportFileId: id, itemCount: parsed.findings.length });
        storedNew = await this.storage.put(sha256, bytes);
        return id;
      });
      const report = await this.reports.findInRequest(requestId, reportId);
      if (!report) throw new Error('report vanished after insert');
      return { report, isDuplicate: false, proposedCount: parsed.findings.length, skippedCount: parsed.skipped.length };
    } catch (err) {
      // The transaction rolled back: drop bytes this attempt stored so nothing is left behind.
      if (storedNew) await this.storage.delete(sha256);
      if ((err as { code?: string }).code === '23505') return this.keep(mover, requestId, bytes, kind, originalName, pages);
      throw err;
    }
  }

  /**
   * Reads a stored report again (e.g. after the parser learned new phrasings). Proposals nobody
   * touched are replaced; edited, confirmed or removed items stay as they are, and a finding at the
   * same place as one of them is not proposed again.
   */
  async reparse(user: CurrentUser, requestId: number, reportId: number): Promise<UploadResult> {
    const mover = await this.assertCanUpload(user, requestId);
    const report = await this.reports.findInRequest(requestId, reportId);
    if (!report) throw new NotFoundError('No such report');
    const parsed = parseReport(report.pages);
    const proposedCount = await this.db.transaction(async (trx) => {
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

import { createHash } from 'node:crypto';
import {
  evaluateReadings,
  labelsApplyTo,
  mayMoveItem,
  missingProof,
  missingProofMessage,
  type Correction,
  type CurrentUser,
  type FlowActor,
  type ItemEvent,
  type PhotoKind,
  type RecordCorrectionParsed,
  type RequestStatus,
} from '@cc/shared';
import type { Db, Trx } from '../db/knex';
import type { FlowService } from '../flow/flow.service';
import type { FileStorage } from '../integrations/storage/file-storage';
import { StagedFiles } from '../integrations/storage/staged-files';
import { ConflictError, NotFoundError, ValidationError } from '../errors';
import type { RequestsService } from '../requests/requests.service';
import type { SiteVisitRepository } from '../visits/site-visit.repository';
import type { ProofMessages } from '../work/proof-messages';
import { assertMayAct, requestWithActors } from '../work/request-actors';
import { moveItem, moveRequest } from '../work/request-moves';
import type { WorkItemRepository } from '../work/work-item.repository';
import type { CorrectionRecord, CorrectionRepository, NewPhoto } from './correction.repository';
import { cleanPhoto } from './photo-image';

export interface UploadedPhoto {
  kind: PhotoKind;
  buffer: Buffer;
}

/** Recording what was done to each approved item: outcome, work, device, labels, readings and photos. */
export class CorrectionsService {
  constructor(
    private readonly db: Db,
    private readonly access: RequestsService,
    private readonly flow: FlowService,
    private readonly items: WorkItemRepository,
    private readonly visits: SiteVisitRepository,
    private readonly corrections: CorrectionRepository,
    private readonly storage: FileStorage,
    private readonly messages: ProofMessages,
  ) {}

  /**
   * Records the item's outcome. Photos are checked and cleaned first; then the record, its photos and
   * the moves of the item and the request are written in one transaction, the photo files under a
   * temporary name that becomes theirs only once it committed.
   */
  async record(user: CurrentUser, requestId: number, itemId: number, input: RecordCorrectionParsed, uploads: readonly UploadedPhoto[]): Promise<Correction> {
    const { request, actors } = await requestWithActors(this.access, user, requestId);
    assertMayAct(actors, 'record-correction', request.status, 'Recording a correction');
    const photos: (NewPhoto & { data: Buffer })[] = [];
    for (const [index, upload] of uploads.entries()) {
      const clean = await cleanPhoto(upload.buffer, `${upload.kind}.${index}`);
      const storageKey = `photo-${createHash('sha256').update(clean.data).digest('hex')}.jpg`;
      photos.push({ kind: upload.kind, storageKey, width: clean.width, height: clean.height, sizeBytes: clean.data.length, data: clean.data });
    }
    const event: ItemEvent = input.outcome === 'corrected' ? 'correct' : 'not-correct';

    await StagedFiles.around(this.storage, (files) =>
      this.db.transaction(async (trx) => {
        const locked = await this.items.lockRequest(requestId, trx);
        let status = locked?.status as RequestStatus;
        if (!locked || status !== request.status) throw new ConflictError('The request changed meanwhile. Reload and try again.');
        const items = await this.items.listForRequest(requestId, trx, true);
        const item = items.find((i) => i.id === itemId);
        if (!item) throw new NotFoundError('No such approved item on this request');
        if (!mayMoveItem(actors, event, item.status)) throw new ConflictError('This item has an outcome already');
        if (input.labels.length && !labelsApplyTo(item.code)) {
          throw new ValidationError('These labels do not apply to this item', [{ path: 'labels', message: 'Labels mark receptacles on GFCI protection (NEC 406.4(D)(2)); this item is not one' }]);
        }
        const unproven = input.outcome === 'corrected' ? missingProof(item.code, input.readings) : [];
        if (unproven.length) throw new ValidationError('A test reading is needed', [{ path: 'readings', message: missingProofMessage(unproven) }]);
        const siteVisitId = input.siteVisitId ?? item.siteVisitId;
        const onVisit = siteVisitId === null ? null : await this.visits.find(requestId, siteVisitId, trx);
        if (siteVisitId !== null && !onVisit) {
          throw new ValidationError('No such site visit', [{ path: 'siteVisitId', message: 'Choose one of the visits of this request' }]);
        }
        if (onVisit?.status === 'cancelled') {
          throw new ValidationError('This visit was cancelled', [{ path: 'siteVisitId', message: 'Choose a visit that took place' }]);
        }
        status = await this.bringUnderWay(requestId, status, actors, user.id, trx);
        const correctionId = await this.corrections.save(requestId, itemId, { ...input, siteVisitId }, user.id, trx);
        for (const photo of photos) await files.stage(photo.storageKey, photo.data);
        await this.corrections.addPhotos(requestId, correctionId, photos, trx);
        await moveItem(this.flow, { ...item, requestId }, event, { actors, by: user.id }, trx);
        const stillOpen = items.filter((i) => i.id !== itemId && i.status === 'approved');
        if (!stillOpen.length) await moveRequest(this.flow, { requestId, event: 'finish-work', actors, by: user.id, note: 'Every approved item has an outcome' }, trx);
        await this.messages.itemCorrected(trx, { requestId, itemId, correctionId, outcome: input.outcome, by: user.id });
      }),
    );
    const saved = (await this.corrections.listForRequest(requestId)).find((c) => c.itemId === itemId)!;
    return toCorrectionDto(requestId, saved);
  }

  /** A request whose visit was booked, or that was reopened, is under way once work is recorded. */
  private async bringUnderWay(requestId: number, status: RequestStatus, actors: readonly FlowActor[], by: number, trx: Trx): Promise<RequestStatus> {
    if (status === 'scheduled') return moveRequest(this.flow, { requestId, event: 'start-work', actors, by }, trx);
    if (status === 'reopened') return moveRequest(this.flow, { requestId, event: 'resume-work', actors, by }, trx);
    return status;
  }

  /** The bytes of one photo, for anyone who may see the request. */
  async photo(user: CurrentUser, requestId: number, photoId: number): Promise<Buffer> {
    await this.access.get(user, requestId);
    const photo = await this.corrections.findPhoto(requestId, photoId);
    if (!photo) throw new NotFoundError('No such photo');
    return this.storage.get(photo.storageKey);
  }
}

export function toCorrectionDto(requestId: number, c: CorrectionRecord): Correction {
  return {
    itemId: c.itemId,
    outcome: c.outcome,
    reason: c.reason,
    workPerformed: c.workPerformed,
    materials: c.materials,
    deviceMake: c.deviceMake,
    deviceModel: c.deviceModel,
    deviceLot: c.deviceLot,
    labels: c.labels,
    readings: c.readings,
    evaluations: evaluateReadings(c.readings, { labels: c.labels }),
    siteVisitId: c.siteVisitId,
    siteVisitNumber: c.siteVisitNumber,
    isFirstVisit: c.isFirstVisit,
    returnCause: c.returnCause,
    recordedByName: c.recordedByName,
    recordedAt: c.recordedAt.toISOString(),
    photos: c.photos.map((p) => ({ id: p.id, kind: p.kind, width: p.width, height: p.height, url: `/api/requests/${requestId}/photos/${p.id}` })),
  };
}

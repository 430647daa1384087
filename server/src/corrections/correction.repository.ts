import type { CorrectionOutcome, PhotoKind, Readings, RecordCorrectionParsed, ReturnCause } from '@cc/shared';
import type { Db, Trx } from '../db/knex';

/** A correction record as stored, with its photos and the names it is shown with. */
export interface CorrectionRecord {
  id: number;
  itemId: number;
  outcome: CorrectionOutcome;
  reason: string;
  workPerformed: string;
  materials: string;
  deviceMake: string;
  deviceModel: string;
  deviceLot: string;
  labels: string[];
  readings: Readings;
  siteVisitId: number | null;
  siteVisitNumber: number | null;
  isFirstVisit: boolean;
  returnCause: ReturnCause | null;
  recordedByName: string | null;
  recordedAt: Date;
  photos: PhotoRecord[];
}

export interface PhotoRecord {
  id: number;
  correctionId: number;
  requestId: number;
  kind: PhotoKind;
  storageKey: string;
  width: number;
  height: number;
}

interface CorrectionRow {
  id: number;
  line_item_id: number;
  outcome: CorrectionOutcome;
  reason: string;
  work_performed: string;
  materials: string;
  device_make: string;
  device_model: string;
  device_lot: string;
  labels: string[];
  readings: Readings;
  site_visit_id: number | null;
  site_visit_number: number | null;
  first_visit: boolean;
  return_cause: ReturnCause | null;
  recorded_by_name: string | null;
  recorded_at: Date;
}

interface PhotoRow {
  id: number;
  correction_id: number;
  request_id: number;
  kind: PhotoKind;
  storage_key: string;
  width: number;
  height: number;
}

const toPhoto = (r: PhotoRow): PhotoRecord => ({ id: r.id, correctionId: r.correction_id, requestId: r.request_id, kind: r.kind, storageKey: r.storage_key, width: r.width, height: r.height });

function toCorrection(row: CorrectionRow, photos: PhotoRecord[]): CorrectionRecord {
  return {
    id: row.id,
    itemId: row.line_item_id,
    outcome: row.outcome,
    reason: row.reason,
    workPerformed: row.work_performed,
    materials: row.materials,
    deviceMake: row.device_make,
    deviceModel: row.device_model,
    deviceLot: row.device_lot,
    labels: row.labels,
    readings: row.readings,
    siteVisitId: row.site_visit_id,
    siteVisitNumber: row.site_visit_number,
    isFirstVisit: row.first_visit,
    returnCause: row.return_cause,
    recordedByName: row.recorded_by_name,
    recordedAt: row.recorded_at,
    photos: photos.filter((p) => p.correctionId === row.id),
  };
}

export interface NewPhoto {
  kind: PhotoKind;
  storageKey: string;
  width: number;
  height: number;
  sizeBytes: number;
}

export class CorrectionRepository {
  constructor(private readonly db: Db) {}

  async listForRequest(requestId: number, trx?: Trx): Promise<CorrectionRecord[]> {
    const db = trx ?? this.db;
    const [rows, photos]: [CorrectionRow[], PhotoRow[]] = await Promise.all([
      db('item_corrections as c')
        .leftJoin('site_visits as v', 'v.id', 'c.site_visit_id')
        .leftJoin('users as u', 'u.id', 'c.recorded_by')
        .where('c.request_id', requestId)
        .select('c.*', 'v.number as site_visit_number', 'u.name as recorded_by_name')
        .orderBy('c.line_item_id'),
      db('correction_photos').where({ request_id: requestId }).orderBy('id'),
    ]);
    const photoRecords = photos.map(toPhoto);
    return rows.map((r) => toCorrection(r, photoRecords));
  }

  /**
   * Stores the item's correction record, replacing an earlier one (an item taken back for rework is
   * recorded afresh, and that counts as not finished on the first visit); returns its id.
   */
  async save(requestId: number, itemId: number, record: RecordCorrectionParsed, recordedBy: number, trx: Trx): Promise<number> {
    const earlier: { return_cause: ReturnCause | null } | undefined = await trx('item_corrections').where({ line_item_id: itemId }).first('return_cause');
    const isFirstVisit = !earlier && record.outcome === 'corrected' && record.finishedOnFirstVisit;
    const returnCause = isFirstVisit ? null : (record.returnCause ?? earlier?.return_cause ?? 'rework-after-review');
    await trx('item_corrections').where({ line_item_id: itemId }).delete();
    const [row] = await trx('item_corrections')
      .insert({
        line_item_id: itemId,
        request_id: requestId,
        site_visit_id: record.siteVisitId,
        outcome: record.outcome,
        reason: record.reason,
        work_performed: record.workPerformed,
        materials: record.materials,
        device_make: record.deviceMake,
        device_model: record.deviceModel,
        device_lot: record.deviceLot,
        labels: record.labels,
        readings: JSON.stringify(record.readings),
        first_visit: isFirstVisit,
        return_cause: record.outcome === 'declined-on-site' && !earlier ? record.returnCause : returnCause,
        recorded_by: recordedBy,
      })
      .returning('id');
    return row.id;
  }

  async addPhotos(requestId: number, correctionId: number, photos: readonly NewPhoto[], trx: Trx): Promise<void> {
    if (!photos.length) return;
    await trx('correction_photos').insert(
      photos.map((p) => ({ correction_id: correctionId, request_id: requestId, kind: p.kind, storage_key: p.storageKey, width: p.width, height: p.height, size_bytes: p.sizeBytes })),
    );
  }

  async findPhoto(requestId: number, photoId: number): Promise<PhotoRecord | null> {
    const row: PhotoRow | undefined = await this.db('correction_photos').where({ request_id: requestId, id: photoId }).first();
    return row ? toPhoto(row) : null;
  }
}

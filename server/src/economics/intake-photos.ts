import { createHash } from 'node:crypto';
import { actorsOnRequest, mayAct, MAX_INTAKE_PHOTOS, type CurrentUser, type IntakePhoto, type VisitPrep } from '@cc/shared';
import { assertMayAct } from '../work/request-actors';
import type { Db } from '../db/knex';
import { ConflictError, NotFoundError, ValidationError } from '../errors';
import type { FileStorage } from '../integrations/storage/file-storage';
import { StagedFiles } from '../integrations/storage/staged-files';
import { cleanPhoto } from '../corrections/photo-image';
import type { RequestsService } from '../requests/requests.service';

interface PhotoRow {
  id: number;
  line_item_id: number | null;
  caption: string;
  storage_key: string;
  width: number;
  height: number;
  uploaded_by_name: string | null;
}

const toDto = (requestId: number, r: PhotoRow): IntakePhoto => ({
  id: r.id,
  itemId: r.line_item_id,
  caption: r.caption,
  width: r.width,
  height: r.height,
  uploadedByName: r.uploaded_by_name,
  url: `/api/requests/${requestId}/intake-photos/${r.id}`,
});

/** Photos the agent or the seller attach at intake, and the visit screen's preparation (photos and the report's evidence). */
export class IntakePhotosService {
  constructor(
    private readonly db: Db,
    private readonly access: RequestsService,
    private readonly storage: FileStorage,
  ) {}

  private rows(requestId: number) {
    return this.db('intake_photos as p')
      .leftJoin('users as u', 'u.id', 'p.uploaded_by')
      .where('p.request_id', requestId)
      .select('p.id', 'p.line_item_id', 'p.caption', 'p.storage_key', 'p.width', 'p.height', 'u.name as uploaded_by_name')
      .orderBy('p.id');
  }

  async prep(user: CurrentUser, requestId: number): Promise<VisitPrep> {
    const request = await this.access.get(user, requestId);
    const photos: PhotoRow[] = await this.rows(requestId);
    const items: { id: number; evidence: string | null; page: number | null }[] = await this.db('line_items')
      .where({ request_id: requestId })
      .whereNot('status', 'removed')
      .select('id', 'evidence', 'page')
      .orderBy('id');
    return {
      photos: photos.map((p) => toDto(requestId, p)),
      evidence: items.filter((i) => i.evidence).map((i) => ({ itemId: i.id, evidence: i.evidence!, page: i.page })),
      canAddPhotos: mayAct(actorsOnRequest(user, request), 'add-intake-photo', request.status),
    };
  }

  async add(user: CurrentUser, requestId: number, input: { itemId?: number; caption: string }, uploads: readonly Buffer[]): Promise<IntakePhoto[]> {
    const request = await this.access.get(user, requestId);
    assertMayAct(actorsOnRequest(user, request), 'add-intake-photo', request.status, 'Adding photos for the electrician');
    if (!uploads.length) throw new ValidationError('Attach a photo', [{ path: 'photo', message: 'Choose a photo' }]);
    const cleaned: { data: Buffer; width: number; height: number; key: string }[] = [];
    for (const [i, bytes] of uploads.entries()) {
      const clean = await cleanPhoto(bytes, `photo.${i}`);
      cleaned.push({ ...clean, key: `intake-${createHash('sha256').update(clean.data).digest('hex')}.jpg` });
    }
    await StagedFiles.around(this.storage, (files) =>
      this.db.transaction(async (trx) => {
        await trx('repair_requests').where({ id: requestId }).forUpdate().first('id');
        const { count } = (await trx('intake_photos').where({ request_id: requestId }).count('* as count').first()) as { count: string };
        if (Number(count) + cleaned.length > MAX_INTAKE_PHOTOS) throw new ConflictError(`A request keeps at most ${MAX_INTAKE_PHOTOS} intake photos`);
        if (input.itemId !== undefined && !(await trx('line_items').where({ id: input.itemId, request_id: requestId }).first('id'))) {
          throw new ValidationError('No such item on this request', [{ path: 'itemId', message: 'Choose an item of this request' }]);
        }
        for (const c of cleaned) {
          await files.stage(c.key, c.data);
          await trx('intake_photos').insert({ request_id: requestId, line_item_id: input.itemId ?? null, caption: input.caption, storage_key: c.key, width: c.width, height: c.height, size_bytes: c.data.length, uploaded_by: user.id });
        }
      }),
    );
    return (await this.prep(user, requestId)).photos;
  }

  async photo(user: CurrentUser, requestId: number, photoId: number): Promise<Buffer> {
    await this.access.get(user, requestId);
    const row: { storage_key: string } | undefined = await this.db('intake_photos').where({ request_id: requestId, id: photoId }).first('storage_key');
    if (!row) throw new NotFoundError('No such photo');
    return this.storage.get(row.storage_key);
  }
}

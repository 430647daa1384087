import { Router, type Request } from 'express';
import multer from 'multer';
import { MAX_PHOTO_BYTES, MAX_PHOTOS_PER_KIND, PHOTO_KINDS, RecordCorrectionSchema } from '@cc/shared';
import type { RouterDeps } from '../http/router-deps';
import { requireUser, userOf } from '../http/require-user';
import { idParam } from '../http/params';
import { ValidationError } from '../errors';
import type { UploadedPhoto } from './corrections.service';

const MAX_RECORD_CHARS = 20_000;

/** The `record` field of the multipart form: the correction as JSON. */
function recordOf(req: Request) {
  const raw: unknown = req.body?.record;
  if (typeof raw !== 'string' || raw.length > MAX_RECORD_CHARS) throw new ValidationError('Send the correction record', [{ path: 'record', message: 'The record is missing or too long' }]);
  let json: unknown;
  try {
    json = JSON.parse(raw);
  } catch {
    throw new ValidationError('The correction record is not valid JSON', [{ path: 'record', message: 'Not valid JSON' }]);
  }
  return RecordCorrectionSchema.parse(json);
}

function photosOf(req: Request): UploadedPhoto[] {
  const files = (req.files ?? {}) as Record<string, Express.Multer.File[]>;
  return PHOTO_KINDS.flatMap((kind) => (files[kind] ?? []).map((f) => ({ kind, buffer: f.buffer })));
}

/** Correction records and their photos: /api/requests/:id/items/:itemId/correction, /api/requests/:id/photos/:photoId */
export function createCorrectionsRouter({ services }: RouterDeps): Router {
  const { corrections } = services;
  const router = Router({ mergeParams: true });
  // Photos stay in memory until they are checked and cleaned; nothing reaches the disk before that.
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: MAX_PHOTO_BYTES, files: 2 * MAX_PHOTOS_PER_KIND, fields: 2, fieldSize: MAX_RECORD_CHARS + 1 },
  }).fields(PHOTO_KINDS.map((name) => ({ name, maxCount: MAX_PHOTOS_PER_KIND })));
  router.use(requireUser);

  router.post('/items/:itemId/correction', upload, async (req, res) => {
    const record = recordOf(req);
    res.status(201).json(await corrections.record(userOf(req), idParam(req), idParam(req, 'itemId'), record, photosOf(req)));
  });

  router.get('/photos/:photoId', async (req, res) => {
    const photo = await corrections.photo(userOf(req), idParam(req), idParam(req, 'photoId'));
    res.type('image/jpeg').set('Cache-Control', 'private, max-age=3600').send(photo);
  });

  return router;
}

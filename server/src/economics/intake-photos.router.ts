import { Router } from 'express';
import multer from 'multer';
import { IntakePhotoFieldsSchema, MAX_INTAKE_PHOTOS, MAX_PHOTO_BYTES } from '@cc/shared';
import type { RouterDeps } from '../http/router-deps';
import { requireUser, userOf } from '../http/require-user';
import { idParam } from '../http/params';

/** Intake photos and the visit screen's preparation: /api/requests/:id/intake-photos, /api/requests/:id/visit-prep */
export function createIntakePhotosRouter({ services }: RouterDeps): Router {
  const { intakePhotos } = services;
  const router = Router({ mergeParams: true });
  // Kept in memory until checked and re-encoded; nothing reaches the disk before that.
  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: MAX_PHOTO_BYTES, files: MAX_INTAKE_PHOTOS, fields: 2, fieldSize: 1_000 } }).array('photo', MAX_INTAKE_PHOTOS);
  router.use(requireUser);

  router.get('/visit-prep', async (req, res) => {
    res.json(await intakePhotos.prep(userOf(req), idParam(req)));
  });

  router.post('/intake-photos', upload, async (req, res) => {
    const fields = IntakePhotoFieldsSchema.parse(req.body ?? {});
    const files = (req.files ?? []) as Express.Multer.File[];
    res.status(201).json(await intakePhotos.add(userOf(req), idParam(req), fields, files.map((f) => f.buffer)));
  });

  router.get('/intake-photos/:photoId', async (req, res) => {
    const photo = await intakePhotos.photo(userOf(req), idParam(req), idParam(req, 'photoId'));
    res.type('image/jpeg').set('Cache-Control', 'private, max-age=3600').send(photo);
  });

  return router;
}

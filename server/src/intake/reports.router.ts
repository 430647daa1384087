import { Router } from 'express';
import multer from 'multer';
import { MAX_REPORT_BYTES, PasteReportSchema } from '@cc/shared';
import type { RouterDeps } from '../http/router-deps';
import { requireUser, userOf } from '../http/require-user';
import { ValidationError } from '../errors';
import { idParam } from '../http/params';

/** Report excerpts of one request: /api/requests/:id/reports */
export function createReportsRouter({ services }: RouterDeps): Router {
  const { reportIntake } = services;
  const router = Router({ mergeParams: true });
  // Uploads stay in memory until they are checked; nothing reaches the disk before that.
  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: MAX_REPORT_BYTES, files: 1, fields: 4 } });
  router.use(requireUser);

  router.get('/', async (req, res) => {
    res.json(await reportIntake.list(userOf(req), idParam(req)));
  });

  router.post('/', upload.single('file'), async (req, res) => {
    const requestId = idParam(req);
    if (!req.file) throw new ValidationError('Choose a file to upload', [{ path: 'file', message: 'Choose a PDF or text file' }]);
    const result = await reportIntake.uploadFile(userOf(req), requestId, {
      buffer: req.file.buffer,
      originalName: Buffer.from(req.file.originalname, 'latin1').toString('utf8'),
      declaredType: req.file.mimetype,
    });
    res.status(result.isDuplicate ? 200 : 201).json(result);
  });

  router.post('/paste', async (req, res) => {
    const requestId = idParam(req);
    const { text, name } = PasteReportSchema.parse(req.body);
    const result = await reportIntake.paste(userOf(req), requestId, text, name);
    res.status(result.isDuplicate ? 200 : 201).json(result);
  });

  router.post('/:reportId/reparse', async (req, res) => {
    res.json(await reportIntake.reparse(userOf(req), idParam(req), idParam(req, 'reportId')));
  });

  return router;
}

import { Router, type Request } from 'express';
import multer from 'multer';
import { IssueLetterSchema, ProofReviewSchema } from '@cc/shared';
import type { RouterDeps } from '../http/router-deps';
import { requireUser, userOf } from '../http/require-user';
import { idParam } from '../http/params';
import { NotFoundError, ValidationError } from '../errors';

/** Largest PDF the verification page takes (letters with photo thumbnails stay well under it). */
const MAX_CHECKED_PDF_BYTES = 20 * 1024 * 1024;

function revisionParam(req: Request): number {
  const raw = req.params.revision;
  const revision = typeof raw === 'string' && /^\d{1,4}$/.test(raw) ? Number(raw) : 0;
  if (revision < 1) throw new NotFoundError('No such letter revision');
  return revision;
}

/** Completion letters of one request: /api/requests/:id/letters, and the review: /api/requests/:id/proof-review */
export function createLettersRouter({ services }: RouterDeps): Router {
  const { letters } = services;
  const router = Router({ mergeParams: true });
  router.use(requireUser);

  router.get('/letters', async (req, res) => {
    res.json(await letters.list(userOf(req), idParam(req)));
  });

  router.post('/letters', async (req, res) => {
    res.status(201).json(await letters.issue(userOf(req), idParam(req), IssueLetterSchema.parse(req.body ?? {})));
  });

  router.get('/letters/:revision.pdf', async (req, res) => {
    const { fileName, pdf } = await letters.pdf(userOf(req), idParam(req), revisionParam(req));
    res.type('application/pdf').attachment(fileName).send(pdf);
  });

  router.post('/proof-review', async (req, res) => {
    await letters.review(userOf(req), idParam(req), ProofReviewSchema.parse(req.body ?? {}));
    res.status(204).end();
  });

  return router;
}

/** The public verification of letters (no sign-in, no personal data): /api/verify */
export function createVerificationRouter({ services }: RouterDeps): Router {
  const { letters } = services;
  const router = Router();
  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: MAX_CHECKED_PDF_BYTES, files: 1, fields: 1, fieldSize: 100 } });

  router.get('/:code', async (req, res) => {
    res.json(await letters.verify(String(req.params.code).toUpperCase()));
  });

  router.post('/', upload.single('file'), async (req, res) => {
    if (!req.file) throw new ValidationError('Choose the letter’s PDF file', [{ path: 'file', message: 'Choose a PDF file' }]);
    const code = typeof req.body?.code === 'string' && req.body.code.trim() ? req.body.code.trim().toUpperCase() : null;
    res.json(await letters.checkPdf(req.file.buffer, code));
  });

  return router;
}

import express, { Router } from 'express';
import multer from 'multer';
import { z } from 'zod';
import {
  CreateRateBookEntrySchema,
  CreateSiteAdderSchema,
  MAX_RATE_BOOK_CSV_BYTES,
  PageQuerySchema,
  UpdateRateBookEntrySchema,
  UpdateRateBookTermsSchema,
  UpdateSiteAdderSchema,
} from '@cc/shared';
import type { RouterDeps } from '../http/router-deps';
import { requireRole, requireUser, userOf } from '../http/require-user';
import { ValidationError } from '../errors';
import { idParam } from '../http/params';

const VersionQuerySchema = z.object({ version: z.coerce.number().int().min(1) });
const CsvJsonBodySchema = z.object({ csv: z.string().min(1, 'Paste the CSV text') });

/** The signed-in contractor organisation's rate book: /api/rate-book */
export function createRateBookRouter({ services }: RouterDeps): Router {
  const { rateBook } = services;
  const router = Router();
  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: MAX_RATE_BOOK_CSV_BYTES, files: 1, fields: 2 } });
  const csvText = express.text({ type: ['text/csv', 'text/plain'], limit: MAX_RATE_BOOK_CSV_BYTES });
  router.use(requireUser, requireRole('contractor'));

  router.get('/', async (req, res) => {
    res.json(await rateBook.get(userOf(req)));
  });

  router.get('/terms', async (req, res) => {
    res.json(await rateBook.getTerms(userOf(req)));
  });

  router.put('/terms', async (req, res) => {
    const { version, terms } = UpdateRateBookTermsSchema.parse(req.body);
    res.json(await rateBook.saveTerms(userOf(req), version, terms));
  });

  router.get('/changes', async (req, res) => {
    const { page, pageSize } = PageQuerySchema.parse(req.query);
    res.json(await rateBook.changes(userOf(req), page, pageSize));
  });

  router.get('/entries.csv', async (req, res) => {
    const csv = await rateBook.exportCsv(userOf(req));
    res.type('text/csv').attachment('rate-book-entries.csv').send(csv);
  });

  router.post('/entries/import', csvText, upload.single('file'), async (req, res) => {
    let text: string | null = null;
    if (req.file) text = req.file.buffer.toString('utf8');
    else if (typeof req.body === 'string') text = req.body;
    else if (req.body && typeof req.body === 'object' && Object.keys(req.body).length) text = CsvJsonBodySchema.parse(req.body).csv;
    if (!text) throw new ValidationError('Send the CSV file', [{ path: 'file', message: 'Choose a CSV file of rate-book entries' }]);
    res.json(await rateBook.importCsv(userOf(req), text));
  });

  router.get('/entries', async (req, res) => {
    res.json(await rateBook.listEntries(userOf(req)));
  });

  router.post('/entries', async (req, res) => {
    res.status(201).json(await rateBook.createEntry(userOf(req), CreateRateBookEntrySchema.parse(req.body)));
  });

  router.get('/entries/:entryId', async (req, res) => {
    res.json(await rateBook.getEntry(userOf(req), idParam(req, 'entryId')));
  });

  router.patch('/entries/:entryId', async (req, res) => {
    res.json(await rateBook.updateEntry(userOf(req), idParam(req, 'entryId'), UpdateRateBookEntrySchema.parse(req.body)));
  });

  router.delete('/entries/:entryId', async (req, res) => {
    await rateBook.deleteEntry(userOf(req), idParam(req, 'entryId'), VersionQuerySchema.parse(req.query).version);
    res.status(204).end();
  });

  router.get('/adders', async (req, res) => {
    res.json(await rateBook.listAdders(userOf(req)));
  });

  router.post('/adders', async (req, res) => {
    res.status(201).json(await rateBook.createAdder(userOf(req), CreateSiteAdderSchema.parse(req.body)));
  });

  router.patch('/adders/:adderId', async (req, res) => {
    res.json(await rateBook.updateAdder(userOf(req), idParam(req, 'adderId'), UpdateSiteAdderSchema.parse(req.body)));
  });

  router.delete('/adders/:adderId', async (req, res) => {
    await rateBook.deleteAdder(userOf(req), idParam(req, 'adderId'), VersionQuerySchema.parse(req.query).version);
    res.status(204).end();
  });

  return router;
}

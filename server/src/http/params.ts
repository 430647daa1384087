import type { Request } from 'express';
import { NotFoundError } from '../errors';

/** A positive integer route parameter; anything else names no record, so 404. */
export function idParam(req: Request, name = 'id'): number {
  const raw = req.params[name];
  const id = typeof raw === 'string' && /^\d{1,9}$/.test(raw) ? Number(raw) : NaN;
  if (!Number.isSafeInteger(id) || id <= 0) throw new NotFoundError('No such record');
  return id;
}

import type { ErrorRequestHandler, RequestHandler } from 'express';
import { MulterError } from 'multer';
import { ZodError } from 'zod';
import type { ApiError } from '@cc/shared';
import {
  ConflictError,
  DomainError,
  ForbiddenError,
  NotFoundError,
  TooLargeError,
  UnauthenticatedError,
  UnprocessableError,
  UnsupportedTypeError,
  ValidationError,
} from '../errors';

const STATUS_BY_ERROR: [new (...args: never[]) => DomainError, number][] = [
  [ValidationError, 400],
  [UnauthenticatedError, 401],
  [ForbiddenError, 403],
  [NotFoundError, 404],
  [ConflictError, 409],
  [TooLargeError, 413],
  [UnsupportedTypeError, 415],
  [UnprocessableError, 422],
];

function toApiError(err: unknown): { status: number; body: ApiError } {
  if (err instanceof ZodError) {
    return {
      status: 400,
      body: {
        error: 'Some fields need attention',
        details: err.issues.map((i) => ({ path: i.path.map(String).join('.'), message: i.message })),
      },
    };
  }
  if (err instanceof DomainError) {
    const status = STATUS_BY_ERROR.find(([type]) => err instanceof type)?.[1] ?? 500;
    return { status, body: { error: err.message, details: err.details } };
  }
  if (err instanceof MulterError) {
    const status = err.code === 'LIMIT_FILE_SIZE' ? 413 : 400;
    const message = err.code === 'LIMIT_FILE_SIZE' ? 'The file is larger than allowed' : err.message;
    return { status, body: { error: message, details: err.field ? [{ path: err.field, message }] : [] } };
  }
  const status = typeof (err as { status?: unknown })?.status === 'number' ? (err as { status: number }).status : 500;
  if (status >= 400 && status < 500) {
    // Errors raised by body parsers and other middleware (bad JSON, CSRF, payload too large).
    return { status, body: { error: (err as Error).message || 'Bad request', details: [] } };
  }
  return { status: 500, body: { error: 'Something went wrong on our side', details: [] } };
}

/** The one place that turns errors into `{error, details}` responses. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  const { status, body } = toApiError(err);
  if (status >= 500) console.error(`${req.method} ${req.originalUrl} failed:`, err);
  res.status(status).json(body);
};

/** JSON 404 for any /api route that matched nothing. */
export const apiNotFound: RequestHandler = (_req, res) => {
  res.status(404).json({ error: 'No such endpoint', details: [] } satisfies ApiError);
};

import type { RequestHandler } from 'express';
import { findInputProblem } from '@cc/shared';
import { ValidationError } from '../errors';

/**
 * Refuses, before any route runs, a path, query or JSON body holding a NUL character (PostgreSQL
 * text cannot store one) or nested deeper than any form sends. Field rules stay in the shared
 * schemas; this catches the same problems in places no schema names, with the same answer.
 */
export const inputGuard: RequestHandler = (req, _res, next) => {
  let path: string;
  try {
    path = decodeURIComponent(req.path);
  } catch {
    throw new ValidationError('The address is not valid', [{ path: 'path', message: 'The address holds a broken %-escape' }]);
  }
  const sources: [string, unknown][] = [
    ['path', path],
    ['query', req.query],
    ['body', req.body],
  ];
  for (const [where, value] of sources) {
    const problem = findInputProblem(value);
    if (problem) {
      const at = where === 'body' ? problem.path : [where, problem.path].filter(Boolean).join('.');
      throw new ValidationError(problem.message, [{ path: at, message: problem.message }]);
    }
  }
  next();
};

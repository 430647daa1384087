import type { Request, RequestHandler } from 'express';
import type { CurrentUser, Role } from '@cc/shared';
import '../auth/session-user';
import { ForbiddenError, UnauthenticatedError } from '../errors';

/** Lets only signed-in users through. */
export const requireUser: RequestHandler = (req, _res, next) => {
  if (!req.user) throw new UnauthenticatedError('Please sign in');
  next();
};

/** Lets only users with one of `roles` through (after requireUser). */
export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) throw new UnauthenticatedError('Please sign in');
    if (!roles.includes(req.user.role)) throw new ForbiddenError('Your role cannot do this');
    next();
  };
}

/** The signed-in user of a request that passed requireUser. */
export function userOf(req: Request): CurrentUser {
  if (!req.user) throw new UnauthenticatedError('Please sign in');
  return req.user;
}

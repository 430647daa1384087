import type { Request, RequestHandler } from 'express';
import rateLimit, { ipKeyGenerator } from 'express-rate-limit';
import type { ApiError } from '@cc/shared';
import type { Config } from '../config/config';
import type { Db } from '../db/knex';
import { PgRateLimitStore } from './pg-rate-limit-store';

/** The answer every limiter gives; it says nothing about whether the account exists. */
function tooMany(what: string, windowMs: number): RequestHandler {
  return (_req, res) => {
    const minutes = Math.ceil(windowMs / 60_000);
    res.status(429).json({ error: `Too many ${what}. Try again in ${minutes} minutes.`, details: [] } satisfies ApiError);
  };
}

function limiter(db: Db, name: string, options: { windowMs: number; limit: number; what: string; keyGenerator: (req: Request) => string }): RequestHandler {
  return rateLimit({
    windowMs: options.windowMs,
    limit: options.limit,
    keyGenerator: options.keyGenerator,
    // Only failures count: a right password takes its attempt back.
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    store: new PgRateLimitStore(db, name),
    handler: tooMany(options.what, options.windowMs),
    // X-Forwarded-For is ignored on purpose unless TRUST_PROXY names the proxy; no warning for it.
    validate: { xForwardedForHeader: false },
  });
}

/** The e-mail a sign-in names, as the account key (lower case, trimmed); '' when none is given. */
function emailOf(req: Request): string {
  const email = (req.body as { email?: unknown } | undefined)?.email;
  return typeof email === 'string' ? email.trim().toLowerCase().slice(0, 254) : '';
}

/**
 * Sign-in limits: per client address (the socket's, or the one a configured proxy reports) and per
 * account, whatever address the attempts come from. Both count failed attempts in PostgreSQL.
 */
export function signInLimits(config: Config, db: Db): RequestHandler[] {
  return [
    limiter(db, 'sign-in-address', {
      windowMs: config.signInWindowMs,
      limit: config.signInLimit,
      what: 'sign-in attempts',
      keyGenerator: (req) => ipKeyGenerator(req.ip ?? 'unknown'),
    }),
    limiter(db, 'sign-in-account', {
      windowMs: config.signInWindowMs,
      limit: config.signInAccountLimit,
      what: 'sign-in attempts',
      keyGenerator: (req) => emailOf(req) || ipKeyGenerator(req.ip ?? 'unknown'),
    }),
  ];
}

/** Password changes: failed attempts per signed-in account (a stolen session cannot guess on). */
export function passwordChangeLimit(config: Config, db: Db): RequestHandler {
  return limiter(db, 'password-change', {
    windowMs: config.signInWindowMs,
    limit: config.passwordChangeLimit,
    what: 'password attempts',
    keyGenerator: (req) => `user-${req.user?.id ?? 'none'}`,
  });
}

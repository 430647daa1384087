import { Router, type Request } from 'express';
import rateLimit from 'express-rate-limit';
import { ChangePasswordSchema, SignInSchema, type ApiError, type CurrentUser, type Session } from '@cc/shared';
import type { RouterDeps } from '../http/router-deps';
import { requireUser, userOf } from '../http/require-user';
import { UnauthenticatedError } from '../errors';

/** Logs `user` in (passport regenerates the session) and issues the new session's CSRF token. */
export async function signInAs(req: Request, user: CurrentUser, deps: RouterDeps): Promise<Session> {
  await new Promise<void>((resolve, reject) => req.login(user, (err) => (err ? reject(err) : resolve())));
  return { user, csrfToken: deps.csrf.generateToken(req, true) };
}

export function createAuthRouter(deps: RouterDeps): Router {
  const { passport, services, config, csrf } = deps;
  const router = Router();

  const signInLimiter = rateLimit({
    windowMs: config.signInWindowMs,
    limit: config.signInLimit,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, res) => {
      const minutes = Math.ceil(config.signInWindowMs / 60_000);
      res.status(429).json({ error: `Too many sign-in attempts. Try again in ${minutes} minutes.`, details: [] } satisfies ApiError);
    },
  });

  router.get('/csrf', (req, res) => {
    res.json({ csrfToken: csrf.generateToken(req) });
  });

  router.post('/sign-in', signInLimiter, async (req, res, next) => {
    req.body = SignInSchema.parse(req.body);
    const user = await new Promise<Express.User | false>((resolve, reject) =>
      passport.authenticate('local', { session: false }, (err: unknown, found: Express.User | false) =>
        err ? reject(err) : resolve(found),
      )(req, res, next),
    );
    if (!user) throw new UnauthenticatedError('E-mail or password not recognised');
    res.json(await signInAs(req, user, deps));
  });

  router.post('/sign-out', requireUser, async (req, res) => {
    await new Promise<void>((resolve, reject) => req.logout((err) => (err ? reject(err) : resolve())));
    await new Promise<void>((resolve, reject) => req.session.destroy((err) => (err ? reject(err) : resolve())));
    res.clearCookie('cc.sid');
    res.status(204).end();
  });

  router.get('/me', requireUser, (req, res) => {
    res.json({ user: userOf(req), csrfToken: csrf.generateToken(req) } satisfies Session);
  });

  router.post('/password', requireUser, async (req, res) => {
    await services.auth.changePassword(userOf(req), ChangePasswordSchema.parse(req.body));
    res.status(204).end();
  });

  return router;
}

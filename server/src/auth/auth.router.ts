import { Router, type Request } from 'express';
import { ChangePasswordSchema, SignInSchema, type CurrentUser, type Session, type SessionState } from '@cc/shared';
import type { RouterDeps } from '../http/router-deps';
import { passwordChangeLimit, signInLimits } from '../http/rate-limits';
import { requireUser, userOf } from '../http/require-user';
import { UnauthenticatedError } from '../errors';

/** Logs `user` in (passport regenerates the session) and issues the new session's CSRF token. */
export async function signInAs(req: Request, user: CurrentUser, deps: RouterDeps): Promise<Session> {
  await new Promise<void>((resolve, reject) => req.login(user, (err) => (err ? reject(err) : resolve())));
  return { user, csrfToken: deps.csrf.generateToken(req, true) };
}

export function createAuthRouter(deps: RouterDeps): Router {
  const { passport, services, config, csrf, db } = deps;
  const router = Router();

  router.get('/csrf', (req, res) => {
    res.json({ csrfToken: csrf.generateToken(req) });
  });

  router.post('/sign-in', ...signInLimits(config, db), async (req, res, next) => {
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

  router.get('/session', (req, res) => {
    res.json({ user: req.user ?? null, csrfToken: csrf.generateToken(req) } satisfies SessionState);
  });

  router.get('/me', requireUser, (req, res) => {
    res.json({ user: userOf(req), csrfToken: csrf.generateToken(req) } satisfies Session);
  });

  router.post('/password', requireUser, passwordChangeLimit(config, db), async (req, res) => {
    await services.auth.changePassword(userOf(req), ChangePasswordSchema.parse(req.body), req.sessionID);
    res.status(204).end();
  });

  return router;
}

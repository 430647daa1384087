import type { Request } from 'express';
import { Passport } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { UserRepository } from './user.repository';
import type { AuthService } from './auth.service';
import { userReadWithSession } from './session-store';
import './session-user';

export type PassportInstance = InstanceType<typeof Passport>;

/** A passport instance of this app: e-mail + password sign-in, the user id kept in the session. */
export function createPassport(auth: AuthService, users: UserRepository): PassportInstance {
  const passport = new Passport();
  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, (email, password, done) => {
      auth.verifyCredentials({ email, password }).then((user) => done(null, user ?? false), done);
    }),
  );
  passport.serializeUser((user, done) => done(null, user.id));
  passport.deserializeUser((req: Request, id: number, done: (err: unknown, user?: Express.User | false) => void) => {
    // A deactivated account's session no longer finds its user: the person is signed out. The
    // session store read the active user with the session (one statement); read it here otherwise.
    const read = userReadWithSession((req.session as { passport?: unknown } | undefined)?.passport, id);
    if (read !== undefined) return done(null, read ?? false);
    users.findActiveById(id).then((user) => done(null, user ?? false), done);
  });
  return passport;
}

import { Passport } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { UserRepository } from './user.repository';
import type { AuthService } from './auth.service';
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
  passport.deserializeUser((id: number, done) => {
    users.findById(id).then((user) => done(null, user ?? false), done);
  });
  return passport;
}

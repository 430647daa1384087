import type { ChangePassword, CurrentUser, SignIn } from '@cc/shared';
import type { SessionRepository } from './session.repository';
import type { UserRepository } from './user.repository';
import { ValidationError } from '../errors';
import type { Passwords } from './passwords';
import type { SessionInvalidation } from './session-cache';

export class AuthService {
  /** A real hash to compare against when the e-mail is unknown, so both paths take the same time. */
  private unknownUserHash?: Promise<string>;

  constructor(
    private readonly users: UserRepository,
    private readonly passwords: Passwords,
    private readonly sessions: SessionRepository,
    /** This process's kept sessions: told of each change here at once (other processes by notice). */
    private readonly kept: SessionInvalidation,
  ) {}

  /**
   * The user for these credentials, or null. Unknown e-mail and wrong password cost the same: one
   * bcrypt comparison at the server's cost, and a hash made at another cost (older seeds, a changed
   * BCRYPT_ROUNDS) is made again at the server's cost on the next right password.
   */
  async verifyCredentials({ email, password }: SignIn): Promise<CurrentUser | null> {
    const user = await this.users.findByEmail(email);
    const hash = user ? await this.users.passwordHashOf(user.id) : null;
    this.unknownUserHash ??= this.passwords.hash('no account has this password');
    const isValid = await this.passwords.verify(password, hash ?? (await this.unknownUserHash));
    if (!user || !hash || !isValid) return null;
    if (this.passwords.needsRehash(hash)) {
      await this.users.setPasswordHash(user.id, await this.passwords.hash(password));
      this.kept.forgetUser(user.id);
    }
    return user;
  }

  /** Changes the password and ends the user's other sessions (the one that asked, `sessionId`, stays). */
  async changePassword(user: CurrentUser, input: ChangePassword, sessionId: string): Promise<void> {
    const hash = await this.users.passwordHashOf(user.id);
    if (!hash || !(await this.passwords.verify(input.currentPassword, hash))) {
      throw new ValidationError('Your current password is not right', [
        { path: 'currentPassword', message: 'This is not your current password' },
      ]);
    }
    try {
      await this.users.setPasswordHash(user.id, await this.passwords.hash(input.newPassword));
      await this.sessions.endOthers(user.id, sessionId);
    } finally {
      // After the writes, before the answer: the very next request of any other session reads again.
      this.kept.forgetUser(user.id);
    }
  }
}

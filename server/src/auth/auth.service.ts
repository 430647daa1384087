import type { ChangePassword, CurrentUser, SignIn } from '@cc/shared';
import type { UserRepository } from './user.repository';
import { ValidationError } from '../errors';
import type { Passwords } from './passwords';

export class AuthService {
  /** A real hash to compare against when the e-mail is unknown, so both paths take the same time. */
  private unknownUserHash?: Promise<string>;

  constructor(
    private readonly users: UserRepository,
    private readonly passwords: Passwords,
  ) {}

  /** The user for these credentials, or null. */
  async verifyCredentials({ email, password }: SignIn): Promise<CurrentUser | null> {
    const user = await this.users.findByEmail(email);
    const hash = user ? await this.users.passwordHashOf(user.id) : null;
    this.unknownUserHash ??= this.passwords.hash('no account has this password');
    const isValid = await this.passwords.verify(password, hash ?? (await this.unknownUserHash));
    return user && hash && isValid ? user : null;
  }

  async changePassword(user: CurrentUser, input: ChangePassword): Promise<void> {
    const hash = await this.users.passwordHashOf(user.id);
    if (!hash || !(await this.passwords.verify(input.currentPassword, hash))) {
      throw new ValidationError('Your current password is not right', [
        { path: 'currentPassword', message: 'This is not your current password' },
      ]);
    }
    await this.users.setPasswordHash(user.id, await this.passwords.hash(input.newPassword));
  }
}

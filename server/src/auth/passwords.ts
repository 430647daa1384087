import bcrypt from 'bcryptjs';

/** Password hashing in one place (bcrypt; the cost comes from configuration). */
export class Passwords {
  constructor(private readonly rounds: number) {}

  hash(password: string): Promise<string> {
    return bcrypt.hash(password, this.rounds);
  }

  verify(password: string, hash: string): Promise<boolean> {
    return bcrypt.compare(password, hash);
  }
}

import { randomBytes } from 'node:crypto';
import type { CreateOrganisation, CreateUser, CurrentUser, Organisation, Page, PasswordReset, UpdateUser, User } from '@cc/shared';
import type { Db } from '../db/knex';
import type { OrganisationRepository } from '../organisations/organisation.repository';
import type { UserRepository } from '../auth/user.repository';
import { ConflictError, NotFoundError, ValidationError } from '../errors';
import type { Passwords } from '../auth/passwords';
import type { SessionInvalidation } from '../auth/session-cache';

/** Which organisation kinds each role may belong to (null: none needed). */
const ORGANISATION_KIND_FOR_ROLE: Record<CreateUser['role'], Organisation['kind'] | null> = {
  agent: 'brokerage',
  contractor: 'contractor',
  inspector: 'inspection-company',
  seller: null,
  admin: 'platform',
};

export class AdminService {
  constructor(
    private readonly users: UserRepository,
    private readonly organisations: OrganisationRepository,
    private readonly passwords: Passwords,
    private readonly db: Db,
    /** This process's kept sessions: told of each account change here once it is written. */
    private readonly kept: SessionInvalidation,
  ) {}

  listOrganisations(page: number, pageSize: number): Promise<Page<Organisation>> {
    return this.organisations.list(page, pageSize);
  }

  createOrganisation(input: CreateOrganisation): Promise<Organisation> {
    return this.organisations.create(input);
  }

  listUsers(page: number, pageSize: number): Promise<Page<User>> {
    return this.users.list(page, pageSize);
  }

  async createUser(input: CreateUser): Promise<CurrentUser> {
    if (await this.users.findByEmail(input.email)) {
      throw new ValidationError('That e-mail is taken', [{ path: 'email', message: 'An account with this e-mail exists already' }]);
    }
    await this.checkOrganisation(input.role, input.organisationId);
    return this.users.create({
      email: input.email,
      name: input.name,
      role: input.role,
      organisationId: input.organisationId,
      passwordHash: await this.passwords.hash(input.password),
    });
  }

  /** The organisation must exist and be of the kind the role belongs to (contractors need one). */
  private async checkOrganisation(role: CreateUser['role'], organisationId: number | null): Promise<void> {
    const expectedKind = ORGANISATION_KIND_FOR_ROLE[role];
    if (organisationId !== null) {
      const org = await this.organisations.findById(organisationId);
      if (!org) throw new ValidationError('No such organisation', [{ path: 'organisationId', message: 'Choose an existing organisation' }]);
      if (expectedKind && org.kind !== expectedKind) {
        throw new ValidationError('Organisation does not fit the role', [
          { path: 'organisationId', message: `A ${role} belongs to an organisation of kind ${expectedKind}` },
        ]);
      }
    } else if (role === 'contractor') {
      throw new ValidationError('A contractor needs an organisation', [
        { path: 'organisationId', message: 'Choose the contractor organisation this person works for' },
      ]);
    }
  }

  private async account(id: number): Promise<User> {
    const user = await this.users.findUserById(id);
    if (!user) throw new NotFoundError('No such account');
    return user;
  }

  async updateUser(id: number, input: UpdateUser): Promise<User> {
    const user = await this.account(id);
    const owner = await this.users.findByEmail(input.email);
    if (owner && owner.id !== id) {
      throw new ValidationError('That e-mail is taken', [{ path: 'email', message: 'An account with this e-mail exists already' }]);
    }
    await this.checkOrganisation(user.role, input.organisationId);
    try {
      await this.users.update(id, input);
    } finally {
      this.kept.forgetUser(id);
    }
    return this.account(id);
  }

  /** Deactivating stops sign-in and ends every session of the account at once. */
  async setUserActive(admin: CurrentUser, id: number, isActive: boolean): Promise<User> {
    await this.account(id);
    if (admin.id === id && !isActive) throw new ConflictError('You cannot deactivate your own account');
    try {
      await this.db.transaction(async (trx) => {
        await this.users.setActive(id, isActive, trx);
        if (!isActive) await this.users.endSessions(id, trx);
      });
    } finally {
      this.kept.forgetUser(id);
    }
    return this.account(id);
  }

  /** A new temporary password, answered once; the person's sessions end (no e-mail is sent yet). */
  async resetPassword(id: number): Promise<PasswordReset> {
    const user = await this.account(id);
    if (!user.isActive) throw new ConflictError('Reactivate the account before resetting its password');
    const temporaryPassword = temporaryPasswordText();
    const hash = await this.passwords.hash(temporaryPassword);
    try {
      await this.db.transaction(async (trx) => {
        await this.users.setPasswordHash(id, hash, trx);
        await this.users.endSessions(id, trx);
      });
    } finally {
      this.kept.forgetUser(id);
    }
    return { temporaryPassword };
  }

  /** Name, contact and licence change; the kind stays (its people's roles depend on it). */
  async updateOrganisation(id: number, input: CreateOrganisation): Promise<Organisation> {
    const org = await this.organisations.findById(id);
    if (!org) throw new NotFoundError('No such organisation');
    if (input.kind !== org.kind) {
      throw new ValidationError('The kind of an organisation cannot change', [{ path: 'kind', message: 'The kind stays as it was: add a new organisation for another kind' }]);
    }
    try {
      return (await this.organisations.update(id, input))!;
    } finally {
      // Its name is part of its people's signed-in user.
      this.kept.forgetOrganisation(id);
    }
  }
}

/** Four groups of four letters and digits that are easy to read aloud (no 0/O, 1/l/I): 80 bits. */
function temporaryPasswordText(): string {
  const alphabet = 'abcdefghjkmnpqrstuvwxyz23456789';
  const bytes = randomBytes(16);
  const chars = [...bytes].map((b) => alphabet[b % alphabet.length]);
  return [0, 4, 8, 12].map((at) => chars.slice(at, at + 4).join('')).join('-');
}

import type { CreateOrganisation, CreateUser, CurrentUser, Organisation, Page, User } from '@cc/shared';
import type { OrganisationRepository } from '../organisations/organisation.repository';
import type { UserRepository } from '../auth/user.repository';
import { ValidationError } from '../errors';
import type { Passwords } from '../auth/passwords';

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
    const expectedKind = ORGANISATION_KIND_FOR_ROLE[input.role];
    if (input.organisationId !== null) {
      const org = await this.organisations.findById(input.organisationId);
      if (!org) throw new ValidationError('No such organisation', [{ path: 'organisationId', message: 'Choose an existing organisation' }]);
      if (expectedKind && org.kind !== expectedKind) {
        throw new ValidationError('Organisation does not fit the role', [
          { path: 'organisationId', message: `A ${input.role} belongs to an organisation of kind ${expectedKind}` },
        ]);
      }
    } else if (input.role === 'contractor') {
      throw new ValidationError('A contractor needs an organisation', [
        { path: 'organisationId', message: 'Choose the contractor organisation this person works for' },
      ]);
    }
    return this.users.create({
      email: input.email,
      name: input.name,
      role: input.role,
      organisationId: input.organisationId,
      passwordHash: await this.passwords.hash(input.password),
    });
  }
}

import type { Config } from '../config/config';
import type { Db } from '../db/knex';
import { OrganisationRepository } from '../db/organisation.repository';
import { RequestRepository } from '../db/request.repository';
import { UserRepository } from '../db/user.repository';
import { AdminService } from './admin.service';
import { AuthService } from './auth.service';
import { InvitationsService } from './invitations.service';
import { Passwords } from './passwords';
import { RequestsService } from './requests.service';

/** Builds every repository and service of the app from one database handle and the config. */
export function createServices(db: Db, config: Config) {
  const users = new UserRepository(db);
  const organisations = new OrganisationRepository(db);
  const requests = new RequestRepository(db);
  const passwords = new Passwords(config.bcryptRounds);
  return {
    repositories: { users, organisations, requests },
    auth: new AuthService(users, passwords),
    admin: new AdminService(users, organisations, passwords),
    requests: new RequestsService(db, requests, users, organisations, config.publicUrl),
    invitations: new InvitationsService(db, requests, users, passwords),
  };
}

export type Services = ReturnType<typeof createServices>;

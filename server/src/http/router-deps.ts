import type { csrfSync } from 'csrf-sync';
import type { PassportInstance } from '../auth/passport';
import type { Config } from '../config/config';
import type { Db } from '../db/knex';
import type { Services } from '../services';

/** What every feature router is built from. In its own file so routers and the API router don't import each other. */
export interface RouterDeps {
  config: Config;
  db: Db;
  services: Services;
  passport: PassportInstance;
  csrf: ReturnType<typeof csrfSync>;
}

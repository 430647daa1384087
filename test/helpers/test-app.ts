import type { Express } from 'express';
import { createApp, type AppOptions } from '../../server/src/app';
import type { SessionCache, SessionChangeListener } from '../../server/src/auth/session-cache';
import { loadConfig, type Config } from '../../server/src/config/config';
import { createDb, type Db } from '../../server/src/db/knex';
import type { Services } from '../../server/src/services';

export interface TestApp {
  app: Express;
  db: Db;
  config: Config;
  services: Services;
  sessionCache: SessionCache;
  sessionChanges: SessionChangeListener;
  close(): Promise<void>;
}

/** The real app on the test database (DATABASE_URL), with test settings overridable per file. */
export function createTestApp(overrides: NodeJS.ProcessEnv = {}, options: AppOptions = {}): TestApp {
  const config = loadConfig({
    NODE_ENV: 'test',
    SESSION_SECRET: 'test-secret-that-is-only-used-by-the-test-suite',
    BCRYPT_ROUNDS: '4',
    PUBLIC_URL: 'http://portal.test',
    PORTAL_DIST: '/nonexistent',
    // Each outcome's message at once; the gathering of outcomes is tested with its own setting.
    ITEM_MESSAGES_GATHER_MINUTES: '0',
    DATABASE_URL: process.env.DATABASE_URL,
    ...overrides,
  });
  const db = createDb(config.databaseUrl, 4);
  const { app, close, services, sessionCache, sessionChanges } = createApp(config, db, options);
  return {
    app,
    services,
    sessionCache,
    sessionChanges,
    db,
    config,
    async close() {
      await close();
      await db.destroy();
    },
  };
}

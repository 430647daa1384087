import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { csrfSync } from 'csrf-sync';
import express, { type Express } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import pg from 'pg';
import { createPassport } from './auth/passport';
import { createSessionStore } from './auth/session-store';
import type { Config } from './config/config';
import type { Db } from './db/knex';
import { apiNotFound, errorHandler } from './http/error-handler';
import { createApiRouter } from './api.router';
import { createServices, type Services } from './services';

export interface App {
  app: Express;
  services: Services;
  /** Closes what the app opened (session store pool). The caller owns `db`. */
  close(): Promise<void>;
}

/** Builds the Express app without listening, so tests can drive it with supertest. */
export function createApp(config: Config, db: Db): App {
  const services = createServices(db, config);
  const passport = createPassport(services.auth, services.repositories.users);
  const sessionPool = new pg.Pool({ connectionString: config.databaseUrl, max: 10 });
  const store = createSessionStore(sessionPool, { prune: config.env !== 'test' });
  const csrf = csrfSync({ getTokenFromRequest: (req) => req.headers['x-csrf-token'] as string | undefined });

  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          // Angular Material sets inline style attributes.
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'"],
          connectSrc: ["'self'"],
          frameAncestors: ["'none'"],
          formAction: ["'self'"],
        },
      },
    }),
  );
  app.use(express.json({ limit: '1mb' }));
  app.use(
    session({
      name: 'cc.sid',
      secret: config.sessionSecret,
      store,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: { httpOnly: true, sameSite: 'lax', secure: config.isCookieSecure, maxAge: 8 * 3600_000 },
    }),
  );
  app.use(passport.session());

  app.use('/api', createApiRouter({ config, db, services, passport, csrf }));
  app.use('/api', apiNotFound);

  const portal = resolve(config.portalDist);
  if (existsSync(join(portal, 'index.html'))) {
    app.use(express.static(portal, { index: false, maxAge: '1h' }));
    app.get('/*splat', (_req, res) => res.sendFile(join(portal, 'index.html')));
  }
  app.use(errorHandler);

  return {
    app,
    services,
    async close() {
      store.close();
      await sessionPool.end();
    },
  };
}

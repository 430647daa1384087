import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { csrfSync } from 'csrf-sync';
import express, { type Express } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import { createPassport } from './auth/passport';
import { createSessionStore } from './auth/session-store';
import { SESSION_CACHE_MS, SessionCache, SessionChangeListener } from './auth/session-cache';
import type { Config } from './config/config';
import type { Db } from './db/knex';
import { createReadPool } from './db/read-pool';
import { apiNotFound, errorHandler } from './http/error-handler';
import { inputGuard } from './http/input-guard';
import { createApiRouter } from './api.router';
import { createServices, type Services } from './services';
import { createPaymentWebhookRouter } from './payments/payment-webhook.router';

export interface App {
  app: Express;
  services: Services;
  /** Sessions and their users kept for a moment, and the listener that tells it of changes. */
  sessionCache: SessionCache;
  sessionChanges: SessionChangeListener;
  /** Closes what the app opened (the read pool of sessions and lists, the listener). The caller owns `db`. */
  close(): Promise<void>;
}

export interface AppOptions {
  /** How long a session is kept in the process (tests lengthen it to show that changes, not time, end it). */
  sessionCacheMs?: number;
}

/** Builds the Express app without listening, so tests can drive it with supertest. */
export function createApp(config: Config, db: Db, options: AppOptions = {}): App {
  // The session with its user and list pages run as prepared statements on their own connections.
  const readPool = createReadPool(config.databaseUrl);
  // Sessions and their users are kept a moment, only while a connection listens for their changes.
  const sessionCache = new SessionCache(options.sessionCacheMs ?? SESSION_CACHE_MS);
  const sessionChanges = new SessionChangeListener(config.databaseUrl, sessionCache);
  sessionChanges.start();
  const services = createServices(db, config, readPool, sessionCache);
  const passport = createPassport(services.auth, services.repositories.users);
  const store = createSessionStore(readPool, sessionCache, { prune: config.env !== 'test' });
  const csrf = csrfSync({ getTokenFromRequest: (req) => req.headers['x-csrf-token'] as string | undefined });

  const app = express();
  app.disable('x-powered-by');
  // No ETag on API answers: they are private and change with every move, the portal never asks
  // "if none match", and hashing each body cost a list request a SHA-1 of its whole answer.
  // (express.static keeps its own ETags for the portal's files.)
  app.set('etag', false);
  // The client address comes from X-Forwarded-For only behind a proxy the configuration names.
  app.set('trust proxy', config.trustProxy);
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
  // The payment service's events need the raw body for their signature: before the JSON parser and the session.
  app.use('/api/payments/webhook', createPaymentWebhookRouter(services));
  app.use(express.json({ limit: '1mb' }));
  app.use('/api', inputGuard);
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
    // '/{*splat}' also matches the root itself ('/*splat' does not), so the printed address opens the portal.
    app.get('/{*splat}', (_req, res) => res.sendFile(join(portal, 'index.html')));
  }
  app.use(errorHandler);

  return {
    app,
    services,
    sessionCache,
    sessionChanges,
    async close() {
      store.close();
      await Promise.all([sessionChanges.close(), readPool.end(), services.reportReader.close()]);
    },
  };
}

import { z } from 'zod';

/** Every setting the server reads, from environment variables, validated once at start-up. */
const EnvSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(4300),
  DATABASE_URL: z.string().regex(/^postgres(ql)?:\/\//, 'must be a postgres:// connection URL'),
  SESSION_SECRET: z.string().min(32, 'must be at least 32 characters (use a long random value)'),
  /** Base URL people reach the portal at; used in links inside invitations and e-mails. */
  PUBLIC_URL: z.url().optional(),
  /** Whether the session cookie is marked Secure (set when served over HTTPS). */
  COOKIE_SECURE: z
    .enum(['true', 'false'])
    .default('false')
    .transform((v) => v === 'true'),
  BCRYPT_ROUNDS: z.coerce.number().int().min(4).max(15).default(12),
  /** Sign-in attempts allowed per client address and window. */
  SIGN_IN_LIMIT: z.coerce.number().int().min(1).default(10),
  SIGN_IN_WINDOW_MINUTES: z.coerce.number().int().min(1).default(15),
  /** Folder where uploaded files are kept (the local storage adapter). */
  STORAGE_DIR: z.string().default('.data/files'),
  /** Folder of the built portal served as static files. */
  PORTAL_DIST: z.string().default('dist/portal/browser'),
  /** Approved items still open this many business days before closing flag the request as at risk. */
  AT_RISK_BUSINESS_DAYS: z.coerce.number().int().min(0).max(30).default(3),
});

export interface Config {
  env: 'development' | 'test' | 'production';
  host: string;
  port: number;
  databaseUrl: string;
  sessionSecret: string;
  publicUrl: string;
  isCookieSecure: boolean;
  bcryptRounds: number;
  signInLimit: number;
  signInWindowMs: number;
  portalDist: string;
  storageDir: string;
  atRiskBusinessDays: number;
}

/** Reads the environment; throws one readable message listing every bad or missing variable. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = EnvSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid configuration:\n${lines.join('\n')}`);
  }
  const e = parsed.data;
  return {
    env: e.NODE_ENV,
    host: e.HOST,
    port: e.PORT,
    databaseUrl: e.DATABASE_URL,
    sessionSecret: e.SESSION_SECRET,
    publicUrl: (e.PUBLIC_URL ?? `http://${e.HOST}:${e.PORT}`).replace(/\/$/, ''),
    isCookieSecure: e.COOKIE_SECURE,
    bcryptRounds: e.BCRYPT_ROUNDS,
    signInLimit: e.SIGN_IN_LIMIT,
    signInWindowMs: e.SIGN_IN_WINDOW_MINUTES * 60_000,
    portalDist: e.PORTAL_DIST,
    storageDir: e.STORAGE_DIR,
    atRiskBusinessDays: e.AT_RISK_BUSINESS_DAYS,
  };
}

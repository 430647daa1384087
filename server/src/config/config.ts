import { z } from 'zod';
import type { PaymentsConfig } from '../integrations/payments/payment-gateway';

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
  /** Sign-in attempts allowed per account (e-mail) and window, from any address. */
  SIGN_IN_ACCOUNT_LIMIT: z.coerce.number().int().min(1).default(10),
  /** Password-change attempts allowed per account and window. */
  PASSWORD_CHANGE_LIMIT: z.coerce.number().int().min(1).default(5),
  /**
   * Which proxies in front of the server to trust for the client address (X-Forwarded-For): unset
   * trusts none; a number of hops, or addresses/subnets as Express's "trust proxy" takes them.
   */
  TRUST_PROXY: z
    .string()
    .trim()
    .regex(/^(\d{1,2}|[0-9a-fA-F.:/, ]+|loopback|linklocal|uniquelocal)$/, 'a hop count, addresses/subnets, or loopback')
    .optional(),
  /** Worker threads that read uploaded reports, and the time and memory each read may take. */
  REPORT_READ_THREADS: z.coerce.number().int().min(1).max(8).default(1),
  REPORT_READ_TIMEOUT_SECONDS: z.coerce.number().int().min(1).max(600).default(30),
  REPORT_READ_HEAP_MB: z.coerce.number().int().min(64).max(4096).default(256),
  /** Folder where uploaded files are kept (the local storage adapter). */
  STORAGE_DIR: z.string().default('.data/files'),
  /** Folder of the built portal served as static files. */
  PORTAL_DIST: z.string().default('dist/portal/browser'),
  /** Approved items still open this many business days before closing flag the request as at risk. */
  AT_RISK_BUSINESS_DAYS: z.coerce.number().int().min(0).max(30).default(3),
  /** Real SMTP server for e-mail. Unset: mail goes to the local sink on loopback (development mailbox). */
  SMTP_HOST: z.string().min(1).optional(),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(587),
  /** TLS from the first byte (usually port 465); otherwise STARTTLS when offered. */
  SMTP_SECURE: z
    .enum(['true', 'false'])
    .default('false')
    .transform((v) => v === 'true'),
  SMTP_USER: z.string().min(1).optional(),
  SMTP_PASSWORD: z.string().min(1).optional(),
  /** Port of the local mail sink (0: any free port). */
  MAIL_SINK_PORT: z.coerce.number().int().min(0).max(65535).default(0),
  MAIL_FROM: z.string().min(3).max(300).default('Closing Circuit <no-reply@closing-circuit.local>'),
  /** Whether this process sends the outbox (several processes may; they share the work). */
  OUTBOX_WORKER: z
    .enum(['on', 'off'])
    .default('on')
    .transform((v) => v === 'on'),
  /** Names this process in the outbox's attempt records (default: host and process id). */
  OUTBOX_WORKER_NAME: z.string().min(1).max(100).optional(),
  /** How long a worker's claim on a message holds (a stopped worker's message is taken over after it). */
  OUTBOX_LEASE_MS: z.coerce.number().int().min(1_000).max(3_600_000).default(120_000),
  /**
   * Outcomes of items a contractor records within this many minutes of the first are told in one
   * e-mail per person (0: one e-mail per outcome, at once).
   */
  ITEM_MESSAGES_GATHER_MINUTES: z.coerce.number().int().min(0).max(120).default(10),
  /** Hour of the day (UTC) after which the daily digest goes out. */
  DIGEST_HOUR_UTC: z.coerce.number().int().min(0).max(23).default(13),
  /** Card payments: a real secret key and webhook secret of the payment service. Without them the server
   * starts a local fake payment service on loopback (outside production). */
  STRIPE_SECRET_KEY: z.string().min(8).optional(),
  STRIPE_WEBHOOK_SECRET: z.string().min(8).optional(),
  /** Where the payment SDK sends its calls when not the real service (e.g. http://127.0.0.1:4310). */
  STRIPE_API_BASE: z.url().optional(),
  /** Port of the local fake payment service (0 = any free port). */
  FAKE_PAYMENTS_PORT: z.coerce.number().int().min(0).max(65535).default(0),
}).refine((e) => !e.STRIPE_SECRET_KEY === !e.STRIPE_WEBHOOK_SECRET, { path: ['STRIPE_WEBHOOK_SECRET'], message: 'set STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET together' });

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
  signInAccountLimit: number;
  passwordChangeLimit: number;
  /** Express "trust proxy" setting; false trusts no proxy header. */
  trustProxy: false | number | string;
  reportReader: { maxThreads: number; timeoutMs: number; maxHeapMb: number };
  portalDist: string;
  storageDir: string;
  /** The payment service's keys and address; null until a fake is started (see main.ts) or keys are given. */
  payments: PaymentsConfig | null;
  fakePaymentsPort: number;
  atRiskBusinessDays: number;
  mail: {
    /** null: the local sink on loopback. */
    smtp: { host: string; port: number; secure: boolean; user: string | null; password: string | null } | null;
    sinkPort: number;
    from: string;
    runWorker: boolean;
    leaseMs: number;
    workerName: string | null;
    digestHourUtc: number;
    gatherItemMessagesMs: number;
  };
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
    signInAccountLimit: e.SIGN_IN_ACCOUNT_LIMIT,
    passwordChangeLimit: e.PASSWORD_CHANGE_LIMIT,
    trustProxy: e.TRUST_PROXY === undefined || e.TRUST_PROXY === '' ? false : /^\d+$/.test(e.TRUST_PROXY) ? Number(e.TRUST_PROXY) : e.TRUST_PROXY,
    reportReader: { maxThreads: e.REPORT_READ_THREADS, timeoutMs: e.REPORT_READ_TIMEOUT_SECONDS * 1000, maxHeapMb: e.REPORT_READ_HEAP_MB },
    portalDist: e.PORTAL_DIST,
    storageDir: e.STORAGE_DIR,
    payments: e.STRIPE_SECRET_KEY && e.STRIPE_WEBHOOK_SECRET ? { secretKey: e.STRIPE_SECRET_KEY, webhookSecret: e.STRIPE_WEBHOOK_SECRET, apiBase: e.STRIPE_API_BASE ?? null } : null,
    fakePaymentsPort: e.FAKE_PAYMENTS_PORT,
    atRiskBusinessDays: e.AT_RISK_BUSINESS_DAYS,
    mail: {
      smtp: e.SMTP_HOST ? { host: e.SMTP_HOST, port: e.SMTP_PORT, secure: e.SMTP_SECURE, user: e.SMTP_USER ?? null, password: e.SMTP_PASSWORD ?? null } : null,
      sinkPort: e.MAIL_SINK_PORT,
      from: e.MAIL_FROM,
      runWorker: e.OUTBOX_WORKER,
      leaseMs: e.OUTBOX_LEASE_MS,
      workerName: e.OUTBOX_WORKER_NAME ?? null,
      digestHourUtc: e.DIGEST_HOUR_UTC,
      gatherItemMessagesMs: e.ITEM_MESSAGES_GATHER_MINUTES * 60_000,
    },
  };
}

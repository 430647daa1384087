// The environment `npm start` and `npm run dev` share: the database (private cluster or
// DATABASE_URL), a session secret kept in .data/, and the variables the server reads.
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { startCluster } from './postgres.mjs';

export function prepareEnvironment(root, { port, publicUrl }) {
  const dataDir = join(root, '.data');
  mkdirSync(dataDir, { recursive: true });

  let cluster = null;
  let databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl) {
    const pgPort = Number(process.env.PG_PORT ?? 54329);
    console.log(`• Starting PostgreSQL on 127.0.0.1:${pgPort}…`);
    cluster = startCluster({ dataDir: join(dataDir, 'pg'), port: pgPort });
    cluster.createDatabase('closing_circuit');
    databaseUrl = cluster.url('closing_circuit');
  }

  const secretFile = join(dataDir, 'session-secret');
  if (!process.env.SESSION_SECRET && !existsSync(secretFile)) writeFileSync(secretFile, randomBytes(32).toString('hex'), { mode: 0o600 });
  const env = {
    ...process.env,
    DATABASE_URL: databaseUrl,
    PORT: String(port),
    SESSION_SECRET: process.env.SESSION_SECRET ?? readFileSync(secretFile, 'utf8').trim(),
    STORAGE_DIR: process.env.STORAGE_DIR ?? join(dataDir, 'files'),
    ...(publicUrl ? { PUBLIC_URL: publicUrl } : {}),
  };
  return { env, stopDatabase: () => cluster?.stop() };
}

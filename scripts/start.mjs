#!/usr/bin/env node
// `npm start`: everything from a fresh clone to a running portal on loopback.
// 1. npm dependencies  2. PostgreSQL (private cluster in .data/, or DATABASE_URL)  3. migrations and
// demo seeds (only into an empty database)  4. client build  5. the server  6. Ctrl-C stops it all.
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureDependencies } from './lib/deps.mjs';
import { buildPortalIfStale } from './lib/portal-build.mjs';
import { startCluster } from './lib/postgres.mjs';
import { run, runAsync } from './lib/run.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const dataDir = join(root, '.data');
const port = Number(process.env.PORT ?? 4300);
const pgPort = Number(process.env.PG_PORT ?? 54329);

ensureDependencies(root);
mkdirSync(dataDir, { recursive: true });

let cluster = null;
let databaseUrl = process.env.DATABASE_URL;
if (!databaseUrl) {
  console.log(`• Starting PostgreSQL on 127.0.0.1:${pgPort}…`);
  cluster = startCluster({ dataDir: join(dataDir, 'pg'), port: pgPort });
  cluster.createDatabase('closing_circuit');
  databaseUrl = cluster.url('closing_circuit');
}
const stopDatabase = () => cluster?.stop();
process.on('exit', stopDatabase);

const secretFile = join(dataDir, 'session-secret');
if (!process.env.SESSION_SECRET && !existsSync(secretFile)) writeFileSync(secretFile, randomBytes(32).toString('hex'), { mode: 0o600 });
const env = {
  ...process.env,
  DATABASE_URL: databaseUrl,
  PORT: String(port),
  SESSION_SECRET: process.env.SESSION_SECRET ?? readFileSync(secretFile, 'utf8').trim(),
};

try {
  run(join(root, 'node_modules/.bin/tsx'), ['scripts/db-setup.ts', '--seed=if-empty'], { cwd: root, env });
  buildPortalIfStale(root);
} catch (err) {
  console.error(err.message);
  stopDatabase();
  process.exit(1);
}

console.log(`\nClosing Circuit is starting at http://127.0.0.1:${port}\n`);
run(join(root, 'node_modules/.bin/tsx'), ['scripts/demo-sign-ins.ts'], { cwd: root, env });
console.log('\nPress Ctrl-C to stop the server and PostgreSQL.\n');

for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => {});
const code = await runAsync(join(root, 'node_modules/.bin/tsx'), ['server/src/main.ts'], { cwd: root, env });
stopDatabase();
console.log('Stopped.');
process.exit(code);

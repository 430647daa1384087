#!/usr/bin/env node
// `npm run dev`: the API on 127.0.0.1:4300 (restarting on change) and `ng serve` on :4200 proxying
// /api to it. Uses the same private PostgreSQL cluster and data as `npm start`.
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { spawn } from 'node:child_process';
import { ensureDependencies } from './lib/deps.mjs';
import { startCluster } from './lib/postgres.mjs';
import { run } from './lib/run.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const dataDir = join(root, '.data');
ensureDependencies(root);
mkdirSync(dataDir, { recursive: true });

let cluster = null;
let databaseUrl = process.env.DATABASE_URL;
if (!databaseUrl) {
  cluster = startCluster({ dataDir: join(dataDir, 'pg'), port: Number(process.env.PG_PORT ?? 54329) });
  cluster.createDatabase('closing_circuit');
  databaseUrl = cluster.url('closing_circuit');
}
const secretFile = join(dataDir, 'session-secret');
if (!process.env.SESSION_SECRET && !existsSync(secretFile)) writeFileSync(secretFile, randomBytes(32).toString('hex'), { mode: 0o600 });
const env = { ...process.env, DATABASE_URL: databaseUrl, PORT: '4300', SESSION_SECRET: process.env.SESSION_SECRET ?? readFileSync(secretFile, 'utf8').trim(), PUBLIC_URL: 'http://127.0.0.1:4200' };
run(join(root, 'node_modules/.bin/tsx'), ['scripts/db-setup.ts', '--seed=if-empty'], { cwd: root, env });

const children = [
  spawn(join(root, 'node_modules/.bin/tsx'), ['watch', 'server/src/main.ts'], { cwd: root, env, stdio: 'inherit' }),
  spawn(join(root, 'node_modules/.bin/ng'), ['serve', 'portal', '--host', '127.0.0.1'], { cwd: root, env, stdio: 'inherit' }),
];
console.log('\nPortal (dev): http://127.0.0.1:4200  ·  API: http://127.0.0.1:4300/api\n');
const stop = () => {
  for (const child of children) child.kill('SIGINT');
  cluster?.stop();
  process.exit(0);
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);

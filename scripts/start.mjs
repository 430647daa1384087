#!/usr/bin/env node
// `npm start`: everything from a fresh clone to a running portal on loopback.
// 1. npm dependencies  2. PostgreSQL (private cluster in .data/, or DATABASE_URL)  3. migrations and
// demo seeds (only into an empty database)  4. client build  5. the server, built as JavaScript and
// run by node (scripts/lib/server-build.mjs)  6. Ctrl-C stops it all.
import { spawn } from 'node:child_process';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureDependencies } from './lib/deps.mjs';
import { prepareEnvironment } from './lib/environment.mjs';
import { buildPortalIfStale } from './lib/portal-build.mjs';
import { run } from './lib/run.mjs';
import { buildServer } from './lib/server-build.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const tsx = join(root, 'node_modules/.bin/tsx');
const port = Number(process.env.PORT ?? 4300);

ensureDependencies(root);
const { env, stopDatabase } = prepareEnvironment(root, { port });
process.on('exit', stopDatabase);

let serverEntry;
try {
  run(tsx, ['scripts/db-setup.ts', '--seed=if-empty'], { cwd: root, env });
  buildPortalIfStale(root);
  serverEntry = await buildServer(root);
} catch (err) {
  console.error(err.message);
  process.exit(1);
}

console.log(`\nClosing Circuit is starting at http://127.0.0.1:${port}\n`);
run(tsx, ['scripts/demo-sign-ins.ts'], { cwd: root, env });
console.log('\nPress Ctrl-C to stop the server and PostgreSQL.\n');

const server = spawn(process.execPath, ['--enable-source-maps', serverEntry], { cwd: root, env, stdio: 'inherit' });
// Ctrl-C reaches the whole process group; a signal sent to this process alone is passed on.
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => server.kill(signal));
server.on('exit', (code) => {
  stopDatabase();
  console.log('Stopped the server and PostgreSQL.');
  process.exit(code ?? 0);
});

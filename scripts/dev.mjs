#!/usr/bin/env node
// `npm run dev`: the API on 127.0.0.1:4300 (restarting on change) and `ng serve` on :4200 proxying
// /api to it. Uses the same private PostgreSQL cluster and data as `npm start`.
import { spawn } from 'node:child_process';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureDependencies } from './lib/deps.mjs';
import { prepareEnvironment } from './lib/environment.mjs';
import { run } from './lib/run.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
ensureDependencies(root);
const { env, stopDatabase } = prepareEnvironment(root, { port: 4300, publicUrl: 'http://127.0.0.1:4200' });
run(join(root, 'node_modules/.bin/tsx'), ['scripts/db-setup.ts', '--seed=if-empty'], { cwd: root, env });

const children = [
  spawn(join(root, 'node_modules/.bin/tsx'), ['watch', 'server/src/main.ts'], { cwd: root, env, stdio: 'inherit' }),
  spawn(join(root, 'node_modules/.bin/ng'), ['serve', 'portal', '--host', '127.0.0.1'], { cwd: root, env, stdio: 'inherit' }),
];
console.log('\nPortal (dev): http://127.0.0.1:4200  ·  API: http://127.0.0.1:4300/api\n');
const stop = () => {
  for (const child of children) child.kill('SIGINT');
  stopDatabase();
  process.exit(0);
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);

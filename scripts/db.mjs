#!/usr/bin/env node
// `npm run migrate` / `npm run seed`: migrations, or migrations plus a fresh demo scenario, on the
// database `npm start` uses (the private cluster in .data/, started for the moment, or DATABASE_URL).
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureDependencies } from './lib/deps.mjs';
import { prepareEnvironment } from './lib/environment.mjs';
import { run } from './lib/run.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const mode = process.argv[2] === 'seed' ? 'always' : 'never';
ensureDependencies(root);
const { env, stopDatabase } = prepareEnvironment(root, { port: Number(process.env.PORT ?? 4300) });
try {
  run(join(root, 'node_modules/.bin/tsx'), ['scripts/db-setup.ts', `--seed=${mode}`], { cwd: root, env });
} finally {
  stopDatabase();
}
